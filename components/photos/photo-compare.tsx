'use client';

import { ArrowLeftRight, Info, X } from 'lucide-react';
import { useId, useState } from 'react';
import { FullScreenDialog } from '@/components/photos/full-screen-dialog';
import { formatPhotoDay, PhotoKindLabel, photoDayKey, timeApart } from '@/components/photos/photo-kind';
import { useZoomPan } from '@/components/photos/use-zoom-pan';
import { darkButton as dark, ZoomButtons } from '@/components/photos/zoom-buttons';
import type { PhotoDto } from '@/lib/photos/dto';
import { photoKindLabels } from '@/lib/photos/terms';

// Two photos of the same equipment side by side (stacked on a phone), earlier on the left, with
// one zoom and pan for both so the same spot lines up: corrosion then and now.

/**
 * The oldest and newest photo of one kind (the kind whose photos span the longest time), so the
 * first view is "the same thing, then and now"; any two photos when no kind has two.
 */
export function defaultPair(photos: PhotoDto[]): [string, string] | null {
  if (photos.length < 2) return null;
  const byTime = [...photos].sort((a, b) => a.sortAt.localeCompare(b.sortAt));
  let best: [PhotoDto, PhotoDto] | null = null;
  for (const kind of new Set(byTime.map((p) => p.kind))) {
    const same = byTime.filter((p) => p.kind === kind);
    if (same.length < 2) continue;
    const pair: [PhotoDto, PhotoDto] = [same[0]!, same[same.length - 1]!];
    const span = (x: [PhotoDto, PhotoDto]) => new Date(x[1].sortAt).getTime() - new Date(x[0].sortAt).getTime();
    if (!best || span(pair) > span(best)) best = pair;
  }
  const chosen = best ?? [byTime[0]!, byTime[byTime.length - 1]!];
  return [chosen[0].id, chosen[1].id];
}

export function PhotoCompare({ photos, timeZone, onClose }: { photos: PhotoDto[]; timeZone: string; onClose: () => void }) {
  const titleId = useId();
  const selectId = useId();
  const pair = defaultPair(photos);
  const [leftId, setLeftId] = useState(pair?.[0] ?? '');
  const [rightId, setRightId] = useState(pair?.[1] ?? '');
  const zoom = useZoomPan();
  const ordered = [...photos].sort((a, b) => a.sortAt.localeCompare(b.sortAt));
  const left = photos.find((p) => p.id === leftId);
  const right = photos.find((p) => p.id === rightId);
  const option = (p: PhotoDto) => `${formatPhotoDay(p.sortAt, timeZone)} · ${photoKindLabels[p.kind]}${p.caption ? ` · ${p.caption}` : ''}`;
  const sameDay = left && right && photoDayKey(left.sortAt, timeZone) === photoDayKey(right.sortAt, timeZone);

  return (
    <FullScreenDialog labelledBy={titleId} onClose={onClose}>
      <header className="flex flex-wrap items-center gap-2 border-b border-slate-800 px-3 py-2">
        <h2 id={titleId} className="order-1 min-w-0 flex-1 text-base font-semibold">
          Compare photos
          {left && right ? <span className="font-normal text-slate-300"> · {timeApart(left.sortAt, right.sortAt, timeZone)}</span> : null}
        </h2>
        <div className="order-3 flex w-full flex-wrap items-center gap-2 sm:order-2 sm:w-auto">
          <ZoomButtons zoom={zoom} both />
          <button
            type="button"
            className={dark}
            onClick={() => {
              setLeftId(rightId);
              setRightId(leftId);
            }}
            aria-label="Swap sides"
          >
            <ArrowLeftRight aria-hidden className="size-5" />
          </button>
        </div>
        <button type="button" className={`${dark} order-2 sm:order-3`} onClick={onClose} aria-label="Close">
          <X aria-hidden className="size-5" />
        </button>
      </header>
      {sameDay ? (
        <p className="flex items-center gap-2 bg-slate-900 px-3 py-2 text-sm" role="status">
          <Info aria-hidden className="size-4 shrink-0" />
          <span>
            <span className="font-semibold">Note: </span>both photos are from the same day. Choose photos from different dates to see change over time.
          </span>
        </p>
      ) : null}
      <div className="grid min-h-0 flex-1 grid-rows-2 gap-px bg-slate-800 md:grid-cols-2 md:grid-rows-1">
        {[
          { side: 'Left', photo: left, value: leftId, set: setLeftId },
          { side: 'Right', photo: right, value: rightId, set: setRightId },
        ].map(({ side, photo, value, set }) => (
          <section key={side} className="flex min-h-0 flex-col bg-slate-950" aria-label={`${side} photo`}>
            <div className="flex flex-wrap items-center gap-2 px-3 py-2">
              <label htmlFor={`${selectId}-${side}`} className="sr-only">
                Choose the {side.toLowerCase()} photo
              </label>
              <select
                id={`${selectId}-${side}`}
                value={value}
                onChange={(e) => set(e.target.value)}
                className="min-h-11 min-w-0 flex-1 rounded-md border border-slate-500 bg-slate-900 px-2 text-sm text-white"
              >
                {ordered.map((p) => (
                  <option key={p.id} value={p.id}>
                    {option(p)}
                  </option>
                ))}
              </select>
              {photo ? (
                <p className="text-sm">
                  <span className="block text-lg font-bold">{formatPhotoDay(photo.sortAt, timeZone)}</span>
                  <PhotoKindLabel kind={photo.kind} className="text-slate-200" />
                </p>
              ) : null}
            </div>
            <div
              ref={zoom.measure}
              tabIndex={0}
              role="img"
              aria-label={photo ? `${side}: ${option(photo)}. Plus and minus zoom both photos, arrow keys move.` : `${side}: no photo chosen`}
              className="relative min-h-0 flex-1 touch-none select-none overflow-hidden"
              {...zoom.handlers}
            >
              {photo ? (
                <img
                  src={photo.urls.display}
                  alt=""
                  draggable={false}
                  className="absolute inset-0 size-full object-contain"
                  style={{ transform: zoom.transform, transformOrigin: 'center center' }}
                />
              ) : null}
            </div>
          </section>
        ))}
      </div>
    </FullScreenDialog>
  );
}
