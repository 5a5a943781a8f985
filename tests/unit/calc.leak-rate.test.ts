import { describe, expect, it } from 'vitest';

import { COMPLIANCE_RULES, getComplianceRules } from '@/lib/calc/compliance-rules';
import { toUtcDay } from '@/lib/calc/dates';
import { CalcInputError } from '@/lib/calc/errors';
import {
  annualizedLeakRate,
  evaluateLeakEvent,
  leakRuleApplicability,
  rollingAverageLeakRate,
} from '@/lib/calc/leak-rate';
import { yearlyTotals } from '@/lib/calc/refrigerant-totals';

describe('annualizing method, 40 CFR 82.152 (TRADE-REFERENCE §6.1)', () => {
  it('10 lb added, 100 lb full charge, 180 days → 20.28 %', () => {
    const r = annualizedLeakRate({ added: 10, fullCharge: 100, additionDate: '2025-06-29', previousAdditionDate: '2024-12-31' });
    expect(r.daysSinceLastAddition).toBe(180);
    expect(r.ratePct).toBeCloseTo(20.28, 2);
  });

  it('3 lb, 50 lb, 60 days → 36.5 %', () => {
    const r = annualizedLeakRate({ added: 3, fullCharge: 50, additionDate: '2026-03-02', previousAdditionDate: '2026-01-01' });
    expect(r.daysUsed).toBe(60);
    expect(r.ratePct).toBeCloseTo(36.5, 9);
  });

  it('first addition uses 365 days; more than 365 days is capped at 365', () => {
    expect(annualizedLeakRate({ added: 10, fullCharge: 100, additionDate: '2026-05-01' }).ratePct).toBeCloseTo(10, 9);
    const capped = annualizedLeakRate({ added: 10, fullCharge: 100, additionDate: '2026-05-01', previousAdditionDate: '2024-01-01' });
    expect(capped.daysUsed).toBe(365);
    expect(capped.ratePct).toBeCloseTo(10, 9);
  });

  it('rejects bad input with clear messages', () => {
    expect(() => annualizedLeakRate({ added: 10, fullCharge: -100, additionDate: '2026-05-01' })).toThrow('full charge must be greater than zero (got -100)');
    expect(() => annualizedLeakRate({ added: 0, fullCharge: 100, additionDate: '2026-05-01' })).toThrow(/refrigerant added must be greater than zero/);
    expect(() => annualizedLeakRate({ added: Number.NaN, fullCharge: 100, additionDate: '2026-05-01' })).toThrow(CalcInputError);
    expect(() => annualizedLeakRate({ added: 1, fullCharge: 100, additionDate: '2026-02-30' })).toThrow(/not a valid date/);
    expect(() => annualizedLeakRate({ added: 1, fullCharge: 100, additionDate: 'yesterday' })).toThrow(/use YYYY-MM-DD/);
    expect(() => annualizedLeakRate({ added: 1, fullCharge: 100, additionDate: '2026-05-01', previousAdditionDate: '2026-06-01' })).toThrow(
      /previous addition date is after/,
    );
    expect(() => annualizedLeakRate({ added: 1, fullCharge: 100, additionDate: '2026-05-01', previousAdditionDate: '2026-05-01' })).toThrow(
      /same day count as one/,
    );
  });
});

describe('rolling-average method, 40 CFR 82.152', () => {
  it('sums additions in the previous 365 days, or since the last passed follow-up verification test', () => {
    const additions = [
      { date: '2025-01-10', amount: 5 },
      { date: '2025-08-01', amount: 4 },
      { date: '2026-01-05', amount: 6 },
    ];
    expect(rollingAverageLeakRate({ additions, fullCharge: 50, asOf: '2026-01-05' }).ratePct).toBeCloseTo(30, 9);
    expect(rollingAverageLeakRate({ additions, fullCharge: 50, asOf: '2026-01-12' }).ratePct).toBeCloseTo(20, 9);
    expect(rollingAverageLeakRate({ additions, fullCharge: 50, asOf: '2026-01-05', lastPassedFollowUpTestDate: '2025-09-01' }).ratePct).toBeCloseTo(12, 9);
  });
});

