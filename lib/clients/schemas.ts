import { z } from 'zod';
import { listQueryBase, optionalText, requiredText } from '@/lib/api/schemas';

export const createClientSchema = z.object({
  name: requiredText('Name', 120),
  notes: optionalText(2000),
});
export const updateClientSchema = createClientSchema.partial();
export const listClientsQuerySchema = listQueryBase;

export const createContactSchema = z.object({
  name: requiredText('Name', 120),
  email: z
    .string()
    .trim()
    .toLowerCase()
    .transform((v) => (v === '' ? null : v))
    .pipe(z.email('Enter a valid e-mail address.').nullable())
    .nullable()
    .optional(),
  phone: optionalText(40),
  title: optionalText(80),
  receivesReports: z.boolean().default(false),
});
export const updateContactSchema = createContactSchema.partial();

export type CreateClientInput = z.infer<typeof createClientSchema>;
export type UpdateClientInput = z.infer<typeof updateClientSchema>;
export type ListClientsQuery = z.infer<typeof listClientsQuerySchema>;
export type CreateContactInput = z.infer<typeof createContactSchema>;
export type UpdateContactInput = z.infer<typeof updateContactSchema>;
