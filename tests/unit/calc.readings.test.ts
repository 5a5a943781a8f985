import { describe, expect, it } from 'vitest';

import { CalcInputError, CalcRangeError } from '@/lib/calc/errors';
import { compressionRatio, computeReadings, condenserSplit, evaporatorTd, subcooling, superheat } from '@/lib/calc/readings';
import { KPA_PER_PSI, STANDARD_ATMOSPHERE_KPA } from '@/lib/calc/units';

// Saturation points below are TRADE-REFERENCE §1.3/§1.4 values (CoolProp reference EOS), so each
// expected reading is worked out by hand from published numbers, not from the code.
describe('superheat and subcooling (TRADE-REFERENCE §3 definitions)', () => {
  it('pure fluid: R-134a at 292.80 kPa abs (0 °C saturation, §1.3) with an 8 °C suction line → 8 K superheat', () => {
    const r = superheat({ refrigerant: 'R-134a', suctionPressureKpaAbs: 292.8, suctionLineTempC: 8 });
    expect(r.superheatK).toBeCloseTo(8, 2);
    expect(r.basis).toMatch(/dew/);
  });

  it('blend: superheat is taken from the dew point (R-404A dew at −30 °C = 202.23 kPa, §1.4)', () => {
    const r = superheat({ refrigerant: 'R-404A', suctionPressureKpaAbs: 202.23, suctionLineTempC: -24 });
    expect(r.dewC).toBeCloseTo(-30, 1);
    expect(r.superheatK).toBeCloseTo(6, 1);
  });

  it('blend with glide: R-407C dew at 0 °C = 460.71 kPa (§1.4) → suction line 5 °C gives 5 K, not the ~12 K a bubble reading would', () => {
    const r = superheat({ refrigerant: 'R-407C', suctionPressureKpaAbs: 460.71, suctionLineTempC: 5 });
    expect(r.superheatK).toBeCloseTo(5, 1);
  });

  it('subcooling is taken from the bubble point (R-404A bubble at 40 °C = 1829.42 kPa, §1.4)', () => {
    const r = subcooling({ refrigerant: 'R-404A', liquidPressureKpaAbs: 1829.42, liquidLineTempC: 35 });
    expect(r.bubbleC).toBeCloseTo(40, 1);
    expect(r.subcoolingK).toBeCloseTo(5, 1);
  });

  it('negative values are reported with a note, not hidden', () => {
    expect(superheat({ refrigerant: 'R-134a', suctionPressureKpaAbs: 292.8, suctionLineTempC: -1 }).notes[0]).toMatch(/Negative superheat/);
    expect(subcooling({ refrigerant: 'R-404A', liquidPressureKpaAbs: 1829.42, liquidLineTempC: 41 }).notes[0]).toMatch(/flash gas/);
  });
});

describe('evaporator TD, condenser split, compression ratio', () => {
  it('evaporator TD uses the glide mid-point by default (common practice); R-407C at 1 atm: NBP −43.63/−36.63 °C (§1.2)', () => {
    const mid = evaporatorTd({ refrigerant: 'R-407C', suctionPressureKpaAbs: STANDARD_ATMOSPHERE_KPA, boxTempC: -30 });
    expect(mid.reference).toBe('midpoint');
    expect(mid.evaporatingC).toBeCloseTo(-40.13, 1);
    expect(mid.tdK).toBeCloseTo(10.13, 1);
    const dew = evaporatorTd({ refrigerant: 'R-407C', suctionPressureKpaAbs: STANDARD_ATMOSPHERE_KPA, boxTempC: -30, reference: 'dew' });
    expect(dew.tdK).toBeCloseTo(6.63, 1);
    expect(dew.basis).toMatch(/dew point/);
  });

  it('condenser split: R-134a at 1016.59 kPa (40 °C, §1.3) with 30 °C air → 10 K', () => {
    expect(condenserSplit({ refrigerant: 'R-134a', headPressureKpaAbs: 1016.59, ambientC: 30 }).splitK).toBeCloseTo(10, 2);
  });

  it('compression ratio on absolute pressures: 200 psig / 20 psig = 214.696/34.696 = 6.188, not 10', () => {
    const r = compressionRatio({
      suctionKpaAbs: 20 * KPA_PER_PSI + STANDARD_ATMOSPHERE_KPA,
      dischargeKpaAbs: 200 * KPA_PER_PSI + STANDARD_ATMOSPHERE_KPA,
    });
    expect(r.ratio).toBeCloseTo(6.188, 3);
  });
});

describe('computeReadings in the user’s units', () => {
  it('°F and kPa abs: R-134a 292.80 kPa (32 °F saturation) and 50 °F suction line → 18 °F superheat (10 K)', () => {
    const r = computeReadings({
      refrigerant: 'r134a',
      pressureUnit: 'kPaAbs',
      temperatureUnit: 'F',
      suctionPressure: 292.8,
      suctionLineTemp: 50,
    });
    expect(r.refrigerant).toBe('R-134a');
    expect(r.superheat?.value).toBeCloseTo(18, 1);
    expect(r.superheat?.valueK).toBeCloseTo(10, 1);
    expect(r.superheat?.saturation).toBeCloseTo(32, 1);
    expect(r.subcooling).toBeNull();
    expect(r.compressionRatio).toBeNull();
  });

  it('psig: R-404A at 14.6 psig suction (−30 °C dew, §1.4) and 250.6 psig head (40 °C bubble, §1.4)', () => {
    const r = computeReadings({
      refrigerant: 'R-404A',
      pressureUnit: 'psig',
      temperatureUnit: 'C',
      suctionPressure: 14.6,
      headPressure: 250.6,
      suctionLineTemp: -24,
      liquidLineTemp: 35,
      boxTemp: -20,
      ambientTemp: 30,
    });
    expect(r.superheat?.value).toBeCloseTo(6, 0);
    expect(r.subcooling?.value).toBeCloseTo(5, 0);
    expect(r.evaporatorTd?.reference).toBe('midpoint');
    expect(r.condenserSplit?.value).toBeGreaterThan(9);
    expect(r.condenserSplit?.value).toBeLessThan(10.5);
    expect(r.compressionRatio?.ratio).toBeCloseTo((250.6 + 14.696) / (14.6 + 14.696), 2);
  });

  it('rejects bad input with clear messages', () => {
    const base = { refrigerant: 'R-404A', pressureUnit: 'psig', temperatureUnit: 'F' } as const;
    expect(() => computeReadings({ ...base, refrigerant: 'R-999' })).toThrow(/unknown refrigerant "R-999"/);
    expect(() => computeReadings({ ...base, suctionPressure: Number.NaN, suctionLineTemp: 40 })).toThrow(CalcInputError);
    expect(() => computeReadings({ ...base, suctionPressure: 20, suctionLineTemp: Number.NaN })).toThrow(/finite number/);
    // A head below suction fails the compression ratio alone; the saturation values stay.
    const r = computeReadings({ ...base, suctionPressure: 20, headPressure: 10 });
    expect(r.compressionRatio).toBeNull();
    expect(r.errors.compressionRatio).toMatchObject({ field: 'headPressure', message: expect.stringMatching(/discharge pressure must not be below suction/) });
    expect(r.evaporating).not.toBeNull();
    // When nothing at all can be computed, the request itself is refused with the reason.
    expect(() => computeReadings({ ...base, suctionPressure: 600, suctionLineTemp: 40 })).toThrow(CalcRangeError);
    expect(() => compressionRatio({ suctionKpaAbs: 0, dischargeKpaAbs: 100 })).toThrow(/greater than zero/);
  });
});
