import { describe, expect, it } from 'vitest';

import { CalcInputError } from '@/lib/calc/errors';
import { EQUIPMENT_TYPES, medianServiceLife, serviceLifeOutlook } from '@/lib/calc/service-life';

describe('median service life, ASHRAE "Comparison of Service Life Estimates" (Akalin 1978), TRADE-REFERENCE §7', () => {
  it.each([
    ['compressor', 'Compressors, reciprocating', 20],
    ['condensing_unit', 'Compressors, reciprocating', 20],
    ['evaporator', 'Coils, DX/water/steam', 20],
    ['condenser', 'Condensers, air-cooled', 20],
    ['fan_motor', 'Electric motors', 18],
    ['contactor', 'Motor starters', 17],
    ['pressure_control', 'Controls, electric', 16],
    ['defrost_control', 'Controls, electric', 16],
    ['solenoid_valve', 'Controls, electric', 16],
    ['thermostat', 'Controls, electronic', 15],
    ['expansion_valve', 'Valve actuators, self-contained', 10],
  ] as const)('%s → "%s", %s years', (type, row, years) => {
    const e = medianServiceLife(type);
    expect(e?.tableRow).toBe(row);
    expect(e?.medianYears).toBe(years);
    expect(e?.mapping.length).toBeGreaterThan(5);
  });

  it('marks the electric/electronic control rows as from memory, as TRADE-REFERENCE does', () => {
    expect(medianServiceLife('pressure_control')?.howKnown).toBe('M');
    expect(medianServiceLife('thermostat')?.howKnown).toBe('M');
    expect(medianServiceLife('fan_motor')?.howKnown).toBe('V');
  });

  it('has an entry (possibly none) for every equipment type, and none for "other"', () => {
    for (const t of EQUIPMENT_TYPES) expect(() => medianServiceLife(t)).not.toThrow();
    expect(medianServiceLife('other')).toBeNull();
  });
});

describe('age, remaining life and condition-weighted outlook (our own rule, guidance only)', () => {
  it('a compressor installed 2010-01-01 is 15.0 years old on 2025-01-01 with 5 years of median life left', () => {
    const r = serviceLifeOutlook({ equipmentType: 'compressor', installedOn: '2010-01-01', asOf: '2025-01-01' });
    expect(r.ageYears).toBeCloseTo(15, 2);
    expect(r.remainingYears).toBeCloseTo(5, 2);
    expect(r.outlook).toBe('monitor');
    expect(r.caution).toMatch(/not a prediction/);
    expect(r.basis).toMatch(/Akalin 1978/);
  });

  it('condition shifts the outlook: same age, poor condition → replace now; good → no action', () => {
    const base = { equipmentType: 'compressor', installedOn: '2010-01-01', asOf: '2025-01-01' } as const;
    expect(serviceLifeOutlook({ ...base, condition: 1 }).outlook).toBe('replace_now');
    expect(serviceLifeOutlook({ ...base, condition: 3 }).outlook).toBe('monitor');
    expect(serviceLifeOutlook({ ...base, condition: 4 }).outlook).toBe('no_action');
    expect(serviceLifeOutlook({ ...base, asOf: '2029-01-01', condition: 3 }).outlook).toBe('plan_replacement');
    expect(serviceLifeOutlook({ ...base, condition: 5 }).adjustedRemainingYears).toBeCloseTo(9, 1);
  });

  it('past its median → replace_now; "other" has no estimate', () => {
    expect(serviceLifeOutlook({ equipmentType: 'fan_motor', installedOn: '2000-06-01', asOf: '2025-06-01' }).outlook).toBe('replace_now');
    const other = serviceLifeOutlook({ equipmentType: 'other', installedOn: '2020-01-01', asOf: '2025-01-01' });
    expect(other.outlook).toBe('unknown');
    expect(other.remainingYears).toBeNull();
  });

  it('rejects bad input', () => {
    const base = { equipmentType: 'compressor', installedOn: '2010-01-01', asOf: '2025-01-01' } as const;
    expect(() => serviceLifeOutlook({ ...base, condition: 0 })).toThrow('condition must be a whole number from 1 (poor) to 5 (good) (got 0)');
    expect(() => serviceLifeOutlook({ ...base, condition: 2.5 })).toThrow(CalcInputError);
    expect(() => serviceLifeOutlook({ ...base, installedOn: '2030-01-01' })).toThrow(/in the future/);
    expect(() => serviceLifeOutlook({ ...base, equipmentType: 'boiler' as never })).toThrow(/unknown equipment type "boiler"/);
  });
});
