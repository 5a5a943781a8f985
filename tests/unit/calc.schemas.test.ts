import { describe, expect, it } from 'vitest';

import {
  controlVoltageQuerySchema,
  highPressureControlSchema,
  leakEventSchema,
  lowPressureControlSchema,
  readingsInputSchema,
  saturationQuerySchema,
  saturationTableQuerySchema,
  serviceLifeQuerySchema,
  supplyVoltageQuerySchema,
  voltageUnbalanceQuerySchema,
  yearlyTotalsBodySchema,
} from '@/lib/calc/schemas';

const messages = (r: { success: boolean; error?: { issues: { message: string }[] } }): string[] =>
  r.error?.issues.map((i) => i.message) ?? [];

describe('saturation query (issue 4: GET /api/calc/saturation)', () => {
  it('temperature form: coerces the number, canonicalises the refrigerant', () => {
    const r = saturationQuerySchema.safeParse({ refrigerant: 'r404a', temperature: '-20', unit: 'C' });
    expect(r.success && r.data).toEqual({ kind: 'temperature', refrigerant: 'R-404A', temperature: -20, unit: 'C' });
  });

  it('pressure form with optional elevation', () => {
    const r = saturationQuerySchema.safeParse({ refrigerant: 'R-404A', pressure: '30', unit: 'psig', elevationM: '1600' });
    expect(r.success && r.data).toEqual({
      kind: 'pressure',
      refrigerant: 'R-404A',
      pressure: 30,
      unit: 'psig',
      elevationM: 1600,
      barometricKpa: undefined,
    });
  });

  it.each([
    [{ refrigerant: 'R-404A', unit: 'C' }, 'give either a temperature or a pressure, not both or neither'],
    [{ refrigerant: 'R-404A', temperature: '1', pressure: '2', unit: 'C' }, 'give either a temperature or a pressure, not both or neither'],
    [{ refrigerant: 'R-404A', temperature: '1', unit: 'psig' }, 'a temperature unit must be C or F'],
    [{ refrigerant: 'R-404A', pressure: '1', unit: 'C' }, 'a pressure unit must be one of kPaAbs, kPaG, bar, barG, psia, psig'],
    [{ refrigerant: 'R-404A', temperature: 'warm', unit: 'C' }, 'temperature must be a number'],
    [{ refrigerant: 'R-12', temperature: '1', unit: 'C' }, 'unknown refrigerant "R-12"; known: R-22, R-134a, R-404A, R-407A, R-407C, R-410A, R-448A, R-449A, R-507A, R-32, R-290, R-744, R-717, R-1234yf, R-454C, R-455A'],
    [{ temperature: '1', unit: 'C' }, 'refrigerant is required'],
    [{ refrigerant: 'R-22', temperature: '1' }, 'unit is required'],
  ])('rejects %j with "%s"', (input, message) => {
    expect(messages(saturationQuerySchema.safeParse(input))).toContain(message);
  });

  it('chart table query', () => {
    const r = saturationTableQuerySchema.safeParse({ refrigerant: 'R-22', from: '-40', to: '120', step: '5', temperatureUnit: 'F', pressureUnit: 'psig' });
    expect(r.success && r.data.step).toBe(5);
    expect(messages(saturationTableQuerySchema.safeParse({ refrigerant: 'R-22', from: '0', to: '1', step: '0', temperatureUnit: 'F', pressureUnit: 'psig' }))).toContain(
      'step must be greater than zero',
    );
  });
});

describe('other calculation inputs', () => {
  it('readings: blanks are missing, and at least one usable pair is required', () => {
    const ok = readingsInputSchema.safeParse({ refrigerant: 'R-404A', pressureUnit: 'psig', temperatureUnit: 'F', suctionPressure: '20', suctionLineTemp: '30', headPressure: '' });
    expect(ok.success && ok.data.headPressure).toBeUndefined();
    expect(messages(readingsInputSchema.safeParse({ refrigerant: 'R-404A', pressureUnit: 'psig', temperatureUnit: 'F', boxTemp: '35' }))[0]).toMatch(
      /enter a pressure and a matching temperature/,
    );
    expect(messages(readingsInputSchema.safeParse({ refrigerant: 'R-404A', pressureUnit: 'inHg', temperatureUnit: 'F' }))).toContain(
      'pressure unit must be one of kPaAbs, kPaG, bar, barG, psia, psig',
    );
  });

  it('pressure controls: positive differential, boolean from a query string', () => {
    const lp = lowPressureControlSchema.safeParse({ refrigerant: 'R-404A', unit: 'psig', cutIn: '30', differential: '20', vacuumAllowed: 'false' });
    expect(lp.success && lp.data).toMatchObject({ cutIn: 30, differential: 20, vacuumAllowed: false });
    expect(messages(lowPressureControlSchema.safeParse({ refrigerant: 'R-404A', unit: 'psig', cutIn: '30', differential: '-2' }))).toContain(
      'differential must be greater than zero',
    );
    expect(messages(lowPressureControlSchema.safeParse({ refrigerant: 'R-404A', unit: 'psig', cutIn: '30', differential: '5', vacuumAllowed: 'maybe' }))).toContain(
      'vacuum allowed must be true or false',
    );
    expect(messages(highPressureControlSchema.safeParse({ refrigerant: 'R-404A', unit: 'psig', differential: '5' }))).toContain('cut-out is required');
  });

  it('electrical', () => {
    const u = voltageUnbalanceQuerySchema.safeParse({ v1: '460', v2: '467', v3: '450' });
    expect(u.success && u.data.lineVoltages).toEqual([460, 467, 450]);
    expect(messages(voltageUnbalanceQuerySchema.safeParse({ v1: '460', v2: '0', v3: '450' }))).toContain('voltage 2 must be greater than zero');
    expect(messages(supplyVoltageQuerySchema.safeParse({ measuredV: '440', nameplateV: '575' }))[0]).toMatch(/nameplate voltage must be one of/);
    expect(messages(controlVoltageQuerySchema.safeParse({ measuredV: '24', tolerancePct: '80' }))).toContain('tolerance must be below 50 %');
  });

  it('leak event: positive charge, ISO dates in order', () => {
    const base = {
      refrigerant: 'R-404A',
      application: 'commercial_refrigeration',
      fullCharge: '100',
      added: '10',
      massUnit: 'lb',
      additionDate: '2026-06-29',
      previousAdditionDate: '2025-12-31',
    };
    expect(leakEventSchema.safeParse(base).success).toBe(true);
    expect(messages(leakEventSchema.safeParse({ ...base, fullCharge: '-100' }))).toContain('full charge must be greater than zero');
    expect(messages(leakEventSchema.safeParse({ ...base, additionDate: '29/06/2026' }))).toContain('addition date must be a date as YYYY-MM-DD');
    expect(messages(leakEventSchema.safeParse({ ...base, previousAdditionDate: '2026-07-01' }))).toContain('the previous addition must be before this addition');
    expect(messages(leakEventSchema.safeParse({ ...base, application: 'supermarket' }))[0]).toMatch(/application must be one of/);
    const t = yearlyTotalsBodySchema.safeParse({
      transactions: [{ systemId: 'a', refrigerant: 'R-22', date: '2025-01-01', kind: 'added', amount: 2, unit: 'lb' }],
    });
    expect(t.success).toBe(true);
  });

  it('service life: condition 1–5 whole numbers', () => {
    const ok = serviceLifeQuerySchema.safeParse({ equipmentType: 'compressor', installedOn: '2010-01-01', asOf: '2025-01-01', condition: '4' });
    expect(ok.success && ok.data.condition).toBe(4);
    expect(messages(serviceLifeQuerySchema.safeParse({ equipmentType: 'compressor', installedOn: '2010-01-01', asOf: '2025-01-01', condition: '7' }))).toContain(
      'condition must be 1 to 5',
    );
  });
});

