// Over 300 lines on purpose: the saturation curves, bubble/dew and glide share one fitted model and its checks.
// Saturation pressure ↔ temperature, bubble and dew curves.
// Basis: Wagner "2.5-5" vapour-pressure equation (Wagner 1973; Poling, Prausnitz & O'Connell, The
// Properties of Gases and Liquids, eq. 7-3.3), constants fitted to the CoolProp 8.0.0 reference EOS
// data by docker-free-scripts/fit-saturation.ts. Checked to within 0.1 % of that data, −50 to +50 °C.
// The hot path (used by charts and the benchmark) works on plain numbers and allocates nothing.
import { resolveBarometricKpa } from '@/lib/calc/atmosphere';
import { CalcInputError, CalcRangeError, fmt, isCalcError } from '@/lib/calc/errors';
import { formatPressure, formatTemperature } from '@/lib/calc/format';
import { getRefrigerant, REFRIGERANTS, type Refrigerant, type RefrigerantId } from '@/lib/calc/refrigerants';
import { SATURATION_COEFFICIENTS } from '@/lib/calc/saturation-coefficients';
import {
  fromCelsius,
  fromKpaAbs,
  KELVIN_OFFSET,
  STANDARD_ATMOSPHERE_KPA,
  toCelsius,
  toKpaAbs,
  type PressureUnit,
  type TemperatureUnit,
} from '@/lib/calc/units';

export type SaturationCurve = 'bubble' | 'dew';
/** A Refrigerant from the list, or any spelling getRefrigerant accepts ("R-404A", "r404a"). */
export type RefrigerantInput = Refrigerant | string;

export const SATURATION_BASIS =
  'Wagner 2.5-5 vapour-pressure equation fitted to CoolProp 8.0.0 reference EOS data (docker-free-scripts/fit-saturation.ts)';

interface CurveModel {
  readonly tcK: number;
  readonly lnPc: number;
  readonly a1: number;
  readonly a2: number;
  readonly a3: number;
  readonly a4: number;
  readonly tMinK: number;
  readonly tMaxK: number;
  readonly pMinKpa: number;
  readonly pMaxKpa: number;
  readonly lnPMin: number;
  readonly lnPMax: number;
  // Accepted input span: the range plus a rounding allowance (1e-4 relative, ≈ 0.003 K), clamped.
  readonly pLoKpa: number;
  readonly pHiKpa: number;
  // ln p ≈ ccA − ccB/T through the range ends: the fallback Newton start.
  readonly ccA: number;
  readonly ccB: number;
  // 1/T at GUESS_NODES evenly spaced ln p nodes: the usual Newton start.
  readonly guessInvT: Float64Array;
  readonly guessScale: number;
}

const P_ALLOWANCE = 1e-4;
const T_ALLOWANCE_K = 1e-6;

interface SaturationModel {
  readonly refrigerant: Refrigerant;
  readonly bubble: CurveModel;
  readonly dew: CurveModel;
}

function lnPressure(c: CurveModel, tK: number): number {
  const tau = 1 - tK / c.tcK;
  const t15 = tau * Math.sqrt(tau);
  const t25 = t15 * tau;
  return c.lnPc + (c.tcK / tK) * (c.a1 * tau + c.a2 * t15 + c.a3 * t25 + c.a4 * t25 * t25);
}

