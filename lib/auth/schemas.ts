import { z } from 'zod';
import { safeString } from '@/lib/api/schemas';
import { INVALID_TEXT_MESSAGE, isValidText } from '@/lib/api/text';

const email = safeString().toLowerCase().pipe(z.email('Enter a valid e-mail address.'));

export const credentialsSchema = z.object({
  email,
  password: z.string().min(1, 'Enter your password.').max(200).refine(isValidText, INVALID_TEXT_MESSAGE),
});

export const magicLinkSchema = z.object({ email });

export const passwordSchema = z
  .string()
  .min(10, 'Use at least 10 characters.')
  .max(200, 'Use at most 200 characters.')
  .refine(isValidText, INVALID_TEXT_MESSAGE);
