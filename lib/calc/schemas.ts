// zod schemas for the calculation API inputs (query strings or JSON bodies). Numbers are coerced
// from strings; blank strings count as missing. The outputs feed the lib/calc functions directly.
import { z } from 'zod';

import { APPLICATION_CATEGORIES, JURISDICTIONS } from '@/lib/calc/compliance-rules';
import { SUPPORTED_NAMEPLATE_VOLTAGES } from '@/lib/calc/supply-voltage';
import { BOX_CLASSES, METERING_DEVICES } from '@/lib/calc/reading-bands';
import { findRefrigerant, REFRIGERANT_IDS, type RefrigerantId } from '@/lib/calc/refrigerants';
import type { SaturationQuery } from '@/lib/calc/saturation';
import { EQUIPMENT_TYPES } from '@/lib/calc/service-life';
import { MASS_UNITS, PRESSURE_UNITS, type PressureUnit } from '@/lib/calc/units';

const blank = (v: unknown): unknown => (v === null || (typeof v === 'string' && v.trim() === '') ? undefined : v);

const coerced = (label: string) => z.coerce.number({ error: `${label} must be a number` });

function requiredNumber(label: string) {
  return z.preprocess(blank, z.unknown().refine((v): boolean => v !== undefined, { error: `${label} is required` }).pipe(coerced(label)));
}

function optionalNumber(label: string) {
  return z.preprocess(blank, coerced(label).optional());
}

function requiredPositive(label: string) {
  return z.preprocess(
    blank,
    z
      .unknown()
      .refine((v): boolean => v !== undefined, { error: `${label} is required` })
      .pipe(coerced(label).positive({ error: `${label} must be greater than zero` })),
  );
}

const optionalBoolean = (label: string) =>
  z.preprocess((v) => {
    if (typeof v !== 'string') return v;
    const s = v.trim().toLowerCase();
    if (s === '') return undefined;
    if (['true', '1', 'yes', 'on'].includes(s)) return true;
    if (['false', '0', 'no', 'off'].includes(s)) return false;
    return v;
  }, z.boolean({ error: `${label} must be true or false` }).optional());

const refrigerantField = z
  .string({ error: 'refrigerant is required' })
  .trim()
  .min(1, { error: 'refrigerant is required' })
  .transform((value, ctx): RefrigerantId => {
    const found = findRefrigerant(value);
    if (!found) {
      ctx.issues.push({ code: 'custom', input: value, message: `unknown refrigerant "${value}"; known: ${REFRIGERANT_IDS.join(', ')}` });
      return z.NEVER;
    }
    return found.id;
  });

const pressureUnitField = z.enum(PRESSURE_UNITS, { error: `pressure unit must be one of ${PRESSURE_UNITS.join(', ')}` });
const temperatureUnitField = z.enum(['C', 'F'], { error: 'temperature unit must be C or F' });
/** Every endpoint takes the reader's temperature unit; messages use it. °C when not given. */
const optionalTemperatureUnit = z.preprocess(blank, temperatureUnitField.optional());
const isoDate = (label: string) => z.iso.date({ error: `${label} must be a date as YYYY-MM-DD` });

// A site's barometer: an explicit reading (kPa) wins over elevation (m); both optional.
const barometerFields = {
  elevationM: optionalNumber('elevation (m)'),
  barometricKpa: optionalNumber('barometric pressure (kPa)'),
};

