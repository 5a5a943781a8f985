'use client';

import { CloudOff } from 'lucide-react';
import { useCallback, useEffect, useId, useRef, useState } from 'react';
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
  onKeepOffline,
}: {
  equipmentId: string;
  onSubmit: (data: { photoId: string; caption: string | null }) => Promise<SubmitResult>;
  onDone: () => void;
  /** For a workspace that closes this form by other buttons (another unit, a scan): guard them with useLeaveGuard. */
  onUnsentChange?: (count: number) => void;
  /** Without signal: the photos go into the visit's outbox on the phone and are sent later. */
  onKeepOffline?: (files: File[]) => Promise<void>;
}) {
  const [offline, setOffline] = useState(false);
  useEffect(() => {
    const update = () => setOffline(!navigator.onLine);
    update();
    window.addEventListener('online', update);
    window.addEventListener('offline', update);
    return () => {
      window.removeEventListener('online', update);
      window.removeEventListener('offline', update);
    };
  }, []);
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
      {offline && onKeepOffline ? (
        <OfflinePhotos onKeep={onKeepOffline} />
      ) : (
        <PhotoUploader equipmentId={equipmentId} defaultKind="general" onUploaded={(p) => void uploaded(p)} onUnsentChange={unsentChanged} />
      )}
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

/** No signal: a photo taken now is kept on the phone with the visit's other work and sent with it. */
function OfflinePhotos({ onKeep }: { onKeep: (files: File[]) => Promise<void> }) {
  const id = useId();
  const [kept, setKept] = useState(0);
  return (
    <div className="space-y-2 rounded-lg border-2 border-dashed border-amber-500 bg-amber-50 p-3">
      <p className="flex items-center gap-2 font-semibold text-amber-950">
        <CloudOff aria-hidden className="size-5" /> No signal: photos are kept on this phone and sent with the visit.
      </p>
      <label htmlFor={id} className="inline-flex min-h-12 cursor-pointer items-center rounded-md bg-ice-900 px-4 font-semibold text-white hover:bg-ice-800 has-[:focus-visible]:outline has-[:focus-visible]:outline-3">
        Take or choose photos
        <input
          id={id}
          type="file"
          accept="image/jpeg,image/png,image/webp"
          capture="environment"
          multiple
          className="sr-only"
          data-testid="offline-photo-input"
          onChange={async (e) => {
            const files = [...(e.target.files ?? [])];
            e.target.value = '';
            if (files.length === 0) return;
            await onKeep(files);
            setKept((n) => n + files.length);
          }}
        />
      </label>
      {kept > 0 ? (
        <p role="status" className="font-semibold text-amber-950">
          {kept} {kept === 1 ? 'photo' : 'photos'} kept on this phone for this visit.
        </p>
      ) : null}
    </div>
  );
}
