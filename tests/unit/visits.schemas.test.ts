// The leak work entry schema: each activity's required fields, and one clear message per mistake.
import { randomUUID } from 'node:crypto';
import { describe, expect, it } from 'vitest';
import { createEntrySchema, ENTRY_KINDS, entryKindLabels, leakDataSchema } from '@/lib/visits/schemas';

function issues(data: unknown): Record<string, string> {
  const r = leakDataSchema.safeParse(data);
  if (r.success) return {};
  return Object.fromEntries(r.error.issues.map((i) => [i.path.join('.'), i.message]));
}

describe('leak work entries', () => {
  it('accepts each activity with what it needs, and tidies empty text', () => {
    expect(leakDataSchema.parse({ activity: 'inspection', method: 'ultrasonic', result: 'no_leak_found', location: '', note: '  ' })).toEqual({
      activity: 'inspection',
      method: 'ultrasonic',
      result: 'no_leak_found',
      location: null,
      note: null,
    });
    expect(leakDataSchema.parse({ activity: 'inspection', method: 'electronic_detector', result: 'leak_found', location: ' TXV inlet flare ' }).location).toBe('TXV inlet flare');
    expect(leakDataSchema.safeParse({ activity: 'repair', location: 'TXV inlet flare', note: 'New flare nut' }).success).toBe(true);
    expect(leakDataSchema.safeParse({ activity: 'initial_verification', method: 'pressure_test', result: 'passed' }).success).toBe(true);
    expect(leakDataSchema.safeParse({ activity: 'follow_up_verification', method: 'bubble_solution', result: 'failed', location: 'TXV inlet flare' }).success).toBe(true);
  });

  it('asks for the activity, then the method and result an inspection or a test needs', () => {
    expect(issues({})).toEqual({ activity: 'Choose the leak work: an inspection, a repair or a verification test.' });
    expect(issues({ activity: 'sniffing' })).toEqual({ activity: 'Choose the leak work: an inspection, a repair or a verification test.' });
    expect(issues({ activity: 'inspection' })).toEqual({ method: 'Choose how the leak inspection was done.', result: 'Was a leak found?' });
    expect(issues({ activity: 'follow_up_verification', method: 'vacuum_test' })).toEqual({ result: 'Did the test pass or fail?' });
    expect(issues({ activity: 'inspection', method: 'halide_torch', result: 'leak_found', location: 'x' })).toEqual({ method: 'Choose the test method from the list.' });
  });

  it('refuses a result that belongs to another activity', () => {
    expect(issues({ activity: 'inspection', method: 'ultrasonic', result: 'passed' })).toEqual({ result: 'An inspection finds a leak or finds none.' });
    expect(issues({ activity: 'initial_verification', method: 'pressure_test', result: 'no_leak_found' })).toEqual({ result: 'A verification test passes or fails.' });
  });

  it('needs a location for a repair and for a leak found, but not for a passed test', () => {
    expect(issues({ activity: 'repair' })).toEqual({ location: 'Say where on the system the leak was repaired.' });
    expect(issues({ activity: 'inspection', method: 'fluorescent_dye', result: 'leak_found', location: '   ' })).toEqual({ location: 'Say where on the system the leak was found.' });
    expect(issues({ activity: 'initial_verification', method: 'pressure_test', result: 'failed' })).toEqual({});
  });

  it('keeps the test out of the repair record: method and result belong to a verification entry', () => {
    expect(issues({ activity: 'repair', location: 'Suction service valve', method: 'pressure_test', result: 'passed' })).toEqual({
      method: 'A repair has no test method: record the test as a verification test entry.',
      result: 'A repair has no result: record the outcome as a verification test entry.',
    });
  });

  it('limits text lengths', () => {
    expect(issues({ activity: 'repair', location: 'x'.repeat(201) })).toEqual({ location: 'Use at most 200 characters.' });
    expect(issues({ activity: 'repair', location: 'Drier flare', note: 'x'.repeat(1001) })).toEqual({ note: 'Use at most 1000 characters.' });
  });

  it('is a kind of entry like the others, with a label, and its issues carry the data path', () => {
    expect(ENTRY_KINDS).toContain('leak');
    expect(entryKindLabels.leak).toBe('Leak work');
    const base = { kind: 'leak', equipmentId: randomUUID(), clientEntryId: randomUUID() };
    expect(createEntrySchema.safeParse({ ...base, data: { activity: 'repair', location: 'Drier flare' } }).success).toBe(true);
    const bad = createEntrySchema.safeParse({ ...base, data: { activity: 'repair' } });
    expect(bad.success).toBe(false);
    expect(bad.error?.issues.map((i) => [i.path.join('.'), i.message])).toEqual([['data.location', 'Say where on the system the leak was repaired.']]);
  });
});