// Newton on ln p(T) = ln P inside a shrinking bracket (ln p rises with T). The start comes from a
// small table of 1/T against ln p, so two or three steps reach machine precision. The step
// tolerance of 1e-7 K leaves an error near 1e-12 K after the final (quadratic) step.
function temperatureK(c: CurveModel, lnP: number): number {
  let lo = c.tMinK;
  let hi = c.tMaxK;
  let t: number;
  const table = c.guessInvT;
  if (table.length > 1) {
    const x = (lnP - c.lnPMin) * c.guessScale;
    let j = Math.floor(x);
    if (j < 0) j = 0;
    else if (j > table.length - 2) j = table.length - 2;
    const a = table[j] ?? 0;
    t = 1 / (a + (x - j) * ((table[j + 1] ?? a) - a));
  } else {
    t = c.ccB / (c.ccA - lnP);
  }
  if (!(t > lo && t < hi)) t = 0.5 * (lo + hi);
  for (let i = 0; i < 60; i++) {
    const tau = 1 - t / c.tcK;
    const st = Math.sqrt(tau);
    const t15 = tau * st;
    const t25 = t15 * tau;
    const tau2 = tau * tau;
    const r = c.tcK / t;
    const s = c.a1 * tau + c.a2 * t15 + c.a3 * t25 + c.a4 * t25 * t25;
    const f = c.lnPc + r * s - lnP;
    if (f > 0) hi = t;
    else lo = t;
    const slope = -(r * s + c.a1 + 1.5 * c.a2 * st + 2.5 * c.a3 * t15 + 5 * c.a4 * tau2 * tau2) / t;
    let next = t - f / slope;
    if (!(next >= lo && next <= hi)) next = 0.5 * (lo + hi);
    if (Math.abs(next - t) < 1e-7) return next;
    t = next;
  }
  return t;
}

const GUESS_NODES = 24;

function buildCurve(coef: readonly [number, number, number, number], tcK: number, pcKpa: number, r: Refrigerant): CurveModel {
  const tMinK = r.range.minC + KELVIN_OFFSET;
  // Never past the anchor: τ < 0 has no real τ^1.5.
  const tMaxK = Math.min(r.range.maxC + KELVIN_OFFSET, tcK);
  const partial = { tcK, lnPc: Math.log(pcKpa), a1: coef[0], a2: coef[1], a3: coef[2], a4: coef[3] };
  const empty = new Float64Array(0);
  const probe = { ...partial, tMinK, tMaxK, pMinKpa: 0, pMaxKpa: 0, lnPMin: 0, lnPMax: 0, pLoKpa: 0, pHiKpa: 0, ccA: 0, ccB: 0, guessInvT: empty, guessScale: 0 };
  const lnPMin = lnPressure(probe, tMinK);
  const lnPMax = lnPressure(probe, tMaxK);
  const ccB = (lnPMax - lnPMin) / (1 / tMinK - 1 / tMaxK);
  const ccA = lnPMin + ccB / tMinK;
  const solver = { ...probe, lnPMin, lnPMax, ccA, ccB };
  const guessInvT = new Float64Array(GUESS_NODES);
  const step = (lnPMax - lnPMin) / (GUESS_NODES - 1);
  for (let j = 0; j < GUESS_NODES; j++) guessInvT[j] = 1 / temperatureK(solver, lnPMin + j * step);
  return {
    ...partial,
    guessInvT,
    guessScale: 1 / step,
    tMinK,
    tMaxK,
    lnPMin,
    lnPMax,
    pMinKpa: Math.exp(lnPMin),
    pMaxKpa: Math.exp(lnPMax),
    pLoKpa: Math.exp(lnPMin) * (1 - P_ALLOWANCE),
    pHiKpa: Math.exp(lnPMax) * (1 + P_ALLOWANCE),
    ccA,
    ccB,
  };
}

const MODELS = new Map<string, SaturationModel>();
for (const r of REFRIGERANTS) {
  const c = SATURATION_COEFFICIENTS[r.id];
  if (!c) throw new Error(`saturation-coefficients.ts has no entry for ${r.id}; re-run fit-saturation.ts`);
  MODELS.set(r.id, { refrigerant: r, bubble: buildCurve(c.bubble, c.tcK, c.pcKpa, r), dew: buildCurve(c.dew, c.tcK, c.pcKpa, r) });
}

function modelFor(ref: RefrigerantInput): SaturationModel {
  const key = typeof ref === 'string' ? ref : ref.id;
  const direct = MODELS.get(key);
  if (direct) return direct;
  const resolved = MODELS.get(getRefrigerant(key).id);
  if (!resolved) throw new CalcInputError(`no saturation data for refrigerant "${key}"`, 'refrigerant');
  return resolved;
}

type Formatter = (si: number) => string;
const CELSIUS: Formatter = (c) => formatTemperature(c, 'C');
const KPA_ABS: Formatter = (p) => formatPressure(p, 'kPaAbs');

