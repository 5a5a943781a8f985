// Levels and suggestions for whole readings, case by case. Saturation points are published values
// (TRADE-REFERENCE §1.3/§1.4: CoolProp reference EOS), so each expected reading is worked by hand;
// the bands are the common-practice figures of TRADE-REFERENCE §3 (superheat, subcooling) and §8
// (evaporator TD, condenser split), and the suggestion patterns are common practice from service
// training texts. Each case names its source beside it.
import { describe, expect, it } from 'vitest';

import { suggestCauses } from '@/lib/calc/diagnosis';
import { describeBand, judge } from '@/lib/calc/band-judgement';
import { ALL_BANDS, bandFor, boxClassFor } from '@/lib/calc/reading-bands';
import { computeReadings, type ReadingsInput } from '@/lib/calc/readings';

const F = (k: number): number => k * 1.8; // ΔT: 1 K = 1.8 °F (TRADE-REFERENCE §2)

interface Case {
  name: string;
  source: string;
  input: ReadingsInput;
  levels: Partial<Record<'superheat' | 'subcooling' | 'evaporatorTd' | 'condenserSplit' | 'compressionRatio', string>>;
  values?: Partial<Record<'superheat' | 'subcooling' | 'evaporatorTd' | 'condenserSplit', number>>;
  firstSuggestion: string | null;
  alsoSuggests?: string[];
}

const R134A_0C = 292.8; // kPa abs, R-134a saturation at 0 °C (TRADE-REFERENCE §1.3)
const R134A_40C = 1016.59; // kPa abs, at 40 °C (§1.3)

const cases: Case[] = [
  {
    name: 'R-404A freezer, TXV: high superheat with low subcooling → low charge or a restriction before the valve',
    source: 'R-404A dew −30 °C = 14.6 psig, bubble 40 °C = 250.6 psig (§1.4); freezer TXV superheat 4–6 °F (§3); SC 5–15 °F (§3); freezer TD ≈ 10 °F (§8)',
    input: {
      refrigerant: 'R-404A',
      pressureUnit: 'psig',
      temperatureUnit: 'F',
      designBoxTemp: -10,
      suctionPressure: 14.6,
      suctionLineTemp: 4, // dew −22 °F → 26 °F superheat
      headPressure: 250.6,
      liquidLineTemp: 103, // bubble 104 °F → 1 °F subcooling
      boxTemp: 20,
      ambientTemp: 85,
    },
    levels: { superheat: 'abnormal', subcooling: 'watch', evaporatorTd: 'abnormal', condenserSplit: 'normal' },
    values: { superheat: 26, subcooling: 1 },
    firstSuggestion: 'undercharge_or_liquid_restriction',
  },
  {
    name: 'R-134a cooler, TXV: high superheat with high subcooling → the metering device is starving the coil',
    source: 'R-134a 0 °C = 292.80 kPa, 40 °C = 1016.59 kPa (§1.3); cooler TXV superheat 6–10 °F (§3); split 15–30 °F (§8)',
    input: {
      refrigerant: 'R-134a',
      pressureUnit: 'kPaAbs',
      temperatureUnit: 'C',
      designBoxTemp: 2,
      suctionPressure: R134A_0C,
      suctionLineTemp: 12, // 12 K = 21.6 °F
      liquidPressure: R134A_40C,
      liquidLineTemp: 28, // 12 K = 21.6 °F
      headPressure: R134A_40C,
      ambientTemp: 25, // split 15 K = 27 °F
      boxTemp: 6, // TD 6 K = 10.8 °F
    },
    levels: { superheat: 'abnormal', subcooling: 'abnormal', evaporatorTd: 'normal', condenserSplit: 'normal', compressionRatio: 'normal' },
    values: { superheat: 12, subcooling: 12, evaporatorTd: 6, condenserSplit: 15 },
    firstSuggestion: 'metering_device_starving',
  },
  {
    name: 'R-134a cooler: low superheat with a large TD → low airflow over the evaporator, then overfeeding',
    source: 'R-134a 0 °C = 292.80 kPa (§1.3); cooler TD 8–12 °F (§8); cooler TXV superheat 6–10 °F (§3)',
    input: {
      refrigerant: 'R-134a',
      pressureUnit: 'kPaAbs',
      temperatureUnit: 'C',
      boxClass: 'cooler',
      suctionPressure: R134A_0C,
      suctionLineTemp: 1, // 1 K = 1.8 °F
      boxTemp: 10, // 10 K = 18 °F
    },
    levels: { superheat: 'abnormal', evaporatorTd: 'abnormal' },
    firstSuggestion: 'low_evaporator_airflow',
    alsoSuggests: ['overfeeding_or_flooding'],
  },
  {
    name: 'R-134a cooler: high condenser split, the rest usual → dirty condenser, airflow or non-condensables',
    source: 'R-134a 40 °C = 1016.59 kPa (§1.3); split 15–30 °F (§8): 20 K = 36 °F is beyond it',
    input: {
      refrigerant: 'R-134a',
      pressureUnit: 'kPaAbs',
      temperatureUnit: 'F',
      designBoxTemp: 36,
      suctionPressure: R134A_0C,
      suctionLineTemp: 32 + F(4), // 4 K = 7.2 °F superheat
      headPressure: R134A_40C,
      liquidLineTemp: 104 - F(5), // 5 K = 9 °F subcooling
      ambientTemp: 68, // 20 °C → split 36 °F
      boxTemp: 32 + F(5.5), // TD 9.9 °F
    },
    levels: { superheat: 'normal', subcooling: 'normal', evaporatorTd: 'normal', condenserSplit: 'abnormal' },
    values: { condenserSplit: 36 },
    firstSuggestion: 'condenser_airflow_or_noncondensables',
  },
  {
    name: 'every value usual → no suggestion',
    source: 'R-134a (§1.3); bands of §3 and §8',
    input: {
      refrigerant: 'R-134a',
      pressureUnit: 'kPaAbs',
      temperatureUnit: 'C',
      boxClass: 'cooler',
      suctionPressure: R134A_0C,
      suctionLineTemp: 4,
      headPressure: R134A_40C,
      liquidLineTemp: 35,
      ambientTemp: 28,
      boxTemp: 5.5,
    },
    levels: { superheat: 'normal', subcooling: 'normal', evaporatorTd: 'normal', condenserSplit: 'normal', compressionRatio: 'normal' },
    firstSuggestion: null,
  },
];

