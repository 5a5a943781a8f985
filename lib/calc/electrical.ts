// Electrical checks on motor supply and control circuits.
import { CalcInputError, fmt, requirePositive } from '@/lib/calc/errors';
import { formatPercent, formatVolts } from '@/lib/calc/format';
import {
  CONTROL_VOLTAGE_BAND,
  VOLTAGE_UNBALANCE_BAND,
  describeBand,
  judge,
  type BandView,
  type Level,
} from '@/lib/calc/reading-bands';

// NEMA MG 1 Fig. 14-1 derating curve, as tabulated in secondary engineering references
// quoting MG 1: [percent unbalance, derating factor].
const DERATING_CURVE: readonly (readonly [number, number])[] = [
  [0, 1],
  [1, 1],
  [1.5, 0.97],
  [2, 0.95],
  [2.5, 0.93],
  [3, 0.89],
  [3.5, 0.85],
  [4, 0.82],
  [4.5, 0.78],
  [5, 0.76],
];

export const NEMA_MAX_UNBALANCE_PCT = 5;

/**
 * Motor derating factor for a voltage unbalance, by linear interpolation of the NEMA MG 1
 * Fig. 14-1 curve. Null above 5 %: NEMA recommends not operating the motor at all.
 */
export function motorDeratingFactor(unbalancePct: number): number | null {
  if (!Number.isFinite(unbalancePct) || unbalancePct < 0) {
    throw new CalcInputError(`unbalance must be a non-negative number (got ${fmt(unbalancePct, 2)})`, 'unbalancePct');
  }
  if (unbalancePct > NEMA_MAX_UNBALANCE_PCT) return null;
  for (let i = 1; i < DERATING_CURVE.length; i++) {
    const hi = DERATING_CURVE[i];
    const lo = DERATING_CURVE[i - 1];
    if (hi && lo && unbalancePct <= hi[0]) {
      return lo[1] + ((unbalancePct - lo[0]) / (hi[0] - lo[0])) * (hi[1] - lo[1]);
    }
  }
  return DERATING_CURVE[DERATING_CURVE.length - 1]?.[1] ?? null;
}

export interface VoltageUnbalanceResult {
  averageV: number;
  maxDeviationV: number;
  unbalancePct: number;
  /** Null when above 5 %: do not operate. */
  deratingFactor: number | null;
  doNotOperate: boolean;
  status: 'ok' | 'caution' | 'derate' | 'do_not_operate';
  /** normal ≤ 1 %, watch ≤ 2 %, abnormal above (VOLTAGE_UNBALANCE_BAND). */
  level: Level;
  band: BandView;
  notes: string[];
  basis: string;
}

/**
 * Three-phase voltage unbalance by the NEMA MG 1 definition:
 * 100 × (maximum deviation of a line voltage from the average) ÷ average.
 * Not (max − min)/average, which roughly doubles the figure.
 */
export function voltageUnbalance(lineVoltages: readonly number[]): VoltageUnbalanceResult {
  if (lineVoltages.length !== 3) {
    throw new CalcInputError(`three line-to-line voltages are needed (got ${lineVoltages.length})`, 'voltages');
  }
  lineVoltages.forEach((v, i) => requirePositive(v, `voltage ${i + 1}`));
  const [a = 0, b = 0, c = 0] = lineVoltages;
  const averageV = (a + b + c) / 3;
  const maxDeviationV = Math.max(...lineVoltages.map((v) => Math.abs(v - averageV)));
  const unbalancePct = (100 * maxDeviationV) / averageV;
  const deratingFactor = motorDeratingFactor(unbalancePct);
  const doNotOperate = deratingFactor === null;
  const notes: string[] = [];
  let status: VoltageUnbalanceResult['status'] = 'ok';
  if (doNotOperate) {
    status = 'do_not_operate';
    notes.push('Above 5 % unbalance NEMA MG 1 recommends against operating the motor. Find the cause before running it.');
  } else if (unbalancePct > 1) {
    status = unbalancePct > 2 ? 'derate' : 'caution';
    notes.push('Keep unbalance at or below 1 % at the motor terminals (NEMA MG 1 guidance); equipment instructions commonly allow 2 %.');
  }
  if (unbalancePct > 1) {
    notes.push(`Current unbalance typically runs 6–10 times the voltage unbalance (common practice): expect roughly ${fmt(unbalancePct * 6, 0)}–${fmt(unbalancePct * 10, 0)} %.`);
  }
  return {
    averageV,
    maxDeviationV,
    unbalancePct,
    deratingFactor,
    doNotOperate,
    status,
    level: judge(unbalancePct, VOLTAGE_UNBALANCE_BAND).level,
    band: describeBand(VOLTAGE_UNBALANCE_BAND, 'C'),
    notes,
    basis: 'NEMA MG 1: unbalance = 100 × max deviation from the average ÷ average; derating from the MG 1 curve (Fig. 14-1), interpolated.',
  };
}

