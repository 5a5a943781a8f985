// Unit conversions. Basis: NIST SP 811 (2008) Appendix B; the factors marked exact follow from the
// definitions of the pound (0.45359237 kg), the inch (0.0254 m) and standard gravity (9.80665 m/s²).
import { CalcInputError, fmt, requireFinite, requirePositive } from '@/lib/calc/errors';

/** Exact: 1 lbf/in² = 0.45359237 kg × 9.80665 m/s² / (0.0254 m)². */
export const PA_PER_PSI = 6894.757293168361;
export const KPA_PER_PSI = PA_PER_PSI / 1000;
/** Standard atmosphere, exact by definition (ISO 2533, NIST SP 811). */
export const STANDARD_ATMOSPHERE_KPA = 101.325;
export const KPA_PER_BAR = 100;
/** Conventional inch of mercury (NIST SP 811 B.8), used by vacuum gauges. */
export const KPA_PER_INHG = 3.386389;
export const KELVIN_OFFSET = 273.15;
export const KG_PER_LB = 0.45359237;
export const G_PER_OZ = 28.349523125;
/** 1 ton of refrigeration = 12 000 Btu_IT/h (Btu_IT = 1055.05585262 J). */
export const KW_PER_TON_REFRIGERATION = (12_000 * 1055.05585262) / 3_600_000;

export const PRESSURE_UNITS = ['kPaAbs', 'kPaG', 'bar', 'barG', 'psia', 'psig'] as const;
export type PressureUnit = (typeof PRESSURE_UNITS)[number];
export const TEMPERATURE_UNITS = ['C', 'F', 'K'] as const;
export type TemperatureUnit = (typeof TEMPERATURE_UNITS)[number];
export const MASS_UNITS = ['kg', 'lb'] as const;
export type MassUnit = (typeof MASS_UNITS)[number];

const PRESSURE_LABELS: Record<PressureUnit, string> = {
  kPaAbs: 'kPa abs',
  kPaG: 'kPa(g)',
  bar: 'bar abs',
  barG: 'bar(g)',
  psia: 'psia',
  psig: 'psig',
};

export function pressureUnitLabel(unit: PressureUnit): string {
  return PRESSURE_LABELS[unit];
}

export function isGaugeUnit(unit: PressureUnit): boolean {
  return unit === 'kPaG' || unit === 'barG' || unit === 'psig';
}

/** kPa per one unit of pressure difference (gauge and absolute units share their step). */
export function kpaPerPressureStep(unit: PressureUnit): number {
  if (unit === 'psia' || unit === 'psig') return KPA_PER_PSI;
  if (unit === 'bar' || unit === 'barG') return KPA_PER_BAR;
  return 1;
}

function checkBarometer(barometricKpa: number): void {
  requirePositive(barometricKpa, 'barometric pressure');
}

/** Any pressure unit → kPa absolute. Gauge readings are taken against `barometricKpa`. */
export function toKpaAbs(value: number, unit: PressureUnit, barometricKpa = STANDARD_ATMOSPHERE_KPA): number {
  requireFinite(value, 'pressure');
  checkBarometer(barometricKpa);
  const kpa = value * kpaPerPressureStep(unit) + (isGaugeUnit(unit) ? barometricKpa : 0);
  if (kpa <= 0) {
    const floor = isGaugeUnit(unit) ? -barometricKpa / kpaPerPressureStep(unit) : 0;
    throw new CalcInputError(
      `${fmt(value, 2)} ${pressureUnitLabel(unit)} is not a possible pressure (perfect vacuum is ${fmt(floor, 2)} ${pressureUnitLabel(unit)})`,
      'pressure',
    );
  }
  return kpa;
}

/** kPa absolute → any pressure unit. */
export function fromKpaAbs(kpaAbs: number, unit: PressureUnit, barometricKpa = STANDARD_ATMOSPHERE_KPA): number {
  requireFinite(kpaAbs, 'pressure');
  checkBarometer(barometricKpa);
  return (kpaAbs - (isGaugeUnit(unit) ? barometricKpa : 0)) / kpaPerPressureStep(unit);
}

/** A pressure difference (a control differential, a pressure drop): no barometric offset. */
export function pressureDifferenceToKpa(delta: number, unit: PressureUnit): number {
  requireFinite(delta, 'pressure difference');
  return delta * kpaPerPressureStep(unit);
}

export function pressureDifferenceFromKpa(deltaKpa: number, unit: PressureUnit): number {
  requireFinite(deltaKpa, 'pressure difference');
  return deltaKpa / kpaPerPressureStep(unit);
}

/** Vacuum-gauge reading in inches of mercury below the barometer → kPa absolute. */
export function inHgVacuumToKpaAbs(inHgVacuum: number, barometricKpa = STANDARD_ATMOSPHERE_KPA): number {
  requireFinite(inHgVacuum, 'vacuum');
  checkBarometer(barometricKpa);
  return barometricKpa - inHgVacuum * KPA_PER_INHG;
}

export function kpaAbsToInHgVacuum(kpaAbs: number, barometricKpa = STANDARD_ATMOSPHERE_KPA): number {
  requireFinite(kpaAbs, 'pressure');
  checkBarometer(barometricKpa);
  return (barometricKpa - kpaAbs) / KPA_PER_INHG;
}

export function celsiusToFahrenheit(c: number): number {
  return c * 1.8 + 32;
}

export function fahrenheitToCelsius(f: number): number {
  return (f - 32) / 1.8;
}

export function celsiusToKelvin(c: number): number {
  return c + KELVIN_OFFSET;
}

export function kelvinToCelsius(k: number): number {
  return k - KELVIN_OFFSET;
}

export function toCelsius(value: number, unit: TemperatureUnit): number {
  requireFinite(value, 'temperature');
  const c = unit === 'C' ? value : unit === 'F' ? fahrenheitToCelsius(value) : kelvinToCelsius(value);
  if (c < -KELVIN_OFFSET) throw new CalcInputError(`${fmt(value, 1)} ${temperatureUnitLabel(unit)} is below absolute zero`, 'temperature');
  return c;
}

export function fromCelsius(c: number, unit: TemperatureUnit): number {
  return unit === 'C' ? c : unit === 'F' ? celsiusToFahrenheit(c) : celsiusToKelvin(c);
}

/** A temperature difference (superheat, TD): 1 K = 1.8 °F, with no 32 °F offset. */
export function temperatureDifferenceToKelvin(delta: number, unit: TemperatureUnit): number {
  requireFinite(delta, 'temperature difference');
  return unit === 'F' ? delta / 1.8 : delta;
}

export function temperatureDifferenceFromKelvin(deltaK: number, unit: TemperatureUnit): number {
  return unit === 'F' ? deltaK * 1.8 : deltaK;
}

export function temperatureUnitLabel(unit: TemperatureUnit): string {
  return unit === 'K' ? 'K' : `°${unit}`;
}

export function lbToKg(lb: number): number {
  return lb * KG_PER_LB;
}

export function kgToLb(kg: number): number {
  return kg / KG_PER_LB;
}

export function toKg(value: number, unit: MassUnit): number {
  return unit === 'kg' ? value : lbToKg(value);
}

export function fromKg(kg: number, unit: MassUnit): number {
  return unit === 'kg' ? kg : kgToLb(kg);
}
