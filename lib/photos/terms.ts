import { formatBytes } from '@/lib/format/numbers';

// Photo words and limits without zod, so that the browser's photo parts (the unit page's photo
// strip, the quick photo button) do not load the schema library; lib/photos/schemas.ts
// re-exports all of it beside the schemas.

export const photoKinds = ['nameplate', 'damage', 'corrosion', 'wiring', 'before', 'after', 'general'] as const;
export type PhotoKind = (typeof photoKinds)[number];

export const photoKindLabels: Record<PhotoKind, string> = {
  nameplate: 'Nameplate',
  damage: 'Damage',
  corrosion: 'Corrosion',
  wiring: 'Wiring',
  before: 'Before',
  after: 'After',
  general: 'General',
};

/** Largest file accepted (a 50-megapixel phone JPEG is about 15–20 MB). */
export const MAX_PHOTO_BYTES = 25 * 1024 * 1024;
/** Room for the multipart framing and the small text fields around the file. */
export const MAX_UPLOAD_OVERHEAD_BYTES = 64 * 1024;
/** Decoded-size limit against decompression bombs: covers 50 MP sensors, refuses a 20000×20000 PNG. */
export const MAX_PHOTO_PIXELS = 75_000_000;
/** Longest side of the display copy, enough to read a nameplate on a desktop screen. */
export const DISPLAY_MAX_SIDE = 2048;
/** Square thumbnail edge: sharp on a 3× phone screen at about 130 CSS px. */
export const THUMB_SIDE = 400;

/** Checked in the browser before sending, so an empty or oversized file is refused at once. */
export function photoFileProblem(file: { size: number }): string | undefined {
  if (file.size === 0) return 'This file is empty. Choose the photo again.';
  if (file.size > MAX_PHOTO_BYTES) return `This file is ${formatBytes(file.size)}; the limit is ${formatBytes(MAX_PHOTO_BYTES)} per photo.`;
  return undefined;
}

/** What the server stores: sniffed from the bytes, whatever the browser claimed. */
export const acceptedPhotoTypes = ['image/jpeg', 'image/png', 'image/webp'] as const;
export type PhotoContentType = (typeof acceptedPhotoTypes)[number];

export { formatBytes };