describe('applicability (40 CFR 82.157(a); 40 CFR 84 Subpart C from 2026-01-01)', () => {
  const applies = (args: Parameters<typeof leakRuleApplicability>[0]): string[] =>
    leakRuleApplicability(args)
      .filter((a) => a.applies)
      .map((a) => a.regimeId);

  it('Part 82: ODS (R-22) at ≥ 50 lb', () => {
    expect(applies({ refrigerant: 'R-22', fullCharge: 60, massUnit: 'lb', onDate: '2025-06-01' })).toEqual(['US-40CFR82F']);
    expect(applies({ refrigerant: 'R-22', fullCharge: 40, massUnit: 'lb', onDate: '2025-06-01' })).toEqual([]);
    // 25 kg = 55.1 lb
    expect(applies({ refrigerant: 'R-22', fullCharge: 25, massUnit: 'kg', onDate: '2025-06-01' })).toEqual(['US-40CFR82F']);
  });

  it('Part 84: HFC refrigerant at ≥ 15 lb, from 2026-01-01 only', () => {
    expect(applies({ refrigerant: 'R-404A', fullCharge: 20, massUnit: 'lb', onDate: '2026-03-01' })).toEqual(['US-40CFR84C']);
    expect(applies({ refrigerant: 'R-404A', fullCharge: 20, massUnit: 'lb', onDate: '2025-12-31' })).toEqual([]);
    expect(applies({ refrigerant: 'R-404A', fullCharge: 10, massUnit: 'lb', onDate: '2026-03-01' })).toEqual([]);
    expect(applies({ refrigerant: 'R-454C', fullCharge: 20, massUnit: 'lb', onDate: '2026-03-01' })).toEqual(['US-40CFR84C']);
  });

  it('not covered: refrigerants with no HFC and GWP ≤ 53 (R-290, R-744, R-717, R-1234yf)', () => {
    for (const refrigerant of ['R-290', 'R-744', 'R-717', 'R-1234yf']) {
      expect(applies({ refrigerant, fullCharge: 100, massUnit: 'lb', onDate: '2026-03-01' }), refrigerant).toEqual([]);
    }
  });
});

describe('leak event: threshold, repair deadline, verification (40 CFR 82.157 / 84.106, TRADE-REFERENCE §6.2–6.3)', () => {
  it('20.28 % on a 100 lb R-404A commercial system exceeds 20 %: repair within 30 days', () => {
    const r = evaluateLeakEvent({
      refrigerant: 'R-404A',
      application: 'commercial_refrigeration',
      fullCharge: 100,
      added: 10,
      massUnit: 'lb',
      additionDate: '2026-06-29',
      previousAdditionDate: '2025-12-31',
    });
    expect(r.ratePct).toBeCloseTo(20.28, 2);
    expect(r.thresholdPct).toBe(20);
    expect(r.exceedsThreshold).toBe(true);
    expect(r.regulated).toBe(true);
    expect(r.repairDueDate).toBe('2026-07-29');
    expect(r.verification?.followUpDays).toBe(10);
    expect(r.cautions[0]).toMatch(/local rules|State and local/);
  });

  it.each([
    ['commercial_refrigeration', 20],
    ['industrial_process_refrigeration', 30],
    ['comfort_cooling', 10],
    ['other', 10],
  ] as const)('threshold for %s is %s %%', (application, threshold) => {
    const r = evaluateLeakEvent({ refrigerant: 'R-22', application, fullCharge: 60, added: 1, massUnit: 'lb', additionDate: '2025-05-01' });
    expect(r.thresholdPct).toBe(threshold);
    expect(r.exceedsThreshold).toBe(false);
    expect(r.repairDueDate).toBeNull();
  });

  it('industrial process refrigeration needing a shutdown gets 120 days', () => {
    const r = evaluateLeakEvent({
      refrigerant: 'R-22',
      application: 'industrial_process_refrigeration',
      fullCharge: 200,
      added: 80,
      massUnit: 'lb',
      additionDate: '2025-01-01',
      iprShutdown: true,
    });
    expect(r.ratePct).toBeCloseTo(40, 9);
    expect(r.repairDueDate).toBe('2025-05-01');
  });

  it('an unregulated appliance still gets its rate, but no deadline and a guidance caution', () => {
    const r = evaluateLeakEvent({
      refrigerant: 'R-290',
      application: 'commercial_refrigeration',
      fullCharge: 1,
      added: 0.5,
      massUnit: 'lb',
      additionDate: '2026-03-01',
    });
    expect(r.exceedsThreshold).toBe(true);
    expect(r.regulated).toBe(false);
    expect(r.repairDueDate).toBeNull();
    expect(r.cautions.join(' ')).toMatch(/guidance only/);
  });

  it('rules are data keyed by jurisdiction with US-EPA as the default', () => {
    expect(getComplianceRules()).toBe(COMPLIANCE_RULES['US-EPA']);
    expect(getComplianceRules().chronicLeakerPctOfCharge).toBe(125);
    expect(getComplianceRules().repairDays).toBe(30);
  });
});

