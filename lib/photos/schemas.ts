import { z } from 'zod';
import { pageParams } from '@/lib/api/schemas';
import { photoKinds } from '@/lib/photos/terms';

// Photo contracts shared by the uploader, the route handlers and the services.

export * from '@/lib/photos/terms';

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
  ...pageParams(100, 48),
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
