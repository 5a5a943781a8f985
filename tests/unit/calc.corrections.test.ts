// The corrections from the outside review of lib/calc (issue 14), each against its source.
import { readdirSync, readFileSync, statSync } from 'node:fs';
import path from 'node:path';

import { describe, expect, it } from 'vitest';

import { evaluateLeakEvent, lastPassedFollowUpTest, leakRuleApplicability, rollingAverageLeakRate } from '@/lib/calc/leak-rate';
import { controlWarningMessage } from '@/lib/calc/control-warnings';
import { highPressureControl, lowPressureControl } from '@/lib/calc/pressure-controls';
import { computeReadings } from '@/lib/calc/readings';
import { getRefrigerant, REFRIGERANTS } from '@/lib/calc/refrigerants';
import { chartRange, saturationLookup, saturationTable } from '@/lib/calc/saturation';
import { medianServiceLife } from '@/lib/calc/service-life';

const root = path.resolve(import.meta.dirname, '../..');

describe('leak-repair coverage and thresholds by date, as the rules stood', () => {
  const applies = (refrigerant: string, lb: number, onDate: string) =>
    leakRuleApplicability({ refrigerant, fullCharge: lb, massUnit: 'lb', onDate }).filter((a) => a.applies).map((a) => a.regimeId);
  const event = (refrigerant: string, lb: number, additionDate: string) =>
    evaluateLeakEvent({ refrigerant, application: 'commercial_refrigeration', fullCharge: lb, added: 1, massUnit: 'lb', additionDate });

  it('R-22, 100 lb, 2019: covered by 40 CFR 82.157 at 20 % (81 FR 82272, from 2019-01-01) — the review found it "not regulated"', () => {
    expect(applies('R-22', 100, '2019-06-01')).toEqual(['US-40CFR82F']);
    expect(event('R-22', 100, '2019-06-01')).toMatchObject({ regulated: true, thresholdPct: 20 });
  });

  it('R-22, 100 lb, 2018: the earlier Subpart F threshold, 35 % for commercial refrigeration (former §82.156(i), from memory)', () => {
    expect(applies('R-22', 100, '2018-06-01')).toEqual(['US-40CFR82F-1993']);
    expect(event('R-22', 100, '2018-12-31')).toMatchObject({ regulated: true, thresholdPct: 35 });
    const comfort = evaluateLeakEvent({ refrigerant: 'R-22', application: 'comfort_cooling', fullCharge: 100, added: 1, massUnit: 'lb', additionDate: '2018-06-01' });
    expect(comfort.thresholdPct).toBe(15);
  });

  it('R-404A (HFC substitute), 100 lb: covered 2019-01-01 to 2020-04-09, not from 2020-04-10 (85 FR 14150), again from 2026-01-01 (40 CFR 84 Subpart C)', () => {
    expect(applies('R-404A', 100, '2018-12-31')).toEqual([]);
    expect(applies('R-404A', 100, '2019-01-01')).toEqual(['US-40CFR82F-HFC']);
    expect(applies('R-404A', 100, '2020-04-09')).toEqual(['US-40CFR82F-HFC']);
    expect(applies('R-404A', 100, '2020-04-10')).toEqual([]);
    const gap = leakRuleApplicability({ refrigerant: 'R-404A', fullCharge: 100, massUnit: 'lb', onDate: '2021-01-01' }).find((a) => a.regimeId === 'US-40CFR82F-HFC')!;
    expect(gap.reason).toMatch(/85 FR 14150/);
    expect(applies('R-404A', 100, '2026-01-01')).toEqual(['US-40CFR84C']);
  });

  it('the substitute rule needed 50 lb; Part 84 needs 15 lb (89 FR 82682, §84.106)', () => {
    expect(applies('R-404A', 40, '2019-06-01')).toEqual([]);
    expect(applies('R-404A', 20, '2026-02-01')).toEqual(['US-40CFR84C']);
  });
});

