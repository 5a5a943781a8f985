import { describe, expect, it } from 'vitest';

import { CalcInputError } from '@/lib/calc/errors';
import { highPressureControl, LP_FLOOR_KPA_ABS, lowPressureControl } from '@/lib/calc/pressure-controls';
import { KPA_PER_PSI, STANDARD_ATMOSPHERE_KPA } from '@/lib/calc/units';

const codes = (w: { code: string }[]): string[] => w.map((x) => x.code);

describe('low-pressure control (TRADE-REFERENCE §4, common practice)', () => {
  it('worked example: cut-in 30 psig, differential 20 psi → cut-out 10 psig', () => {
    const r = lowPressureControl({ refrigerant: 'R-404A', unit: 'psig', cutIn: 30, differential: 20 });
    expect(r.cutOut).toBe(10);
    expect(r.cutOutKpaAbs).toBeCloseTo(10 * KPA_PER_PSI + STANDARD_ATMOSPHERE_KPA, 9);
    expect(r.warnings).toEqual([]);
  });

  it('worked example: cut-in 50 psig, differential 35 psi → cut-out 15 psig', () => {
    expect(lowPressureControl({ refrigerant: 'R-404A', unit: 'psig', cutIn: 50, differential: 35 }).cutOut).toBe(15);
  });

  it('gives the dew-point saturation temperature of each setting (R-404A dew at 0 °C = 600.33 kPa abs, §1.4)', () => {
    const cutIn = (600.33 - STANDARD_ATMOSPHERE_KPA) / KPA_PER_PSI;
    const r = lowPressureControl({ refrigerant: 'R-404A', unit: 'psig', cutIn, differential: 10, temperatureUnit: 'F' });
    expect(r.cutInSaturation.dew).toBeCloseTo(32, 1);
    // Bubble sits ~0.55 K lower: log-interpolating the reference bubble pressures at −5 and 0 °C
    // (519.37 and 610.19 kPa) puts 600.33 kPa at about −0.55 °C = 31.0 °F.
    expect(r.cutInSaturation.bubble).toBeCloseTo(31.0, 0);
  });

  it('works in bar(g) with a bar differential', () => {
    const r = lowPressureControl({ refrigerant: 'R-404A', unit: 'barG', cutIn: 2, differential: 1.5 });
    expect(r.cutOut).toBeCloseTo(0.5, 12);
    expect(r.cutOutKpaAbs).toBeCloseTo(50 + STANDARD_ATMOSPHERE_KPA, 9);
  });

  it('warns when the cut-out is a vacuum on a system not designed for one; not when vacuum is allowed', () => {
    const r = lowPressureControl({ refrigerant: 'R-404A', unit: 'psig', cutIn: 10, differential: 15 });
    expect(r.cutOut).toBe(-5);
    expect(codes(r.warnings)).toEqual(['vacuum_cut_out']);
    expect(r.cutOutSaturation.dew).toBeNull();
    expect(r.cutOutSaturation.note).toMatch(/below the dew pressure at -50 °C/);
    const ok = lowPressureControl({ refrigerant: 'R-404A', unit: 'psig', cutIn: 10, differential: 15, vacuumAllowed: true });
    expect(ok.warnings).toEqual([]);
  });

  it('warns below the 27 inHg vacuum floor (≈1.435 psia, common practice)', () => {
    expect(LP_FLOOR_KPA_ABS / KPA_PER_PSI).toBeCloseTo(1.435, 3);
    const r = lowPressureControl({ refrigerant: 'R-404A', unit: 'psig', cutIn: 0, differential: 14, vacuumAllowed: true });
    expect(codes(r.warnings)).toEqual(['below_vacuum_floor']);
  });

  it('warns when the cut-in saturation is above the design box temperature (35 °F box, R-404A)', () => {
    // R-404A dew at 5 °C (41 °F) is 701.8 kPa = 87.1 psig (reference data), so 90 psig saturates above 35 °F.
    const high = lowPressureControl({ refrigerant: 'R-404A', unit: 'psig', cutIn: 90, differential: 40, temperatureUnit: 'F', designBoxTemp: 35 });
    expect(codes(high.warnings)).toEqual(['cut_in_above_box']);
    expect(high.warnings[0]?.message).toMatch(/cannot hold the box/);
    // 60 psig is below the 0 °C dew pressure (72.4 psig), so it saturates below 32 °F.
    const ok = lowPressureControl({ refrigerant: 'R-404A', unit: 'psig', cutIn: 60, differential: 40, temperatureUnit: 'F', designBoxTemp: 35 });
    expect(ok.warnings).toEqual([]);
  });

  it('rejects bad settings with clear messages', () => {
    expect(() => lowPressureControl({ refrigerant: 'R-404A', unit: 'psig', cutIn: 30, differential: 0 })).toThrow(
      'differential must be greater than zero (got 0)',
    );
    expect(() => lowPressureControl({ refrigerant: 'R-404A', unit: 'psig', cutIn: 30, differential: -5 })).toThrow(CalcInputError);
    expect(() => lowPressureControl({ refrigerant: 'R-404A', unit: 'psig', cutIn: 0, differential: 20 })).toThrow(/below a perfect vacuum/);
    expect(() => lowPressureControl({ refrigerant: 'R-404A', unit: 'psig', cutIn: Number.NaN, differential: 20 })).toThrow(/cut-in must be a finite number/);
    expect(() => lowPressureControl({ refrigerant: 'nope', unit: 'psig', cutIn: 30, differential: 20 })).toThrow(/unknown refrigerant/);
  });
});