describe('yearly totals per system and per refrigerant; chronic leaker ≥ 125 % (40 CFR 82.157)', () => {
  const tx = [
    { systemId: 'wic-1', refrigerant: 'r404a', date: '2025-02-01', kind: 'added', amount: 10, unit: 'lb' },
    { systemId: 'wic-1', refrigerant: 'R-404A', date: '2025-07-01', kind: 'added', amount: 10, unit: 'lb' },
    { systemId: 'wic-1', refrigerant: 'R-404A', date: '2025-09-01', kind: 'recovered', amount: 2, unit: 'lb' },
    { systemId: 'wic-2', refrigerant: 'R-448A', date: '2025-03-01', kind: 'added', amount: 2, unit: 'kg' },
    { systemId: 'wic-1', refrigerant: 'R-404A', date: '2026-01-15', kind: 'added', amount: 1, unit: 'lb' },
    { systemId: 'old', refrigerant: 'R-12', date: '2025-04-01', kind: 'added', amount: 1, unit: 'lb' },
  ] as const;

  it('totals by calendar year, normalises refrigerant names, keeps unknown ones', () => {
    const r = yearlyTotals(tx, { 'wic-1': 16 * 0.45359237 });
    const wic1 = r.bySystem.find((s) => s.systemId === 'wic-1' && s.year === 2025);
    expect(wic1?.addedLb).toBeCloseTo(20, 9);
    expect(wic1?.recoveredLb).toBeCloseTo(2, 9);
    expect(wic1?.refrigerants).toEqual(['R-404A']);
    expect(wic1?.addedPctOfCharge).toBeCloseTo(125, 9);
    expect(wic1?.chronicLeaker).toBe(true);
    expect(r.bySystem.find((s) => s.systemId === 'wic-1' && s.year === 2026)?.chronicLeaker).toBe(false);
    expect(r.bySystem.find((s) => s.systemId === 'wic-2')?.chronicLeaker).toBeNull();
    const r404 = r.byRefrigerant.find((x) => x.refrigerant === 'R-404A' && x.year === 2025);
    expect(r404?.addedLb).toBeCloseTo(20, 9);
    expect(r.byRefrigerant.find((x) => x.refrigerant === 'R-448A')?.addedKg).toBeCloseTo(2, 12);
    expect(r.byRefrigerant.some((x) => x.refrigerant === 'R-12')).toBe(true);
    expect(r.bySystem.map((s) => `${s.year}:${s.systemId}`)).toEqual(['2025:old', '2025:wic-1', '2025:wic-2', '2026:wic-1']);
  });

  it('rejects bad transactions', () => {
    expect(() => yearlyTotals([{ ...tx[0], amount: -1 }])).toThrow('transaction 1 amount must be greater than zero (got -1)');
    expect(() => yearlyTotals([{ ...tx[0], date: '2025-13-01' }])).toThrow(/transaction 1 date is not a valid date/);
    expect(() => yearlyTotals([{ ...tx[0], systemId: '' }])).toThrow(/has no system id/);
  });

  it('dates are UTC calendar days', () => {
    expect(toUtcDay('1970-01-02')).toBe(1);
    expect(toUtcDay(new Date(Date.UTC(2026, 0, 1, 23, 59)))).toBe(toUtcDay('2026-01-01'));
  });
});
