import { z } from 'zod';
import { optionalText } from '@/lib/api/schemas';
import { labelled } from '@/lib/labelled';
import { defineKind } from '@/lib/visits/kinds/types';

// Leak work as records: the inspection, the repair and the two verification tests that
// 40 CFR 82.157 asks for after a leak-rate exceedance (names of the tests are the regulation's).

export const { values: LEAK_ACTIVITIES, labels: leakActivityLabels } = labelled({
  inspection: 'Leak inspection',
  repair: 'Leak repair',
  initial_verification: 'Initial verification test',
  follow_up_verification: 'Follow-up verification test',
});
export type LeakActivity = (typeof LEAK_ACTIVITIES)[number];

/** Generic ways of finding or ruling out a leak; no open-flame (halide) method, since A2L/A3 refrigerants are flammable. */
export const { values: LEAK_METHODS, labels: leakMethodLabels } = labelled({
  electronic_detector: 'Electronic leak detector',
  ultrasonic: 'Ultrasonic detector',
  bubble_solution: 'Bubble solution',
  fluorescent_dye: 'Fluorescent dye and UV lamp',
  pressure_test: 'Standing pressure test (dry nitrogen)',
  vacuum_test: 'Vacuum decay test',
});
export type LeakMethod = (typeof LEAK_METHODS)[number];

export const { values: LEAK_RESULTS, labels: leakResultLabels } = labelled({
  leak_found: 'Leak found',
  no_leak_found: 'No leak found',
  passed: 'Passed',
  failed: 'Failed',
});
export type LeakResult = (typeof LEAK_RESULTS)[number];

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
export type LeakData = z.infer<typeof leakDataSchema>;

/** Leak work in one line: what, how, the outcome and where; a repair says whether it met its deadline. */
export function describeLeakWork(d: Record<string, unknown>, c: Record<string, unknown> | null): string {
  const activity = leakActivityLabels[d.activity as LeakActivity] ?? String(d.activity);
  const method = d.method ? (leakMethodLabels[d.method as LeakMethod] ?? String(d.method)).toLowerCase() : null;
  const result = d.result ? (leakResultLabels[d.result as LeakResult] ?? String(d.result)).toLowerCase() : null;
  const where = typeof d.location === 'string' && d.location ? `at ${d.location}` : null;
  const deadline =
    c && typeof c.repairDueDate === 'string' ? (c.onTime ? `within the repair deadline of ${c.repairDueDate}` : `AFTER the repair deadline of ${c.repairDueDate}`) : null;
  const note = d.note ? `. ${d.note}` : '';
  if (d.activity === 'repair') return `${activity}${where ? ` ${where}` : ''}${deadline ? `, ${deadline}` : ''}${note}`;
  const outcome = [result, where].filter(Boolean).join(' ');
  return `${activity}${method ? ` (${method})` : ''}${outcome ? `: ${outcome}` : ''}${note}`;
}

/** Units that carry refrigerant, where a leak can be looked for and repaired. */
const NO_REFRIGERANT = new Set(['thermostat', 'contactor', 'fan_motor', 'defrost_control']);

export const leak = defineKind({
  kind: 'leak',
  fits: (u) => !NO_REFRIGERANT.has(u.type),
  data: leakDataSchema,
  describe: (d, computed) => describeLeakWork(d, computed),
  /**
   * A repair: whether it met the deadline set by the system's last addition before it, when that
   * addition was over the leak-rate threshold (repair due date from lib/calc/leak-rate).
   */
  async compute(d, tools) {
    if (d.activity !== 'repair' || !tools.ctx.systemId) return null;
    const addition = await tools.lastAddition({ inclusive: true });
    const due = (addition?.computed as { leak?: { exceedsThreshold?: boolean; repairDueDate?: string | null } | null } | null)?.leak;
    if (!addition || !due?.exceedsThreshold || !due.repairDueDate) return null;
    const repairedOn = tools.localDate(tools.recordedAt);
    return { repairDueDate: due.repairDueDate, repairedOn, onTime: repairedOn <= due.repairDueDate, additionEntryId: addition.id };
  },
});
