// Every message lib/calc returns is written for a person: numbers at their quantity's precision
// (never a raw float like "208.33333333333334 V") and in the reader's temperature unit.
// Property tests over random inputs (fast-check); the API-level twin is in tests/integration/calc.api.test.ts.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';

import { controlCircuitVoltage, voltageUnbalance } from '@/lib/calc/electrical';
import { supplyVoltageLines } from '@/lib/calc/supply-voltage';
import { isCalcError } from '@/lib/calc/errors';
import { formatDecimal, MAX_MESSAGE_DECIMALS } from '@/lib/calc/format';
import { highPressureControl, lowPressureControl } from '@/lib/calc/pressure-controls';
import { computeReadings } from '@/lib/calc/readings';
import { REFRIGERANT_IDS } from '@/lib/calc/refrigerants';
import { saturationLookup } from '@/lib/calc/saturation';

/** A number with more decimals than any message may carry. */
const RAW_FLOAT = new RegExp(`\\d\\.\\d{${MAX_MESSAGE_DECIMALS + 1},}`);

/** Every string in a result, wherever it sits. */
function strings(value: unknown, out: string[] = []): string[] {
  if (typeof value === 'string') out.push(value);
  else if (Array.isArray(value)) value.forEach((v) => strings(v, out));
  else if (value && typeof value === 'object') Object.values(value).forEach((v) => strings(v, out));
  return out;
}

/** The strings of a result, or the message of the calculation error it threw. */
function messagesOf(fn: () => unknown): string[] {
  try {
    return strings(fn());
  } catch (error) {
    if (isCalcError(error)) return [error.message];
    throw error;
  }
}

function expectReadable(messages: string[], temperatureUnit: 'C' | 'F'): void {
  for (const m of messages) {
    expect(m, m).not.toMatch(RAW_FLOAT);
    expect(m, m).not.toMatch(/NaN|Infinity|undefined|e[+-]\d/);
    // Temperatures in the reader's unit (bases may name a definition in both, e.g. "35 °F box").
    if (temperatureUnit === 'F') expect(m, m).not.toMatch(/-?\d[\d,.]* °C\b(?!.*°F)/);
  }
}

const refrigerant = fc.constantFrom(...REFRIGERANT_IDS);
const tUnit = fc.constantFrom('C' as const, 'F' as const);
const pUnit = fc.constantFrom('psig' as const, 'kPaG' as const, 'kPaAbs' as const, 'barG' as const, 'psia' as const, 'bar' as const);
const real = (min: number, max: number) => fc.double({ min, max, noNaN: true, noDefaultInfinity: true });
const maybe = <T,>(arb: fc.Arbitrary<T>) => fc.option(arb, { nil: undefined });

describe('no raw float in any lib/calc message', () => {
  it('formatDecimal: at most the asked decimals, no "-0"', () => {
    fc.assert(
      fc.property(real(-1e6, 1e6), fc.integer({ min: 0, max: 2 }), (v, d) => {
        const text = formatDecimal(v, d);
        expect(text).not.toMatch(new RegExp(`\\.\\d{${d + 1},}`));
        expect(text).not.toBe('-0');
      }),
    );
  });

  it('computeReadings, in either unit', () => {
    fc.assert(
      fc.property(
        refrigerant,
        tUnit,
        pUnit,
        fc.record({
          suctionPressure: maybe(real(-10, 800)),
          headPressure: maybe(real(-10, 3000)),
          liquidPressure: maybe(real(-10, 3000)),
          suctionLineTemp: maybe(real(-60, 120)),
          liquidLineTemp: maybe(real(-60, 160)),
          boxTemp: maybe(real(-40, 60)),
          ambientTemp: maybe(real(-20, 120)),
          elevationM: maybe(real(-100, 3000)),
          controlVolts: maybe(real(1, 300)),
        }),
        (ref, tu, pu, values) => {
          expectReadable(messagesOf(() => computeReadings({ refrigerant: ref, temperatureUnit: tu, pressureUnit: pu, ...values })), tu);
        },
      ),
      { numRuns: 300 },
    );
  });

  it('pressure controls, low and high', () => {
    fc.assert(
      fc.property(refrigerant, tUnit, pUnit, real(-20, 2000), real(0.5, 500), maybe(real(-40, 60)), maybe(real(50, 3000)), (ref, tu, pu, setting, diff, box, design) => {
        expectReadable(messagesOf(() => lowPressureControl({ refrigerant: ref, unit: pu, cutIn: setting, differential: diff, temperatureUnit: tu, designBoxTemp: box })), tu);
        expectReadable(messagesOf(() => highPressureControl({ refrigerant: ref, unit: pu, cutOut: setting, differential: diff, temperatureUnit: tu, designPressure: design })), tu);
      }),
      { numRuns: 300 },
    );
  });

  it('saturation look-ups, both directions', () => {
    fc.assert(
      fc.property(refrigerant, tUnit, pUnit, real(-100, 250), real(-20, 1500), (ref, tu, pu, t, p) => {
        expectReadable(messagesOf(() => saturationLookup({ kind: 'temperature', refrigerant: ref, temperature: t, unit: tu })), tu);
        expectReadable(messagesOf(() => saturationLookup({ kind: 'pressure', refrigerant: ref, pressure: p, unit: pu, temperatureUnit: tu })), tu);
      }),
      { numRuns: 300 },
    );
  });

  it('electrical checks', () => {
    const volts = real(1, 700);
    fc.assert(
      fc.property(volts, volts, volts, fc.constantFrom(115, 120, 200, 208, 230, 240, 460, 480), maybe(real(5, 240)), (a, b, c, nameplate, nominal) => {
        expectReadable(messagesOf(() => voltageUnbalance([a, b, c])), 'C');
        expectReadable(messagesOf(() => supplyVoltageLines({ lines: [a, b, c], nameplateV: nameplate })), 'C');
        expectReadable(messagesOf(() => supplyVoltageLines({ lines: [(a + b + c) / 3], nameplateV: nameplate })), 'C');
        expectReadable(messagesOf(() => controlCircuitVoltage({ measuredV: a / 7, nominalV: nominal })), 'C');
      }),
      { numRuns: 300 },
    );
  });
});
