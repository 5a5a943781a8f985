'use client';

import { Columns2, ImageOff, LoaderCircle } from 'lucide-react';
import dynamic from 'next/dynamic';
import { useState } from 'react';
import { formatPhotoDay, PhotoKindLabel, photoKindIcons } from '@/components/photos/photo-kind';
import { PhotoUploader } from '@/components/photos/photo-uploader';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { EmptyState } from '@/components/ui/card';
import type { PhotoDto } from '@/lib/photos/dto';
import { usePhotos } from '@/lib/photos/hooks';
import { photoKindLabels, photoKinds, type PhotoKind } from '@/lib/photos/terms';
import { Section } from '@/components/ui/section';
import { FilterChip } from '@/components/ui/filter-chip';

// The photos section of an equipment page: uploader (for those who may upload), filter by kind,
// thumbnails, the full-screen viewer and the side-by-side comparison.

// The viewer and the comparison open on a tap: their code (zoom, edit, delete) loads then.
const PhotoViewer = dynamic(() => import('@/components/photos/photo-viewer').then((m) => m.PhotoViewer), { ssr: false });
const PhotoCompare = dynamic(() => import('@/components/photos/photo-compare').then((m) => m.PhotoCompare), { ssr: false });

export function EquipmentPhotos({ equipmentId }: { equipmentId: string }) {
  const [kind, setKind] = useState<PhotoKind | null>(null);
  const [open, setOpen] = useState<number | null>(null);
  const [comparing, setComparing] = useState(false);
  const query = usePhotos(equipmentId, kind ? [kind] : []);
  const pages = query.data?.pages ?? [];
  const first = pages[0];
  const photos = pages.flatMap((p) => p.items);
  const timeZone = first?.timeZone ?? 'UTC';
  // Once known, the uploader stays mounted whatever the list does next: unmounting it would drop
  // photos still on their way.
  const [canUpload, setCanUpload] = useState(false);
  if (first && first.canUpload !== canUpload) setCanUpload(first.canUpload);
  const viewing = open !== null && photos.length > 0 ? Math.min(open, photos.length - 1) : null;

  return (
    <Section
      id="photos-h"
      title={<>Photos {first ? <span className="font-normal text-slate-600">({first.total})</span> : null}</>}
      actions={
        <>
          {photos.length >= 2 ? (
            <Button variant="secondary" onClick={() => setComparing(true)}>
              <Columns2 aria-hidden className="size-4" /> Compare two
            </Button>
          ) : null}
        </>
      }
    >

      {canUpload ? <PhotoUploader equipmentId={equipmentId} /> : null}

      {first && first.total > 0 ? (
        <div role="group" aria-label="Show photos of kind" className="flex flex-wrap gap-2">
          <FilterChip pressed={kind === null} onClick={() => setKind(null)}>{`All (${first.total})`}</FilterChip>
          {photoKinds
            .filter((k) => first.kindCounts[k] > 0 || kind === k)
            .map((k) => {
              const Icon = photoKindIcons[k];
              return (
                <FilterChip
                  key={k}
                  pressed={kind === k}
                  onClick={() => setKind(kind === k ? null : k)}
                  icon={<Icon aria-hidden className="size-4" />}
                >
                  {`${photoKindLabels[k]} (${first.kindCounts[k]})`}
                </FilterChip>
              );
            })}
        </div>
      ) : null}

      {query.isPending ? (
        <p className="flex items-center gap-2 text-slate-700" role="status">
          <LoaderCircle aria-hidden className="size-4 animate-spin" /> Loading photos…
        </p>
      ) : query.isError ? (
        <Alert tone="danger" title="The photos could not be loaded.">
          {query.error.message}{' '}
          <button type="button" className="font-semibold underline" onClick={() => void query.refetch()}>
            Try again
          </button>
        </Alert>
      ) : photos.length === 0 ? (
        <EmptyState title={kind ? `No ${photoKindLabels[kind].toLowerCase()} photos.` : 'No photos yet.'}>
          {first?.canUpload ? 'Take or choose photos above: nameplates, damage, corrosion, wiring, before and after.' : 'Photos taken on visits will appear here.'}
        </EmptyState>
      ) : (
        <ul className="grid grid-cols-2 gap-3 sm:grid-cols-3 lg:grid-cols-4" aria-label="Photos">
          {photos.map((p, i) => (
            <li key={p.id}>
              <PhotoTile photo={p} timeZone={timeZone} onOpen={() => setOpen(i)} />
            </li>
          ))}
        </ul>
      )}

      {query.hasNextPage ? (
        <Button variant="secondary" onClick={() => void query.fetchNextPage()} disabled={query.isFetchingNextPage}>
          {query.isFetchingNextPage ? 'Loading…' : 'Show more photos'}
        </Button>
      ) : null}

      {viewing !== null ? <PhotoViewer photos={photos} index={viewing} timeZone={timeZone} onIndex={setOpen} onClose={() => setOpen(null)} /> : null}
      {comparing ? <PhotoCompare photos={photos} timeZone={timeZone} onClose={() => setComparing(false)} /> : null}
    </Section>
  );
}

/** One thumbnail that opens the viewer; also usable in a timeline entry. */
export function PhotoTile({ photo, timeZone, onOpen }: { photo: PhotoDto; timeZone: string; onOpen: () => void }) {
  const [broken, setBroken] = useState(false);
  const day = formatPhotoDay(photo.sortAt, timeZone);
  return (
    <button
      type="button"
      onClick={onOpen}
      className="group block w-full overflow-hidden rounded-lg border border-slate-200 bg-white text-left shadow-sm hover:border-ice-500"
      aria-label={`Open ${photoKindLabels[photo.kind].toLowerCase()} photo from ${day}${photo.caption ? `: ${photo.caption}` : ''}`}
    >
      <span className="relative block aspect-square bg-slate-100">
        {broken ? (
          <span className="absolute inset-0 flex flex-col items-center justify-center gap-1 p-2 text-center text-sm text-slate-700">
            <ImageOff aria-hidden className="size-6" /> Image unavailable
          </span>
        ) : (
          <img src={photo.urls.thumb} alt="" loading="lazy" className="size-full object-cover" onError={() => setBroken(true)} data-testid="photo-thumb" />
        )}
      </span>
      <span className="block space-y-0.5 p-2 text-sm">
        <PhotoKindLabel kind={photo.kind} className="text-slate-900" />
        <span className="block text-slate-700">{day}</span>
        {photo.caption ? <span className="block truncate text-slate-700">{photo.caption}</span> : null}
      </span>
    </button>
  );
}