/** GET /api/calc/saturation: temperature + unit C|F, or pressure + unit kPaAbs|kPaG|bar|barG|psia|psig. */
export const saturationQuerySchema = z
  .object({
    refrigerant: refrigerantField,
    temperature: optionalNumber('temperature'),
    pressure: optionalNumber('pressure'),
    unit: z.string({ error: 'unit is required' }).trim().min(1, { error: 'unit is required' }),
    temperatureUnit: optionalTemperatureUnit,
    ...barometerFields,
  })
  .transform((q, ctx): SaturationQuery => {
    const hasT = q.temperature !== undefined;
    const hasP = q.pressure !== undefined;
    if (hasT === hasP) {
      ctx.issues.push({ code: 'custom', input: q, path: ['temperature'], message: 'give either a temperature or a pressure, not both or neither' });
      return z.NEVER;
    }
    if (q.temperature !== undefined) {
      if (q.unit !== 'C' && q.unit !== 'F') {
        ctx.issues.push({ code: 'custom', input: q.unit, path: ['unit'], message: 'a temperature unit must be C or F' });
        return z.NEVER;
      }
      return { kind: 'temperature', refrigerant: q.refrigerant, temperature: q.temperature, unit: q.unit };
    }
    if (!(PRESSURE_UNITS as readonly string[]).includes(q.unit)) {
      ctx.issues.push({ code: 'custom', input: q.unit, path: ['unit'], message: `a pressure unit must be one of ${PRESSURE_UNITS.join(', ')}` });
      return z.NEVER;
    }
    return {
      kind: 'pressure',
      refrigerant: q.refrigerant,
      pressure: q.pressure ?? Number.NaN,
      unit: q.unit as PressureUnit,
      elevationM: q.elevationM,
      barometricKpa: q.barometricKpa,
      temperatureUnit: q.temperatureUnit,
    };
  });

/** GET /api/calc/saturation/table: rows for the pressure–temperature chart. */
export const saturationTableQuerySchema = z.object({
  refrigerant: refrigerantField,
  from: requiredNumber('from'),
  to: requiredNumber('to'),
  step: requiredPositive('step'),
  temperatureUnit: temperatureUnitField,
  pressureUnit: pressureUnitField,
  ...barometerFields,
});

const saturationReference = z.enum(['midpoint', 'dew', 'bubble'], { error: 'reference must be midpoint, dew or bubble' });

/** Readings (superheat, subcooling, TDs, compression ratio, and optional electrical) in the user's units. */
export const readingsInputSchema = z
  .object({
    refrigerant: refrigerantField,
    pressureUnit: pressureUnitField,
    temperatureUnit: temperatureUnitField,
    ...barometerFields,
    suctionPressure: optionalNumber('suction pressure'),
    headPressure: optionalNumber('head pressure'),
    liquidPressure: optionalNumber('liquid-line pressure'),
    suctionLineTemp: optionalNumber('suction line temperature'),
    liquidLineTemp: optionalNumber('liquid line temperature'),
    boxTemp: optionalNumber('box temperature'),
    ambientTemp: optionalNumber('ambient temperature'),
    designBoxTemp: optionalNumber('design box temperature'),
    boxClass: z.preprocess(blank, z.enum(BOX_CLASSES, { error: `box class must be one of ${BOX_CLASSES.join(', ')}` }).optional()),
    meteringDevice: z.preprocess(blank, z.enum(METERING_DEVICES, { error: `metering device must be one of ${METERING_DEVICES.join(', ')}` }).optional()),
    superheatAt: z.preprocess(
      blank,
      z.enum(['evaporator_outlet', 'compressor_inlet'], { error: 'superheat point must be evaporator_outlet or compressor_inlet' }).optional(),
    ),
    evaporatorReference: saturationReference.optional(),
    condenserReference: saturationReference.optional(),
    controlVolts: z.preprocess(blank, coerced('control voltage').positive({ error: 'control voltage must be greater than zero' }).optional()),
    controlNominalV: z.preprocess(blank, coerced('nominal control voltage').positive({ error: 'nominal control voltage must be greater than zero' }).optional()),
    v1: z.preprocess(blank, coerced('voltage 1').positive({ error: 'voltage 1 must be greater than zero' }).optional()),
    v2: z.preprocess(blank, coerced('voltage 2').positive({ error: 'voltage 2 must be greater than zero' }).optional()),
    v3: z.preprocess(blank, coerced('voltage 3').positive({ error: 'voltage 3 must be greater than zero' }).optional()),
    nameplateV: z.preprocess(
      blank,
      coerced('nameplate voltage')
        .refine((v) => SUPPORTED_NAMEPLATE_VOLTAGES.includes(v), { error: `nameplate voltage must be one of ${SUPPORTED_NAMEPLATE_VOLTAGES.join(', ')}` })
        .optional(),
    ),
  })
  .refine(
    (r) =>
      (r.suctionPressure !== undefined && (r.suctionLineTemp !== undefined || r.boxTemp !== undefined || r.headPressure !== undefined)) ||
      ((r.headPressure !== undefined || r.liquidPressure !== undefined) && (r.liquidLineTemp !== undefined || r.ambientTemp !== undefined)) ||
      r.controlVolts !== undefined ||
      (r.v1 !== undefined && r.v2 !== undefined && r.v3 !== undefined),
    { error: 'enter a pressure and a matching temperature (e.g. suction pressure and suction line temperature)', path: ['suctionPressure'] },
  )
  .refine((r) => [r.v1, r.v2, r.v3].every((v) => v === undefined) || [r.v1, r.v2, r.v3].every((v) => v !== undefined), {
    error: 'enter all three line voltages, or none',
    path: ['v3'],
  })
  .transform(({ v1, v2, v3, ...rest }) => ({
    ...rest,
    lineVoltages: v1 !== undefined && v2 !== undefined && v3 !== undefined ? ([v1, v2, v3] as const) : undefined,
  }));

