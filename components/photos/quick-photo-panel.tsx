'use client';

import { Camera, CircleCheck, RotateCcw, X } from 'lucide-react';
import { useId, useState } from 'react';
import { photoKindIcons } from '@/components/photos/photo-kind';
import { UploadStatusLine } from '@/components/photos/photo-uploader';
import { usePhotoUploads, unsentMessage } from '@/components/photos/use-photo-uploads';
import { Button } from '@/components/ui/button';
import { LeaveDialog } from '@/components/ui/leave-dialog';
import { Modal } from '@/components/ui/modal';
import { useLeaveGuard } from '@/components/ui/use-leave-guard';
import { photoKindLabels, photoKinds } from '@/lib/photos/terms';

// A photo from the unit's header in three taps: "Add photo", the kind, the shutter. Each kind in
// the sheet is a label for its own camera input, so the second tap opens the camera directly;
// the upload then starts by itself and shows its progress under the button.

/** Loaded by QuickPhotoButton on its first press, and opens at once. */
export function QuickPhotoPanel({ equipmentId }: { equipmentId: string }) {
  const id = useId();
  const [open, setOpen] = useState(true);
  const uploads = usePhotoUploads(equipmentId);
  const guard = useLeaveGuard(uploads.unsent > 0, unsentMessage(uploads.unsent));

  return (
    <div className="flex min-w-0 flex-col gap-2">
      <Button size="lg" variant="secondary" onClick={() => setOpen(true)} aria-haspopup="dialog">
        <Camera aria-hidden className="size-5" />
        Add photo
      </Button>

      {uploads.items.length > 0 ? (
        <ul className="space-y-2" aria-label="Photos from this button">
          {uploads.items.map((item) => (
            <li key={item.id} className="space-y-1.5 rounded-md border border-slate-200 bg-white p-2 text-sm" data-testid="quick-upload" data-status={item.status}>
              <p className="font-semibold text-slate-900">{photoKindLabels[item.kind]} photo</p>
              {item.status === 'done' ? (
                <p className="flex items-center gap-1.5 font-semibold text-emerald-800">
                  <CircleCheck aria-hidden className="size-4" /> Added to this unit’s photos
                </p>
              ) : (
                <UploadStatusLine item={item} />
              )}
              {item.status === 'failed' || item.status === 'done' ? (
                <div className="flex flex-wrap gap-2">
                  {item.status === 'failed' && item.retryable ? (
                    <Button size="md" onClick={() => uploads.retry(item.id)}>
                      <RotateCcw aria-hidden className="size-4" /> Retry
                    </Button>
                  ) : null}
                  <Button size="md" variant="secondary" onClick={() => uploads.remove(item.id)} aria-label={item.status === 'done' ? `Hide this ${photoKindLabels[item.kind].toLowerCase()} photo note` : `Remove the ${photoKindLabels[item.kind].toLowerCase()} photo`}>
                    <X aria-hidden className="size-4" /> {item.status === 'done' ? 'Hide' : 'Remove'}
                  </Button>
                </div>
              ) : null}
            </li>
          ))}
        </ul>
      ) : null}

      <Modal open={open} onClose={() => setOpen(false)} labelledBy={`${id}-title`}>
        <div className="flex items-center justify-between gap-2">
          <h2 id={`${id}-title`} className="text-lg font-bold">
            What does the photo show?
          </h2>
          <Button variant="ghost" onClick={() => setOpen(false)} aria-label="Close">
            <X aria-hidden className="size-5" />
          </Button>
        </div>
        <div className="grid grid-cols-2 gap-2">
          {photoKinds.map((kind) => {
            const Icon = photoKindIcons[kind];
            return (
              <label
                key={kind}
                className="relative flex min-h-16 cursor-pointer flex-col items-center justify-center gap-1 rounded-lg border-2 border-slate-300 bg-white px-2 py-2 text-center font-semibold text-slate-900 hover:border-ice-700 hover:bg-ice-50 has-[input:focus-visible]:outline-3 has-[input:focus-visible]:outline-offset-2 has-[input:focus-visible]:outline-[#2a88b4] has-[input:focus-visible]:outline-solid"
              >
                <Icon aria-hidden className="size-6 text-ice-700" />
                {photoKindLabels[kind]}
                {/* Kept in the tab order (not display:none) so a keyboard can open the camera too. */}
                <input
                  type="file"
                  accept="image/*"
                  capture="environment"
                  className="sr-only"
                  data-testid={`quick-photo-${kind}`}
                  onChange={(e) => {
                    uploads.add(e.target.files, kind);
                    e.target.value = '';
                    setOpen(false);
                  }}
                />
              </label>
            );
          })}
        </div>
        <p className="text-sm text-slate-600">The photo is sent as soon as it is taken.</p>
      </Modal>
      <LeaveDialog {...guard.dialog} />
    </div>
  );
}