describe('issue 14 inputs', () => {
  const readings = { refrigerant: 'R-404A', pressureUnit: 'psig', temperatureUnit: 'F' };

  it('readings: liquidPressure with a liquid line temperature is enough; context fields are checked', () => {
    const r = readingsInputSchema.safeParse({ ...readings, liquidPressure: '250', liquidLineTemp: '95', boxClass: 'freezer', meteringDevice: 'txv' });
    expect(r.success && r.data).toMatchObject({ liquidPressure: 250, liquidLineTemp: 95, boxClass: 'freezer', meteringDevice: 'txv', lineVoltages: undefined });
    expect(messages(readingsInputSchema.safeParse({ ...readings, suctionPressure: '20', suctionLineTemp: '30', boxClass: 'walk-in' }))).toEqual([
      'box class must be one of cooler, freezer, low_temp_display',
    ]);
    expect(messages(readingsInputSchema.safeParse({ ...readings, suctionPressure: '20', suctionLineTemp: '30', meteringDevice: 'valve' }))).toEqual([
      'metering device must be one of txv, fixed',
    ]);
  });

  it('readings: three line voltages become lineVoltages; two are refused on v3', () => {
    const r = readingsInputSchema.safeParse({ ...readings, v1: '460', v2: '467', v3: '450', nameplateV: '460' });
    expect(r.success && r.data.lineVoltages).toEqual([460, 467, 450]);
    const partial = readingsInputSchema.safeParse({ ...readings, v1: '460', v2: '467' });
    expect(partial.success).toBe(false);
    expect(partial.error?.issues.find((i) => i.path[0] === 'v3')?.message).toBe('enter all three line voltages, or none');
  });

  it('supply voltage: one measured voltage or three lines; the reader’s temperature unit is taken (C by default)', () => {
    const one = supplyVoltageQuerySchema.safeParse({ measuredV: '430', nameplateV: '460' });
    expect(one.success && one.data).toEqual({ lines: [430], nameplateV: 460, point: undefined, temperatureUnit: 'C' });
    const three = supplyVoltageQuerySchema.safeParse({ v1: '470', v2: '465', v3: '430', nameplateV: '460', temperatureUnit: 'F' });
    expect(three.success && three.data).toMatchObject({ lines: [470, 465, 430], temperatureUnit: 'F' });
    expect(messages(supplyVoltageQuerySchema.safeParse({ nameplateV: '460' }))).toEqual(['measured voltage is required (or the three line voltages v1, v2, v3)']);
    expect(messages(supplyVoltageQuerySchema.safeParse({ v1: '470', nameplateV: '460' }))[0]).toMatch(/enter all three line voltages/);
  });

  it('every calculation schema takes temperatureUnit C or F', () => {
    for (const [schema, input] of [
      [controlVoltageQuerySchema, { measuredV: '22' }],
      [voltageUnbalanceQuerySchema, { v1: '460', v2: '467', v3: '450' }],
      [serviceLifeQuerySchema, { equipmentType: 'compressor', installedOn: '2010-01-01', asOf: '2025-01-01' }],
      [saturationQuerySchema, { refrigerant: 'R-404A', pressure: '30', unit: 'psig' }],
    ] as const) {
      expect((schema as { safeParse: (v: unknown) => { success: boolean } }).safeParse({ ...input, temperatureUnit: 'F' }).success).toBe(true);
      expect((schema as { safeParse: (v: unknown) => { success: boolean } }).safeParse({ ...input, temperatureUnit: 'K' }).success).toBe(false);
    }
  });
});
