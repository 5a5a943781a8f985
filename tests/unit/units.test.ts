// Unit round trips: a value typed in the user's units, stored in SI and reopened reads as typed.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { formatQuantity, fromDisplayValue, toDisplayValue, type Quantity, type UnitPrefs } from '@/lib/units/quantities';

const prefsList: UnitPrefs[] = [
  { units: 'imperial', metricPressure: 'kPa' },
  { units: 'metric', metricPressure: 'kPa' },
  { units: 'metric', metricPressure: 'bar' },
];
const quantities: Quantity[] = ['pressureGauge', 'pressureDiff', 'temperature', 'temperatureDiff', 'mass', 'length'];

describe('unit conversion', () => {
  it('known conversions (NIST SP 811: 1 psi = 6.894757 kPa; °F = 1.8·°C + 32; 1 lb = 0.45359237 kg)', () => {
    const imperial = prefsList[0]!;
    expect(fromDisplayValue('100', 'pressureGauge', imperial)).toBeCloseTo(689.4757, 3);
    expect(fromDisplayValue('35', 'temperature', imperial)).toBeCloseTo(1.6667, 4);
    expect(fromDisplayValue('-40', 'temperature', imperial)).toBeCloseTo(-40, 9);
    expect(fromDisplayValue('18', 'temperatureDiff', imperial)).toBeCloseTo(10, 9);
    expect(fromDisplayValue('10', 'mass', imperial)).toBeCloseTo(4.5359237, 9);
    expect(formatQuantity(689.4757, 'pressureGauge', imperial)).toBe('100 psig');
    expect(formatQuantity(250, 'pressureGauge', { units: 'metric', metricPressure: 'bar' })).toBe('2.5 barg');
  });

  it('empty text is null; nonsense is NaN so the schema refuses it', () => {
    expect(fromDisplayValue(' ', 'mass', prefsList[0]!)).toBeNull();
    expect(fromDisplayValue('abc', 'mass', prefsList[0]!)).toBeNaN();
    expect(fromDisplayValue('12,5', 'mass', prefsList[1]!)).toBe(12.5);
  });

  it('typed → SI → shown again gives the typed value, for every quantity and unit choice (property)', () => {
    fc.assert(
      fc.property(
        fc.integer({ min: -50_000, max: 500_000 }),
        fc.integer({ min: 0, max: 2 }),
        fc.constantFrom(...quantities),
        fc.constantFrom(...prefsList),
        (scaled, decimals, quantity, prefs) => {
          const typed = String(Number((scaled / 10 ** decimals).toFixed(decimals)));
          const si = fromDisplayValue(typed, quantity, prefs);
          expect(toDisplayValue(si, quantity, prefs)).toBe(typed);
        },
      ),
      { numRuns: 2000 },
    );
  });

  it('a value stored from another unit is shown at the usual precision, without conversion noise', () => {
    const imperial = { units: 'imperial', metricPressure: 'kPa' } as const;
    // 144.8 kPa typed by a metric user is 21.0015 psig; an imperial form shows 21, not 21.0015.
    expect(toDisplayValue(144.8, 'pressureGauge', imperial)).toBe('21');
    // 2758 kPa (a nameplate's 400 psig design pressure, rounded) is 400.0 psig, not 399.9996.
    expect(toDisplayValue(2758, 'pressureGauge', imperial)).toBe('400');
    expect(toDisplayValue(-3.3333333, 'temperature', { units: 'metric', metricPressure: 'kPa' })).toBe('-3.3');
  });
});
