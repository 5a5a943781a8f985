'use client';

import { ChevronLeft, ChevronRight, Download, LoaderCircle, Pencil, Trash2, X } from 'lucide-react';
import { useEffect, useId, useState } from 'react';
import { FullScreenDialog } from '@/components/photos/full-screen-dialog';
import { formatPhotoTime, PhotoKindLabel } from '@/components/photos/photo-kind';
import { useZoomPan } from '@/components/photos/use-zoom-pan';
import { darkButton as dark, ZoomButtons } from '@/components/photos/zoom-buttons';
import { ApiError } from '@/lib/api/client';
import type { PhotoDto } from '@/lib/photos/dto';
import { useDeletePhoto, useUpdatePhoto } from '@/lib/photos/hooks';
import { formatBytes, photoKindLabels, photoKinds, type PhotoKind } from '@/lib/photos/terms';
import { cn } from '@/lib/utils';
import { optionsOf, SelectOptions } from '@/components/forms/select-options';

// Full-screen photo with zoom and pan. Past 2× it swaps the display copy for the original, so
// small nameplate print stays sharp. Left/right page through the photos when not zoomed in.

export function PhotoViewer({
  photos,
  index,
  timeZone,
  onIndex,
  onClose,
}: {
  photos: PhotoDto[];
  index: number;
  timeZone: string;
  onIndex: (index: number) => void;
  onClose: () => void;
}) {
  const titleId = useId();
  const photo = photos[index];
  const zoom = useZoomPan();
  const [fullLoaded, setFullLoaded] = useState<string | null>(null);
  const [editing, setEditing] = useState(false);
  const wantFull = zoom.view.scale >= 2;

  // Another photo starts fitted, without the previous one's zoom or edit form.
  const { reset } = zoom;
  useEffect(() => {
    reset();
    setEditing(false);
  }, [index, reset]);

  useEffect(() => {
    if (!photo || !wantFull || fullLoaded === photo.id) return;
    const img = new Image();
    img.onload = () => setFullLoaded(photo.id);
    img.src = photo.urls.original;
  }, [photo, wantFull, fullLoaded]);

  if (!photo) return null;
  const showFull = wantFull && fullLoaded === photo.id;
  const when = photo.takenAt ? `Taken ${formatPhotoTime(photo.takenAt, timeZone)}` : `Uploaded ${formatPhotoTime(photo.uploadedAt, timeZone)}`;
  const go = (to: number) => {
    if (to >= 0 && to < photos.length) onIndex(to);
  };

  return (
    <FullScreenDialog labelledBy={titleId} onClose={onClose} initialFocus="[data-photo-stage]">
      <header className="flex flex-wrap items-center gap-2 border-b border-slate-800 px-3 py-2">
        <h2 id={titleId} className="order-1 min-w-0 flex-1 text-base font-semibold">
          <PhotoKindLabel kind={photo.kind} /> <span className="font-normal text-slate-300">· {when}</span>
          <span className="sr-only">
            , photo {index + 1} of {photos.length}
          </span>
        </h2>
        {/* On a phone the controls take their own row under the title; the Close button stays top right. */}
        <div className="order-3 flex w-full flex-wrap items-center gap-2 sm:order-2 sm:w-auto">
          <span className="text-sm text-slate-300" aria-hidden>
            {index + 1} / {photos.length}
          </span>
          <ZoomButtons zoom={zoom} />
          <a className={dark} href={photo.urls.download} aria-label="Download the original">
            <Download aria-hidden className="size-5" />
          </a>
        </div>
        <button type="button" className={cn(dark, 'order-2 sm:order-3')} onClick={onClose} aria-label="Close">
          <X aria-hidden className="size-5" />
        </button>
      </header>

      <div
        data-photo-stage
        ref={zoom.measure}
        tabIndex={0}
        role="img"
        aria-label={`${photoKindLabels[photo.kind]} photo${photo.caption ? `: ${photo.caption}` : ''}. Plus and minus zoom, arrow keys move when zoomed in, zero fits, Escape closes.`}
        className={cn('relative min-h-0 flex-1 touch-none select-none overflow-hidden', zoom.view.scale > 1 ? 'cursor-grab' : 'cursor-zoom-in')}
        {...zoom.handlers}
        onKeyDown={(e) => {
          if (zoom.handlers.onKeyDown(e)) return;
          if (e.key === 'ArrowLeft') go(index - 1);
          else if (e.key === 'ArrowRight') go(index + 1);
        }}
      >
        <img
          src={showFull ? photo.urls.original : photo.urls.display}
          alt=""
          draggable={false}
          className="absolute inset-0 size-full object-contain"
          style={{ transform: zoom.transform, transformOrigin: 'center center' }}
        />
        {wantFull && !showFull ? (
          <p className="absolute bottom-2 left-2 flex items-center gap-1.5 rounded bg-slate-900/90 px-2 py-1 text-sm">
            <LoaderCircle aria-hidden className="size-4 animate-spin" /> Loading full resolution…
          </p>
        ) : showFull ? (
          <p className="absolute bottom-2 left-2 rounded bg-slate-900/90 px-2 py-1 text-sm">Full resolution</p>
        ) : null}
      </div>

      <footer className="space-y-2 border-t border-slate-800 px-3 py-2">
        <div className="flex flex-wrap items-center gap-2">
          <button type="button" className={dark} onClick={() => go(index - 1)} disabled={index === 0} aria-label="Previous photo">
            <ChevronLeft aria-hidden className="size-5" />
          </button>
          <button type="button" className={dark} onClick={() => go(index + 1)} disabled={index >= photos.length - 1} aria-label="Next photo">
            <ChevronRight aria-hidden className="size-5" />
          </button>
          <div className="min-w-0 flex-1 text-sm">
            {photo.caption ? <p className="font-semibold">{photo.caption}</p> : null}
            <p className="text-slate-300">
              {photo.uploadedBy.name} · {photo.width} × {photo.height} · {formatBytes(photo.byteSize)}
              {photo.locationKept ? ' · location kept' : ''}
            </p>
          </div>
          {photo.canEdit && !editing ? (
            <button type="button" className={dark} onClick={() => setEditing(true)}>
              <Pencil aria-hidden className="size-4" /> Edit
            </button>
          ) : null}
        </div>
        {editing ? <EditPhoto photo={photo} onDone={() => setEditing(false)} onDeleted={() => (photos.length > 1 ? go(Math.max(0, index - 1)) : onClose())} /> : null}
      </footer>
    </FullScreenDialog>
  );
}