describe('reading cases: levels and suggestions', () => {
  it.each(cases.map((c) => [c.name, c] as const))('%s', (_name, c) => {
    const r = computeReadings(c.input);
    for (const [key, level] of Object.entries(c.levels)) {
      const value = r[key as keyof typeof c.levels];
      expect(value, `${key} (${c.source})`).not.toBeNull();
      expect(value!.level, `${key} (${c.source})`).toBe(level);
    }
    for (const [key, expected] of Object.entries(c.values ?? {})) {
      const v = r[key as 'superheat' | 'subcooling' | 'evaporatorTd' | 'condenserSplit']!;
      const inUnit = c.input.temperatureUnit === 'F' ? v.value : v.valueK;
      expect(inUnit, `${key} (${c.source})`).toBeCloseTo(expected, 0);
    }
    expect(r.suggestions[0]?.code ?? null, c.source).toBe(c.firstSuggestion);
    for (const code of c.alsoSuggests ?? []) expect(r.suggestions.map((s) => s.code)).toContain(code);
    // Always a guide with its reasoning and checks, never a verdict.
    for (const s of r.suggestions) {
      expect(s.guide).toBe(true);
      expect(s.basis).toMatch(/common practice/);
      expect(s.reasoning.length).toBeGreaterThan(20);
      expect(s.checks.length).toBeGreaterThan(0);
    }
    expect(r.suggestions.map((s) => s.rank)).toEqual(r.suggestions.map((_, i) => i + 1));
  });

  it('issue 14: on a freezer, TD 49.5 °F and superheat 25.9 °F are abnormal, shown against "usual 8–12 °F for a freezer evaporator"', () => {
    // TRADE-REFERENCE §8: freezer TD ≈ 10 °F; §3: low-temperature TXV superheat 4–6 °F (common practice).
    const td = bandFor('evaporatorTd', { boxClass: 'freezer' });
    expect(judge(49.5 / 1.8, td)).toEqual({ level: 'abnormal', direction: 'high' });
    expect(describeBand(td, 'F').text).toBe('usual 8–12 °F for a freezer evaporator');
    expect(describeBand(td, 'C').text).toBe('usual 4.4–6.7 K for a freezer evaporator');
    const sh = bandFor('superheat', { boxClass: 'freezer', meteringDevice: 'txv' });
    expect(judge(25.9 / 1.8, sh).level).toBe('abnormal');
    expect(describeBand(sh, 'F').text).toBe('usual 4–6 °F for a freezer evaporator (TXV)');
  });

  it('the metering device changes the band: 14 °F superheat is watch with a TXV, normal with a fixed orifice (§3; fixed band from memory)', () => {
    const base = { refrigerant: 'R-134a', pressureUnit: 'kPaAbs', temperatureUnit: 'F', boxClass: 'cooler', suctionPressure: R134A_0C, suctionLineTemp: 46 } as const;
    expect(computeReadings({ ...base, meteringDevice: 'txv' }).superheat?.level).toBe('watch');
    const fixed = computeReadings({ ...base, meteringDevice: 'fixed' }).superheat!;
    expect(fixed.level).toBe('normal');
    expect(fixed.band.howKnown).toBe('from memory');
  });

  it('superheat at the compressor is judged on return-gas superheat 20–30 °F (§3, common practice)', () => {
    const r = computeReadings({ refrigerant: 'R-134a', pressureUnit: 'kPaAbs', temperatureUnit: 'F', suctionPressure: R134A_0C, suctionLineTemp: 57, superheatAt: 'compressor_inlet' });
    expect(r.superheat?.level).toBe('normal');
    expect(r.superheat?.band.text).toBe('usual 20–30 °F for suction gas at the compressor');
  });

  it('box class: given, else from the design box temperature, else the measured one; split at 32 °F (10 CFR 431.302)', () => {
    expect(boxClassFor({ boxTempC: 1.7 }).boxClass).toBe('cooler');
    expect(boxClassFor({ boxTempC: 0 }).boxClass).toBe('freezer');
    expect(boxClassFor({ boxClass: 'low_temp_display', boxTempC: 5 })).toEqual({ boxClass: 'low_temp_display', from: 'given' });
    const r = computeReadings({ refrigerant: 'R-134a', pressureUnit: 'kPaAbs', temperatureUnit: 'C', suctionPressure: R134A_0C, boxTemp: 8, designBoxTemp: -18 });
    expect(r).toMatchObject({ boxClass: 'freezer', boxClassFrom: 'design_box_temperature' });
  });

  it('every band is labelled with its source, says common practice or from memory, and nests normal inside watch', () => {
    for (const b of ALL_BANDS) {
      expect(b.source.length, b.label).toBeGreaterThan(20);
      expect(b.source, b.label).toMatch(/common practice|from memory/);
      if (b.normal.min !== null && b.watch.min !== null) expect(b.watch.min).toBeLessThanOrEqual(b.normal.min);
      if (b.normal.max !== null && b.watch.max !== null) expect(b.watch.max).toBeGreaterThanOrEqual(b.normal.max);
    }
  });
});