/** The units a person reads range messages in; kPa abs and °C when not given. */
export interface MessageUnits {
  pressureUnit?: PressureUnit | undefined;
  temperatureUnit?: TemperatureUnit | undefined;
  barometricKpa?: number | undefined;
}

function formattersFor(units: MessageUnits | undefined): { show: Formatter; showT: Formatter } {
  if (!units) return { show: KPA_ABS, showT: CELSIUS };
  const pu = units.pressureUnit;
  const tu = units.temperatureUnit;
  const bar = units.barometricKpa ?? STANDARD_ATMOSPHERE_KPA;
  return {
    show: pu ? (p) => formatPressure(fromKpaAbs(p, pu, bar), pu) : KPA_ABS,
    showT: tu ? (c) => formatTemperature(fromCelsius(c, tu), tu) : CELSIUS,
  };
}

function curveWord(m: SaturationModel, curve: SaturationCurve): string {
  return m.refrigerant.zeotropic ? `${curve} ` : 'saturation ';
}

function temperatureRangeError(m: SaturationModel, tC: number, show: Formatter): CalcRangeError {
  const r = m.refrigerant;
  if (tC > r.range.maxC) {
    const limit = r.critical
      ? `its ${r.critical.kind === 'pseudo' ? 'pseudo-critical' : 'critical'} temperature ${show(r.critical.tC)}`
      : `${show(r.range.maxC)}, the highest temperature covered for this blend (data above it are low-confidence)`;
    return new CalcRangeError(`${r.id}: ${show(tC)} is above ${limit}`, 'temperature');
  }
  const limit = r.triplePoint
    ? `its triple point ${show(r.triplePoint.tC)} (it is solid below that)`
    : `${show(r.range.minC)}, the lowest temperature covered by the reference data`;
  return new CalcRangeError(`${r.id}: ${show(tC)} is below ${limit}`, 'temperature');
}

function pressureRangeError(m: SaturationModel, curve: SaturationCurve, pKpa: number, show: Formatter, showT: Formatter): CalcRangeError {
  const r = m.refrigerant;
  const c = m[curve];
  if (pKpa > c.pMaxKpa) {
    const limit = r.critical
      ? `its ${r.critical.kind === 'pseudo' ? 'pseudo-critical' : 'critical'} pressure ${show(r.critical.pKpaAbs)}`
      : `the ${curveWord(m, curve)}pressure at ${showT(r.range.maxC)} (${show(c.pMaxKpa)}), the highest covered for this blend`;
    return new CalcRangeError(`${r.id}: ${show(pKpa)} is above ${limit}`, 'pressure');
  }
  const limit = r.triplePoint
    ? `its triple-point pressure ${show(r.triplePoint.pKpaAbs)} (it is solid below that)`
    : `the ${curveWord(m, curve)}pressure at ${showT(r.range.minC)} (${show(c.pMinKpa)}), the lowest covered`;
  return new CalcRangeError(`${r.id}: ${show(pKpa)} is below ${limit}`, 'pressure');
}

function pressureAt(m: SaturationModel, curve: SaturationCurve, tC: number, show: Formatter): number {
  const c = m[curve];
  let tK = tC + KELVIN_OFFSET;
  if (!(tK >= c.tMinK - T_ALLOWANCE_K && tK <= c.tMaxK + T_ALLOWANCE_K)) {
    if (typeof tC !== 'number' || !Number.isFinite(tC)) {
      throw new CalcInputError(`temperature must be a finite number (got ${String(tC)})`, 'temperature');
    }
    throw temperatureRangeError(m, tC, show);
  }
  // Clamp the allowance away: above Tc, τ^1.5 is not real.
  tK = tK < c.tMinK ? c.tMinK : tK > c.tMaxK ? c.tMaxK : tK;
  return Math.exp(lnPressure(c, tK));
}

function temperatureAt(m: SaturationModel, curve: SaturationCurve, pKpa: number, show: Formatter, showT: Formatter): number {
  const c = m[curve];
  if (!(pKpa >= c.pLoKpa && pKpa <= c.pHiKpa)) {
    if (typeof pKpa !== 'number' || !Number.isFinite(pKpa)) {
      throw new CalcInputError(`pressure must be a finite number (got ${String(pKpa)})`, 'pressure');
    }
    if (pKpa <= 0) throw new CalcInputError(`absolute pressure must be greater than zero (got ${fmt(pKpa, 1)} kPa abs)`, 'pressure');
    throw pressureRangeError(m, curve, pKpa, show, showT);
  }
  const lnP = Math.log(pKpa);
  return temperatureK(c, lnP < c.lnPMin ? c.lnPMin : lnP > c.lnPMax ? c.lnPMax : lnP) - KELVIN_OFFSET;
}

