import { z } from 'zod';
import { optionalText, repeatedParam, requiredText } from '@/lib/api/schemas';
import { REFRIGERANT_IDS } from '@/lib/calc/refrigerants';

export const VISIT_REASONS = ['no_cooling', 'maintenance', 'install', 'inspection', 'leak_check', 'follow_up'] as const;
export type VisitReason = (typeof VISIT_REASONS)[number];
export const visitReasonLabels: Record<VisitReason, string> = {
  no_cooling: 'No-cooling call',
  maintenance: 'Maintenance',
  install: 'Install',
  inspection: 'Inspection',
  leak_check: 'Leak check',
  follow_up: 'Follow-up',
};

export const SEVERITIES = ['safety', 'down', 'degraded', 'minor'] as const;
export type Severity = (typeof SEVERITIES)[number];
export const severityLabels: Record<Severity, string> = {
  safety: 'Safety',
  down: 'Down',
  degraded: 'Degraded',
  minor: 'Minor',
};

export const ENTRY_KINDS = ['reading', 'finding', 'action', 'setting_change', 'part', 'refrigerant', 'leak', 'condition', 'note', 'photo'] as const;
export type EntryKind = (typeof ENTRY_KINDS)[number];
export const entryKindLabels: Record<EntryKind, string> = {
  reading: 'Readings',
  finding: 'Finding',
  action: 'Action',
  setting_change: 'Setting change',
  part: 'Part replaced',
  refrigerant: 'Refrigerant',
  leak: 'Leak work',
  condition: 'Condition',
  note: 'Note',
  photo: 'Photo',
};

const dateTime = z.iso.datetime({ offset: true, message: 'Use a date and time with its offset.' });

// Readings are SI: kPa gauge, °C, V, A. Ranges cover every plausible field value (deep vacuum
// to CO2 high side; −60 °C freezers to 90 °C discharge lines) and refuse typos beyond them.
const kpaG = (label: string) => z.number({ message: `${label} must be a number.` }).min(-101, `${label} is below a full vacuum.`).max(14_000, `${label} is above any system's pressure.`);
const tempC = (label: string) => z.number({ message: `${label} must be a number.` }).min(-70, `${label} is below −70 °C.`).max(150, `${label} is above 150 °C.`);
const volts = (label: string) => z.number({ message: `${label} must be a number.` }).min(0, `${label} cannot be negative.`).max(1000, `${label} is above 1000 V.`);
const amps = (label: string) => z.number({ message: `${label} must be a number.` }).min(0, `${label} cannot be negative.`).max(2000, `${label} is above 2000 A.`);

export const readingFields = {
  suctionKpaG: kpaG('Suction pressure'),
  dischargeKpaG: kpaG('Discharge pressure'),
  suctionLineC: tempC('Suction-line temperature'),
  liquidLineC: tempC('Liquid-line temperature'),
  boxC: tempC('Box (return air) temperature'),
  supplyAirC: tempC('Supply air temperature'),
  ambientC: tempC('Ambient temperature'),
  voltsL1L2: volts('L1–L2'),
  voltsL2L3: volts('L2–L3'),
  voltsL1L3: volts('L1–L3'),
  controlVolts: volts('Control voltage'),
  compressorAmps: amps('Compressor current'),
  fanAmps: amps('Fan current'),
};
export type ReadingKey = keyof typeof readingFields;

export const readingDataSchema = z
  .object(Object.fromEntries(Object.entries(readingFields).map(([k, s]) => [k, s.nullable().optional()])) as { [K in ReadingKey]: z.ZodOptional<z.ZodNullable<(typeof readingFields)[K]>> })
  .strict()
  .refine((d) => Object.values(d).some((v) => v !== null && v !== undefined), { message: 'Enter at least one reading.' });

export const findingDataSchema = z.object({
  text: requiredText('What was found', 2000),
  severity: z.enum(SEVERITIES, { message: 'Choose a severity.' }),
  raiseFollowUp: z.boolean().default(false),
  followUpTitle: optionalText(200),
});

