// The P-T chart's unit choices, labels and typed-number parsing; its numbers are formatted by
// lib/format/numbers (formatFixed, formatChartPressure).
import { pressureUnitLabel, type PressureUnit } from '@/lib/calc/units';

export type ChartTemperatureUnit = 'C' | 'F';

export const PRESSURE_UNIT_OPTIONS: { value: PressureUnit; label: string }[] = [
  { value: 'psig', label: 'psig (gauge)' },
  { value: 'psia', label: 'psia (absolute)' },
  { value: 'kPaG', label: 'kPa (gauge)' },
  { value: 'kPaAbs', label: 'kPa abs' },
  { value: 'barG', label: 'bar (gauge)' },
  { value: 'bar', label: 'bar abs' },
];

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