export const lowPressureControlSchema = z.object({
  refrigerant: refrigerantField,
  unit: pressureUnitField,
  cutIn: requiredNumber('cut-in'),
  differential: requiredPositive('differential'),
  temperatureUnit: temperatureUnitField.optional(),
  designBoxTemp: optionalNumber('design box temperature'),
  vacuumAllowed: optionalBoolean('vacuum allowed'),
  ...barometerFields,
});

export const highPressureControlSchema = z.object({
  refrigerant: refrigerantField,
  unit: pressureUnitField,
  cutOut: requiredNumber('cut-out'),
  differential: requiredPositive('differential'),
  temperatureUnit: temperatureUnitField.optional(),
  designPressure: optionalNumber('design pressure'),
  ...barometerFields,
});

/** GET /api/calc/voltage-unbalance?v1=…&v2=…&v3=… → { lineVoltages }. */
export const voltageUnbalanceQuerySchema = z
  .object({
    v1: requiredPositive('voltage 1'),
    v2: requiredPositive('voltage 2'),
    v3: requiredPositive('voltage 3'),
    temperatureUnit: optionalTemperatureUnit,
  })
  .transform((q) => ({ lineVoltages: [q.v1, q.v2, q.v3] as const, temperatureUnit: q.temperatureUnit ?? 'C' }));

const optionalPositive = (label: string) =>
  z.preprocess(blank, coerced(label).positive({ error: `${label} must be greater than zero` }).optional());

/** One measured voltage (measuredV), or the three line voltages v1, v2, v3 (the worst line decides). */
export const supplyVoltageQuerySchema = z
  .object({
    measuredV: optionalPositive('measured voltage'),
    v1: optionalPositive('voltage 1'),
    v2: optionalPositive('voltage 2'),
    v3: optionalPositive('voltage 3'),
    nameplateV: requiredNumber('nameplate voltage').refine((v) => SUPPORTED_NAMEPLATE_VOLTAGES.includes(v), {
      error: `nameplate voltage must be one of ${SUPPORTED_NAMEPLATE_VOLTAGES.join(', ')}`,
    }),
    point: z.enum(['service', 'utilization'], { error: 'point must be service or utilization' }).optional(),
    temperatureUnit: optionalTemperatureUnit,
  })
  .superRefine((q, ctx) => {
    const lines = [q.v1, q.v2, q.v3];
    const some = lines.some((v) => v !== undefined);
    if (some && lines.some((v) => v === undefined)) {
      const missing = lines.findIndex((v) => v === undefined);
      ctx.addIssue({ code: 'custom', path: [`v${missing + 1}`], message: 'enter all three line voltages (v1, v2, v3), or one measured voltage' });
    } else if (!some && q.measuredV === undefined) {
      ctx.addIssue({ code: 'custom', path: ['measuredV'], message: 'measured voltage is required (or the three line voltages v1, v2, v3)' });
    }
  })
  .transform((q) => ({
    lines: q.v1 !== undefined && q.v2 !== undefined && q.v3 !== undefined ? [q.v1, q.v2, q.v3] : [q.measuredV as number],
    nameplateV: q.nameplateV,
    point: q.point,
    temperatureUnit: q.temperatureUnit ?? 'C',
  }));

