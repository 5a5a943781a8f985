// Numbers in lib/calc messages: one precision per quantity, so a message never shows a raw float
// ("208.33333333333334 V"). lib/calc is pure (no framework imports), so it keeps this small
// formatter; pages use lib/units and lib/format, which follow the same precisions.
import { pressureUnitLabel, temperatureUnitLabel, type PressureUnit, type TemperatureUnit } from '@/lib/calc/units';

export type MessageQuantity =
  | 'temperature'
  | 'temperatureDiff'
  | 'pressure'
  | 'voltage'
  | 'percent'
  | 'ratio'
  | 'kpa'
  | 'elevation'
  | 'mass'
  | 'count';

/** Decimals shown per quantity (pressure depends on its unit). */
export const MESSAGE_DECIMALS: Readonly<Record<Exclude<MessageQuantity, 'pressure'>, number>> = {
  temperature: 1,
  temperatureDiff: 1,
  voltage: 1,
  percent: 1,
  ratio: 1,
  kpa: 1,
  elevation: 0,
  mass: 1,
  count: 0,
};

// About 0.1 psi of resolution in every unit, as a good gauge reads.
export const PRESSURE_DECIMALS: Readonly<Record<PressureUnit, number>> = { psig: 1, psia: 1, kPaG: 0, kPaAbs: 0, barG: 2, bar: 2 };

/** The most decimals any message may carry (checked by the property test over the API). */
export const MAX_MESSAGE_DECIMALS = 2;

// One formatter per number of decimals: toLocaleString with options builds a new Intl.NumberFormat
// on every call (about 0.1 ms each), which lists of hundreds of figures felt. Same output.
const decimalFormats = new Map<number, Intl.NumberFormat>();

/** en-US digits, trailing zeros dropped, never "-0". */
export function formatDecimal(value: number, decimals: number): string {
  if (!Number.isFinite(value)) return String(value);
  const factor = 10 ** decimals;
  let rounded = Math.round(value * factor) / factor;
  if (Object.is(rounded, -0) || rounded === 0) rounded = 0;
  let format = decimalFormats.get(decimals);
  if (!format) {
    format = new Intl.NumberFormat('en-US', { maximumFractionDigits: decimals, minimumFractionDigits: 0 });
    decimalFormats.set(decimals, format);
  }
  return format.format(rounded);
}

/** A number for a message, at the precision of its quantity. */
export function formatFor(value: number, quantity: Exclude<MessageQuantity, 'pressure'>): string {
  return formatDecimal(value, MESSAGE_DECIMALS[quantity]);
}

export function formatTemperature(valueInUnit: number, unit: TemperatureUnit): string {
  return `${formatDecimal(valueInUnit, 1)} ${temperatureUnitLabel(unit)}`;
}

/** A temperature difference already in the user's unit: °F for F, K for C and K. */
export function formatTemperatureDiff(valueInUnit: number, unit: TemperatureUnit): string {
  return `${formatDecimal(valueInUnit, 1)} ${unit === 'F' ? '°F' : 'K'}`;
}

export function formatPressure(valueInUnit: number, unit: PressureUnit): string {
  return `${formatDecimal(valueInUnit, PRESSURE_DECIMALS[unit])} ${pressureUnitLabel(unit)}`;
}

export function formatVolts(v: number): string {
  return `${formatDecimal(v, 1)} V`;
}

export function formatPercent(pct: number): string {
  return `${formatDecimal(pct, 1)} %`;
}

/** An echo of what the user typed: up to 4 significant decimals, never a long float. */
export function formatInput(value: number): string {
  if (!Number.isFinite(value)) return String(value);
  return formatDecimal(value, Math.abs(value) >= 100 ? 1 : 2);
}

const DIFFERENCE_LABELS: Readonly<Record<PressureUnit, string>> = { psig: 'psi', psia: 'psi', kPaG: 'kPa', kPaAbs: 'kPa', barG: 'bar', bar: 'bar' };

/** A pressure difference (a control differential) in the unit of its gauge: psi, kPa or bar, no g/abs. */
export function formatPressureDifference(valueInUnit: number, unit: PressureUnit): string {
  return `${formatDecimal(valueInUnit, PRESSURE_DECIMALS[unit])} ${DIFFERENCE_LABELS[unit]}`;
}
