// The needs-attention ranking on a crafted set of units: the order follows the written rule.
import { describe, expect, it } from 'vitest';
import { priorityLabels, priorityRule, rankUnits, rankingRule, scoreSignal, signalPriority, type Signal, type UnitSignals } from '@/lib/attention/rank';

const unit = (name: string, signals: UnitSignals['signals']): UnitSignals => ({
  equipmentId: `id-${name}`,
  equipmentName: name,
  equipmentType: 'condensing_unit',
  siteId: 'site',
  siteName: 'Site',
  signals,
});

describe('needs-attention ranking', () => {
  it('ranks urgent, then soon, then watch, by the rule in words; points only order units within a priority', () => {
    const ranked = rankUnits([
      unit('Old fan', [{ kind: 'past_expected_life', ageYears: 21.5, medianYears: 18 }]),
      unit('Leaking rack', [{ kind: 'leak_over_threshold', visitId: 'v1', ratePct: 36.5, thresholdPct: 20, repairDueDate: '2026-12-01', on: '2026-11-01' }]),
      unit('Fine unit', []),
      unit('Hot box', [
        { kind: 'repeat_no_cooling', visitIds: ['a', 'b', 'c'] },
        { kind: 'condition_worsening', from: 4, to: 2, visitId: 'c' },
      ]),
      unit('Frayed wiring', [{ kind: 'open_safety_finding', followUpId: 'f1', title: 'Exposed conductor at disconnect', since: '2026-10-01' }]),
      unit('Worn box', [{ kind: 'condition_worsening', from: 5, to: 1, visitId: 'd' }]),
    ]);
    // Hot box has more points (70 + 40) than Frayed wiring (100), but a safety finding is urgent and
    // repeat no-cooling calls are "soon"; Worn box (80 points) is still only "watch".
    expect(ranked.map((u) => [u.equipmentName, u.priority])).toEqual([
      ['Frayed wiring', 'urgent'],
      ['Leaking rack', 'urgent'],
      ['Hot box', 'soon'],
      ['Worn box', 'watch'],
      ['Old fan', 'watch'],
    ]);
    expect(ranked.find((u) => u.equipmentName === 'Hot box')!.reasons.map((r) => r.text)).toEqual(['3 no-cooling visits in the last 90 days', 'Condition fell from 4 to 2 (of 5)']);
    expect(ranked[1]!.reasons[0]!.href).toBe('/visits/v1');
  });

  it('gives each signal the priority its line of the rule names', () => {
    const leak: Signal = { kind: 'leak_over_threshold', visitId: 'v', ratePct: 30, thresholdPct: 20, repairDueDate: null, on: '2026-11-01' };
    const cases: [Signal, string][] = [
      [{ kind: 'open_safety_finding', followUpId: 'f', title: 't', since: '2026-01-01' }, 'urgent'],
      [leak, 'urgent'],
      [{ ...leak, repairedOn: '2026-11-05' }, 'soon'],
      [{ ...leak, repairedOn: '2026-11-05', verificationFailed: true }, 'urgent'],
      [{ kind: 'repeat_no_cooling', visitIds: ['a', 'b'] }, 'soon'],
      [{ kind: 'condition_worsening', from: 3, to: 2, visitId: 'v' }, 'watch'],
      [{ kind: 'past_expected_life', ageYears: 30, medianYears: 15 }, 'watch'],
    ];
    for (const [signal, priority] of cases) expect([signal.kind, signalPriority(signal)]).toEqual([signal.kind, priority]);
    // A unit takes its highest priority, however many lesser reasons it has.
    const mixed = rankUnits([
      unit('Mixed', [
        { kind: 'past_expected_life', ageYears: 40, medianYears: 15 },
        { kind: 'condition_worsening', from: 5, to: 1, visitId: 'x' },
        { ...leak, repairedOn: '2026-11-05' },
      ]),
    ]);
    expect(mixed[0]!.priority).toBe('soon');
  });

  it('caps the age points and breaks ties by the longest-waiting problem', () => {
    expect(scoreSignal({ kind: 'past_expected_life', ageYears: 60, medianYears: 15 })).toBe(40);
    const ranked = rankUnits([
      unit('Newer finding', [{ kind: 'open_safety_finding', followUpId: 'f2', title: 'x', since: '2026-11-20' }]),
      unit('Older finding', [{ kind: 'open_safety_finding', followUpId: 'f3', title: 'y', since: '2026-09-02' }]),
    ]);
    expect(ranked.map((u) => u.equipmentName)).toEqual(['Older finding', 'Newer finding']);
  });

  it('states the rule in words: each priority once, in order, and no points', () => {
    expect(priorityRule.filter((l) => l.priority).map((l) => l.priority)).toEqual(['urgent', 'soon', 'watch']);
    expect(rankingRule).toContain(`${priorityLabels.urgent}: an open safety finding`);
    expect(rankingRule).toContain(`${priorityLabels.soon}: two or more no-cooling visits`);
    expect(rankingRule).toContain(`${priorityLabels.watch}: condition worse`);
    expect(rankingRule).not.toMatch(/points?\b|\bpts\b/i);
    // The only numbers are the ones a person can check: the 12 months and the 90 days.
    expect(rankingRule.match(/\d+/g)).toEqual(['12', '90']);
  });
});