describe('suggestCauses on levels alone (common practice patterns)', () => {
  it('low control voltage → transformer or loose connection; a low supply line joins it', () => {
    const s = suggestCauses({ controlVoltage: { level: 'watch', direction: 'low' } });
    expect(s.map((x) => x.code)).toEqual(['control_transformer_or_connection']);
    const both = suggestCauses({ controlVoltage: { level: 'watch', direction: 'low' }, supplyVoltage: { level: 'abnormal', direction: 'low' } });
    expect(both.map((x) => x.code)).toContain('supply_voltage');
  });

  it('high superheat with high subcooling ranks the metering device first, not the single-reading "starving" line', () => {
    const s = suggestCauses({ superheat: { level: 'abnormal', direction: 'high' }, subcooling: { level: 'watch', direction: 'high' } });
    expect(s[0]!.code).toBe('metering_device_starving');
    expect(s.map((x) => x.code)).not.toContain('evaporator_starving');
  });

  it('a large TD with high superheat puts the starved coil ahead of low airflow (a starved coil also raises TD)', () => {
    const s = suggestCauses({ superheat: { level: 'abnormal', direction: 'high' }, evaporatorTd: { level: 'abnormal', direction: 'high' } });
    expect(s[0]!.code).toBe('evaporator_starving');
    expect(s.map((x) => x.code)).toContain('low_evaporator_airflow');
  });

  it('all normal, or nothing known → no suggestions; at most four are returned', () => {
    expect(suggestCauses({})).toEqual([]);
    expect(suggestCauses({ superheat: { level: 'normal', direction: null } })).toEqual([]);
    const many = suggestCauses({
      superheat: { level: 'abnormal', direction: 'low' },
      evaporatorTd: { level: 'abnormal', direction: 'high' },
      condenserSplit: { level: 'abnormal', direction: 'high' },
      subcooling: { level: 'abnormal', direction: 'high' },
      controlVoltage: { level: 'abnormal', direction: 'low' },
      voltageUnbalance: { level: 'abnormal', direction: 'high' },
    });
    expect(many.length).toBe(4);
  });
});