export const actionDataSchema = z
  .object({
    text: requiredText('What was done', 2000),
    // A jumper or bypass across a safety or operating control, for diagnosis only.
    bypassedControl: z.boolean().default(false),
    bypassDescription: optionalText(300),
  })
  .refine((d) => !d.bypassedControl || Boolean(d.bypassDescription), { message: 'Say which control was bypassed.', path: ['bypassDescription'] });

const lowSettings = z.object({ cutInKpaG: kpaG('Cut-in'), differentialKpa: z.number().min(0).max(7000) });
const highSettings = z.object({ cutOutKpaG: kpaG('Cut-out'), differentialKpa: z.number().min(0).max(7000) });
const thermostatSettings = z.object({ setpointC: tempC('Setpoint'), differentialK: z.number().min(0).max(30) });

export const settingChangeDataSchema = z.discriminatedUnion('control', [
  z.object({ control: z.literal('low'), asFound: lowSettings, asLeft: lowSettings }),
  z.object({ control: z.literal('high'), asFound: highSettings, asLeft: highSettings }),
  z.object({ control: z.literal('thermostat'), asFound: thermostatSettings, asLeft: thermostatSettings }),
]);

export const partDataSchema = z.object({
  part: requiredText('Part', 200),
  quantity: z.number().int().min(1, 'Quantity must be at least 1.').max(1000),
  oldSerial: optionalText(80),
  newSerial: optionalText(80),
  // The whole component was replaced: retire this record and register its replacement.
  replacesEquipment: z.boolean().default(false),
});

export const refrigerantDataSchema = z.object({
  direction: z.enum(['added', 'recovered'], { message: 'Added or recovered?' }),
  amountKg: z.number({ message: 'Amount must be a number.' }).positive('Amount must be above zero.').max(2000, 'Amount is above 2000 kg.'),
  refrigerant: z.enum(REFRIGERANT_IDS, { message: 'Choose the refrigerant by its ASHRAE number.' }),
  cylinderId: optionalText(60),
  technicianCert: optionalText(60),
});

// Leak work as records: the inspection, the repair and the two verification tests that
// 40 CFR 82.157 asks for after a leak-rate exceedance (names of the tests are the regulation's).
export const LEAK_ACTIVITIES = ['inspection', 'repair', 'initial_verification', 'follow_up_verification'] as const;
export type LeakActivity = (typeof LEAK_ACTIVITIES)[number];
export const leakActivityLabels: Record<LeakActivity, string> = {
  inspection: 'Leak inspection',
  repair: 'Leak repair',
  initial_verification: 'Initial verification test',
  follow_up_verification: 'Follow-up verification test',
};

/** Generic ways of finding or ruling out a leak; no open-flame (halide) method, since A2L/A3 refrigerants are flammable. */
export const LEAK_METHODS = ['electronic_detector', 'ultrasonic', 'bubble_solution', 'fluorescent_dye', 'pressure_test', 'vacuum_test'] as const;
export type LeakMethod = (typeof LEAK_METHODS)[number];
export const leakMethodLabels: Record<LeakMethod, string> = {
  electronic_detector: 'Electronic leak detector',
  ultrasonic: 'Ultrasonic detector',
  bubble_solution: 'Bubble solution',
  fluorescent_dye: 'Fluorescent dye and UV lamp',
  pressure_test: 'Standing pressure test (dry nitrogen)',
  vacuum_test: 'Vacuum decay test',
};

export const LEAK_RESULTS = ['leak_found', 'no_leak_found', 'passed', 'failed'] as const;
export type LeakResult = (typeof LEAK_RESULTS)[number];
export const leakResultLabels: Record<LeakResult, string> = {
  leak_found: 'Leak found',
  no_leak_found: 'No leak found',
  passed: 'Passed',
  failed: 'Failed',
};

/** The results each activity can have; a repair has none (its test is a verification entry). */
export const leakResultsFor: Record<LeakActivity, readonly LeakResult[]> = {
  inspection: ['leak_found', 'no_leak_found'],
  repair: [],
  initial_verification: ['passed', 'failed'],
  follow_up_verification: ['passed', 'failed'],
};

