import { z } from 'zod';
import { controlWarningMessage, type ControlWarningCode, type ControlWarningData } from '@/lib/calc/control-warnings';
import { highPressureControl, lowPressureControl, type LowPressureControlInput } from '@/lib/calc/pressure-controls';
import { calcUnitsFor, conversionFor, formatQuantity, type UnitPrefs } from '@/lib/units/quantities';
import { kpaDiff, kpaG, tempC, tempDiffK } from '@/lib/visits/kinds/fields';
import { attempt } from '@/lib/visits/kinds/reading';
import { defineKind, type EntryContext, type UnitShape } from '@/lib/visits/kinds/types';

// Settings as found → as left on a pressure control (low, high or dual) or a thermostat. The unit's
// current settings follow the as-left values, in the time order of the entries.

const lowSide = z.object({ cutInKpaG: kpaG('Cut-in'), differentialKpa: kpaDiff('Differential') });
const highSide = z.object({ cutOutKpaG: kpaG('Cut-out'), differentialKpa: kpaDiff('Differential') });
const thermostatSide = z.object({ setpointC: tempC('Setpoint'), differentialK: tempDiffK('Differential') });
const dualSide = z.object({ low: lowSide, high: highSide });

export const settingChangeDataSchema = z.discriminatedUnion('control', [
  z.object({ control: z.literal('low'), asFound: lowSide, asLeft: lowSide }),
  z.object({ control: z.literal('high'), asFound: highSide, asLeft: highSide }),
  z.object({ control: z.literal('dual'), asFound: dualSide, asLeft: dualSide }),
  z.object({ control: z.literal('thermostat'), asFound: thermostatSide, asLeft: thermostatSide }),
]);
export type SettingChangeData = z.infer<typeof settingChangeDataSchema>;
export type SettingControl = SettingChangeData['control'];
export type LowSettings = z.infer<typeof lowSide>;
export type HighSettings = z.infer<typeof highSide>;

export const settingControlLabels: Record<SettingControl, string> = {
  low: 'Low-pressure control',
  high: 'High-pressure control',
  dual: 'Dual pressure control',
  thermostat: 'Thermostat',
};

/** The controls a unit has: a thermostat has a setpoint; a pressure control the side(s) on its nameplate. */
export function controlsFor(unit: UnitShape): SettingControl[] {
  if (unit.type === 'thermostat') return ['thermostat'];
  if (unit.type !== 'pressure_control') return [];
  const kind = unit.nameplate.controlKind;
  if (kind === 'low' || kind === 'high' || kind === 'dual') return [kind];
  return ['low', 'high', 'dual'];
}

/** Where each control keeps its current settings in the unit's record (SI). */
export const settingRecordKeys = {
  low: { cutInKpaG: 'lowCutInKpa', differentialKpa: 'lowDifferentialKpa' },
  high: { cutOutKpaG: 'highCutOutKpa', differentialKpa: 'highDifferentialKpa' },
  thermostat: { setpointC: 'setpointC', differentialK: 'differentialK' },
} as const;

function recordPatch(d: SettingChangeData): Record<string, number> {
  const map = (keys: Record<string, string>, side: Record<string, number>) => Object.fromEntries(Object.entries(keys).map(([k, target]) => [target, side[k]!]));
  switch (d.control) {
    case 'low':
      return map(settingRecordKeys.low, d.asLeft);
    case 'high':
      return map(settingRecordKeys.high, d.asLeft);
    case 'dual':
      return { ...map(settingRecordKeys.low, d.asLeft.low), ...map(settingRecordKeys.high, d.asLeft.high) };
    case 'thermostat':
      return map(settingRecordKeys.thermostat, d.asLeft);
  }
}

/** The unit's current settings of one control, when all of them are on record. */
export function recordedSettings(nameplate: Record<string, unknown>, control: SettingControl): Record<string, unknown> | null {
  const read = (keys: Record<string, string>) => {
    const out: Record<string, number> = {};
    for (const [k, source] of Object.entries(keys)) {
      const v = nameplate[source];
      if (typeof v !== 'number') return null;
      out[k] = v;
    }
    return out;
  };
  if (control === 'dual') {
    const low = read(settingRecordKeys.low);
    const high = read(settingRecordKeys.high);
    return low && high ? { low, high } : null;
  }
  return read(settingRecordKeys[control]);
}

export interface SideComputed {
  /** Low side: the cut-out; high side: the cut-in (kPa gauge). */
  asFoundOtherKpaG: number | null;
  asLeftOtherKpaG: number | null;
  /** Saturation temperatures (°C) of each setting: dew for the low side, bubble for the high side. */
  asLeftSaturation: { setting: number | null; other: number | null };
  asFoundSaturation: { setting: number | null; other: number | null };
}

