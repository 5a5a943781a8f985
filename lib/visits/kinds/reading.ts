import { z } from 'zod';
import { isCalcError } from '@/lib/calc/errors';
import { controlCircuitVoltage, voltageUnbalance } from '@/lib/calc/electrical';
import { supplyVoltageLines } from '@/lib/calc/supply-voltage';
import { computeReadings } from '@/lib/calc/readings';
import { formatElectrical, formatPercent, formatRatio } from '@/lib/format/numbers';
import { calcUnitsFor, conversionFor, formatQuantity, type Quantity, type UnitPrefs } from '@/lib/units/quantities';
import { amps, kpaG, tempC, volts } from '@/lib/visits/kinds/fields';
import { defineKind, type EntryContext } from '@/lib/visits/kinds/types';

// Readings: pressures, line and air temperatures, voltages and currents, with what they mean
// (saturation, superheat, subcooling, TD, split, compression ratio, unbalance) from lib/calc.

export const readingFields = {
  suctionKpaG: kpaG('Suction pressure'),
  dischargeKpaG: kpaG('Discharge pressure'),
  suctionLineC: tempC('Suction-line temperature'),
  liquidLineC: tempC('Liquid-line temperature'),
  boxC: tempC('Box (return air) temperature'),
  supplyAirC: tempC('Supply air temperature'),
  ambientC: tempC('Ambient temperature'),
  voltsL1L2: volts('L1–L2'),
  voltsL2L3: volts('L2–L3'),
  voltsL1L3: volts('L1–L3'),
  controlVolts: volts('Control voltage'),
  compressorAmps: amps('Compressor current'),
  fanAmps: amps('Fan current'),
};
export type ReadingKey = keyof typeof readingFields;

export const readingDataSchema = z
  .object(Object.fromEntries(Object.entries(readingFields).map(([k, s]) => [k, s.nullable().optional()])) as { [K in ReadingKey]: z.ZodOptional<z.ZodNullable<(typeof readingFields)[K]>> })
  .strict()
  .refine((d) => Object.values(d).some((v) => v !== null && v !== undefined), { message: 'Enter at least one reading.' });
export type ReadingData = z.infer<typeof readingDataSchema>;


/** Runs one calculation; a calculation range error becomes a problem to show, anything else is a bug. */
export function attempt<T>(problems: string[], fn: () => T): T | null {
  try {
    return fn();
  } catch (error) {
    if (isCalcError(error)) {
      problems.push(error.message);
      return null;
    }
    throw error;
  }
}

/** A computed value judged against its usual band (common practice, lib/calc/reading-bands). */
export interface ValueLevel {
  level: 'normal' | 'watch' | 'abnormal';
  direction: 'low' | 'high' | null;
  /** The usual band in SI (K, or a plain ratio), what it is for and where it comes from. */
  band: { min: number | null; max: number | null; label: string; source: string } | null;
}

export interface ReadingComputed {
  refrigerant: string | null;
  /** Always the dew point at the suction pressure (TD uses its own reference, in `references`). */
  evaporatingC: number | null;
  /** Always the bubble point at the head pressure. */
  condensingC: number | null;
  superheatK: number | null;
  subcoolingK: number | null;
  evaporatorTdK: number | null;
  condenserSplitK: number | null;
  compressionRatio: number | null;
  unbalancePct: number | null;
  deratingFactor: number | null;
  unbalanceStatus: string | null;
  doNotOperate: boolean;
  supplyVerdict: string | null;
  supplyMessage: string | null;
  controlVoltageStatus: string | null;
  controlVoltageNotes: string[];
  /** The saturation reference evaporator TD and condenser split were taken against. */
  references?: { evaporatorTd: string | null; condenserSplit: string | null };
  levels?: Partial<Record<'superheatK' | 'subcoolingK' | 'evaporatorTdK' | 'condenserSplitK' | 'compressionRatio' | 'unbalancePct' | 'supplyVerdict' | 'controlVoltageStatus', ValueLevel>>;
  /** Likely causes from the combination of values: a guide (common practice), never a verdict. */
  suggestions?: { title: string; reasoning: string; checks: string[] }[];
  bases: string[];
  problems: string[];
}

