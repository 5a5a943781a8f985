// What the readings and settings forms and the visit report say around the numbers: the barometer
// and elevation in the reader's units, the sea-level value beside a corrected saturation
// temperature, the saturation each TD is taken from, calculation messages and pressure-control
// warnings in the reader's units, and the likely causes in the report, labelled as a guide.
import { describe, expect, it } from 'vitest';

import { readingRows } from '@/app/(app)/visits/[id]/_components/kinds/reading-form';
import { gaugeSaturationC } from '@/lib/calc/saturation';
import { KPA_PER_PSI } from '@/lib/calc/units';
import { gaugeBasis } from '@/lib/format/barometer';
import { formatStamp } from '@/lib/format/dates';
import { formatFactor, formatPercent, formatRatio } from '@/lib/format/numbers';
import { calcUnitsFor, formatAbsolutePressure, type UnitPrefs } from '@/lib/units/quantities';
import { computeReading } from '@/lib/visits/kinds/reading';
import { computeSettingChange, settingWarningText } from '@/lib/visits/kinds/setting-change';
import type { EntryContext } from '@/lib/visits/kinds/types';
import { suggestionLines } from '@/lib/visits/report-content';

const imperial: UnitPrefs = { units: 'imperial', metricPressure: 'kPa' };
const metric: UnitPrefs = { units: 'metric', metricPressure: 'kPa' };
const metricBar: UnitPrefs = { units: 'metric', metricPressure: 'bar' };
const psigToKpaG = (psig: number) => psig * KPA_PER_PSI;
const toF = (c: number) => c * 1.8 + 32;

const ctx = (over: Partial<EntryContext> = {}): EntryContext => ({
  refrigerant: 'R-404A',
  elevationM: 1610,
  designBoxTempC: null,
  nameplateVoltage: null,
  controlVoltageNominal: null,
  designPressureHighKpaG: null,
  ...over,
});

describe('the barometer a gauge reading was taken against, in the reader’s units', () => {
  // ICAO / ISO 2533 standard atmosphere: p = 101.325 · (1 − 2.25577e-5 · h)^5.25588 → 83.42 kPa at 1610 m,
  // 12.10 psia (1 psi = 6.894757 kPa, NIST SP 811); 1610 m = 5,282 ft (1 ft = 0.3048 m exactly).
  it('at 1610 m: corrected, elevation in ft and barometer in psia for an imperial reader', () => {
    const b = gaugeBasis(1610, imperial);
    expect(b.corrected).toBe(true);
    expect(b.barometricKpa).toBeCloseTo(83.42, 2);
    expect(b.text).toContain('corrected for the site’s elevation (5,282 ft)');
    expect(b.text).toContain('barometer of 12.1 psia');
    expect(b.text).toContain('sea-level value');
    expect(b.text).not.toMatch(/ m\)|kPa/);
  });
  it('the same site in m and kPa abs, or bar abs, for a metric reader', () => {
    expect(gaugeBasis(1610, metric).text).toContain('(1,610 m)');
    expect(gaugeBasis(1610, metric).text).toContain('83.4 kPa abs');
    expect(gaugeBasis(1610, metricBar).text).toContain('0.834 bar abs');
  });
  it('at sea level nothing is corrected, and it says so', () => {
    const b = gaugeBasis(0, imperial);
    expect(b.corrected).toBe(false);
    expect(b.text).toContain('sea-level barometer (14.7 psia');
  });
  it('absolute pressure in each unit, and the units lib/calc words messages in', () => {
    expect(formatAbsolutePressure(101.325, imperial)).toBe('14.7 psia');
    expect(calcUnitsFor(imperial)).toEqual({ pressureUnit: 'psig', temperatureUnit: 'F' });
    expect(calcUnitsFor(metricBar)).toEqual({ pressureUnit: 'barG', temperatureUnit: 'C' });
  });
});