interface VoltageSystem {
  readonly system: string;
  readonly nameplates: readonly number[];
  readonly rangeA: { readonly serviceMin: number; readonly serviceMax: number; readonly utilizationMin: number };
  readonly rangeB: { readonly serviceMin: number; readonly serviceMax: number; readonly utilizationMin: number };
}

// ANSI C84.1-2016 Table 1: values FROM MEMORY, confirm against the standard before
// relying on them. Utilization maximum equals the service maximum.
const C84_1_SYSTEMS: readonly VoltageSystem[] = [
  { system: '120', nameplates: [115, 120], rangeA: { serviceMin: 114, serviceMax: 126, utilizationMin: 110 }, rangeB: { serviceMin: 110, serviceMax: 127, utilizationMin: 106 } },
  { system: '208Y/120', nameplates: [200, 208], rangeA: { serviceMin: 197, serviceMax: 218, utilizationMin: 191 }, rangeB: { serviceMin: 191, serviceMax: 220, utilizationMin: 184 } },
  { system: '240', nameplates: [230, 240], rangeA: { serviceMin: 228, serviceMax: 252, utilizationMin: 220 }, rangeB: { serviceMin: 220, serviceMax: 254, utilizationMin: 212 } },
  { system: '480', nameplates: [460, 480], rangeA: { serviceMin: 456, serviceMax: 504, utilizationMin: 440 }, rangeB: { serviceMin: 440, serviceMax: 508, utilizationMin: 424 } },
];

export const SUPPORTED_NAMEPLATE_VOLTAGES = C84_1_SYSTEMS.flatMap((s) => s.nameplates);

export interface SupplyVoltageResult {
  system: string;
  point: 'service' | 'utilization';
  rangeA: { minV: number; maxV: number };
  rangeB: { minV: number; maxV: number };
  verdict: 'range_a' | 'range_b' | 'outside';
  direction: 'low' | 'high' | null;
  /** Range A normal, Range B watch, outside abnormal. */
  level: Level;
  measuredV: number;
  message: string;
  basis: string;
}

const VERDICT_LEVEL: Record<SupplyVoltageResult['verdict'], Level> = { range_a: 'normal', range_b: 'watch', outside: 'abnormal' };

/**
 * Supply voltage against the ANSI C84.1 ranges of the system that feeds a given nameplate voltage.
 * `point`: 'utilization' for a reading at the equipment (default), 'service' at the service entrance.
 * Basis: ANSI C84.1 Table 1 (values from memory; confirm before release).
 */
