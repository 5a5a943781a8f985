import { describe, expect, it } from 'vitest';

import { controlCircuitVoltage, motorDeratingFactor, motorVoltageTolerance, voltageUnbalance } from '@/lib/calc/electrical';
import { supplyVoltageCheck, supplyVoltageLines } from '@/lib/calc/supply-voltage';
import { CalcInputError } from '@/lib/calc/errors';

describe('voltage unbalance, NEMA MG 1 (TRADE-REFERENCE §5.1)', () => {
  it('worked example 460/467/450 V: average 459, max deviation 9, 1.96 %, derate ≈ 0.95 (±0.01)', () => {
    const r = voltageUnbalance([460, 467, 450]);
    expect(r.averageV).toBeCloseTo(459, 9);
    expect(r.maxDeviationV).toBeCloseTo(9, 9);
    expect(r.unbalancePct).toBeCloseTo(1.96, 2);
    expect(Math.abs((r.deratingFactor ?? NaN) - 0.95)).toBeLessThanOrEqual(0.01);
    expect(r.doNotOperate).toBe(false);
  });

  it('worked example 462/463/455 V: 1.09 % (not the (max − min)/average figure of 1.74 %)', () => {
    const r = voltageUnbalance([462, 463, 455]);
    expect(r.unbalancePct).toBeCloseTo(1.087, 3);
    expect(r.status).toBe('caution');
  });

  it.each([
    [0.5, 1.0],
    [1.0, 1.0],
    [1.5, 0.97],
    [2.0, 0.95],
    [2.5, 0.93],
    [3.0, 0.89],
    [3.5, 0.85],
    [4.0, 0.82],
    [4.5, 0.78],
    [5.0, 0.76],
  ])('derating factor at %s %% is %s (NEMA MG 1 Fig. 14-1 table)', (pct, factor) => {
    expect(Math.abs((motorDeratingFactor(pct) ?? NaN) - factor)).toBeLessThanOrEqual(0.01);
  });

  it('interpolates between table points and refuses above 5 % ("do not operate")', () => {
    expect(motorDeratingFactor(2.75)).toBeCloseTo(0.91, 9);
    expect(motorDeratingFactor(5.01)).toBeNull();
    const r = voltageUnbalance([480, 480, 430]);
    expect(r.unbalancePct).toBeGreaterThan(5);
    expect(r.doNotOperate).toBe(true);
    expect(r.status).toBe('do_not_operate');
    expect(r.notes[0]).toMatch(/recommends against operating/);
  });

  it('rejects anything but three positive voltages', () => {
    expect(() => voltageUnbalance([460, 467])).toThrow('three line-to-line voltages are needed (got 2)');
    expect(() => voltageUnbalance([460, 0, 450])).toThrow('voltage 2 must be greater than zero (got 0)');
    expect(() => voltageUnbalance([460, Number.NaN, 450])).toThrow(CalcInputError);
    expect(() => motorDeratingFactor(-1)).toThrow(CalcInputError);
  });
});

describe('supply voltage, ANSI C84.1 (TRADE-REFERENCE §5.2, values from memory)', () => {
  it('460 V nameplate → 480 V system: 445 V Range A, 430 V Range B (low), 420 V outside', () => {
    expect(supplyVoltageCheck({ measuredV: 445, nameplateV: 460 }).verdict).toBe('range_a');
    const b = supplyVoltageCheck({ measuredV: 430, nameplateV: 460 });
    expect(b.system).toBe('480');
    expect(b.verdict).toBe('range_b');
    expect(b.direction).toBe('low');
    expect(supplyVoltageCheck({ measuredV: 420, nameplateV: 460 }).verdict).toBe('outside');
    expect(supplyVoltageCheck({ measuredV: 506, nameplateV: 460 }).direction).toBe('high');
  });

  it('200 V nameplate → 208Y/120 system: 187 V is Range B at the equipment (utilization min 191 / 184)', () => {
    const r = supplyVoltageCheck({ measuredV: 187, nameplateV: 200 });
    expect(r.rangeA).toEqual({ minV: 191, maxV: 218 });
    expect(r.verdict).toBe('range_b');
    // At the service entrance Range B starts at 191, so the same reading is outside.
    expect(supplyVoltageCheck({ measuredV: 187, nameplateV: 200, point: 'service' }).verdict).toBe('outside');
  });

  it('unknown nameplate voltage is rejected with the supported list', () => {
    expect(() => supplyVoltageCheck({ measuredV: 575, nameplateV: 575 })).toThrow(/supported: 115, 120, 200, 208, 230, 240, 460, 480 V/);
  });

  it('motor tolerance ±10 % (NEMA MG 1 12.44); dual 208–230 V nameplate spans 187–253 V (common practice)', () => {
    const dual = motorVoltageTolerance({ measuredV: 190, ratedV: 208, ratedMaxV: 230 });
    expect(dual.minV).toBeCloseTo(187.2, 9);
    expect(dual.maxV).toBeCloseTo(253, 9);
    expect(dual.within).toBe(true);
    expect(motorVoltageTolerance({ measuredV: 410, ratedV: 460 }).within).toBe(false);
  });
});

