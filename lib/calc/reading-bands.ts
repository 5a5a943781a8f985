// The usual bands for computed readings, as data (the level a value gets against them: band-judgement.ts).
// Every band is a rule of thumb unless it names a standard: superheat, subcooling, TD and split
// bands are common practice from refrigeration service training texts (evaporator superheat
// targets at the coil outlet, condenser-outlet subcooling, box-minus-saturated-suction TD,
// condensing-minus-ambient split); the electrical bands name their standard. A value inside
// `normal` is normal, inside `watch` (which contains `normal`) is watch, outside it abnormal.

export type Level = 'normal' | 'watch' | 'abnormal';
export const LEVELS: readonly Level[] = ['normal', 'watch', 'abnormal'];

/** Box temperature class. Cooler/freezer split at 0 °C (32 °F), as 10 CFR 431.302 defines walk-ins. */
export const BOX_CLASSES = ['cooler', 'freezer', 'low_temp_display'] as const;
export type BoxClass = (typeof BOX_CLASSES)[number];

/** Metering device: thermostatic (or electronic) expansion valve, or a fixed orifice / capillary tube. */
export const METERING_DEVICES = ['txv', 'fixed'] as const;
export type MeteringDevice = (typeof METERING_DEVICES)[number];

export type BandQuantity =
  | 'superheat'
  | 'subcooling'
  | 'evaporatorTd'
  | 'condenserSplit'
  | 'compressionRatio'
  | 'voltageUnbalance'
  | 'controlVoltage'
  | 'supplyVoltage';

/** K for temperature differences, a plain ratio, or % (of the average, or of nominal). */
export type BandUnit = 'K' | 'ratio' | '%';

export interface Bounds {
  readonly min: number | null;
  readonly max: number | null;
}

export interface ReadingBand {
  readonly quantity: BandQuantity;
  /** Context words for "usual … for a freezer evaporator (TXV)". */
  readonly label: string;
  readonly unit: BandUnit;
  readonly normal: Bounds;
  readonly watch: Bounds;
  /** Where the band comes from; "common practice" or "from memory" where it is not a standard. */
  readonly source: string;
  readonly howKnown: 'common practice' | 'from memory' | 'standard, from memory';
}

const TRAINING = 'common practice (refrigeration service training texts)';
const SH_TXV = `${TRAINING}: evaporator-outlet superheat targets for a TXV`;

/** ΔT in °F → K, exact (1 K = 1.8 °F). Bands are written in °F as the trade quotes them. */
const f = (deltaF: number): number => deltaF / 1.8;

type ClassKey = BoxClass | 'unknown';

const SUPERHEAT_TXV: Readonly<Record<ClassKey, ReadingBand>> = {
  cooler: {
    quantity: 'superheat',
    label: 'a cooler evaporator (TXV)',
    unit: 'K',
    normal: { min: f(6), max: f(10) },
    watch: { min: f(3), max: f(15) },
    source: `${SH_TXV}, medium temperature 6–10 °F (3–6 K)`,
    howKnown: 'common practice',
  },
  freezer: {
    quantity: 'superheat',
    label: 'a freezer evaporator (TXV)',
    unit: 'K',
    normal: { min: f(4), max: f(6) },
    watch: { min: f(2), max: f(10) },
    source: `${SH_TXV}, low temperature 4–6 °F (2–3 K)`,
    howKnown: 'common practice',
  },
  low_temp_display: {
    quantity: 'superheat',
    label: 'a low-temperature display case (TXV)',
    unit: 'K',
    normal: { min: f(4), max: f(6) },
    watch: { min: f(2), max: f(10) },
    source: `${SH_TXV}, low temperature 4–6 °F (2–3 K)`,
    howKnown: 'common practice',
  },
  unknown: {
    quantity: 'superheat',
    label: 'an evaporator of unknown box class (TXV)',
    unit: 'K',
    normal: { min: f(4), max: f(10) },
    watch: { min: f(2), max: f(15) },
    source: `${SH_TXV}, the low- and medium-temperature targets together (4–10 °F)`,
    howKnown: 'common practice',
  },
};