export function supplyVoltageCheck(input: { measuredV: number; nameplateV: number; point?: 'service' | 'utilization' }): SupplyVoltageResult {
  requirePositive(input.measuredV, 'measured voltage');
  const sys = C84_1_SYSTEMS.find((s) => s.nameplates.includes(input.nameplateV));
  if (!sys) {
    throw new CalcInputError(
      `no ANSI C84.1 system stored for a ${input.nameplateV} V nameplate; supported: ${SUPPORTED_NAMEPLATE_VOLTAGES.join(', ')} V`,
      'nameplateV',
    );
  }
  const point = input.point ?? 'utilization';
  const limits = (r: VoltageSystem['rangeA']): { minV: number; maxV: number } => ({
    minV: point === 'service' ? r.serviceMin : r.utilizationMin,
    maxV: r.serviceMax,
  });
  const rangeA = limits(sys.rangeA);
  const rangeB = limits(sys.rangeB);
  const v = input.measuredV;
  const direction = v < rangeA.minV ? 'low' : v > rangeA.maxV ? 'high' : null;
  let verdict: SupplyVoltageResult['verdict'];
  let message: string;
  if (direction === null) {
    verdict = 'range_a';
    message = `${formatVolts(v)} is within Range A (${rangeA.minV}–${rangeA.maxV} V) for a ${sys.system} V system: normal.`;
  } else if (v >= rangeB.minV && v <= rangeB.maxV) {
    verdict = 'range_b';
    message = `${formatVolts(v)} is ${direction} but within Range B (${rangeB.minV}–${rangeB.maxV} V): acceptable only as an infrequent excursion; the supply should be corrected.`;
  } else {
    verdict = 'outside';
    message = `${formatVolts(v)} is ${direction} and outside Range B (${rangeB.minV}–${rangeB.maxV} V) for a ${sys.system} V system: have the supply corrected before relying on the equipment.`;
  }
  return {
    system: sys.system,
    point,
    rangeA,
    rangeB,
    verdict,
    direction,
    level: VERDICT_LEVEL[verdict],
    measuredV: v,
    message,
    basis: `ANSI C84.1 ${point} voltage ranges, ${sys.system} V system (table values from memory; confirm against the standard).`,
  };
}

const VERDICT_ORDER: Record<SupplyVoltageResult['verdict'], number> = { range_a: 0, range_b: 1, outside: 2 };

export interface SupplyVoltageLinesResult extends SupplyVoltageResult {
  /** Each line judged on its own; the worst decides the verdict, level and message. */
  lines: SupplyVoltageResult[];
  /** Index (0-based) of the line that decided. */
  worstLine: number;
}

/**
 * Three line voltages against ANSI C84.1: each line is judged on its own and the worst decides
 * (ties go to the line farthest from the middle of Range A). Basis: ANSI C84.1 (from memory).
 */
export function supplyVoltageLines(input: {
  lines: readonly number[];
  nameplateV: number;
  point?: 'service' | 'utilization';
}): SupplyVoltageLinesResult {
  if (input.lines.length < 1 || input.lines.length > 3) {
    throw new CalcInputError(`one to three line voltages are needed (got ${input.lines.length})`, 'lines');
  }
  const lines = input.lines.map((measuredV, i) => {
    requirePositive(measuredV, `voltage ${i + 1}`);
    return supplyVoltageCheck({ measuredV, nameplateV: input.nameplateV, point: input.point });
  });
  let worstLine = 0;
  lines.forEach((line, i) => {
    const best = lines[worstLine]!;
    const mid = (best.rangeA.minV + best.rangeA.maxV) / 2;
    const worse =
      VERDICT_ORDER[line.verdict] > VERDICT_ORDER[best.verdict] ||
      (VERDICT_ORDER[line.verdict] === VERDICT_ORDER[best.verdict] && Math.abs(line.measuredV - mid) > Math.abs(best.measuredV - mid));
    if (worse) worstLine = i;
  });
  const worst = lines[worstLine]!;
  const message = lines.length > 1 ? `Line ${worstLine + 1} decides: ${worst.message}` : worst.message;
  return { ...worst, message, lines, worstLine };
}

/**
 * Motor voltage tolerance: ±10 % of rated voltage at rated frequency (NEMA MG 1 12.44).
 * For a dual rating (e.g. 208–230 V) the band runs from 90 % of the low to 110 % of the high rating
 * (common practice: 187–253 V).
 */
export function motorVoltageTolerance(input: { measuredV: number; ratedV: number; ratedMaxV?: number }): {
  minV: number;
  maxV: number;
  within: boolean;
  basis: string;
} {
  requirePositive(input.measuredV, 'measured voltage');
  requirePositive(input.ratedV, 'rated voltage');
  const high = input.ratedMaxV ?? input.ratedV;
  requirePositive(high, 'rated maximum voltage');
  if (high < input.ratedV) throw new CalcInputError('the upper rating must not be below the lower rating', 'ratedMaxV');
  const minV = input.ratedV * 0.9;
  const maxV = high * 1.1;
  return {
    minV,
    maxV,
    within: input.measuredV >= minV && input.measuredV <= maxV,
    basis: 'NEMA MG 1 12.44: ±10 % of rated voltage at rated frequency; dual ratings span 90 % of the low to 110 % of the high rating (common practice).',
  };
}