/** Saturation pressure (kPa abs) at tC on the bubble or dew curve. Basis: SATURATION_BASIS. */
export function saturationPressureKpa(ref: RefrigerantInput, tC: number, curve: SaturationCurve, units?: MessageUnits): number {
  return pressureAt(modelFor(ref), curve, tC, formattersFor(units).showT);
}

/** Saturation temperature (°C) at pKpaAbs on the bubble or dew curve. Basis: SATURATION_BASIS. */
export function saturationTemperatureC(ref: RefrigerantInput, pKpaAbs: number, curve: SaturationCurve, units?: MessageUnits): number {
  const f = formattersFor(units);
  return temperatureAt(modelFor(ref), curve, pKpaAbs, f.show, f.showT);
}

export const bubblePressureKpa = (ref: RefrigerantInput, tC: number): number => saturationPressureKpa(ref, tC, 'bubble');
export const dewPressureKpa = (ref: RefrigerantInput, tC: number): number => saturationPressureKpa(ref, tC, 'dew');
export const bubbleTemperatureC = (ref: RefrigerantInput, pKpaAbs: number): number => saturationTemperatureC(ref, pKpaAbs, 'bubble');
export const dewTemperatureC = (ref: RefrigerantInput, pKpaAbs: number): number => saturationTemperatureC(ref, pKpaAbs, 'dew');

/** The span the P-T chart shows: the saturation range, capped where the fit is known to drift. */
export function chartRange(ref: RefrigerantInput): { minC: number; maxC: number; note: string | null } {
  const r = modelFor(ref).refrigerant;
  const cap = r.chart;
  return { minC: r.range.minC, maxC: cap ? Math.min(cap.maxC, r.range.maxC) : r.range.maxC, note: cap?.note ?? null };
}

/** The temperature and pressure span each curve covers (inclusive). */
export function saturationRange(ref: RefrigerantInput): {
  refrigerant: RefrigerantId;
  minC: number;
  maxC: number;
  minBasis: string;
  maxBasis: string;
  bubble: { minKpaAbs: number; maxKpaAbs: number };
  dew: { minKpaAbs: number; maxKpaAbs: number };
} {
  const m = modelFor(ref);
  const { range } = m.refrigerant;
  return {
    refrigerant: m.refrigerant.id,
    minC: range.minC,
    maxC: m.bubble.tMaxK - KELVIN_OFFSET,
    minBasis: range.minBasis,
    maxBasis: range.maxBasis,
    bubble: { minKpaAbs: m.bubble.pMinKpa, maxKpaAbs: m.bubble.pMaxKpa },
    dew: { minKpaAbs: m.dew.pMinKpa, maxKpaAbs: m.dew.pMaxKpa },
  };
}

export interface SaturationAtTemperature {
  refrigerant: RefrigerantId;
  temperatureC: number;
  bubbleKpaAbs: number;
  dewKpaAbs: number;
  zeotropic: boolean;
  basis: string;
}

export function saturationAtTemperature(ref: RefrigerantInput, tC: number): SaturationAtTemperature {
  const m = modelFor(ref);
  return {
    refrigerant: m.refrigerant.id,
    temperatureC: tC,
    bubbleKpaAbs: pressureAt(m, 'bubble', tC, CELSIUS),
    dewKpaAbs: pressureAt(m, 'dew', tC, CELSIUS),
    zeotropic: m.refrigerant.zeotropic,
    basis: SATURATION_BASIS,
  };
}

export interface SaturationAtPressure {
  refrigerant: RefrigerantId;
  pressureKpaAbs: number;
  bubbleC: number;
  dewC: number;
  /** Dew − bubble temperature at this pressure (K); 0 for pure fluids and azeotropes. */
  glideK: number;
  /** (bubble + dew)/2: the common-practice evaporating temperature for glide blends. */
  midpointC: number;
  zeotropic: boolean;
  basis: string;
}