describe('rolling leak rate: the window restarts at the passed follow-up verification test (40 CFR 82.152 "leak rate")', () => {
  const additions = [
    { date: '2025-03-01', amount: 5 },
    { date: '2025-06-10', amount: 4 },
    { date: '2025-11-01', amount: 3 },
  ];
  it('a repair alone does not restart it; the passed follow-up test does', () => {
    const events = [
      { date: '2025-06-12', kind: 'repair' as const },
      { date: '2025-06-12', kind: 'initial_verification' as const, passed: true },
      { date: '2025-06-20', kind: 'follow_up_verification' as const, passed: false },
      { date: '2025-07-01', kind: 'follow_up_verification' as const, passed: true },
    ];
    expect(lastPassedFollowUpTest(events)).toBe('2025-07-01');
    expect(lastPassedFollowUpTest(events.slice(0, 3))).toBeNull();
    const r = rollingAverageLeakRate({ additions, fullCharge: 50, asOf: '2026-01-15', lastPassedFollowUpTestDate: lastPassedFollowUpTest(events) });
    expect(r).toMatchObject({ windowStart: '2025-07-01', windowStartReason: 'passed_follow_up_test', addedInWindow: 3 });
    expect(r.ratePct).toBeCloseTo(6, 9);
    // Without a passed follow-up test: the previous 365 days (all three additions, 12 of 50 lb).
    expect(rollingAverageLeakRate({ additions, fullCharge: 50, asOf: '2026-01-15' }).ratePct).toBeCloseTo(24, 9);
  });

  it('a test more than a year back leaves the 365-day window', () => {
    const r = rollingAverageLeakRate({ additions, fullCharge: 50, asOf: '2026-01-15', lastPassedFollowUpTestDate: '2024-01-01' });
    expect(r.windowStartReason).toBe('previous_365_days');
  });
});

describe('subcooling from the liquid-line pressure (TRADE-REFERENCE §3: bubble point at liquid pressure)', () => {
  const base = { refrigerant: 'R-134a', pressureUnit: 'kPaAbs', temperatureUnit: 'C', liquidLineTemp: 35 } as const;
  it('uses liquidPressure when given (R-134a 1016.59 kPa = 40 °C, §1.3 → 5 K), even with a higher head pressure', () => {
    const r = computeReadings({ ...base, liquidPressure: 1016.59, headPressure: 1100 });
    expect(r.subcooling?.pressureSource).toBe('liquid');
    expect(r.subcooling?.valueK).toBeCloseTo(5, 1);
  });
  it('falls back to the head pressure only when absent, and says so', () => {
    const r = computeReadings({ ...base, headPressure: 1016.59 });
    expect(r.subcooling?.pressureSource).toBe('head');
    expect(r.subcooling?.notes.join(' ')).toMatch(/No liquid-line pressure was given/);
  });
});

describe('one saturation reference per value, never switched silently', () => {
  it('R-407C at 1 atm (NBP −43.63 / −36.63 °C, TRADE-REFERENCE §1.2): superheat on dew, TD on the reference it names, all three given', () => {
    const r = computeReadings({ refrigerant: 'R-407C', pressureUnit: 'kPaAbs', temperatureUnit: 'C', suctionPressure: 101.325, suctionLineTemp: -30, boxTemp: -30 });
    expect(r.superheat).toMatchObject({ reference: 'dew' });
    expect(r.superheat!.saturation).toBeCloseTo(-36.63, 1);
    expect(r.evaporatorTd!.reference).toBe('midpoint');
    expect(r.evaporatorTd!.saturation).toBeCloseTo(-40.13, 1);
    expect(r.evaporating).toMatchObject({ reference: 'midpoint' });
    expect(r.evaporating!.bubble).toBeCloseTo(-43.63, 1);
    expect(r.evaporating!.dew).toBeCloseTo(-36.63, 1);
    expect(r.evaporating!.temperature).toBe(r.evaporatorTd!.saturation);
    // The same pressure without the line temperature gives the same evaporating reference.
    const noLine = computeReadings({ refrigerant: 'R-407C', pressureUnit: 'kPaAbs', temperatureUnit: 'C', suctionPressure: 101.325, boxTemp: -30 });
    expect(noLine.evaporating).toEqual(r.evaporating);
    const dew = computeReadings({ refrigerant: 'R-407C', pressureUnit: 'kPaAbs', temperatureUnit: 'C', suctionPressure: 101.325, boxTemp: -30, evaporatorReference: 'dew' });
    expect(dew.evaporatorTd!.valueK).toBeCloseTo(6.63, 1);
  });
});