/**
 * `prefs` words the calculation's messages (range problems, bases) in the reader's units; the values
 * themselves are SI either way. Stored entries are computed without it (kPa gauge and °C).
 */
export function computeReading(data: ReadingData, ctx: EntryContext, prefs?: UnitPrefs): ReadingComputed {
  const problems: string[] = [];
  const bases = new Set<string>();
  const out: ReadingComputed = {
    refrigerant: ctx.refrigerant,
    evaporatingC: null,
    condensingC: null,
    superheatK: null,
    subcoolingK: null,
    evaporatorTdK: null,
    condenserSplitK: null,
    compressionRatio: null,
    unbalancePct: null,
    deratingFactor: null,
    unbalanceStatus: null,
    doNotOperate: false,
    supplyVerdict: null,
    supplyMessage: null,
    controlVoltageStatus: null,
    controlVoltageNotes: [],
    bases: [],
    problems,
  };
  const hasPressure = data.suctionKpaG != null || data.dischargeKpaG != null;
  if (hasPressure && !ctx.refrigerant) problems.push('No refrigerant is on record for this equipment’s system, so pressures cannot be turned into temperatures.');
  if (hasPressure && ctx.refrigerant) {
    // The discharge (head) pressure stands in for the liquid-line pressure when no liquid port is read.
    // The inputs go in the reader's units so every message comes back in them; results read back as SI.
    const units = prefs ? calcUnitsFor(prefs) : { pressureUnit: 'kPaG' as const, temperatureUnit: 'C' as const };
    const p = (v: number | null | undefined) => (v == null ? undefined : prefs ? conversionFor('pressureGauge', prefs).fromSi(v) : v);
    const t = (v: number | null | undefined) => (v == null ? undefined : prefs ? conversionFor('temperature', prefs).fromSi(v) : v);
    const r = attempt(problems, () =>
      computeReadings({
        refrigerant: ctx.refrigerant!,
        pressureUnit: units.pressureUnit,
        temperatureUnit: units.temperatureUnit,
        elevationM: ctx.elevationM,
        suctionPressure: p(data.suctionKpaG),
        headPressure: p(data.dischargeKpaG),
        suctionLineTemp: t(data.suctionLineC),
        liquidLineTemp: t(data.liquidLineC),
        boxTemp: t(data.boxC),
        ambientTemp: t(data.ambientC),
        designBoxTemp: t(ctx.designBoxTempC),
      }),
    );
    if (r) {
      out.superheatK = r.superheat?.valueK ?? null;
      out.subcoolingK = r.subcooling?.valueK ?? null;
      out.evaporatorTdK = r.evaporatorTd?.valueK ?? null;
      out.condenserSplitK = r.condenserSplit?.valueK ?? null;
      // One reference each, whatever else was read: never a silent switch to the mid-point.
      out.evaporatingC = r.evaporating?.dewC ?? null;
      out.condensingC = r.condensing?.bubbleC ?? null;
      out.compressionRatio = r.compressionRatio?.ratio ?? null;
      out.references = { evaporatorTd: r.evaporatorTd?.reference ?? null, condenserSplit: r.condenserSplit?.reference ?? null };
      const judged = (v: { level: ValueLevel['level']; direction: ValueLevel['direction']; band: { label: string; source: string; normal: { min: number | null; max: number | null } } } | null | undefined): ValueLevel | undefined =>
        v ? { level: v.level, direction: v.direction, band: { min: v.band.normal.min, max: v.band.normal.max, label: v.band.label, source: v.band.source } } : undefined;
      out.levels = {
        superheatK: judged(r.superheat),
        subcoolingK: judged(r.subcooling),
        evaporatorTdK: judged(r.evaporatorTd),
        condenserSplitK: judged(r.condenserSplit),
        compressionRatio: judged(r.compressionRatio),
      };
      out.suggestions = r.suggestions.map((x) => ({ title: x.title, reasoning: x.reasoning, checks: [...x.checks] }));
      // One value that cannot be computed keeps every other one, and says why on its own.
      for (const e of Object.values(r.errors)) if (e) problems.push(e.message);
      for (const part of [r.superheat, r.subcooling, r.evaporatorTd, r.condenserSplit, r.compressionRatio]) if (part) bases.add(part.basis);
    }
  }
  const lines = [data.voltsL1L2, data.voltsL2L3, data.voltsL1L3];
  if (lines.every((v) => v != null && v > 0)) {
    const u = attempt(problems, () => voltageUnbalance(lines as number[]));
    if (u) {
      out.unbalancePct = u.unbalancePct;
      out.deratingFactor = u.deratingFactor;
      out.unbalanceStatus = u.status;
      out.doNotOperate = u.doNotOperate;
      bases.add(u.basis);
    }
    if (ctx.nameplateVoltage) {
      // Each line against ANSI C84.1; the worst line decides.
      const s = attempt(problems, () => supplyVoltageLines({ lines: lines as number[], nameplateV: ctx.nameplateVoltage!, point: 'utilization' }));
      if (s) {
        out.supplyVerdict = s.verdict;
        out.supplyMessage = s.message;
        bases.add(s.basis);
      }
    }
  }
  if (data.controlVolts != null) {
    const c = attempt(problems, () => controlCircuitVoltage({ measuredV: data.controlVolts!, nominalV: ctx.controlVoltageNominal ?? 24 }));
    if (c) {
      out.controlVoltageStatus = c.status;
      out.controlVoltageNotes = [c.message, ...c.notes];
      out.levels = { ...out.levels, controlVoltageStatus: { level: c.level, direction: c.direction, band: null } };
      bases.add(c.basis);
    }
  }
  out.bases = [...bases];
  return out;
}

