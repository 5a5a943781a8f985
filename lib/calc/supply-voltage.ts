// Supply voltage against ANSI C84.1 Range A and B, per line and for up to three lines.
import { CalcInputError, requirePositive } from '@/lib/calc/errors';
import { formatVolts } from '@/lib/calc/format';
import type { Level } from '@/lib/calc/reading-bands';

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
