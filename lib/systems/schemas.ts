import { z } from 'zod';
import { listQueryBase, optionalText, requiredText } from '@/lib/api/schemas';
import { REFRIGERANT_IDS } from '@/lib/calc/refrigerants';

// A system is one refrigerant circuit on a site: the units on it share its charge and refrigerant.
export const createSystemSchema = z.object({
  siteId: z.uuid('Choose a site.'),
  areaId: z.uuid().nullable().optional(),
  name: requiredText('Name', 120),
  refrigerant: z.enum(REFRIGERANT_IDS, { message: 'Choose the refrigerant by its ASHRAE number.' }),
  fullChargeKg: z.number({ message: 'Full charge must be a number.' }).positive('Full charge must be above zero.').max(20_000).nullable().optional(),
  application: z.enum(['commercial_refrigeration', 'industrial_process', 'comfort_cooling'], { message: 'Choose the application.' }),
  designBoxTempC: z.number({ message: 'Design box temperature must be a number.' }).min(-60).max(30).nullable().optional(),
  maintenanceIntervalDays: z.number().int().min(7).max(1095).nullable().optional(),
  notes: optionalText(2000),
});
export const updateSystemSchema = createSystemSchema.omit({ siteId: true }).partial();
export const listSystemsQuerySchema = listQueryBase.extend({ siteId: z.uuid().optional() });

export type CreateSystemInput = z.infer<typeof createSystemSchema>;
export type UpdateSystemInput = z.infer<typeof updateSystemSchema>;
export type ListSystemsQuery = z.infer<typeof listSystemsQuerySchema>;
