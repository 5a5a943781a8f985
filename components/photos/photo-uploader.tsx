'use client';

import { Camera, CircleCheck, Clock, ImageOff, ImagePlus, LoaderCircle, OctagonAlert, RotateCcw, X } from 'lucide-react';
import dynamic from 'next/dynamic';
import { useEffect, useId, useRef, useState, type ChangeEvent } from 'react';
import { PhotoKindSelect } from '@/components/photos/photo-kind-select';
import { usePhotoUploads, unsentMessage, type UploadItem } from '@/components/photos/use-photo-uploads';
import { Button } from '@/components/ui/button';
import { LeaveDialog } from '@/components/ui/leave-dialog';
import { useLeaveGuard } from '@/components/ui/use-leave-guard';
import type { PhotoDto } from '@/lib/photos/dto';
import { formatBytes, MAX_PHOTO_BYTES, photoKindLabels, type PhotoKind } from '@/lib/photos/terms';
import { cn } from '@/lib/utils';

// Several photos at once, from the camera or from files. Each starts uploading the moment it is
// chosen, with its own progress bar; a failure keeps the file and waits for Retry; a caption (or
// a corrected kind) can be added once it is stored. Leaving the page with a photo not yet sent
// asks first. Independent of any page: the equipment page or a visit form mount it.

// A sent photo's details form (its form library and schema) loads once a photo is sent, not
// with every page that can take a photo (the unit page a scan lands on).
const PhotoDetailsForm = dynamic(() => import('@/components/photos/photo-details-form').then((m) => m.PhotoDetailsForm), { ssr: false });

export interface PhotoUploaderProps {
  equipmentId: string;
  /** Kind preselected for new photos (a scan of a nameplate might start with "nameplate"). */
  defaultKind?: PhotoKind;
  /** Called once per stored photo, e.g. for a visit form to link it to an entry. */
  onUploaded?: (photo: PhotoDto) => void;
  /** How many photos still wait to be sent, for a form that guards its own close button. */
  onUnsentChange?: (count: number) => void;
}

export function PhotoUploader({ equipmentId, defaultKind = 'general', onUploaded, onUnsentChange }: PhotoUploaderProps) {
  const baseId = useId();
  const cameraInput = useRef<HTMLInputElement>(null);
  const filesInput = useRef<HTMLInputElement>(null);
  const [kind, setKind] = useState<PhotoKind>(defaultKind);
  const uploads = usePhotoUploads(equipmentId, { onUploaded });
  const { items, unsent } = uploads;
  const guard = useLeaveGuard(unsent > 0, unsentMessage(unsent));

  useEffect(() => onUnsentChange?.(unsent), [unsent, onUnsentChange]);
  // Gone from the page, nothing of it waits any more (its uploads are stopped on unmount).
  const unsentRef = useRef(onUnsentChange);
  unsentRef.current = onUnsentChange;
  useEffect(() => () => unsentRef.current?.(0), []);

  const sending = items.filter((i) => i.status === 'queued' || i.status === 'uploading' || i.status === 'processing').length;
  const failed = items.filter((i) => i.status === 'failed' && i.retryable).length;
  const done = items.filter((i) => i.status === 'done').length;
  // Emptied after each choice, so choosing the same file again still sends it.
  const takeFiles = (e: ChangeEvent<HTMLInputElement>) => {
    uploads.add(e.target.files, kind);
    e.target.value = '';
  };

  return (
    <>
      <div className="space-y-4 rounded-lg border border-slate-200 bg-white p-4 shadow-sm">
        {/* Wraps in a narrow column (the unit page's side) so the kind keeps its width. */}
        <div className="flex flex-col gap-3 sm:flex-row sm:flex-wrap sm:items-end">
          <PhotoKindSelect id={`${baseId}-kind`} label="Kind for new photos" className="sm:w-56 sm:shrink-0" value={kind} onChange={(e) => setKind(e.target.value as PhotoKind)} />
          <div className="grid grid-cols-2 gap-2 sm:flex">
            <Button size="lg" className="whitespace-nowrap px-3" onClick={() => cameraInput.current?.click()}>
              <Camera aria-hidden className="size-5" />
              Take photo
            </Button>
            <Button size="lg" variant="secondary" className="whitespace-nowrap px-3" onClick={() => filesInput.current?.click()}>
              <ImagePlus aria-hidden className="size-5" />
              Choose files
            </Button>
          </div>
          {/* image/* lets a phone offer its camera roll and convert its own formats to JPEG. */}
          <input
            ref={cameraInput}
            type="file"
            accept="image/*"
            capture="environment"
            multiple
            className="hidden"
            aria-label="Take a photo with the camera"
            data-testid="photo-camera-input"
            onChange={takeFiles}
          />
          <input
            ref={filesInput}
            type="file"
            accept="image/jpeg,image/png,image/webp,image/*"
            multiple
            className="hidden"
            aria-label="Choose photo files"
            data-testid="photo-file-input"
            onChange={takeFiles}
          />
        </div>
        <p className="text-sm text-slate-600">
          Each photo is sent as soon as you choose it. JPEG, PNG or WebP, up to {formatBytes(MAX_PHOTO_BYTES)} each. Location data is removed unless your company keeps it.
        </p>

        {items.length > 0 ? (
          <ul className="space-y-3" aria-label="Photos being sent">
            {items.map((item, index) => (
              <UploadRow
                key={item.id}
                item={item}
                label={`${baseId}-${index}`}
                onChange={(change) => uploads.patch(item.id, change)}
                onRetry={() => uploads.retry(item.id)}
                onRemove={() => uploads.remove(item.id)}
              />
            ))}
          </ul>
        ) : null}

        {items.length > 0 ? (
          <div className="flex flex-wrap items-center gap-2">
            <p className="text-sm font-medium text-slate-800" role="status" aria-live="polite">
              {[
                sending > 0 ? `Sending ${sending} ${sending === 1 ? 'photo' : 'photos'}…` : null,
                failed > 0 ? `${failed} not sent: press Retry.` : null,
                done > 0 ? `${done} uploaded.` : null,
              ]
                .filter(Boolean)
                .join(' ')}
            </p>
            {done > 0 ? (
              <Button variant="ghost" onClick={uploads.clearDone}>
                Clear uploaded
              </Button>
            ) : null}
          </div>
        ) : null}
      </div>
      <LeaveDialog {...guard.dialog} />
    </>
  );
}

