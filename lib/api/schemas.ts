import { z } from 'zod';
import { INVALID_TEXT_MESSAGE, isValidText, stripBidiControls } from '@/lib/api/text';

/**
 * The one text schema under every name, caption and note: NUL and lone surrogates are refused
 * (PostgreSQL cannot store the first, the second is not Unicode) and bidirectional controls are
 * removed, then the text is trimmed.
 */
export const safeString = () => z.string().refine(isValidText, INVALID_TEXT_MESSAGE).overwrite(stripBidiControls).trim();

export const idParamsSchema = z.object({ id: z.uuid() });

/** A list page's size: a whole number from 1 to `max`, `fallback` when the query leaves it out. */
export const pageLimit = (max: number, fallback: number) => z.coerce.number().int().min(1).max(max).default(fallback);

/** A keyset list's paging parameters (lib/api/paging.ts): the cursor it handed out, and the page size. */
export const pageParams = (max: number, fallback: number) => ({ cursor: z.string().max(500).optional(), limit: pageLimit(max, fallback) });

export const listQueryBase = z.object({
  q: safeString().max(200).optional(),
  cursor: safeString().max(500).optional(),
  limit: pageLimit(200, 50),
  archived: z.enum(['include', 'only', 'exclude']).default('exclude'),
});

/** Empty strings from forms become null so optional text columns stay clean. */
export const optionalText = (max: number) =>
  safeString()
    .max(max, `Use at most ${max} characters.`)
    .transform((v) => (v === '' ? null : v))
    .nullable()
    .optional();

export const requiredText = (label: string, max: number) =>
  safeString().min(1, `${label} is required.`).max(max, `Use at most ${max} characters.`);

/** A query parameter that may repeat (`?type=a&type=b`) read as an array either way. */
export const repeatedParam = <T extends z.ZodType>(item: T) =>
  z
    .union([item, z.array(item)])
    .transform((v) => (Array.isArray(v) ? v : [v]))
    .optional();
