import { z } from 'zod';

export const idParamsSchema = z.object({ id: z.uuid() });

export const listQueryBase = z.object({
  q: z.string().trim().max(200).optional(),
  cursor: z.string().max(500).optional(),
  limit: z.coerce.number().int().min(1).max(200).default(50),
  archived: z.enum(['include', 'only', 'exclude']).default('exclude'),
});

/** Empty strings from forms become null so optional text columns stay clean. */
export const optionalText = (max: number) =>
  z
    .string()
    .trim()
    .max(max, `Use at most ${max} characters.`)
    .transform((v) => (v === '' ? null : v))
    .nullable()
    .optional();

export const requiredText = (label: string, max: number) =>
  z.string().trim().min(1, `${label} is required.`).max(max, `Use at most ${max} characters.`);

/** A query parameter that may repeat (`?type=a&type=b`) read as an array either way. */
export const repeatedParam = <T extends z.ZodType>(item: T) =>
  z
    .union([item, z.array(item)])
    .transform((v) => (Array.isArray(v) ? v : [v]))
    .optional();