describe('sea-level value beside a corrected saturation temperature', () => {
  // Issue 14's worked example, checked there against CoolProp: R-404A at 15 psig reads −21.5 °F dew on a
  // sea-level pocket chart, and −25.4 °F against the 1610 m barometer (83.42 kPa, ISO 2533).
  it('R-404A 15 psig: −21.5 °F dew at sea level, −25.4 °F at 1610 m', () => {
    expect(toF(gaugeSaturationC('R-404A', psigToKpaG(15), 'dew')!)).toBeCloseTo(-21.5, 1);
    expect(toF(gaugeSaturationC('R-404A', psigToKpaG(15), 'dew', gaugeBasis(1610, imperial).barometricKpa)!)).toBeCloseTo(-25.4, 1);
  });
  it('a gauge reading below a perfect vacuum has no saturation value (null, not a throw)', () => {
    expect(gaugeSaturationC('R-404A', -200, 'dew')).toBeNull();
  });
  it('the readings form shows the local dew point with the sea-level one beside it, in °F', () => {
    const data = { suctionKpaG: psigToKpaG(15), suctionLineC: -20, boxC: -10 };
    const c = computeReading(data, ctx(), imperial);
    const rows = readingRows(c, imperial, { data, refrigerant: 'R-404A', elevationM: 1610 });
    const evap = rows.find((r) => r.key === 'evaporatingC')!;
    expect(evap.value).toBe('-25.4 °F');
    expect(evap.note).toContain('At sea level (pocket chart): -21.5 °F');
  });
  it('at sea level no second value is offered', () => {
    const data = { suctionKpaG: psigToKpaG(15), suctionLineC: -20 };
    const rows = readingRows(computeReading(data, ctx({ elevationM: 0 }), imperial), imperial, { data, refrigerant: 'R-404A', elevationM: 0 });
    expect(rows.find((r) => r.key === 'evaporatingC')!.note ?? '').not.toContain('sea level');
  });
});

describe('one saturation reference per value', () => {
  // TD = box − evaporating at the glide mid-point (common practice for blends); R-404A glide is small but not 0.
  it('the TD row names the glide mid-point and shows the saturation it was taken from, which is box − TD', () => {
    const data = { suctionKpaG: psigToKpaG(15), boxC: -10, dischargeKpaG: psigToKpaG(250), ambientC: 30 };
    const c = computeReading(data, ctx({ elevationM: 0 }), imperial);
    expect(c.references).toEqual({ evaporatorTd: 'midpoint', condenserSplit: 'midpoint' });
    const rows = readingRows(c, imperial, { data, refrigerant: 'R-404A', elevationM: 0 });
    const td = rows.find((r) => r.key === 'evaporatorTdK')!;
    const mid = toF(-10 - c.evaporatorTdK!);
    expect(td.note).toContain(`Box − evaporating at the glide mid-point, ${mid.toFixed(1)} °F`);
    // The mid-point lies between bubble and dew: not the dew point shown on the evaporating row.
    expect(mid).not.toBeCloseTo(toF(c.evaporatingC!), 1);
    const split = rows.find((r) => r.key === 'condenserSplitK')!;
    expect(split.note).toContain(`condensing at the glide mid-point, ${toF(30 + c.condenserSplitK!).toFixed(1)} °F`);
  });
});

describe('calculation messages in the reader’s units', () => {
  it('an R-744 head pressure above the critical point: the problem reads in psig for an imperial reader, kPa(g) otherwise', () => {
    // R-744 critical point 7377.3 kPa abs, 31.0 °C (Span & Wagner 1996).
    const data = { suctionKpaG: psigToKpaG(271), suctionLineC: -5, dischargeKpaG: psigToKpaG(1300), ambientC: 27 };
    const c = computeReading(data, ctx({ refrigerant: 'R-744', elevationM: 0 }), imperial);
    expect(c.superheatK).not.toBeNull();
    expect(c.problems.join(' ')).toMatch(/psig/);
    expect(c.problems.join(' ')).not.toMatch(/kPa|°C/);
    expect(computeReading(data, ctx({ refrigerant: 'R-744', elevationM: 0 })).problems.join(' ')).toMatch(/kPa/);
  });
  it('the values are the same SI numbers whichever units words the messages', () => {
    const data = { suctionKpaG: 150, suctionLineC: -20, dischargeKpaG: 1700, liquidLineC: 35, boxC: -18, ambientC: 30 };
    const a = computeReading(data, ctx());
    const b = computeReading(data, ctx(), imperial);
    for (const k of ['evaporatingC', 'condensingC', 'superheatK', 'subcoolingK', 'evaporatorTdK', 'condenserSplitK'] as const) expect(b[k]).toBeCloseTo(a[k]!, 9);
  });
  it('a low-pressure control warning stored in kPa and °C reads in psig and °F for an imperial reader', () => {
    // Cut-in 40 psig on R-404A saturates near 5 °F (dew), above a −10 °F (−23.3 °C) design box: the control cannot hold the box.
    const s = { cutInKpaG: psigToKpaG(40), differentialKpa: psigToKpaG(20) };
    const c = computeSettingChange({ control: 'low', asFound: s, asLeft: s } as never, ctx({ elevationM: 0, designBoxTempC: (-10 - 32) / 1.8 }));
    const w = c.warnings.find((x) => x.code === 'cut_in_above_box')!;
    expect(w.message).toMatch(/°C/);
    const text = settingWarningText(w, imperial);
    expect(text).toMatch(/\(-10 °F\)/);
    expect(text).not.toMatch(/°C|kPa/);
    // Worked in the reader's units from the start, the form's warning already reads in °F.
    const live = computeSettingChange({ control: 'low', asFound: s, asLeft: s } as never, ctx({ elevationM: 0, designBoxTempC: (-10 - 32) / 1.8 }), imperial);
    expect(live.warnings.find((x) => x.code === 'cut_in_above_box')!.message).toMatch(/\(-10 °F\)/);
    // …and its values are the same SI numbers.
    expect(live.asLeftOtherKpaG).toBeCloseTo(c.asLeftOtherKpaG!, 9);
    expect(live.asLeftSaturation.setting).toBeCloseTo(c.asLeftSaturation.setting!, 9);
    // A warning without data (stored before warnings carried it) keeps its saved words.
    expect(settingWarningText({ code: 'x', message: 'Saved words.' }, imperial)).toBe('Saved words.');
  });
});

