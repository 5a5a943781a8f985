import {
  celsiusToFahrenheit,
  fahrenheitToCelsius,
  KG_PER_LB,
  KPA_PER_BAR,
  KPA_PER_PSI,
} from '@/lib/calc/units';

// Every stored quantity is SI (kPa, °C, K, kg, m). Forms and pages convert to and from the
// user's units here, and round only for display, so a saved value reopens as it was typed.
export type UnitSystem = 'imperial' | 'metric';
export interface UnitPrefs {
  units: UnitSystem;
  metricPressure: 'kPa' | 'bar';
}

export type Quantity = 'pressureGauge' | 'pressureDiff' | 'temperature' | 'temperatureDiff' | 'mass' | 'length';

interface Conversion {
  label: string;
  toSi: (v: number) => number;
  fromSi: (v: number) => number;
  decimals: number;
}

const identity = (v: number) => v;

export function conversionFor(quantity: Quantity, prefs: UnitPrefs): Conversion {
  const imperial = prefs.units === 'imperial';
  switch (quantity) {
    case 'pressureGauge':
    case 'pressureDiff': {
      const suffix = quantity === 'pressureGauge' ? 'g' : '';
      if (imperial) return { label: quantity === 'pressureGauge' ? 'psig' : 'psi', toSi: (v) => v * KPA_PER_PSI, fromSi: (v) => v / KPA_PER_PSI, decimals: 1 };
      if (prefs.metricPressure === 'bar') return { label: `bar${suffix}`, toSi: (v) => v * KPA_PER_BAR, fromSi: (v) => v / KPA_PER_BAR, decimals: 2 };
      return { label: `kPa${suffix}`, toSi: identity, fromSi: identity, decimals: 0 };
    }
    case 'temperature':
      return imperial ? { label: '°F', toSi: fahrenheitToCelsius, fromSi: celsiusToFahrenheit, decimals: 1 } : { label: '°C', toSi: identity, fromSi: identity, decimals: 1 };
    case 'temperatureDiff':
      return imperial ? { label: '°F', toSi: (v) => v / 1.8, fromSi: (v) => v * 1.8, decimals: 1 } : { label: 'K', toSi: identity, fromSi: identity, decimals: 1 };
    case 'mass':
      return imperial ? { label: 'lb', toSi: (v) => v * KG_PER_LB, fromSi: (v) => v / KG_PER_LB, decimals: 2 } : { label: 'kg', toSi: identity, fromSi: identity, decimals: 2 };
    case 'length':
      return imperial ? { label: 'ft', toSi: (v) => v * 0.3048, fromSi: (v) => v / 0.3048, decimals: 0 } : { label: 'm', toSi: identity, fromSi: identity, decimals: 0 };
  }
}

/**
 * SI value → the text a form shows: the unit's usual precision, or up to two more decimals when
 * that is what brings a typed value back exactly (21.25 psig reopens as 21.25). A value stored
 * from another unit (144.8 kPa is 21.0015 psig) shows at the usual precision (21), never with
 * conversion noise.
 */
export function toDisplayValue(si: number | null | undefined, quantity: Quantity, prefs: UnitPrefs): string {
  if (si === null || si === undefined || !Number.isFinite(si)) return '';
  const c = conversionFor(quantity, prefs);
  const shown = c.fromSi(si);
  for (let d = c.decimals; d <= c.decimals + 2; d++) {
    const candidate = Number(shown.toFixed(d));
    if (Math.abs(c.toSi(candidate) - si) <= 1e-9 * Math.max(1, Math.abs(si))) return String(candidate);
  }
  return String(Number(shown.toFixed(c.decimals)));
}

/** Form text → SI value; empty → null; anything unparseable → NaN (the schema rejects it). */
export function fromDisplayValue(text: string, quantity: Quantity, prefs: UnitPrefs): number | null {
  const trimmed = text.trim().replace(',', '.');
  if (trimmed === '') return null;
  const n = Number(trimmed);
  if (!Number.isFinite(n)) return Number.NaN;
  return conversionFor(quantity, prefs).toSi(n);
}

/** Display with unit label and display rounding, for read-only pages. */
export function formatQuantity(si: number | null | undefined, quantity: Quantity, prefs: UnitPrefs): string {
  if (si === null || si === undefined || !Number.isFinite(si)) return '—';
  const c = conversionFor(quantity, prefs);
  const value = c.fromSi(si);
  return `${value.toLocaleString('en-US', { maximumFractionDigits: c.decimals, minimumFractionDigits: 0 })} ${c.label}`;
}

/** The units lib/calc words its messages in for this reader (psig and °F, kPa(g) or bar(g) and °C). */
export function calcUnitsFor(prefs: UnitPrefs): { pressureUnit: 'psig' | 'kPaG' | 'barG'; temperatureUnit: 'F' | 'C' } {
  if (prefs.units === 'imperial') return { pressureUnit: 'psig', temperatureUnit: 'F' };
  return { pressureUnit: prefs.metricPressure === 'bar' ? 'barG' : 'kPaG', temperatureUnit: 'C' };
}

/** An absolute pressure (a barometer) in the reader's units: psia, kPa abs or bar abs. */
export function formatAbsolutePressure(kpaAbs: number, prefs: UnitPrefs): string {
  if (!Number.isFinite(kpaAbs)) return '—';
  const [value, label, decimals] =
    prefs.units === 'imperial' ? [kpaAbs / KPA_PER_PSI, 'psia', 1] : prefs.metricPressure === 'bar' ? [kpaAbs / KPA_PER_BAR, 'bar abs', 3] : [kpaAbs, 'kPa abs', 1];
  return `${value.toLocaleString('en-US', { maximumFractionDigits: decimals, minimumFractionDigits: 0 })} ${label}`;
}
