'use client';

import { useRouter } from 'next/navigation';
import { Button } from '@/components/ui/button';

/**
 * The end of every record form: the submit button (its label while saving, "Saving…" unless told) and Cancel, which goes
 * back unless the form says otherwise.
 */
export function FormFooter({ submitting, submitLabel, busyLabel = 'Saving…', onCancel }: { submitting: boolean; submitLabel: string; busyLabel?: string; onCancel?: () => void }) {
  const router = useRouter();
  return (
    <div className="flex flex-wrap gap-2">
      <Button type="submit" size="lg" disabled={submitting}>
        {submitting ? busyLabel : submitLabel}
      </Button>
      <Button variant="secondary" size="lg" onClick={onCancel ?? (() => router.back())}>
        Cancel
      </Button>
    </div>
  );
}