describe('one bad value keeps every other computed value', () => {
  it('R-744 head above the critical pressure (7377.3 kPa, TRADE-REFERENCE §1.2): suction side kept, head-side values carry their own error', () => {
    // R-744 at −20 °C: 1969.63 kPa abs (§1.3).
    const r = computeReadings({
      refrigerant: 'R-744',
      pressureUnit: 'kPaAbs',
      temperatureUnit: 'C',
      suctionPressure: 1969.63,
      suctionLineTemp: -14,
      headPressure: 9000,
      liquidLineTemp: 30,
      ambientTemp: 25,
    });
    expect(r.superheat!.valueK).toBeCloseTo(6, 1);
    expect(r.compressionRatio!.ratio).toBeCloseTo(9000 / 1969.63, 6);
    expect(r.subcooling).toBeNull();
    expect(r.condenserSplit).toBeNull();
    expect(r.errors.subcooling).toMatchObject({ code: 'out_of_range', field: 'headPressure' });
    expect(r.errors.subcooling!.message).toMatch(/above its critical pressure 7,377 kPa abs/);
    expect(r.errors.condenserSplit).toMatchObject({ field: 'headPressure' });
    expect(r.errors.superheat).toBeUndefined();
  });

  it('range messages come in the reader’s units: psig and °F', () => {
    const r = computeReadings({ refrigerant: 'R-744', pressureUnit: 'psig', temperatureUnit: 'F', suctionPressure: 271, suctionLineTemp: 10, headPressure: 1300, ambientTemp: 80 });
    expect(r.errors.condenserSplit!.message).toMatch(/psig/);
    expect(r.errors.condenserSplit!.message).not.toMatch(/kPa|°C/);
  });
});

describe('elevation: the barometer is named and the sea-level value offered', () => {
  // ICAO / ISO 2533 standard atmosphere at 1610 m; R-404A dew at −30 °C = 202.23 kPa abs = 14.6 psig at sea level (§1.4).
  const iso2533 = 101.325 * Math.pow(1 - 2.25577e-5 * 1610, 5.25588);
  it('R-404A 14.6 psig at 1610 m: sea-level dew −22 °F, local dew lower, both given with the barometer', () => {
    const r = computeReadings({ refrigerant: 'R-404A', pressureUnit: 'psig', temperatureUnit: 'F', elevationM: 1610, suctionPressure: 14.6, suctionLineTemp: 0 });
    expect(r.barometricKpa).toBeCloseTo(iso2533, 6);
    expect(r.barometerSource).toBe('elevation');
    expect(r.superheat!.barometricKpa).toBeCloseTo(iso2533, 6);
    expect(r.superheat!.seaLevel!.barometricKpa).toBe(101.325);
    expect(r.superheat!.seaLevel!.saturation).toBeCloseTo(-22, 0);
    expect(r.superheat!.saturation).toBeLessThan(r.superheat!.seaLevel!.saturation - 3);
    expect(r.superheat!.notes.join(' ')).toMatch(/barometer of 83\.\d kPa \(from the site elevation\)/);
    const look = saturationLookup({ kind: 'pressure', refrigerant: 'R-404A', pressure: 14.6, unit: 'psig', elevationM: 1610, temperatureUnit: 'F' });
    expect(look.kind === 'pressure' && look.seaLevel!.dew).toBeCloseTo(-22, 0);
  });
  it('at sea level, or with absolute pressures, there is no separate sea-level figure', () => {
    expect(computeReadings({ refrigerant: 'R-404A', pressureUnit: 'psig', temperatureUnit: 'F', suctionPressure: 14.6, suctionLineTemp: 0 }).superheat!.seaLevel).toBeNull();
    expect(computeReadings({ refrigerant: 'R-404A', pressureUnit: 'kPaAbs', temperatureUnit: 'F', elevationM: 1610, suctionPressure: 202.23, suctionLineTemp: 0 }).superheat!.seaLevel).toBeNull();
  });
});

