'use client';

import { useState } from 'react';
import { PhotoUploader } from '@/components/photos/photo-uploader';
import { Alert } from '@/components/ui/alert';
import type { PhotoDto } from '@/lib/photos/dto';
import type { SubmitResult } from '@/app/(app)/visits/[id]/_components/form-kit';

/**
 * Photos go up through the shared uploader (which stores them on the equipment); each stored photo
 * then becomes a photo entry of this visit, saved like any other entry (kept on the phone if the
 * signal drops between the two).
 */
export function PhotoForm({ equipmentId, onSubmit, onDone }: { equipmentId: string; onSubmit: (data: { photoId: string; caption: string | null }) => Promise<SubmitResult>; onDone: () => void }) {
  const [linked, setLinked] = useState(0);
  const [problem, setProblem] = useState<string | null>(null);

  async function uploaded(photo: PhotoDto) {
    const result = await onSubmit({ photoId: photo.id, caption: photo.caption });
    if (result.ok) setLinked((n) => n + 1);
    else setProblem(result.message ?? 'The photo was stored but not added to the visit.');
  }

  return (
    <div className="space-y-3">
      <PhotoUploader equipmentId={equipmentId} defaultKind="general" onUploaded={(p) => void uploaded(p)} />
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
      <button type="button" onClick={onDone} className="min-h-12 w-full rounded-md border border-slate-300 bg-white px-5 font-semibold text-slate-900 hover:bg-slate-100 sm:w-auto">
        Done with photos
      </button>
    </div>
  );
}