export function saturationAtPressure(ref: RefrigerantInput, pKpaAbs: number, units?: MessageUnits): SaturationAtPressure {
  const f = formattersFor(units);
  return atPressure(modelFor(ref), pKpaAbs, f.show, f.showT);
}

function atPressure(m: SaturationModel, pKpaAbs: number, show: Formatter, showT: Formatter): SaturationAtPressure {
  const bubbleC = temperatureAt(m, 'bubble', pKpaAbs, show, showT);
  const dewC = temperatureAt(m, 'dew', pKpaAbs, show, showT);
  return {
    refrigerant: m.refrigerant.id,
    pressureKpaAbs: pKpaAbs,
    bubbleC,
    dewC,
    glideK: dewC - bubbleC,
    midpointC: (bubbleC + dewC) / 2,
    zeotropic: m.refrigerant.zeotropic,
    basis: SATURATION_BASIS,
  };
}

/** Temperature glide (K) at a pressure: T_dew − T_bubble. */
export function glideK(ref: RefrigerantInput, pKpaAbs: number): number {
  return saturationAtPressure(ref, pKpaAbs).glideK;
}

export interface SaturationTableRow {
  temperature: number;
  bubble: number;
  dew: number;
}

export const MAX_TABLE_ROWS = 2000;

/**
 * Pressure–temperature chart rows in the user's units, from `from` to `to` (clipped to the
 * refrigerant's range) in steps of `step`. Pressures in `pressureUnit` against `barometricKpa`.
 */
export function saturationTable(
  ref: RefrigerantInput,
  options: {
    from: number;
    to: number;
    step: number;
    temperatureUnit: TemperatureUnit;
    pressureUnit: PressureUnit;
    barometricKpa?: number | undefined;
    elevationM?: number | undefined;
  },
): { refrigerant: RefrigerantId; rows: SaturationTableRow[]; clipped: boolean; basis: string } {
  const m = modelFor(ref);
  const { from, to, step, temperatureUnit, pressureUnit } = options;
  const barometricKpa = resolveBarometricKpa(options);
  const fromC = toCelsius(from, temperatureUnit);
  const toC = toCelsius(to, temperatureUnit);
  if (!(step > 0) || !Number.isFinite(step)) throw new CalcInputError(`step must be greater than zero (got ${fmt(step, 2)})`, 'step');
  if (toC < fromC) throw new CalcInputError('the range end must not be below its start', 'to');
  const count = Math.floor((to - from) / step + 1e-9) + 1;
  if (count > MAX_TABLE_ROWS) {
    throw new CalcInputError(`that range and step give ${count} rows; the limit is ${MAX_TABLE_ROWS}`, 'step');
  }
  const rows: SaturationTableRow[] = [];
  let clipped = false;
  const chartMaxK = Math.min(m.bubble.tMaxK, (m.refrigerant.chart?.maxC ?? Infinity) + KELVIN_OFFSET);
  for (let i = 0; i < count; i++) {
    const t = from + i * step;
    const tK = toCelsius(t, temperatureUnit) + KELVIN_OFFSET;
    if (tK < m.bubble.tMinK - 1e-9 || tK > chartMaxK + 1e-9) {
      clipped = true;
      continue;
    }
    const clampedK = Math.min(Math.max(tK, m.bubble.tMinK), m.bubble.tMaxK);
    rows.push({
      temperature: t,
      bubble: fromKpaAbs(Math.exp(lnPressure(m.bubble, clampedK)), pressureUnit, barometricKpa),
      dew: fromKpaAbs(Math.exp(lnPressure(m.dew, clampedK)), pressureUnit, barometricKpa),
    });
  }
  return { refrigerant: m.refrigerant.id, rows, clipped, basis: SATURATION_BASIS };
}

export type SaturationQuery =
  | { kind: 'temperature'; refrigerant: string; temperature: number; unit: 'C' | 'F' }
  | {
      kind: 'pressure';
      refrigerant: string;
      pressure: number;
      unit: PressureUnit;
      elevationM?: number | undefined;
      barometricKpa?: number | undefined;
      /** The unit for the answer and the messages (°C when not given). */
      temperatureUnit?: 'C' | 'F' | undefined;
    };