describe('high-pressure control (TRADE-REFERENCE §4)', () => {
  it('cut-in (reset) = cut-out − differential: 400 psig − 100 psi → 300 psig', () => {
    const r = highPressureControl({ refrigerant: 'R-404A', unit: 'psig', cutOut: 400, differential: 100 });
    expect(r.cutIn).toBe(300);
    expect(r.warnings).toEqual([]);
  });

  it('R-134a: 250 psig corresponds to about 146 °F condensing (§4, common practice)', () => {
    const r = highPressureControl({ refrigerant: 'R-134a', unit: 'psig', cutOut: 250, differential: 50, temperatureUnit: 'F' });
    expect(Math.abs((r.cutOutSaturation.bubble ?? NaN) - 146)).toBeLessThan(1);
    expect(r.cutOutSaturation.bubble).toBe(r.cutOutSaturation.dew);
  });

  it('reports bubble and dew for a glide blend (R-407C at 40 °C: 1749.05 / 1541.32 kPa, §1.4)', () => {
    const r = highPressureControl({ refrigerant: 'R-407C', unit: 'kPaAbs', cutOut: 1749.05, differential: 300 });
    expect(r.cutOutSaturation.bubble).toBeCloseTo(40, 1);
    expect((r.cutOutSaturation.dew ?? NaN) - (r.cutOutSaturation.bubble ?? NaN)).toBeGreaterThan(4);
  });

  it('warns above the nameplate design pressure and below the 50 psig reset floor', () => {
    const over = highPressureControl({ refrigerant: 'R-404A', unit: 'psig', cutOut: 425, differential: 100, designPressure: 400 });
    expect(codes(over.warnings)).toEqual(['above_design_pressure']);
    const low = highPressureControl({ refrigerant: 'R-134a', unit: 'psig', cutOut: 100, differential: 60 });
    // 100 psig is also far below an R-134a condenser on a hot day (saturation ≈ 90 °F): nuisance trips.
    expect(codes(low.warnings)).toEqual(['high_low_event_below_floor', 'cut_out_below_condensing']);
  });

  it('a cut-out above the critical pressure has no saturation temperature (R-744), with the reason', () => {
    const r = highPressureControl({ refrigerant: 'R-744', unit: 'psig', cutOut: 1300, differential: 100 });
    expect(r.cutOutSaturation.dew).toBeNull();
    expect(r.cutOutSaturation.note).toMatch(/above its critical pressure/);
  });

  it('rejects bad settings', () => {
    expect(() => highPressureControl({ refrigerant: 'R-404A', unit: 'psig', cutOut: 50, differential: 70 })).toThrow(/below a perfect vacuum/);
    expect(() => highPressureControl({ refrigerant: 'R-404A', unit: 'psig', cutOut: 400, differential: Number.NaN })).toThrow(CalcInputError);
  });
});