describe('control circuit voltage: IEC 60947-4-1 coil band 85–110 % (from memory), marginal beyond ±5 % (common practice)', () => {
  it('24 V nominal: out below 20.4 V (85 %) or above 26.4 V (110 %); ok within 22.8–25.2 V (±5 %)', () => {
    const r = controlCircuitVoltage({ measuredV: 24 });
    expect(r.minV).toBeCloseTo(20.4, 9);
    expect(r.maxV).toBeCloseTo(26.4, 9);
    expect(r.okMinV).toBeCloseTo(22.8, 9);
    expect(r.okMaxV).toBeCloseTo(25.2, 9);
    expect(r).toMatchObject({ status: 'ok', direction: null, level: 'normal' });
    expect(r.basis).toMatch(/IEC 60947-4-1/);
    expect(r.basis).toMatch(/common practice/);
  });

  it('22 V on 24 V is marginal (low), in words, with the re-check note (TRADE-REFERENCE §5.3: "a little low")', () => {
    const r = controlCircuitVoltage({ measuredV: 22 });
    expect(r).toMatchObject({ status: 'marginal', direction: 'low', level: 'watch' });
    expect(r.message).toBe('22 V on a 24 V circuit: marginal (low); coils operate from 20.4 V to 26.4 V, ok within 5 % of nominal.');
    expect(r.notes[0]).toMatch(/re-check under load/);
  });

  it.each([
    [20.3, 'out', 'low'],
    [20.4, 'marginal', 'low'],
    [22.7, 'marginal', 'low'],
    [22.8, 'ok', null],
    [25.2, 'ok', null],
    [25.3, 'marginal', 'high'],
    [26.4, 'marginal', 'high'],
    [26.5, 'out', 'high'],
  ] as const)('%s V on 24 V → %s (%s)', (v, status, direction) => {
    expect(controlCircuitVoltage({ measuredV: v })).toMatchObject({ status, direction });
  });

  it('accepts another nominal and tolerance; rejects nonsense', () => {
    expect(controlCircuitVoltage({ measuredV: 115, nominalV: 120, tolerancePct: 5 }).status).toBe('ok');
    expect(controlCircuitVoltage({ measuredV: 110, nominalV: 120 }).status).toBe('marginal');
    expect(() => controlCircuitVoltage({ measuredV: -3 })).toThrow(CalcInputError);
    expect(() => controlCircuitVoltage({ measuredV: 24, tolerancePct: 60 })).toThrow(/below 50 %/);
  });
});

describe('supply voltage on three lines, ANSI C84.1 (TRADE-REFERENCE §5.2, values from memory): the worst line decides', () => {
  it('460 V nameplate (480 V system, utilization): 470/465/430 V → line 3 in Range B (low) decides', () => {
    const r = supplyVoltageLines({ lines: [470, 465, 430], nameplateV: 460 });
    expect(r.lines.map((l) => l.verdict)).toEqual(['range_a', 'range_a', 'range_b']);
    expect(r).toMatchObject({ worstLine: 2, verdict: 'range_b', direction: 'low', level: 'watch' });
    expect(r.message).toMatch(/^Line 3 decides: 430 V is low but within Range B \(424–508 V\)/);
  });

  it('one line outside Range B makes the whole supply abnormal even when the average is fine (208Y/120: 218/220/221 V)', () => {
    // Average 219.7 V lies inside Range B (≤ 220 V), but 221 V is above it.
    const r = supplyVoltageLines({ lines: [218, 220, 221], nameplateV: 208 });
    expect(r).toMatchObject({ verdict: 'outside', direction: 'high', level: 'abnormal', worstLine: 2 });
  });

  it('a fractional average never reaches the message as a raw float (issue 14: "208.33333333333334 V")', () => {
    const one = supplyVoltageLines({ lines: [(208 + 209 + 208) / 3], nameplateV: 208 });
    expect(one.message).toBe('208.3 V is within Range A (191–218 V) for a 208Y/120 V system: normal.');
  });

  it('rejects an empty or four-line input', () => {
    expect(() => supplyVoltageLines({ lines: [], nameplateV: 460 })).toThrow(/one to three line voltages/);
    expect(() => supplyVoltageLines({ lines: [1, 2, 3, 4], nameplateV: 460 })).toThrow(/one to three line voltages/);
  });
});
