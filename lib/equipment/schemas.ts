import { z } from 'zod';
import { listQueryBase, optionalText, repeatedParam, requiredText } from '@/lib/api/schemas';
import { REFRIGERANT_IDS } from '@/lib/calc/refrigerants';
import { nameplateSchemaFor } from '@/lib/equipment/nameplate';
import { EQUIPMENT_STATUSES, EQUIPMENT_TYPES, RELATION_KINDS, type EquipmentType } from '@/lib/equipment/types';

const isoDate = z
  .string()
  .trim()
  .regex(/^\d{4}-\d{2}-\d{2}$/, 'Use a date like 2024-05-31.')
  .refine((v) => !Number.isNaN(Date.parse(`${v}T00:00:00Z`)) && new Date(`${v}T00:00:00Z`).toISOString().startsWith(v), 'This date does not exist.')
  .refine((v) => v >= '1950-01-01', 'Dates before 1950 are not accepted.');

const optionalDate = z
  .union([isoDate, z.literal('')])
  .transform((v) => (v === '' ? null : v))
  .nullable()
  .optional();

export const conditionSchema = z
  .number({ message: 'Rate the condition from 1 (failing) to 5 (like new).' })
  .int()
  .min(1, 'Rate the condition from 1 (failing) to 5 (like new).')
  .max(5, 'Rate the condition from 1 (failing) to 5 (like new).');

const commonFields = z.object({
  siteId: z.uuid('Choose a site.'),
  areaId: z.uuid().nullable().optional(),
  systemId: z.uuid().nullable().optional(),
  name: requiredText('Name', 120),
  make: optionalText(80),
  model: optionalText(80),
  serial: optionalText(80),
  manufacturedOn: optionalDate,
  installedOn: optionalDate,
  condition: conditionSchema.nullable().optional(),
  conditionNote: optionalText(1000),
  status: z.enum(EQUIPMENT_STATUSES, { message: 'Choose a status.' }).default('in_service'),
});

function variant<T extends EquipmentType>(type: T) {
  return commonFields.extend({ type: z.literal(type), nameplate: nameplateSchemaFor(type) });
}

const variants = EQUIPMENT_TYPES.map((t) => variant(t)) as unknown as [ReturnType<typeof variant<'condensing_unit'>>, ...ReturnType<typeof variant<EquipmentType>>[]];

function datesInOrder(v: { manufacturedOn?: string | null; installedOn?: string | null }, ctx: z.RefinementCtx) {
  const today = new Date().toISOString().slice(0, 10);
  if (v.installedOn && v.installedOn > today) ctx.addIssue({ code: 'custom', path: ['installedOn'], message: 'The install date is in the future.' });
  if (v.manufacturedOn && v.manufacturedOn > today) ctx.addIssue({ code: 'custom', path: ['manufacturedOn'], message: 'The manufacture date is in the future.' });
  if (v.installedOn && v.manufacturedOn && v.installedOn < v.manufacturedOn) {
    ctx.addIssue({ code: 'custom', path: ['installedOn'], message: 'The install date is before the manufacture date.' });
  }
}

/** One schema per type, discriminated on `type`: shared by the form, the API and CSV import. */
export const createEquipmentSchema = z
  .discriminatedUnion('type', variants, { error: () => 'Choose an equipment type from the list.' })
  .superRefine(datesInOrder);

export const updateEquipmentSchema = commonFields
  .omit({ siteId: true })
  .partial()
  .extend({ nameplate: z.record(z.string(), z.unknown()).optional() })
  .superRefine(datesInOrder);


export const REMOVED_VIEWS = ['exclude', 'only', 'include'] as const;
export type RemovedView = (typeof REMOVED_VIEWS)[number];

export const EQUIPMENT_SORTS = ['name', 'type', 'make', 'model', 'serial', 'condition', 'installedOn', 'updatedAt'] as const;
export type EquipmentSort = (typeof EQUIPMENT_SORTS)[number];

export const listEquipmentQuerySchema = listQueryBase.omit({ archived: true }).extend({
  siteId: z.uuid().optional(),
  areaId: z.uuid().optional(),
  systemId: z.uuid().optional(),
  type: repeatedParam(z.enum(EQUIPMENT_TYPES)),
  condition: repeatedParam(z.coerce.number().int().min(1).max(5)),
  refrigerant: repeatedParam(z.enum(REFRIGERANT_IDS)),
  status: repeatedParam(z.enum(EQUIPMENT_STATUSES)),
  /** Removed units: left out (the default, for pickers and current views), the only ones, or both. */
  removed: z.enum(REMOVED_VIEWS).optional(),
  sort: z.enum(EQUIPMENT_SORTS).default('name'),
  dir: z.enum(['asc', 'desc']).default('asc'),
});

export const createRelationSchema = z.object({
  kind: z.enum(RELATION_KINDS, { message: 'Choose how they relate.' }),
  /** The other piece of equipment; `direction` says which end this one is. */
  otherId: z.uuid('Choose the other equipment.'),
  direction: z.enum(['from', 'to']).default('from'),
});


export type CreateEquipmentInput = z.infer<typeof createEquipmentSchema>;
export type UpdateEquipmentInput = z.infer<typeof updateEquipmentSchema>;
export type ListEquipmentQuery = z.infer<typeof listEquipmentQuerySchema>;
export type CreateRelationInput = z.infer<typeof createRelationSchema>;
