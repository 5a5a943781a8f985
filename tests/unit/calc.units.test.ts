import { describe, expect, it } from 'vitest';

import { barometricPressureKpa, resolveBarometricKpa } from '@/lib/calc/atmosphere';
import { CalcInputError, CalcRangeError } from '@/lib/calc/errors';
import {
  celsiusToFahrenheit,
  fahrenheitToCelsius,
  fromKpaAbs,
  G_PER_OZ,
  inHgVacuumToKpaAbs,
  KG_PER_LB,
  KPA_PER_INHG,
  KPA_PER_PSI,
  KW_PER_TON_REFRIGERATION,
  lbToKg,
  PA_PER_PSI,
  pressureDifferenceToKpa,
  STANDARD_ATMOSPHERE_KPA,
  temperatureDifferenceFromKelvin,
  temperatureDifferenceToKelvin,
  toCelsius,
  toKpaAbs,
} from '@/lib/calc/units';

describe('units, TRADE-REFERENCE §2 (NIST SP 811)', () => {
  it('1 psi = 0.45359237 kg × 9.80665 m/s² / (0.0254 m)² = 6894.757293168361 Pa (exact)', () => {
    expect(PA_PER_PSI).toBe((0.45359237 * 9.80665) / 0.0254 ** 2);
    expect(PA_PER_PSI).toBeCloseTo(6894.757293168361, 9);
  });

  it('1 kPa = 0.145037738 psi; standard atmosphere 101.325 kPa = 14.69594878 psi', () => {
    expect(1 / KPA_PER_PSI).toBeCloseTo(0.145037738, 9);
    expect(STANDARD_ATMOSPHERE_KPA / KPA_PER_PSI).toBeCloseTo(14.69594878, 8);
  });

  it.each([
    [0, 101.325],
    [50, 446.063],
    [100, 790.801],
    [375, 2686.859],
  ])('%s psig = %s kPa abs (sea-level standard barometer)', (gauge, kpa) => {
    expect(toKpaAbs(gauge, 'psig')).toBeCloseTo(kpa, 3);
    expect(fromKpaAbs(kpa, 'psig')).toBeCloseTo(gauge, 4);
  });

  it('every pressure unit round-trips through kPa abs, gauge units against the given barometer', () => {
    expect(toKpaAbs(2, 'bar')).toBe(200);
    expect(toKpaAbs(2, 'barG', 95)).toBe(295);
    expect(toKpaAbs(100, 'kPaG', 90)).toBe(190);
    expect(toKpaAbs(14.7, 'psia')).toBeCloseTo(101.35, 2);
    expect(toKpaAbs(300, 'kPaAbs')).toBe(300);
    expect(fromKpaAbs(190, 'kPaG', 90)).toBe(100);
    // A differential has no barometric offset: 20 psi = 137.895 kPa.
    expect(pressureDifferenceToKpa(20, 'psig')).toBeCloseTo(137.895, 3);
  });

  it('1 inHg = 3386.389 Pa = 0.491154 psi; 27 inHg vacuum ≈ 1.435 psia', () => {
    expect(KPA_PER_INHG / KPA_PER_PSI).toBeCloseTo(0.491154, 6);
    expect(inHgVacuumToKpaAbs(27) / KPA_PER_PSI).toBeCloseTo(1.435, 3);
  });

  it.each([
    [-40, -40],
    [35, 1.6667],
    [38, 3.3333],
    [0, -17.7778],
    [-10, -23.3333],
    [105, 40.5556],
  ])('%s °F = %s °C', (f, c) => {
    expect(fahrenheitToCelsius(f)).toBeCloseTo(c, 4);
    expect(toCelsius(f, 'F')).toBeCloseTo(c, 4);
    expect(celsiusToFahrenheit(c)).toBeCloseTo(f, 3);
  });

  it('a temperature difference converts without the 32 °F offset: 10 K = 18 °F', () => {
    expect(temperatureDifferenceFromKelvin(10, 'F')).toBe(18);
    expect(temperatureDifferenceToKelvin(18, 'F')).toBe(10);
    expect(temperatureDifferenceToKelvin(5, 'C')).toBe(5);
  });

  it('1 lb = 0.45359237 kg = 16 oz; 1 oz = 28.349523125 g; 1 ton of refrigeration = 3.516853 kW', () => {
    expect(KG_PER_LB).toBe(0.45359237);
    expect(lbToKg(100)).toBeCloseTo(45.359237, 9);
    expect((16 * G_PER_OZ) / 1000).toBeCloseTo(KG_PER_LB, 12);
    expect(KW_PER_TON_REFRIGERATION).toBeCloseTo(3.516853, 6);
  });

  it('rejects impossible or non-numeric values with a clear message', () => {
    expect(() => toKpaAbs(-15, 'psig')).toThrow(CalcInputError);
    expect(() => toKpaAbs(-15, 'psig')).toThrow('-15 psig is not a possible pressure (perfect vacuum is -14.7 psig)');
    expect(() => toKpaAbs(0, 'kPaAbs')).toThrow(/not a possible pressure/);
    expect(() => toKpaAbs(Number.NaN, 'psig')).toThrow('pressure must be a finite number (got NaN)');
    expect(() => toKpaAbs(10, 'psig', 0)).toThrow(/barometric pressure must be greater than zero/);
    expect(() => toCelsius(-500, 'F')).toThrow('-500 °F is below absolute zero');
    expect(() => toCelsius(Number.POSITIVE_INFINITY, 'C')).toThrow(CalcInputError);
  });
});

describe('barometric pressure from elevation, ICAO / ISO 2533 standard atmosphere', () => {
  it('is the standard atmosphere at sea level', () => {
    expect(barometricPressureKpa(0)).toBe(STANDARD_ATMOSPHERE_KPA);
  });

  it('matches the ISA table: 1000 m 89.876 kPa, 2000 m 79.50 kPa, 11000 m 22.632 kPa (from memory)', () => {
    expect(barometricPressureKpa(1000)).toBeCloseTo(89.876, 2);
    expect(barometricPressureKpa(2000)).toBeCloseTo(79.5, 1);
    expect(barometricPressureKpa(11_000)).toBeCloseTo(22.632, 2);
  });

  it('falls about 0.5 psi per 1000 ft near sea level (TRADE-REFERENCE §2, common practice)', () => {
    const drop = (STANDARD_ATMOSPHERE_KPA - barometricPressureKpa(304.8)) / KPA_PER_PSI;
    expect(drop).toBeGreaterThan(0.45);
    expect(drop).toBeLessThan(0.55);
  });

  it('explicit reading beats elevation, which beats the default; out-of-range values are rejected', () => {
    expect(resolveBarometricKpa({ barometricKpa: 98, elevationM: 2000 })).toBe(98);
    expect(resolveBarometricKpa({ elevationM: 1000 })).toBeCloseTo(89.876, 2);
    expect(resolveBarometricKpa()).toBe(STANDARD_ATMOSPHERE_KPA);
    expect(() => barometricPressureKpa(12_000)).toThrow(CalcRangeError);
    expect(() => barometricPressureKpa(-1000)).toThrow(/outside the standard-atmosphere range/);
    expect(() => barometricPressureKpa(Number.NaN)).toThrow(CalcInputError);
    expect(() => resolveBarometricKpa({ barometricKpa: 500 })).toThrow(/plausible range/);
  });
});