describe('pressure-control problems in the reader’s units', () => {
  it('a cut-out below a perfect vacuum: the problem names psig for an imperial reader, kPa(g) otherwise', () => {
    // −14 psig cut-in less a 5 psi differential is −19 psig: below −14.7 psig, the perfect vacuum at sea level (NIST SP 811).
    const s = { cutInKpaG: psigToKpaG(-14), differentialKpa: psigToKpaG(5) };
    const data = { control: 'low', asFound: s, asLeft: s } as never;
    const imperialProblems = computeSettingChange(data, ctx({ elevationM: 0 }), imperial).problems.join(' ');
    expect(imperialProblems).toMatch(/a differential of 5 psi from a cut-in of -14 psig puts the cut-out below a perfect vacuum/);
    expect(imperialProblems).not.toMatch(/kPa/);
    expect(computeSettingChange(data, ctx({ elevationM: 0 })).problems.join(' ')).toMatch(/kPa\(g\)/);
  });
});

describe('numbers and dates people read', () => {
  it('percent, ratio and factor at one precision each, never a raw float', () => {
    expect(formatPercent(2.2222222)).toBe('2.2 %');
    expect(formatRatio(8.666666)).toBe('8.7');
    expect(formatFactor(0.95)).toBe('0.95');
  });
  it('a document stamp is in the site’s time zone with its abbreviation; UTC when there is no site', () => {
    expect(formatStamp('2026-12-02T02:30:00Z', 'America/Denver')).toBe('Dec 1, 2026, 7:30 PM MST');
    expect(formatStamp('2026-12-02T02:30:00Z')).toBe('Dec 2, 2026, 2:30 AM UTC');
  });
});

describe('the visit report gives the likely causes as a guide', () => {
  it('a reading with suggestions: a guide line from common practice, then each cause with its reasoning and checks', () => {
    const lines = suggestionLines({ kind: 'reading', computed: { suggestions: [{ title: 'Low charge', reasoning: 'High superheat with low subcooling.', checks: ['leak check', 'sight glass'] }] } });
    expect(lines[0]).toMatch(/guide from common practice, not a verdict/);
    expect(lines[1]).toBe('1. Low charge. High superheat with low subcooling. Check: leak check; sight glass.');
  });
  it('no suggestions, or another kind of entry: no lines', () => {
    expect(suggestionLines({ kind: 'reading', computed: { suggestions: [] } })).toEqual([]);
    expect(suggestionLines({ kind: 'note', computed: null })).toEqual([]);
  });
  it('an R-404A freezer reading with high superheat and low subcooling yields suggestions the report prints', () => {
    // Same case as calc.reading-cases: dew −22 °F at 14.6 psig, bubble 104 °F at 250.6 psig (CoolProp), freezer TXV bands (common practice).
    const data = { suctionKpaG: psigToKpaG(14.6), suctionLineC: (4 - 32) / 1.8, dischargeKpaG: psigToKpaG(250.6), liquidLineC: (103 - 32) / 1.8, boxC: (20 - 32) / 1.8, ambientC: (85 - 32) / 1.8 };
    const c = computeReading(data, ctx({ elevationM: 0, designBoxTempC: (-10 - 32) / 1.8 }));
    const lines = suggestionLines({ kind: 'reading', computed: c as unknown as Record<string, unknown> });
    expect(lines.length).toBeGreaterThan(1);
    expect(lines[1]).toMatch(/^1\. Low charge, or a restriction before the metering device\./);
  });
});
