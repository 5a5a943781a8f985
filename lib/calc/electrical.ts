// Electrical checks on motor supply and control circuits.
import { CalcInputError, fmt, requirePositive } from '@/lib/calc/errors';
import { formatPercent, formatVolts } from '@/lib/calc/format';
import { describeBand, judge, type BandView } from '@/lib/calc/band-judgement';
import { CONTROL_VOLTAGE_BAND, VOLTAGE_UNBALANCE_BAND, type Level } from '@/lib/calc/reading-bands';

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