export const controlVoltageQuerySchema = z.object({
  temperatureUnit: optionalTemperatureUnit,
  measuredV: requiredPositive('measured voltage'),
  nominalV: z.preprocess(blank, coerced('nominal voltage').positive({ error: 'nominal voltage must be greater than zero' }).optional()),
  tolerancePct: z.preprocess(
    blank,
    coerced('tolerance').positive({ error: 'tolerance must be greater than zero' }).lt(50, { error: 'tolerance must be below 50 %' }).optional(),
  ),
});

/** One refrigerant addition, evaluated by evaluateLeakEvent. */
export const leakEventSchema = z
  .object({
    jurisdiction: z.enum(JURISDICTIONS, { error: `jurisdiction must be one of ${JURISDICTIONS.join(', ')}` }).optional(),
    temperatureUnit: optionalTemperatureUnit,
    refrigerant: refrigerantField,
    application: z.enum(APPLICATION_CATEGORIES, { error: `application must be one of ${APPLICATION_CATEGORIES.join(', ')}` }),
    fullCharge: requiredPositive('full charge'),
    added: requiredPositive('refrigerant added'),
    massUnit: z.enum(MASS_UNITS, { error: 'mass unit must be kg or lb' }),
    additionDate: isoDate('addition date'),
    previousAdditionDate: z.preprocess(blank, isoDate('previous addition date').optional()),
    iprShutdown: optionalBoolean('industrial process shutdown'),
  })
  .refine((e) => e.previousAdditionDate === undefined || e.previousAdditionDate < e.additionDate, {
    error: 'the previous addition must be before this addition',
    path: ['previousAdditionDate'],
  });

export const refrigerantTransactionSchema = z.object({
  systemId: z.string({ error: 'system id is required' }).trim().min(1, { error: 'system id is required' }),
  refrigerant: z.string({ error: 'refrigerant is required' }).trim().min(1, { error: 'refrigerant is required' }),
  date: isoDate('date'),
  kind: z.enum(['added', 'recovered'], { error: 'kind must be added or recovered' }),
  amount: requiredPositive('amount'),
  unit: z.enum(MASS_UNITS, { error: 'mass unit must be kg or lb' }),
});

export const yearlyTotalsBodySchema = z.object({
  transactions: z.array(refrigerantTransactionSchema).max(50_000, { error: 'at most 50,000 transactions per request' }),
  fullChargeKgBySystem: z.record(z.string(), z.number().positive({ error: 'full charge must be greater than zero' })).optional(),
});

export const serviceLifeQuerySchema = z.object({
  temperatureUnit: optionalTemperatureUnit,
  equipmentType: z.enum(EQUIPMENT_TYPES, { error: `equipment type must be one of ${EQUIPMENT_TYPES.join(', ')}` }),
  installedOn: isoDate('install date'),
  asOf: isoDate('as-of date'),
  condition: z.preprocess(
    blank,
    coerced('condition').int({ error: 'condition must be a whole number' }).min(1, { error: 'condition must be 1 to 5' }).max(5, { error: 'condition must be 1 to 5' }).optional(),
  ),
});

export type SaturationQueryInput = z.input<typeof saturationQuerySchema>;
export type ReadingsInputParsed = z.output<typeof readingsInputSchema>;
export type LeakEventParsed = z.output<typeof leakEventSchema>;
