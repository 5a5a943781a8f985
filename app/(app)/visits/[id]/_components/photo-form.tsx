'use client';

import { useCallback, useRef, useState } from 'react';
import { PhotoUploader } from '@/components/photos/photo-uploader';
import { unsentMessage } from '@/components/photos/use-photo-uploads';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { LeaveDialog } from '@/components/ui/leave-dialog';
import { useLeaveGuard } from '@/components/ui/use-leave-guard';
import type { PhotoDto } from '@/lib/photos/dto';
import type { SubmitResult } from '@/app/(app)/visits/[id]/_components/form-kit';

/**
 * Photos go up through the shared uploader the moment they are chosen (stored on the equipment);
 * each stored photo then becomes a photo entry of this visit at once, saved like any other entry
 * (kept on the phone if the signal drops between the two). "Done" asks first while a photo is
 * still on its way or waits for Retry.
 */
export function PhotoForm({
  equipmentId,
  onSubmit,
  onDone,
  onUnsentChange,
}: {
  equipmentId: string;
  onSubmit: (data: { photoId: string; caption: string | null }) => Promise<SubmitResult>;
  onDone: () => void;
  /** For a workspace that closes this form by other buttons (another unit, a scan): guard them with useLeaveGuard. */
  onUnsentChange?: (count: number) => void;
}) {
  const [linked, setLinked] = useState(0);
  const [problem, setProblem] = useState<string | null>(null);
  const [unsent, setUnsent] = useState(0);
  // The uploader guards reloads and links; this guards the form's own close button.
  const guard = useLeaveGuard(unsent > 0, unsentMessage(unsent), { pageLeave: false });
  const unsentRef = useRef(onUnsentChange);
  unsentRef.current = onUnsentChange;
  const unsentChanged = useCallback((n: number) => {
    setUnsent(n);
    unsentRef.current?.(n);
  }, []);

  async function uploaded(photo: PhotoDto) {
    const result = await onSubmit({ photoId: photo.id, caption: photo.caption });
    if (result.ok) setLinked((n) => n + 1);
    else setProblem(result.message ?? 'The photo was stored but not added to the visit.');
  }

  return (
    <div className="space-y-3">
      <PhotoUploader equipmentId={equipmentId} defaultKind="general" onUploaded={(p) => void uploaded(p)} onUnsentChange={unsentChanged} />
      {linked > 0 ? (
        <p role="status" className="font-semibold text-emerald-900">
          {linked} {linked === 1 ? 'photo' : 'photos'} added to this visit.
        </p>
      ) : null}
      {problem ? (
        <Alert tone="danger" title="Not added to the visit">
          {problem}
        </Alert>
      ) : null}
      <Button size="lg" variant="secondary" onClick={() => guard.confirm(onDone)}>
        Done with photos
      </Button>
      <LeaveDialog {...guard.dialog} />
    </div>
  );
}