export interface SettingComputed extends SideComputed {
  refrigerant: string | null;
  /** A dual control: each side on its own (the top-level side values are the low side's). */
  sides?: { low: SideComputed; high: SideComputed };
  /** `data` (SI, with the barometer) lets a page word a pressure-control warning in the reader's units. */
  warnings: { code: string; message: string; data?: ControlWarningData }[];
  basis: string | null;
  problems: string[];
}

const emptySide = (): SideComputed => ({
  asFoundOtherKpaG: null,
  asLeftOtherKpaG: null,
  asLeftSaturation: { setting: null, other: null },
  asFoundSaturation: { setting: null, other: null },
});

const same = (v: number) => v;
const orNull = (v: number | null | undefined, f: (x: number) => number) => (v === null || v === undefined ? null : f(v));

/**
 * The units the pressure-control calculation runs in: the reader's (so its range messages and
 * warnings read in psig and °F for an imperial reader), kPa gauge and °C when none is given. Inputs
 * are converted from SI and the results back, so the stored values are SI either way.
 */
function controlUnits(prefs?: UnitPrefs) {
  if (!prefs) return { pressureUnit: 'kPaG' as const, temperatureUnit: 'C' as const, p: same, dp: same, t: same, pSi: same, tSi: same };
  const [p, dp, t] = [conversionFor('pressureGauge', prefs), conversionFor('pressureDiff', prefs), conversionFor('temperature', prefs)];
  return { ...calcUnitsFor(prefs), p: p.fromSi, dp: dp.fromSi, t: t.fromSi, pSi: p.toSi, tSi: t.toSi };
}

type ControlUnits = ReturnType<typeof controlUnits>;
type ControlRun = ReturnType<typeof lowPressureControl> | ReturnType<typeof highPressureControl>;
/** What both controls run with, whichever side: the refrigerant, the units and the site's elevation. */
type ControlBase = Pick<LowPressureControlInput, 'refrigerant' | 'unit' | 'temperatureUnit' | 'elevationM'>;

/**
 * One side of a pressure control: the end it is set by, how the calculation runs (only with a
 * refrigerant on record), and which results are the other end and each end's saturation (dew on the
 * low side, bubble on the high side). Without a result the other end is set end − differential.
 */
interface PressureSide<S extends { differentialKpa: number }, R extends ControlRun> {
  set: (s: S) => number;
  run: (s: S, base: ControlBase, u: ControlUnits, ctx: EntryContext) => R;
  read: (r: R) => { other: number; settingSat: number | null | undefined; otherSat: number | null | undefined };
}

const lowPressureSide: PressureSide<LowSettings, ReturnType<typeof lowPressureControl>> = {
  set: (s) => s.cutInKpaG,
  run: (s, base, u, ctx) =>
    lowPressureControl({ ...base, cutIn: u.p(s.cutInKpaG), differential: u.dp(s.differentialKpa), designBoxTemp: orNull(ctx.designBoxTempC, u.t) ?? undefined }),
  read: (r) => ({ other: r.cutOut, settingSat: r.cutInSaturation?.dew, otherSat: r.cutOutSaturation?.dew }),
};

const highPressureSide: PressureSide<HighSettings, ReturnType<typeof highPressureControl>> = {
  set: (s) => s.cutOutKpaG,
  run: (s, base, u, ctx) =>
    highPressureControl({ ...base, cutOut: u.p(s.cutOutKpaG), differential: u.dp(s.differentialKpa), designPressure: orNull(ctx.designPressureHighKpaG, u.p) ?? undefined }),
  read: (r) => ({ other: r.cutIn, settingSat: r.cutOutSaturation?.bubble, otherSat: r.cutInSaturation?.bubble }),
};

function sideComputed<S extends { differentialKpa: number }, R extends ControlRun>(
  spec: PressureSide<S, R>,
  found: S,
  left: S,
  ctx: EntryContext,
  out: SettingComputed,
  prefs?: UnitPrefs,
): SideComputed {
  const side = emptySide();
  const fallback = (s: S) => spec.set(s) - s.differentialKpa;
  const refrigerant = ctx.refrigerant;
  if (!refrigerant) {
    side.asFoundOtherKpaG = fallback(found);
    side.asLeftOtherKpaG = fallback(left);
    return side;
  }
  const u = controlUnits(prefs);
  const base: ControlBase = { refrigerant, unit: u.pressureUnit, temperatureUnit: u.temperatureUnit, elevationM: ctx.elevationM };
  const run = (s: S) => attempt(out.problems, () => spec.run(s, base, u, ctx));
  const f = run(found);
  const l = run(left);
  const [fr, lr] = [f && spec.read(f), l && spec.read(l)];
  side.asFoundOtherKpaG = orNull(fr?.other, u.pSi) ?? fallback(found);
  side.asLeftOtherKpaG = orNull(lr?.other, u.pSi) ?? fallback(left);
  side.asFoundSaturation = { setting: orNull(fr?.settingSat, u.tSi), other: orNull(fr?.otherSat, u.tSi) };
  side.asLeftSaturation = { setting: orNull(lr?.settingSat, u.tSi), other: orNull(lr?.otherSat, u.tSi) };
  out.warnings.push(...(l?.warnings.map((w) => ({ code: w.code, message: w.message, data: w.data })) ?? []));
  out.basis ??= l?.basis ?? null;
  return side;
}

