import { z } from 'zod';
import { listQueryBase, optionalText, requiredText } from '@/lib/api/schemas';
import { labelled } from '@/lib/labelled';

function isTimeZone(value: string): boolean {
  try {
    new Intl.DateTimeFormat('en-US', { timeZone: value });
    return true;
  } catch {
    return false;
  }
}

export const timeZoneSchema = z.string().trim().refine(isTimeZone, 'Choose a valid time zone, e.g. America/Denver.');

// Elevation bounds cover every inhabited place (Dead Sea shore to high Andean towns). A number
// or numeric text (forms) only: null, "", [] or true are refused rather than coerced to 0 m,
// which would silently shift every saturation temperature computed for the site.
export const elevationMSchema = z.preprocess(
  (v) => (typeof v === 'string' && v.trim() !== '' ? Number(v) : v),
  z
    .number({ message: 'Enter the elevation as a number.' })
    .min(-500, 'Elevation must be at least −500 m.')
    .max(6000, 'Elevation must be at most 6000 m.'),
);

const countrySchema = z.string().trim().length(2, 'Use the two-letter country code.').toUpperCase();

const siteFields = {
  name: requiredText('Name', 120),
  addressLine1: optionalText(200),
  addressLine2: optionalText(200),
  city: optionalText(100),
  region: optionalText(100),
  postalCode: optionalText(20),
  country: countrySchema,
  timeZone: timeZoneSchema,
  elevationM: elevationMSchema,
  accessNotes: optionalText(2000),
};

export const createSiteSchema = z.object({
  clientId: z.uuid('Choose a client.'),
  ...siteFields,
  country: countrySchema.default('US'),
  timeZone: timeZoneSchema.default('America/Chicago'),
  elevationM: elevationMSchema.default(0),
});
// Built without the create defaults: a field left out of an edit keeps its stored value (zod
// applies an inner default even under .partial(), which turned every edit's elevation into 0 m).
export const updateSiteSchema = z.object(siteFields).partial();
export const listSitesQuerySchema = listQueryBase.extend({ clientId: z.uuid().optional() });

export const { values: areaKinds, labels: areaKindLabels } = labelled({
  walk_in_cooler: 'Walk-in cooler',
  walk_in_freezer: 'Walk-in freezer',
  reach_in: 'Reach-in',
  display_case: 'Display case line',
  roof: 'Roof',
  mechanical_room: 'Mechanical room',
  kitchen: 'Kitchen',
  sales_floor: 'Sales floor',
  warehouse: 'Warehouse',
  outdoor: 'Outdoor pad',
  other: 'Other',
});

export const createAreaSchema = z.object({
  name: requiredText('Name', 120),
  kind: z.enum(areaKinds, { message: 'Choose the kind of place.' }).default('other'),
  notes: optionalText(2000),
});
export const updateAreaSchema = createAreaSchema.partial();
export const siteAreaParamsSchema = z.object({ id: z.uuid(), areaId: z.uuid() });

export type CreateSiteInput = z.infer<typeof createSiteSchema>;
export type UpdateSiteInput = z.infer<typeof updateSiteSchema>;
export type ListSitesQuery = z.infer<typeof listSitesQuerySchema>;
export type CreateAreaInput = z.infer<typeof createAreaSchema>;
export type UpdateAreaInput = z.infer<typeof updateAreaSchema>;
export type AreaKind = (typeof areaKinds)[number];