export interface ControlVoltageResult {
  nominalV: number;
  /** How far from nominal still counts as ok (5 % by default, common practice). */
  tolerancePct: number;
  /** The coil operating band: 85 % and 110 % of nominal (IEC 60947-4-1, from memory). */
  minV: number;
  maxV: number;
  /** The ok band: nominal ± tolerancePct. */
  okMinV: number;
  okMaxV: number;
  deviationPct: number;
  /** out: outside 85–110 %; marginal: inside it but more than tolerancePct from nominal; ok otherwise. */
  status: 'ok' | 'marginal' | 'out';
  direction: 'low' | 'high' | null;
  level: Level;
  band: BandView;
  /** One line a person reads, e.g. "22.0 V on a 24 V circuit: marginal (low) …". */
  message: string;
  notes: string[];
  basis: string;
}

export const CONTROL_VOLTAGE_OUT_LOW_PCT = 85;
export const CONTROL_VOLTAGE_OUT_HIGH_PCT = 110;

/**
 * Control-circuit voltage against its nominal (24 VAC by default).
 * out: below 85 % or above 110 % of nominal, the operating band of contactor and relay coils
 * (IEC 60947-4-1; clause quoted from memory). marginal: inside that band but more than 5 % from
 * nominal (common practice: re-check under load). ok otherwise. 22 V on 24 V is marginal.
 */
export function controlCircuitVoltage(input: { measuredV: number; nominalV?: number; tolerancePct?: number }): ControlVoltageResult {
  requirePositive(input.measuredV, 'measured voltage');
  const nominalV = input.nominalV ?? 24;
  const tolerancePct = input.tolerancePct ?? 5;
  requirePositive(nominalV, 'nominal voltage');
  requirePositive(tolerancePct, 'tolerance');
  if (tolerancePct >= 50) throw new CalcInputError('tolerance must be below 50 %', 'tolerancePct');
  const minV = (nominalV * CONTROL_VOLTAGE_OUT_LOW_PCT) / 100;
  const maxV = (nominalV * CONTROL_VOLTAGE_OUT_HIGH_PCT) / 100;
  const okMinV = nominalV * (1 - tolerancePct / 100);
  const okMaxV = nominalV * (1 + tolerancePct / 100);
  const v = input.measuredV;
  const status: ControlVoltageResult['status'] = v < minV || v > maxV ? 'out' : v < okMinV || v > okMaxV ? 'marginal' : 'ok';
  const direction = status === 'ok' ? null : v < nominalV ? 'low' : 'high';
  const notes: string[] = [];
  if (direction === 'low') {
    notes.push('Low control voltage: re-check under load and check the transformer primary tap (use the 208 V tap on a 208 V supply).');
  }
  if (direction === 'high' && nominalV === 24) {
    notes.push('Open or lightly loaded 24 V secondaries commonly read 24–28 V; re-check with the circuit loaded.');
  }
  const words = { ok: 'ok', marginal: 'marginal', out: 'out of the coil operating band' }[status];
  const message =
    `${formatVolts(v)} on a ${fmt(nominalV, 1)} V circuit: ${words}${direction ? ` (${direction})` : ''}; ` +
    `coils operate from ${formatVolts(minV)} to ${formatVolts(maxV)}, ok within ${formatPercent(tolerancePct)} of nominal.`;
  const level: Level = status === 'ok' ? 'normal' : status === 'marginal' ? 'watch' : 'abnormal';
  return {
    nominalV,
    tolerancePct,
    minV,
    maxV,
    okMinV,
    okMaxV,
    deviationPct: ((v - nominalV) / nominalV) * 100,
    status,
    direction,
    level,
    band: describeBand({ ...CONTROL_VOLTAGE_BAND, normal: { min: 100 - tolerancePct, max: 100 + tolerancePct } }, 'C'),
    message,
    notes,
    basis: `Out below 85 % or above 110 % of nominal: contactor and relay coil operating band (IEC 60947-4-1, clause from memory). Marginal more than ${fmt(tolerancePct, 1)} % from nominal: common practice (re-check under load).`,
  };
}