/** A stored warning in the reader's units (psig and °F for an imperial reader); its saved text when it has no data. */
export function settingWarningText(w: SettingComputed['warnings'][number], prefs: UnitPrefs): string {
  return w.data ? controlWarningMessage(w.code as ControlWarningCode, w.data, calcUnitsFor(prefs)) : w.message;
}

/** `prefs` words range problems and warnings in the reader's units; the values are SI either way. */
export function computeSettingChange(data: SettingChangeData, ctx: EntryContext, prefs?: UnitPrefs): SettingComputed {
  const out: SettingComputed = { refrigerant: ctx.refrigerant, ...emptySide(), warnings: [], basis: null, problems: [] };
  if (data.control === 'thermostat') {
    if (ctx.designBoxTempC !== null && data.asLeft.setpointC > ctx.designBoxTempC + 1) {
      out.warnings.push({ code: 'setpoint_above_design', message: 'The setpoint is above the system’s design box temperature.' });
    }
    return out;
  }
  if (!ctx.refrigerant) out.problems.push('No refrigerant is on record for this system, so settings cannot be turned into temperatures.');
  // Each side fills in out's warnings and basis first, then its values are laid over out.
  if (data.control === 'low') {
    const side = sideComputed(lowPressureSide, data.asFound, data.asLeft, ctx, out, prefs);
    return { ...out, ...side };
  }
  if (data.control === 'high') {
    const side = sideComputed(highPressureSide, data.asFound, data.asLeft, ctx, out, prefs);
    return { ...out, ...side };
  }
  const low = sideComputed(lowPressureSide, data.asFound.low, data.asLeft.low, ctx, out, prefs);
  const high = sideComputed(highPressureSide, data.asFound.high, data.asLeft.high, ctx, out, prefs);
  return { ...out, ...low, sides: { low, high } };
}

function describeLow(f: LowSettings, l: LowSettings, otherLeft: unknown, prefs: UnitPrefs): string {
  const p = (v: number) => formatQuantity(v, 'pressureGauge', prefs);
  const out = typeof otherLeft === 'number' ? `, cut-out ${p(otherLeft)}` : '';
  return `cut-in ${p(f.cutInKpaG)} → ${p(l.cutInKpaG)}, differential ${formatQuantity(f.differentialKpa, 'pressureDiff', prefs)} → ${formatQuantity(l.differentialKpa, 'pressureDiff', prefs)}${out}`;
}

function describeHigh(f: HighSettings, l: HighSettings, otherLeft: unknown, prefs: UnitPrefs): string {
  const p = (v: number) => formatQuantity(v, 'pressureGauge', prefs);
  const cutIn = typeof otherLeft === 'number' ? `, cut-in ${p(otherLeft)}` : '';
  return `cut-out ${p(f.cutOutKpaG)} → ${p(l.cutOutKpaG)}, differential ${formatQuantity(f.differentialKpa, 'pressureDiff', prefs)} → ${formatQuantity(l.differentialKpa, 'pressureDiff', prefs)}${cutIn}`;
}

export const settingChange = defineKind({
  kind: 'setting_change',
  fits: (u) => controlsFor(u).length > 0,
  data: settingChangeDataSchema,
  describe(d, computed, prefs) {
    const c = (computed ?? {}) as Partial<SettingComputed>;
    switch (d.control) {
      case 'thermostat':
        return `Thermostat: setpoint ${formatQuantity(d.asFound.setpointC, 'temperature', prefs)} → ${formatQuantity(d.asLeft.setpointC, 'temperature', prefs)}, differential ${formatQuantity(d.asFound.differentialK, 'temperatureDiff', prefs)} → ${formatQuantity(d.asLeft.differentialK, 'temperatureDiff', prefs)}`;
      case 'low':
        return `Low-pressure control: ${describeLow(d.asFound, d.asLeft, c.asLeftOtherKpaG, prefs)}`;
      case 'high':
        return `High-pressure control: ${describeHigh(d.asFound, d.asLeft, c.asLeftOtherKpaG, prefs)}`;
      case 'dual':
        return `Dual pressure control: low side ${describeLow(d.asFound.low, d.asLeft.low, c.sides?.low.asLeftOtherKpaG, prefs)}; high side ${describeHigh(d.asFound.high, d.asLeft.high, c.sides?.high.asLeftOtherKpaG, prefs)}`;
    }
  },
  compute: async (d, tools) => ({ ...computeSettingChange(d, tools.ctx) }),
  apply: (d, tools) => tools.applySettings(recordPatch(d)),
});