describe('pressure-control warnings', () => {
  it('R-744 low cut-out below the triple point (517.96 kPa abs, Span & Wagner 1996 via CoolProp 8.0.0 fluids.csv): dry ice', () => {
    const below = lowPressureControl({ refrigerant: 'R-744', unit: 'kPaAbs', cutIn: 700, differential: 250, temperatureUnit: 'F' });
    const w = below.warnings.find((x) => x.code === 'below_triple_point');
    expect(w?.message).toMatch(/dry ice/);
    expect(w?.message).toMatch(/°F/);
    expect(lowPressureControl({ refrigerant: 'R-744', unit: 'kPaAbs', cutIn: 800, differential: 250 }).warnings.map((x) => x.code)).not.toContain('below_triple_point');
  });

  it('high cut-out far below usual condensing (R-404A 250 psig ≈ 104 °F, §1.4) warns of nuisance trips; 400 psig does not (§4: 375–400 typical)', () => {
    const low = highPressureControl({ refrigerant: 'R-404A', unit: 'psig', cutOut: 250, differential: 60, temperatureUnit: 'F' });
    expect(low.warnings.map((x) => x.code)).toContain('cut_out_below_condensing');
    expect(low.warnings.find((x) => x.code === 'cut_out_below_condensing')!.message).toMatch(/125 °F/);
    expect(highPressureControl({ refrigerant: 'R-404A', unit: 'psig', cutOut: 400, differential: 100 }).warnings).toEqual([]);
  });

  it('a warning stored in kPa(g) and °C re-words in psig and °F from its SI data (issue 14: an imperial user got °C)', () => {
    // R-404A cut-in 30 psig ≈ 308.17 kPa abs (TR §2) sits above a −10 °F box (TR §4 low-temperature pump-down: cut-in 20–25 psig).
    const stored = lowPressureControl({ refrigerant: 'R-404A', unit: 'kPaG', cutIn: 30 * 6.894757293168361, differential: 100, designBoxTemp: (-10 - 32) / 1.8, temperatureUnit: 'C' });
    const w = stored.warnings.find((x) => x.code === 'cut_in_above_box')!;
    expect(w.message).toMatch(/°C/);
    const imperial = controlWarningMessage(w.code, w.data, { pressureUnit: 'psig', temperatureUnit: 'F' });
    expect(imperial).toMatch(/\(-10 °F\)/);
    expect(imperial).not.toMatch(/°C|kPa/);
    const again = lowPressureControl({ refrigerant: 'R-404A', unit: 'psig', cutIn: 30, differential: 100 / 6.894757293168361, designBoxTemp: -10, temperatureUnit: 'F' });
    expect(again.warnings.find((x) => x.code === 'cut_in_above_box')!.message).toBe(imperial);
  });

  it('the setting floors say they are common practice', () => {
    const r = lowPressureControl({ refrigerant: 'R-404A', unit: 'psig', cutIn: 5, differential: 19 });
    expect(r.warnings.find((x) => x.code === 'below_vacuum_floor')!.basis).toMatch(/common practice/);
  });
});

describe('service life: the expansion valve', () => {
  it('maps to the ASHRAE table row "Valve actuators, self-contained", 10 years (row and years from memory), not pneumatic controls', () => {
    expect(medianServiceLife('expansion_valve')).toMatchObject({ tableRow: 'Valve actuators, self-contained', medianYears: 10, howKnown: 'M' });
  });
});