export type SaturationQueryResult =
  | (SaturationAtTemperature & { kind: 'temperature' })
  | (SaturationAtPressure & {
      kind: 'pressure';
      barometricKpa: number;
      temperatureUnit: 'C' | 'F';
      /** Bubble, dew and mid-point in temperatureUnit. */
      bubble: number;
      dew: number;
      midpoint: number;
      /** With a gauge unit away from the standard barometer: the same gauge reading at sea level. */
      seaLevel: { barometricKpa: number; bubble: number; dew: number; midpoint: number; bubbleC: number; dewC: number } | null;
    });

/**
 * The JSON API's saturation look-up, in the units the user chose; range errors quote the user's
 * units. Temperature → { bubbleKpaAbs, dewKpaAbs }; pressure → { bubbleC, dewC }.
 */
export function saturationLookup(query: SaturationQuery): SaturationQueryResult {
  const m = modelFor(query.refrigerant);
  if (query.kind === 'temperature') {
    const unit = query.unit;
    const showT: Formatter = (c) => formatTemperature(fromCelsius(c, unit), unit);
    const tC = toCelsius(query.temperature, unit);
    return {
      kind: 'temperature',
      refrigerant: m.refrigerant.id,
      temperatureC: tC,
      bubbleKpaAbs: pressureAt(m, 'bubble', tC, showT),
      dewKpaAbs: pressureAt(m, 'dew', tC, showT),
      zeotropic: m.refrigerant.zeotropic,
      basis: SATURATION_BASIS,
    };
  }
  const barometricKpa = resolveBarometricKpa(query);
  const unit = query.unit;
  const tu = query.temperatureUnit ?? 'C';
  const show: Formatter = (p) => formatPressure(fromKpaAbs(p, unit, barometricKpa), unit);
  const showT: Formatter = (c) => formatTemperature(fromCelsius(c, tu), tu);
  const pKpaAbs = toKpaAbs(query.pressure, unit, barometricKpa);
  const at = atPressure(m, pKpaAbs, show, showT);
  const gauge = unit === 'psig' || unit === 'kPaG' || unit === 'barG';
  let seaLevel: Extract<SaturationQueryResult, { kind: 'pressure' }>['seaLevel'] = null;
  if (gauge && Math.abs(barometricKpa - STANDARD_ATMOSPHERE_KPA) > 1e-9) {
    try {
      const sea = atPressure(m, toKpaAbs(query.pressure, unit, STANDARD_ATMOSPHERE_KPA), show, showT);
      seaLevel = {
        barometricKpa: STANDARD_ATMOSPHERE_KPA,
        bubble: fromCelsius(sea.bubbleC, tu),
        dew: fromCelsius(sea.dewC, tu),
        midpoint: fromCelsius(sea.midpointC, tu),
        bubbleC: sea.bubbleC,
        dewC: sea.dewC,
      };
    } catch (error) {
      // The sea-level figure is a courtesy: out of range there simply means none is offered.
      if (!(error instanceof CalcRangeError)) throw error;
    }
  }
  return {
    kind: 'pressure',
    barometricKpa,
    temperatureUnit: tu,
    bubble: fromCelsius(at.bubbleC, tu),
    dew: fromCelsius(at.dewC, tu),
    midpoint: fromCelsius(at.midpointC, tu),
    seaLevel,
    ...at,
  };
}

/**
 * The saturation temperature (°C) a gauge reading (kPa gauge) gives against a barometer, or null when
 * it lies outside the refrigerant's range: for the sea-level value shown beside a corrected one.
 */
export function gaugeSaturationC(ref: RefrigerantInput, pressureKpaG: number, curve: SaturationCurve, barometricKpa = STANDARD_ATMOSPHERE_KPA): number | null {
  const abs = pressureKpaG + barometricKpa;
  if (!Number.isFinite(abs) || abs <= 0) return null;
  try {
    return saturationTemperatureC(ref, abs, curve);
  } catch (error) {
    if (isCalcError(error)) return null;
    throw error;
  }
}
