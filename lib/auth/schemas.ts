import { z } from 'zod';

export const credentialsSchema = z.object({
  email: z.string().trim().toLowerCase().pipe(z.email('Enter a valid e-mail address.')),
  password: z.string().min(1, 'Enter your password.').max(200),
});

export const magicLinkSchema = z.object({
  email: z.string().trim().toLowerCase().pipe(z.email('Enter a valid e-mail address.')),
});

export const passwordSchema = z
  .string()
  .min(10, 'Use at least 10 characters.')
  .max(200, 'Use at most 200 characters.');