describe('GWP: AR4 only where IPCC AR4 lists it; AR5 from its table', () => {
  // IPCC AR4 WG1 Table 2.14 and AR5 WG1 Table 8.A.1, as listed in TRADE-REFERENCE §1.1 GWP notes.
  const AR4: Record<string, number> = { 'R-32': 675, 'R-125': 3500, 'R-134a': 1430, 'R-143a': 4470, 'R-22': 1810, 'R-744': 1 };
  const AR5: Record<string, number> = { 'R-32': 677, 'R-125': 3170, 'R-134a': 1300, 'R-143a': 4800, 'R-22': 1760, 'R-744': 1, 'R-1234yf': 0, 'R-1234ze(E)': 0 };

  it('blends: the mass-weighted sum of listed components, or null when a component is not listed', () => {
    for (const r of REFRIGERANTS) {
      if (r.components.length < 2) continue;
      const sum = (table: Record<string, number>) =>
        r.components.every((c) => c.designation in table) ? Math.round(r.components.reduce((a, c) => a + (c.massPct / 100) * table[c.designation]!, 0)) : null;
      expect(r.gwpAr4, `${r.id} AR4`).toBe(sum(AR4));
      expect(r.gwpAr5, `${r.id} AR5`).toBe(sum(AR5));
    }
  });

  it('pure fluids: R-1234yf, propane and ammonia have no AR4 value; their regulatory figure is kept apart', () => {
    expect(getRefrigerant('R-1234yf')).toMatchObject({ gwpAr4: null, gwpEu517: 4 });
    expect(getRefrigerant('R-290')).toMatchObject({ gwpAr4: null, gwpEu517: 3 });
    expect(getRefrigerant('R-717')).toMatchObject({ gwpAr4: null, gwpEu517: 0 });
    expect(getRefrigerant('R-134a')).toMatchObject({ gwpAr4: 1430, gwpAr5: 1300 });
    expect(getRefrigerant('R-22')).toMatchObject({ gwpAr4: 1810, gwpAr5: 1760 });
  });
});

describe('R-407C: the P-T chart stops where the fit is checked (CoolProp 8.0.0 data to 50 °C)', () => {
  it('rows stop at 50 °C and the reason is given for the page', () => {
    const t = saturationTable('R-407C', { from: 40, to: 70, step: 5, temperatureUnit: 'C', pressureUnit: 'kPaAbs' });
    expect(t.rows.map((r) => r.temperature)).toEqual([40, 45, 50]);
    expect(t.clipped).toBe(true);
    const span = chartRange('R-407C');
    expect(span.maxC).toBe(50);
    expect(span.note).toMatch(/50 °C \(122 °F\)/);
    expect(chartRange('R-404A').note).toBeNull();
    // 187 °F (86 °C) is no longer on the chart in °F either.
    expect(saturationTable('R-407C', { from: 120, to: 190, step: 1, temperatureUnit: 'F', pressureUnit: 'psig' }).rows.at(-1)!.temperature).toBe(122);
  });
});

describe('citations: code cites public sources or files that are in the repository', () => {
  const files = (dir: string): string[] =>
    readdirSync(path.join(root, dir)).flatMap((name) => {
      const rel = path.join(dir, name);
      return statSync(path.join(root, rel)).isDirectory() ? files(rel) : /\.(ts|tsx)$/.test(name) ? [rel] : [];
    });
  const code = [...files('lib/calc'), ...files('app/api/calc'), ...files('app/(app)/tools'), 'docker-free-scripts/fit-saturation.ts'];

  it('no reference to a document outside the repository (TRADE-REFERENCE, shared/)', () => {
    for (const f of code) {
      const text = readFileSync(path.join(root, f), 'utf8');
      expect(text, f).not.toMatch(/TRADE-REFERENCE|(^|[^/\w])shared\/reference/);
    }
  });

  it('every repository path a comment cites exists', () => {
    for (const f of code) {
      const text = readFileSync(path.join(root, f), 'utf8');
      for (const m of text.matchAll(/\b((?:tests|lib|docker-free-scripts|db)\/[\w./-]+\.(?:csv|ts|md|json))\b/g)) {
        expect(statSync(path.join(root, m[1]!)).isFile(), `${f} cites ${m[1]}`).toBe(true);
      }
    }
  });
});
