import { z } from 'zod';
import { pageParams, repeatedParam, requiredText } from '@/lib/api/schemas';
import { actionDataSchema } from '@/lib/visits/kinds/action';
import { conditionDataSchema } from '@/lib/visits/kinds/condition';
import { findingDataSchema } from '@/lib/visits/kinds/finding';
import { leakDataSchema } from '@/lib/visits/kinds/leak';
import { noteDataSchema } from '@/lib/visits/kinds/note';
import { partDataSchema } from '@/lib/visits/kinds/part';
import { photoDataSchema } from '@/lib/visits/kinds/photo';
import { readingDataSchema } from '@/lib/visits/kinds/reading';
import { refrigerantDataSchema } from '@/lib/visits/kinds/refrigerant';
import { settingChangeDataSchema } from '@/lib/visits/kinds/setting-change';
import { ENTRY_KINDS, VISIT_REASONS } from '@/lib/visits/terms';

// The visits API's request shapes. Each entry kind's data schema lives in its module under
// lib/visits/kinds/; they are re-exported here so forms, routes and tests have one place to ask.

export * from '@/lib/visits/terms';
export { readingDataSchema, readingFields, type ReadingData, type ReadingKey } from '@/lib/visits/kinds/reading';
export { findingDataSchema } from '@/lib/visits/kinds/finding';
export { actionDataSchema } from '@/lib/visits/kinds/action';
export { settingChangeDataSchema, type SettingChangeData } from '@/lib/visits/kinds/setting-change';
export { partDataSchema } from '@/lib/visits/kinds/part';
export { refrigerantDataSchema, type RefrigerantData } from '@/lib/visits/kinds/refrigerant';
export {
  LEAK_ACTIVITIES,
  LEAK_METHODS,
  LEAK_RESULTS,
  leakActivityLabels,
  leakDataSchema,
  leakMethodLabels,
  leakResultLabels,
  leakResultsFor,
  type LeakActivity,
  type LeakData,
  type LeakMethod,
  type LeakResult,
} from '@/lib/visits/kinds/leak';
export { conditionDataSchema } from '@/lib/visits/kinds/condition';
export { noteDataSchema } from '@/lib/visits/kinds/note';
export { photoDataSchema } from '@/lib/visits/kinds/photo';

const dateTime = z.iso.datetime({ offset: true, message: 'Use a date and time with its offset.' });

const entryBase = { equipmentId: z.uuid('Choose the equipment.'), clientEntryId: z.uuid(), recordedAt: dateTime.optional() };

export const createEntrySchema = z.discriminatedUnion(
  'kind',
  [
    z.object({ ...entryBase, kind: z.literal('reading'), data: readingDataSchema }),
    z.object({ ...entryBase, kind: z.literal('finding'), data: findingDataSchema }),
    z.object({ ...entryBase, kind: z.literal('action'), data: actionDataSchema }),
    z.object({ ...entryBase, kind: z.literal('setting_change'), data: settingChangeDataSchema }),
    z.object({ ...entryBase, kind: z.literal('part'), data: partDataSchema }),
    z.object({ ...entryBase, kind: z.literal('refrigerant'), data: refrigerantDataSchema }),
    z.object({ ...entryBase, kind: z.literal('leak'), data: leakDataSchema }),
    z.object({ ...entryBase, kind: z.literal('condition'), data: conditionDataSchema }),
    z.object({ ...entryBase, kind: z.literal('note'), data: noteDataSchema }),
    z.object({ ...entryBase, kind: z.literal('photo'), data: photoDataSchema }),
  ],
  { error: () => 'Choose what kind of entry this is.' },
);

export const startVisitSchema = z.object({
  /** Made on the phone when the visit is started without signal; a repeat returns the same visit. */
  id: z.uuid().optional(),
  siteId: z.uuid('Choose a site.'),
  reason: z.enum(VISIT_REASONS, { message: 'Choose the reason for the visit.' }),
  startedAt: dateTime.optional(),
  /** The planned visit this one carries out (lib/plans); it is marked started with this visit. */
  planId: z.uuid().optional(),
});

export const closeVisitSchema = z.object({
  summary: requiredText('Summary', 4000),
  endedAt: dateTime.optional(),
  confirmBypassRemoved: z.boolean().default(false),
  /** Made on the phone; a repeat of a close that already went through returns the closed visit. */
  clientCloseId: z.uuid().optional(),
});

export const voidEntrySchema = z.object({ reason: requiredText('Reason', 500) });

export const listVisitsQuerySchema = z.object({
  siteId: z.uuid().optional(),
  status: z.enum(['open', 'closed']).optional(),
  technicianId: z.uuid().optional(),
  /** Closed visits the office has not reviewed yet. */
  review: z.enum(['needed']).optional(),
  ...pageParams(100, 30),
});

/** One page of a unit's history: enough to fill a phone screen or two. */
export const HISTORY_PAGE_SIZE = 25;

export const historyQuerySchema = z.object({
  kind: repeatedParam(z.enum(ENTRY_KINDS)),
  ...pageParams(100, HISTORY_PAGE_SIZE),
});

export type CreateEntryInput = z.infer<typeof createEntrySchema>;
export type StartVisitInput = z.infer<typeof startVisitSchema>;
export type CloseVisitInput = z.infer<typeof closeVisitSchema>;
export type ListVisitsQuery = z.infer<typeof listVisitsQuerySchema>;
export type HistoryQuery = z.infer<typeof historyQuerySchema>;

// tsc fails here when a kind of ENTRY_KINDS has no variant in createEntrySchema.
const everyKindHasAVariant: Exclude<(typeof ENTRY_KINDS)[number], CreateEntryInput['kind']> extends never ? true : false = true;
void everyKindHasAVariant;
