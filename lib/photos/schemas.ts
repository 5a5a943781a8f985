import { z } from 'zod';
import { formatBytes } from '@/lib/format/numbers';

// Photo contracts shared by the uploader, the route handlers and the services.

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

export const photoVariants = ['thumb', 'display', 'original'] as const;
export type PhotoVariant = (typeof photoVariants)[number];

const caption = z
  .string()
  .trim()
  .max(500, 'Keep the caption under 500 characters.')
  .transform((v) => (v === '' ? null : v));

/** The text fields that travel beside the file in a multipart upload. */
export const uploadPhotoFieldsSchema = z.object({
  kind: z.enum(photoKinds, { error: 'Choose what the photo shows.' }),
  caption: caption.nullish().transform((v) => v ?? null),
  uploadKey: z.uuid('The upload key must be a UUID.').optional(),
});
export type UploadPhotoFields = z.infer<typeof uploadPhotoFieldsSchema>;

export const updatePhotoSchema = z
  .object({
    kind: z.enum(photoKinds, { error: 'Choose what the photo shows.' }).optional(),
    caption: caption.nullable().optional(),
  })
  .refine((v) => v.kind !== undefined || v.caption !== undefined, { message: 'Nothing to change.' });
export type UpdatePhotoInput = z.infer<typeof updatePhotoSchema>;

export const photoParamsSchema = z.object({ id: z.uuid() });
export const photoVariantParamsSchema = z.object({ id: z.uuid(), variant: z.enum(photoVariants) });
export const equipmentPhotosParamsSchema = z.object({ id: z.uuid() });

const oneOrMany = <T extends z.ZodType>(item: T) =>
  z
    .union([item, z.array(item)])
    .optional()
    .transform((v) => (v === undefined ? [] : Array.isArray(v) ? v : [v]));

export const listPhotosQuerySchema = z.object({
  kind: oneOrMany(z.enum(photoKinds)),
  cursor: z.string().max(500).optional(),
  limit: z.coerce.number().int().min(1).max(100).default(48),
});
export type ListPhotosQuery = z.infer<typeof listPhotosQuerySchema>;

export const photoVariantQuerySchema = z.object({ download: z.enum(['1']).optional() });

/** File names are shown and offered on download; keep them printable and short. */
export function cleanFileName(name: string | null | undefined): string | null {
  if (!name) return null;
  const cleaned = name.replace(/[\u0000-\u001f\u007f"\\/]/g, '').trim().slice(-200);
  return cleaned === '' ? null : cleaned;
}

/** Kept here for the photo code that reads it from this module; the formatting lives in lib/format. */
export { formatBytes };
