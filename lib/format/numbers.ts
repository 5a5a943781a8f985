import { formatDecimal, MESSAGE_DECIMALS } from '@/lib/calc/format';
import type { PressureUnit } from '@/lib/calc/units';

// Plain numbers a person reads, at one precision per kind, shared with lib/calc's messages so a page,
// a report and a calculation message show the same figure (never a raw float such as 208.33333333333334).

/** A percentage: one decimal ("2.2 %"). */
export function formatPercent(pct: number): string {
  return `${formatDecimal(pct, MESSAGE_DECIMALS.percent)} %`;
}

/** A ratio such as a compression ratio: one decimal ("8.7"). */
export function formatRatio(ratio: number): string {
  return formatDecimal(ratio, MESSAGE_DECIMALS.ratio);
}

/** A multiplying factor such as a motor derating factor: two decimals ("0.95"). */
export function formatFactor(factor: number): string {
  return formatDecimal(factor, 2);
}

/** Volts or amps as read from a meter: one decimal ("208.3 V"). */
export function formatElectrical(value: number, unit: 'V' | 'A'): string {
  return `${formatDecimal(value, MESSAGE_DECIMALS.voltage)} ${unit}`;
}

/** A count with thousands separators ("1,204"). */
export function formatCount(n: number): string {
  return formatDecimal(n, 0);
}

/** An annualised leak rate, always with its one decimal ("30.0 % per year"), as entries and lists show it. */
export function formatLeakRate(pct: number): string {
  return `${pct.toLocaleString('en-US', { minimumFractionDigits: 1, maximumFractionDigits: 1 })} % per year`;
}

/** A mass of CO2 equivalent in tonnes, one decimal ("10.4 t CO2e"). */
export function formatTonnesCo2e(tonnes: number): string {
  return `${formatDecimal(tonnes, 1)} t CO2e`;
}

/** A file or download size ("512 B", "169 KB", "1.6 MB"). */
export function formatBytes(bytes: number): string {
  if (bytes < 1024) return `${formatDecimal(bytes, 0)} B`;
  if (bytes < 1024 * 1024) return `${formatDecimal(bytes / 1024, 0)} KB`;
  return `${formatDecimal(bytes / (1024 * 1024), 1)} MB`;
}

/** A plain number as typed on a nameplate, to at most three decimals ("2,030.5"). */
export function formatPlain(value: number): string {
  return formatDecimal(value, 3);
}

/** Years to one decimal ("12.5 years"). */
export function formatYears(years: number): string {
  return `${formatDecimal(years, 1)} years`;
}

const fixedFormats = new Map<string, Intl.NumberFormat>();

/** A number with a set span of decimals, as chart tables show them ("-40.0"; never "-0.0"). */
export function formatFixed(value: number, minDigits: number, maxDigits = minDigits): string {
  const key = `${minDigits}/${maxDigits}`;
  let f = fixedFormats.get(key);
  if (!f) {
    f = new Intl.NumberFormat('en-US', { minimumFractionDigits: minDigits, maximumFractionDigits: maxDigits });
    fixedFormats.set(key, f);
  }
  const text = f.format(value);
  return /^-0(\.0*)?$/.test(text) ? text.slice(1) : text;
}

// About 0.1 psi (0.7 kPa) of resolution in every unit: the reading a good gauge gives.
const CHART_PRESSURE_DIGITS: Record<PressureUnit, number> = { psig: 1, psia: 1, kPaG: 1, kPaAbs: 1, barG: 2, bar: 2 };

/** A pressure in the P-T chart's chosen unit, at a gauge's resolution (number only). */
export function formatChartPressure(value: number, unit: PressureUnit): string {
  return formatFixed(value, CHART_PRESSURE_DIGITS[unit]);
}