const readingLabels: [ReadingKey, string, Quantity | 'V' | 'A'][] = [
  ['suctionKpaG', 'Suction', 'pressureGauge'],
  ['dischargeKpaG', 'Discharge', 'pressureGauge'],
  ['suctionLineC', 'Suction line', 'temperature'],
  ['liquidLineC', 'Liquid line', 'temperature'],
  ['boxC', 'Box (return air)', 'temperature'],
  ['supplyAirC', 'Supply air', 'temperature'],
  ['ambientC', 'Ambient', 'temperature'],
  ['voltsL1L2', 'L1–L2', 'V'],
  ['voltsL2L3', 'L2–L3', 'V'],
  ['voltsL1L3', 'L1–L3', 'V'],
  ['controlVolts', 'Control circuit', 'V'],
  ['compressorAmps', 'Compressor', 'A'],
  ['fanAmps', 'Fan', 'A'],
];

function shown(v: number, q: Quantity | 'V' | 'A', prefs: UnitPrefs): string {
  if (q === 'V' || q === 'A') return formatElectrical(v, q);
  return formatQuantity(v, q, prefs);
}

/** Units a reading is taken on: everything but the controls, whose entries are their settings. */
const NOT_READ = new Set(['pressure_control', 'thermostat']);

export const reading = defineKind({
  kind: 'reading',
  fits: (u) => !NOT_READ.has(u.type),
  data: readingDataSchema,
  describe(d, computed, prefs) {
    const c = computed ?? {};
    const parts = readingLabels.filter(([k]) => typeof d[k] === 'number').map(([k, label, q]) => `${label} ${shown(d[k] as number, q, prefs)}`);
    const derived = [
      typeof c.superheatK === 'number' ? `superheat ${formatQuantity(c.superheatK, 'temperatureDiff', prefs)}` : null,
      typeof c.subcoolingK === 'number' ? `subcooling ${formatQuantity(c.subcoolingK, 'temperatureDiff', prefs)}` : null,
      typeof c.evaporatorTdK === 'number' ? `evaporator TD ${formatQuantity(c.evaporatorTdK, 'temperatureDiff', prefs)}` : null,
      typeof c.condenserSplitK === 'number' ? `condenser split ${formatQuantity(c.condenserSplitK, 'temperatureDiff', prefs)}` : null,
      typeof c.compressionRatio === 'number' ? `compression ratio ${formatRatio(c.compressionRatio)}` : null,
      typeof c.unbalancePct === 'number' ? `voltage unbalance ${formatPercent(c.unbalancePct)}` : null,
    ].filter(Boolean);
    return `Readings: ${parts.join(', ')}${derived.length ? `. Computed: ${derived.join(', ')}` : ''}.`;
  },
  compute: async (d, tools) => ({ ...computeReading(d, tools.ctx) }),
});
