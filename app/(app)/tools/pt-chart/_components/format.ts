// Display helpers for the P-T chart: digits per unit and en-US number formatting.
import { pressureUnitLabel, type PressureUnit } from '@/lib/calc/units';

export type ChartTemperatureUnit = 'C' | 'F';

// About 0.1 psi (0.7 kPa) of resolution in every unit: the reading a good gauge gives.
const PRESSURE_DIGITS: Record<PressureUnit, number> = { psig: 1, psia: 1, kPaG: 1, kPaAbs: 1, barG: 2, bar: 2 };

export const PRESSURE_UNIT_OPTIONS: { value: PressureUnit; label: string }[] = [
  { value: 'psig', label: 'psig (gauge)' },
  { value: 'psia', label: 'psia (absolute)' },
  { value: 'kPaG', label: 'kPa (gauge)' },
  { value: 'kPaAbs', label: 'kPa abs' },
  { value: 'barG', label: 'bar (gauge)' },
  { value: 'bar', label: 'bar abs' },
];

const formatters = new Map<string, Intl.NumberFormat>();

export function formatNumber(value: number, minDigits: number, maxDigits = minDigits): string {
  const key = `${minDigits}/${maxDigits}`;
  let f = formatters.get(key);
  if (!f) {
    f = new Intl.NumberFormat('en-US', { minimumFractionDigits: minDigits, maximumFractionDigits: maxDigits });
    formatters.set(key, f);
  }
  // Never show "-0.0".
  const text = f.format(value);
  return /^-0(\.0*)?$/.test(text) ? text.slice(1) : text;
}

export function formatPressure(value: number, unit: PressureUnit): string {
  return formatNumber(value, PRESSURE_DIGITS[unit]);
}

export function pressureLabel(unit: PressureUnit): string {
  return pressureUnitLabel(unit);
}

export function temperatureLabel(unit: ChartTemperatureUnit): string {
  return `°${unit}`;
}

/** A number typed into a field, or null when blank or not a number. */
export function parseNumber(text: string): number | null {
  const trimmed = text.trim().replace(/\u2212/g, '-').replace(/,/g, '');
  if (trimmed === '') return null;
  const n = Number(trimmed);
  return Number.isFinite(n) ? n : null;
}

export const RANGE_DEFAULTS: Record<ChartTemperatureUnit, { from: string; to: string; step: string }> = {
  F: { from: '-40', to: '120', step: '5' },
  C: { from: '-40', to: '50', step: '2' },
};
