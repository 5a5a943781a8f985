'use client';

import { CheckCheck, RotateCcw } from 'lucide-react';
import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { useVisitCommand } from '@/lib/visits/hooks';

/** The office's part: mark a closed visit reviewed, or reopen it so more can be added (as the visit's flags allow). */
export function ReviewActions({ visitId, canReview, canReopen }: { visitId: string; canReview: boolean; canReopen: boolean }) {
  const router = useRouter();
  const review = useVisitCommand(visitId, 'review');
  const reopen = useVisitCommand(visitId, 'reopen');
  const [confirmReopen, setConfirmReopen] = useState(false);
  const error = review.error ?? reopen.error;
  return (
    <div className="space-y-2">
      <div className="flex flex-wrap gap-2">
        {canReview ? (
          <Button size="lg" onClick={() => review.mutate(undefined, { onSuccess: () => router.refresh() })} disabled={review.isPending}>
            <CheckCheck aria-hidden className="size-5" /> {review.isPending ? 'Marking…' : 'Mark reviewed'}
          </Button>
        ) : null}
        {!canReopen ? null : !confirmReopen ? (
          <Button size="lg" variant="secondary" onClick={() => setConfirmReopen(true)}>
            <RotateCcw aria-hidden className="size-5" /> Reopen visit…
          </Button>
        ) : (
          <>
            <Button size="lg" variant="danger" onClick={() => reopen.mutate(undefined, { onSuccess: () => router.refresh() })} disabled={reopen.isPending}>
              {reopen.isPending ? 'Reopening…' : 'Yes, reopen it'}
            </Button>
            <Button size="lg" variant="secondary" onClick={() => setConfirmReopen(false)}>
              Keep it closed
            </Button>
          </>
        )}
      </div>
      {confirmReopen ? <p className="text-sm text-slate-700">Reopening lets the technician add entries; closing it again sends a new report.</p> : null}
      {error ? (
        <Alert tone="danger" title="That did not work">
          {error.message}
        </Alert>
      ) : null}
    </div>
  );
}
