// Where a leak over the threshold stands after its addition. The sequence is the one 40 CFR
// 82.157(d)–(e) describes: repair, then an initial and a follow-up verification test.
import { describe, expect, it } from 'vitest';
import { leakFollowThrough, type LeakWorkItem } from '@/lib/attention/leak-follow-through';
import { describeSignal, scoreSignal } from '@/lib/attention/rank';

const addition = { at: '2026-11-02T10:00:00.000Z', visitId: 'v-add' };
const work = (at: string, activity: LeakWorkItem['activity'], result: LeakWorkItem['result'] = null, visitId = 'v-later'): LeakWorkItem => ({ at, visitId, activity, result });

describe('leak follow-through', () => {
  it('is unrepaired with no repair after the addition, even with an older one', () => {
    expect(leakFollowThrough(addition, [])).toEqual({ state: 'unrepaired' });
    expect(leakFollowThrough(addition, [work('2026-10-01T09:00:00.000Z', 'repair', null, 'v-old'), work('2026-11-03T09:00:00.000Z', 'inspection', 'leak_found')])).toEqual({ state: 'unrepaired' });
  });

  it('counts a repair made on the addition’s own visit before the top-up', () => {
    expect(leakFollowThrough(addition, [work('2026-11-02T09:30:00.000Z', 'repair', null, 'v-add')])).toEqual({ state: 'repaired', repairedOn: '2026-11-02', failedTest: false });
  });

  it('needs both verification tests passed after the repair', () => {
    const repaired = work('2026-11-05T09:00:00.000Z', 'repair');
    const initial = work('2026-11-05T11:00:00.000Z', 'initial_verification', 'passed');
    const followUp = work('2026-11-15T09:00:00.000Z', 'follow_up_verification', 'passed');
    expect(leakFollowThrough(addition, [repaired, initial])).toMatchObject({ state: 'repaired', failedTest: false });
    expect(leakFollowThrough(addition, [repaired, followUp])).toMatchObject({ state: 'repaired' });
    expect(leakFollowThrough(addition, [followUp, initial, repaired])).toEqual({ state: 'verified', repairedOn: '2026-11-05', verifiedOn: '2026-11-15' });
    // Tests passed before the repair prove nothing about it.
    expect(leakFollowThrough(addition, [work('2026-11-03T09:00:00.000Z', 'initial_verification', 'passed'), work('2026-11-04T09:00:00.000Z', 'follow_up_verification', 'passed'), repaired])).toMatchObject({ state: 'repaired' });
  });

  it('a failed test after the repair calls for another repair; a new repair starts over', () => {
    const failed = [work('2026-11-05T09:00:00.000Z', 'repair'), work('2026-11-05T11:00:00.000Z', 'initial_verification', 'failed')];
    expect(leakFollowThrough(addition, failed)).toEqual({ state: 'repaired', repairedOn: '2026-11-05', failedTest: true });
    const again = [...failed, work('2026-11-06T09:00:00.000Z', 'repair'), work('2026-11-06T10:00:00.000Z', 'initial_verification', 'passed'), work('2026-11-16T10:00:00.000Z', 'follow_up_verification', 'passed')];
    expect(leakFollowThrough(addition, again)).toEqual({ state: 'verified', repairedOn: '2026-11-06', verifiedOn: '2026-11-16' });
  });

  it('scores and words the signal by where the leak stands (the rule on the attention page)', () => {
    const base = { kind: 'leak_over_threshold' as const, visitId: 'v1', ratePct: 30, thresholdPct: 20, repairDueDate: '2026-12-02', on: '2026-11-02' };
    expect(scoreSignal(base)).toBe(80);
    expect(describeSignal(base).text).toBe('Leak rate 30.0 % per year on Nov 2, 2026, over the 20 % threshold; repair due by Dec 2, 2026');
    expect(scoreSignal({ ...base, repairedOn: '2026-11-05' })).toBe(40);
    expect(describeSignal({ ...base, repairedOn: '2026-11-05' }).text).toContain('repaired on Nov 5, 2026, verification tests still to pass');
    expect(scoreSignal({ ...base, repairedOn: '2026-11-05', verificationFailed: true })).toBe(80);
    expect(describeSignal({ ...base, repairedOn: '2026-11-05', verificationFailed: true }).text).toContain('a verification test failed — repair again');
  });
});