// A fixed orifice or capillary feeds a fixed flow, so its superheat swings with load and condensing
// pressure; the maker's charging chart governs.
const SUPERHEAT_FIXED: ReadingBand = {
  quantity: 'superheat',
  label: 'an evaporator with a fixed orifice or capillary',
  unit: 'K',
  normal: { min: f(5), max: f(20) },
  watch: { min: f(2), max: f(30) },
  source: `${TRAINING}: fixed metering superheat varies with load; 5–20 °F is typical, the maker's charging chart governs (from memory)`,
  howKnown: 'from memory',
};

const SUPERHEAT_COMPRESSOR: ReadingBand = {
  quantity: 'superheat',
  label: 'suction gas at the compressor',
  unit: 'K',
  normal: { min: f(20), max: f(30) },
  watch: { min: f(10), max: f(40) },
  source: `${TRAINING}: return-gas superheat at the compressor 20–30 °F (11–17 K); the compressor maker's limits govern`,
  howKnown: 'common practice',
};

const SUBCOOLING: ReadingBand = {
  quantity: 'subcooling',
  label: 'the liquid leaving an air-cooled condenser',
  unit: 'K',
  normal: { min: f(5), max: f(15) },
  watch: { min: f(0), max: f(20) },
  source: `${TRAINING}: condenser-outlet subcooling 5–15 °F (3–8 K); a system with a receiver can read 0–5 °F at the condenser`,
  howKnown: 'common practice',
};

const EVAPORATOR_TD: Readonly<Record<ClassKey, ReadingBand>> = {
  cooler: {
    quantity: 'evaporatorTd',
    label: 'a cooler evaporator',
    unit: 'K',
    normal: { min: f(8), max: f(12) },
    watch: { min: f(5), max: f(16) },
    source: `${TRAINING}: box temperature − saturated suction, 8–10 °F for high humidity, 10–12 °F general`,
    howKnown: 'common practice',
  },
  freezer: {
    quantity: 'evaporatorTd',
    label: 'a freezer evaporator',
    unit: 'K',
    normal: { min: f(8), max: f(12) },
    watch: { min: f(5), max: f(16) },
    source: `${TRAINING}: box temperature − saturated suction, about 10 °F for freezers`,
    howKnown: 'common practice',
  },
  low_temp_display: {
    quantity: 'evaporatorTd',
    label: 'a low-temperature display case',
    unit: 'K',
    normal: { min: f(8), max: f(14) },
    watch: { min: f(5), max: f(18) },
    source: `${TRAINING}: display cases run a somewhat wider TD than walk-ins; the case maker's data govern (from memory)`,
    howKnown: 'from memory',
  },
  unknown: {
    quantity: 'evaporatorTd',
    label: 'an evaporator',
    unit: 'K',
    normal: { min: f(8), max: f(12) },
    watch: { min: f(5), max: f(16) },
    source: `${TRAINING}: box temperature − saturated suction, 8–12 °F`,
    howKnown: 'common practice',
  },
};

const CONDENSER_SPLIT: ReadingBand = {
  quantity: 'condenserSplit',
  label: 'an air-cooled condenser',
  unit: 'K',
  normal: { min: f(15), max: f(30) },
  watch: { min: f(10), max: f(35) },
  source: `${TRAINING}: condensing temperature ≈ entering air + 15–30 °F (e.g. 95 °F air → 110–125 °F)`,
  howKnown: 'common practice',
};

const COMPRESSION_RATIO: Readonly<Record<ClassKey, ReadingBand>> = {
  cooler: {
    quantity: 'compressionRatio',
    label: 'a medium-temperature single-stage compressor',
    unit: 'ratio',
    normal: { min: 2.5, max: 6 },
    watch: { min: 1.5, max: 8 },
    source: 'from memory: medium-temperature walk-ins typically run 3–6:1 (absolute pressures); a low ratio hints at worn valves',
    howKnown: 'from memory',
  },
  freezer: {
    quantity: 'compressionRatio',
    label: 'a low-temperature single-stage compressor',
    unit: 'ratio',
    normal: { min: 5, max: 10 },
    watch: { min: 3, max: 12 },
    source: 'from memory: low-temperature single-stage systems typically run 6–10:1; above about 10–12:1 two-stage compression is usually considered',
    howKnown: 'from memory',
  },
  low_temp_display: {
    quantity: 'compressionRatio',
    label: 'a low-temperature single-stage compressor',
    unit: 'ratio',
    normal: { min: 5, max: 10 },
    watch: { min: 3, max: 12 },
    source: 'from memory: low-temperature single-stage systems typically run 6–10:1; above about 10–12:1 two-stage compression is usually considered',
    howKnown: 'from memory',
  },
  unknown: {
    quantity: 'compressionRatio',
    label: 'a single-stage compressor',
    unit: 'ratio',
    normal: { min: 2.5, max: 10 },
    watch: { min: 1.5, max: 12 },
    source: 'from memory: single-stage refrigeration compressors typically run 3–10:1',
    howKnown: 'from memory',
  },
};

