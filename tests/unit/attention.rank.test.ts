// The needs-attention ranking on a crafted set of units: the order follows the written rule.
import { describe, expect, it } from 'vitest';
import { rankUnits, rankingRule, scoreSignal, type UnitSignals } from '@/lib/attention/rank';

const unit = (name: string, signals: UnitSignals['signals']): UnitSignals => ({
  equipmentId: `id-${name}`,
  equipmentName: name,
  equipmentType: 'condensing_unit',
  siteId: 'site',
  siteName: 'Site',
  signals,
});

describe('needs-attention ranking', () => {
  it('ranks by the points the rule states, and drops units with nothing wrong', () => {
    const ranked = rankUnits([
      unit('Old fan', [{ kind: 'past_expected_life', ageYears: 21.5, medianYears: 18 }]),
      unit('Leaking rack', [{ kind: 'leak_over_threshold', visitId: 'v1', ratePct: 36.5, thresholdPct: 20, repairDueDate: '2026-12-01', on: '2026-11-01' }]),
      unit('Fine unit', []),
      unit('Hot box', [
        { kind: 'repeat_no_cooling', visitIds: ['a', 'b', 'c'] },
        { kind: 'condition_worsening', from: 4, to: 2, visitId: 'c' },
      ]),
      unit('Frayed wiring', [{ kind: 'open_safety_finding', followUpId: 'f1', title: 'Exposed conductor at disconnect', since: '2026-10-01' }]),
    ]);
    expect(ranked.map((u) => [u.equipmentName, u.score])).toEqual([
      ['Hot box', 70 + 40],
      ['Frayed wiring', 100],
      ['Leaking rack', 80],
      ['Old fan', 15 + 2 * 3],
    ]);
    expect(ranked[0]!.reasons.map((r) => r.text)).toEqual(['3 no-cooling visits in the last 90 days', 'Condition fell from 4 to 2 (of 5)']);
    expect(ranked[2]!.reasons[0]!.href).toBe('/visits/v1');
  });

  it('caps the age points and breaks ties by the longest-waiting problem', () => {
    expect(scoreSignal({ kind: 'past_expected_life', ageYears: 60, medianYears: 15 })).toBe(40);
    const ranked = rankUnits([
      unit('Newer finding', [{ kind: 'open_safety_finding', followUpId: 'f2', title: 'x', since: '2026-11-20' }]),
      unit('Older finding', [{ kind: 'open_safety_finding', followUpId: 'f3', title: 'y', since: '2026-09-02' }]),
    ]);
    expect(ranked.map((u) => u.equipmentName)).toEqual(['Older finding', 'Newer finding']);
  });

  it('states the rule in plain words with the same numbers', () => {
    for (const n of ['100', '80', '60', '20', '15', '40']) expect(rankingRule).toContain(n);
  });
});