function EditPhoto({ photo, onDone, onDeleted }: { photo: PhotoDto; onDone: () => void; onDeleted: () => void }) {
  const id = useId();
  const update = useUpdatePhoto();
  const remove = useDeletePhoto();
  const [kind, setKind] = useState<PhotoKind>(photo.kind);
  const [caption, setCaption] = useState(photo.caption ?? '');
  const [confirming, setConfirming] = useState(false);
  const [error, setError] = useState<string>();
  const field = 'block min-h-11 w-full rounded-md border border-slate-500 bg-slate-900 px-3 text-base text-white';

  async function save() {
    setError(undefined);
    try {
      await update.mutateAsync({ id: photo.id, input: { kind, caption } });
      onDone();
    } catch (e) {
      setError(e instanceof ApiError ? e.message : 'Nothing was changed. Try again.');
    }
  }

  async function destroy() {
    setError(undefined);
    try {
      await remove.mutateAsync(photo.id);
      onDeleted();
    } catch (e) {
      setError(e instanceof ApiError ? e.message : 'Nothing was deleted. Try again.');
    }
  }

  return (
    <div className="grid gap-2 sm:grid-cols-[12rem_1fr_auto] sm:items-end">
      <div>
        <label htmlFor={`${id}-kind`} className="block text-sm font-semibold">
          Kind
        </label>
        <select id={`${id}-kind`} className={field} value={kind} onChange={(e) => setKind(e.target.value as PhotoKind)}>
          <SelectOptions options={optionsOf(photoKinds, photoKindLabels)} />
        </select>
      </div>
      <div>
        <label htmlFor={`${id}-caption`} className="block text-sm font-semibold">
          Caption
        </label>
        <input id={`${id}-caption`} className={field} value={caption} maxLength={500} onChange={(e) => setCaption(e.target.value)} />
      </div>
      <div className="flex flex-wrap gap-2">
        <button type="button" className={cn(dark, 'border-ice-300 bg-ice-800 hover:bg-ice-700')} onClick={() => void save()} disabled={update.isPending}>
          {update.isPending ? 'Saving…' : 'Save'}
        </button>
        <button type="button" className={dark} onClick={onDone}>
          Cancel
        </button>
        {confirming ? (
          <button type="button" className={cn(dark, 'border-red-300 bg-red-800 hover:bg-red-700')} onClick={() => void destroy()} disabled={remove.isPending}>
            <Trash2 aria-hidden className="size-4" /> {remove.isPending ? 'Deleting…' : 'Yes, delete this photo'}
          </button>
        ) : (
          <button type="button" className={dark} onClick={() => setConfirming(true)}>
            <Trash2 aria-hidden className="size-4" /> Delete
          </button>
        )}
      </div>
      {error ? (
        <p role="alert" className="text-sm font-semibold text-red-200 sm:col-span-3">
          {error}
        </p>
      ) : null}
    </div>
  );
}