export const leakDataSchema = z
  .object({
    activity: z.enum(LEAK_ACTIVITIES, { message: 'Choose the leak work: an inspection, a repair or a verification test.' }),
    method: z.enum(LEAK_METHODS, { message: 'Choose the test method from the list.' }).nullable().optional(),
    result: z.enum(LEAK_RESULTS, { message: 'Choose the result from the list.' }).nullable().optional(),
    location: optionalText(200),
    note: optionalText(1000),
  })
  .superRefine((d, ctx) => {
    const issue = (path: string, message: string) => ctx.addIssue({ code: 'custom', path: [path], message });
    const activity = leakActivityLabels[d.activity].toLowerCase();
    if (d.activity === 'repair') {
      if (d.method) issue('method', 'A repair has no test method: record the test as a verification test entry.');
      if (d.result) issue('result', 'A repair has no result: record the outcome as a verification test entry.');
      if (!d.location) issue('location', 'Say where on the system the leak was repaired.');
      return;
    }
    if (!d.method) issue('method', `Choose how the ${activity} was done.`);
    const allowed = leakResultsFor[d.activity];
    const inspection = d.activity === 'inspection';
    if (!d.result) issue('result', inspection ? 'Was a leak found?' : 'Did the test pass or fail?');
    else if (!allowed.includes(d.result)) issue('result', inspection ? 'An inspection finds a leak or finds none.' : 'A verification test passes or fails.');
    if (inspection && d.result === 'leak_found' && !d.location) issue('location', 'Say where on the system the leak was found.');
  });

export const conditionDataSchema = z.object({
  rating: z.number().int().min(1, 'Rate from 1 (failing) to 5 (like new).').max(5, 'Rate from 1 (failing) to 5 (like new).'),
  note: optionalText(1000),
});

export const noteDataSchema = z.object({ text: requiredText('Note', 4000) });
export const photoDataSchema = z.object({ photoId: z.uuid(), caption: optionalText(300) });

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
  siteId: z.uuid('Choose a site.'),
  reason: z.enum(VISIT_REASONS, { message: 'Choose the reason for the visit.' }),
  startedAt: dateTime.optional(),
});

export const closeVisitSchema = z.object({
  summary: requiredText('Summary', 4000),
  endedAt: dateTime.optional(),
  confirmBypassRemoved: z.boolean().default(false),
});

export const voidEntrySchema = z.object({ reason: requiredText('Reason', 500) });

export const listVisitsQuerySchema = z.object({
  siteId: z.uuid().optional(),
  status: z.enum(['open', 'closed']).optional(),
  technicianId: z.uuid().optional(),
  /** Closed visits the office has not reviewed yet. */
  review: z.enum(['needed']).optional(),
  cursor: z.string().max(500).optional(),
  limit: z.coerce.number().int().min(1).max(100).default(30),
});

/** One page of a unit's history: enough to fill a phone screen or two. */
export const HISTORY_PAGE_SIZE = 25;

export const historyQuerySchema = z.object({
  kind: repeatedParam(z.enum(ENTRY_KINDS)),
  cursor: z.string().max(500).optional(),
  limit: z.coerce.number().int().min(1).max(100).default(HISTORY_PAGE_SIZE),
});

export type CreateEntryInput = z.infer<typeof createEntrySchema>;
export type StartVisitInput = z.infer<typeof startVisitSchema>;
export type CloseVisitInput = z.infer<typeof closeVisitSchema>;
export type ListVisitsQuery = z.infer<typeof listVisitsQuerySchema>;
export type HistoryQuery = z.infer<typeof historyQuerySchema>;
export type ReadingData = z.infer<typeof readingDataSchema>;
export type SettingChangeData = z.infer<typeof settingChangeDataSchema>;
export type RefrigerantData = z.infer<typeof refrigerantDataSchema>;
export type LeakData = z.infer<typeof leakDataSchema>;