export function UploadStatusLine({ item }: { item: UploadItem }) {
  if (item.status === 'done') {
    return (
      <p className="flex items-center gap-1.5 text-sm font-semibold text-emerald-800">
        <CircleCheck aria-hidden className="size-4" /> Uploaded
      </p>
    );
  }
  if (item.status === 'failed') {
    return (
      <p role="alert" className="flex items-start gap-1.5 text-sm font-medium text-red-800">
        <OctagonAlert aria-hidden className="mt-0.5 size-4 shrink-0" />
        <span>
          <span className="font-semibold">Not uploaded: </span>
          {item.error}
        </span>
      </p>
    );
  }
  if (item.status === 'uploading' || item.status === 'processing') {
    return (
      <div className="space-y-1">
        <div
          role="progressbar"
          aria-label={`Upload of ${item.file.name}`}
          aria-valuemin={0}
          aria-valuemax={100}
          aria-valuenow={item.percent}
          className="h-3 overflow-hidden rounded-full bg-slate-200"
        >
          <div className="h-full rounded-full bg-ice-700 transition-[width] duration-150" style={{ width: `${item.percent}%` }} />
        </div>
        <p className="flex items-center gap-1.5 text-sm text-slate-700">
          <LoaderCircle aria-hidden className="size-4 animate-spin" />
          {item.status === 'processing' ? 'Sent; checking and storing…' : `Uploading ${item.percent}%`}
        </p>
      </div>
    );
  }
  return (
    <p className="flex items-center gap-1.5 text-sm text-slate-700">
      <Clock aria-hidden className="size-4" /> Waiting to send
    </p>
  );
}

function UploadRow({
  item,
  label,
  onChange,
  onRetry,
  onRemove,
}: {
  item: UploadItem;
  label: string;
  onChange: (change: Partial<UploadItem>) => void;
  onRetry: () => void;
  onRemove: () => void;
}) {
  // The browser cannot draw every file it is handed (not an image, or a format it lacks).
  const [previewBroken, setPreviewBroken] = useState(false);
  const working = item.status === 'queued' || item.status === 'uploading' || item.status === 'processing';
  return (
    <li
      className={cn('flex gap-3 rounded-md border p-3', item.status === 'failed' ? 'border-red-300 bg-red-50' : 'border-slate-200')}
      data-testid="upload-row"
      data-status={item.status}
    >
      {previewBroken ? (
        <span className="flex size-16 shrink-0 items-center justify-center rounded bg-slate-100 text-slate-600 sm:size-20">
          <ImageOff aria-hidden className="size-6" />
        </span>
      ) : (
        <img src={item.preview} alt="" className="size-16 shrink-0 rounded object-cover sm:size-20" onError={() => setPreviewBroken(true)} />
      )}
      <div className="min-w-0 flex-1 space-y-2">
        <p className="truncate text-sm font-semibold text-slate-900" title={item.file.name}>
          {item.file.name} <span className="font-normal text-slate-600">· {formatBytes(item.file.size)}</span>
        </p>
        {item.status === 'done' && item.photo ? (
          <PhotoDetailsForm photo={item.photo} label={label} fileName={item.file.name} onSaved={(photo) => onChange({ photo, kind: photo.kind, caption: photo.caption ?? '' })} />
        ) : item.status === 'failed' && item.retryable ? (
          <PhotoKindSelect id={`${label}-kind`} label={`Kind of ${item.file.name}`} hideLabel value={item.kind} onChange={(e) => onChange({ kind: e.target.value as PhotoKind })} />
        ) : (
          <p className="text-sm text-slate-700">{photoKindLabels[item.kind]}</p>
        )}
        <UploadStatusLine item={item} />
        {!working && item.status !== 'done' ? (
          <div className="flex flex-wrap gap-2">
            {item.status === 'failed' && item.retryable ? (
              <Button onClick={onRetry}>
                <RotateCcw aria-hidden className="size-4" /> Retry
              </Button>
            ) : null}
            <Button variant="secondary" onClick={onRemove} aria-label={`Remove ${item.file.name}`}>
              <X aria-hidden className="size-4" /> Remove
            </Button>
          </div>
        ) : null}
      </div>
    </li>
  );
}
