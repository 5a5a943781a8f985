// A value's level against its band, and a band in the reader's units (the bands: reading-bands.ts).
import { CalcInputError } from '@/lib/calc/errors';
import { formatDecimal } from '@/lib/calc/format';
import type { BandQuantity, BandUnit, Bounds, Level, ReadingBand } from '@/lib/calc/reading-bands';
import { temperatureDifferenceFromKelvin, type TemperatureUnit } from '@/lib/calc/units';

const inside = (v: number, b: Bounds): boolean => (b.min === null || v >= b.min) && (b.max === null || v <= b.max);

export interface Judgement {
  level: Level;
  /** Which side of the usual band the value lies; null inside it. */
  direction: 'low' | 'high' | null;
}

/** The level of a value (in the band's unit) against its band. */
export function judge(value: number, band: Pick<ReadingBand, 'normal' | 'watch'>): Judgement {
  if (!Number.isFinite(value)) throw new CalcInputError('a level needs a finite value', 'value');
  if (inside(value, band.normal)) return { level: 'normal', direction: null };
  const direction = band.normal.min !== null && value < band.normal.min ? 'low' : 'high';
  return { level: inside(value, band.watch) ? 'watch' : 'abnormal', direction };
}

/** A band with its bounds and words, as the API and pages show it. */
export interface BandView {
  quantity: BandQuantity;
  label: string;
  unit: BandUnit;
  normal: Bounds;
  watch: Bounds;
  source: string;
  howKnown: ReadingBand['howKnown'];
  /** "usual 4–6 °F for a freezer evaporator (TXV)", in the reader's temperature unit. */
  text: string;
}

function span(b: Bounds, show: (v: number) => string, suffix: string): string {
  if (b.min !== null && b.max !== null) return `${show(b.min)}–${show(b.max)}${suffix}`;
  if (b.max !== null) return `up to ${show(b.max)}${suffix}`;
  if (b.min !== null) return `at least ${show(b.min)}${suffix}`;
  return 'any value';
}

/** The band in the reader's unit: temperature differences in °F or K, ratios to one decimal. */
export function describeBand(band: ReadingBand, temperatureUnit: TemperatureUnit): BandView {
  let text: string;
  if (band.unit === 'K') {
    const show = (k: number) => formatDecimal(temperatureDifferenceFromKelvin(k, temperatureUnit), temperatureUnit === 'F' ? 0 : 1);
    text = `usual ${span(band.normal, show, temperatureUnit === 'F' ? ' °F' : ' K')} for ${band.label}`;
  } else if (band.unit === 'ratio') {
    text = `usual ${span(band.normal, (v) => formatDecimal(v, 1), ':1')} for ${band.label}`;
  } else {
    text = `usual ${span(band.normal, (v) => formatDecimal(v, 0), ' %')} for ${band.label}`;
  }
  return {
    quantity: band.quantity,
    label: band.label,
    unit: band.unit,
    normal: band.normal,
    watch: band.watch,
    source: band.source,
    howKnown: band.howKnown,
    text,
  };
}