export const VOLTAGE_UNBALANCE_BAND: ReadingBand = {
  quantity: 'voltageUnbalance',
  label: 'a three-phase motor supply',
  unit: '%',
  normal: { min: 0, max: 1 },
  watch: { min: 0, max: 2 },
  source:
    'NEMA MG 1: keep unbalance at or below 1 % at the motor terminals, derate above it, do not operate above 5 % (as quoted by secondary sources); the 2 % allowance is common practice in equipment instructions',
  howKnown: 'standard, from memory',
};

/** Control circuit, as % of nominal: out below 85 % or above 110 %, marginal more than 5 % off. */
export const CONTROL_VOLTAGE_BAND: ReadingBand = {
  quantity: 'controlVoltage',
  label: 'a contactor and relay control circuit',
  unit: '%',
  normal: { min: 95, max: 105 },
  watch: { min: 85, max: 110 },
  source:
    'IEC 60947-4-1: contactor coils close between 85 % and 110 % of rated control voltage (clause from memory); more than 5 % from nominal is marginal: re-check under load (common practice)',
  howKnown: 'standard, from memory',
};

/** Supply voltage bands are per system (ANSI C84.1 Range A / B); this carries the wording only. */
export const SUPPLY_VOLTAGE_SOURCE =
  'ANSI C84.1 Range A (normal) and Range B (infrequent excursions, to be corrected) for the system feeding the nameplate; table values from memory';

export interface BandContext {
  boxClass?: BoxClass | null | undefined;
  meteringDevice?: MeteringDevice | null | undefined;
  /** Where the suction line temperature was taken; the evaporator outlet unless said otherwise. */
  superheatAt?: 'evaporator_outlet' | 'compressor_inlet' | undefined;
}

/** The band for a refrigeration reading in its context. */
export function bandFor(quantity: 'superheat' | 'subcooling' | 'evaporatorTd' | 'condenserSplit' | 'compressionRatio', ctx: BandContext = {}): ReadingBand {
  const key: ClassKey = ctx.boxClass ?? 'unknown';
  switch (quantity) {
    case 'superheat':
      if (ctx.superheatAt === 'compressor_inlet') return SUPERHEAT_COMPRESSOR;
      return ctx.meteringDevice === 'fixed' ? SUPERHEAT_FIXED : SUPERHEAT_TXV[key];
    case 'subcooling':
      return SUBCOOLING;
    case 'evaporatorTd':
      return EVAPORATOR_TD[key];
    case 'condenserSplit':
      return CONDENSER_SPLIT;
    case 'compressionRatio':
      return COMPRESSION_RATIO[key];
  }
}

/** Every band, for documentation and tests. */
export const ALL_BANDS: readonly ReadingBand[] = [
  ...Object.values(SUPERHEAT_TXV),
  SUPERHEAT_FIXED,
  SUPERHEAT_COMPRESSOR,
  SUBCOOLING,
  ...Object.values(EVAPORATOR_TD),
  CONDENSER_SPLIT,
  ...Object.values(COMPRESSION_RATIO),
  VOLTAGE_UNBALANCE_BAND,
  CONTROL_VOLTAGE_BAND,
];

/** Box class from an explicit choice, else from a design (or measured) box temperature in °C. */
export function boxClassFor(input: { boxClass?: BoxClass | null | undefined; boxTempC?: number | null | undefined }): {
  boxClass: BoxClass | null;
  from: 'given' | 'box_temperature' | 'unknown';
} {
  if (input.boxClass) return { boxClass: input.boxClass, from: 'given' };
  if (input.boxTempC !== null && input.boxTempC !== undefined && Number.isFinite(input.boxTempC)) {
    // 10 CFR 431.302: a walk-in cooler is refrigerated above 32 °F, a freezer at or below it.
    return { boxClass: input.boxTempC > 0 ? 'cooler' : 'freezer', from: 'box_temperature' };
  }
  return { boxClass: null, from: 'unknown' };
}
