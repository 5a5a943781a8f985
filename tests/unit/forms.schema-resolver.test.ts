// components/forms/schema-resolver.ts: the one validator of the record forms. The form's text
// becomes the schema's SI input; the submitted values are the schema's own output; range errors on
// numbers with a unit are worded in the reader's units from the schema's limits; nested paths
// reach react-hook-form nested.
import type { ResolverOptions } from 'react-hook-form';
import { describe, expect, it } from 'vitest';
import { z } from 'zod';
import { pathErrors, schemaResolver } from '@/components/forms/schema-resolver';
import { fromDisplayValue, type UnitPrefs } from '@/lib/units/quantities';

const imperial: UnitPrefs = { units: 'imperial', metricPressure: 'kPa' };
const metric: UnitPrefs = { units: 'metric', metricPressure: 'kPa' };

const schema = z.object({
  name: z.string().min(1, 'Name is required.'),
  boxC: z.number().min(-60).max(30).nullable(),
  chargeKg: z.number().positive().max(20_000).nullable(),
  nameplate: z.object({ volts: z.number().max(600, 'Volts must be at most 600.') }),
});
/** As typed: the same names as the schema's, numbers as text in the reader's units. */
interface Values {
  name: string;
  boxC: string;
  chargeKg: string;
  nameplate: { volts: string };
}
const toInput = (prefs: UnitPrefs) => (v: Values) => ({
  name: v.name,
  boxC: fromDisplayValue(v.boxC, 'temperature', prefs),
  chargeKg: fromDisplayValue(v.chargeKg, 'mass', prefs),
  nameplate: { volts: Number(v.nameplate.volts) },
});
const typed = (name: string, boxC: string, chargeKg: string, volts: string): Values => ({ name, boxC, chargeKg, nameplate: { volts } });
const unitFields = { boxC: { label: 'Box temperature', quantity: 'temperature' as const }, chargeKg: { label: 'Charge', quantity: 'mass' as const } };
const options = { fields: {}, shouldUseNativeValidation: false } as ResolverOptions<Values>;

describe('schemaResolver', () => {
  it('submits the schema’s parsed SI values (32 °F is 0 °C; 1 lb is 0.45359237 kg by definition)', async () => {
    const resolve = schemaResolver(schema, toInput(imperial), { unitFields, prefs: imperial });
    const result = await resolve(typed('Cooler', '32', '1', '460'), undefined, options);
    expect(result.errors).toEqual({});
    expect(result.values).toEqual({ name: 'Cooler', boxC: 0, chargeKg: 0.45359237, nameplate: { volts: 460 } });
  });

  it('words range errors in the reader’s units from the schema’s limits (−60 °C is −76 °F, 30 °C is 86 °F)', async () => {
    const resolve = schemaResolver(schema, toInput(imperial), { unitFields, prefs: imperial });
    const low = await resolve(typed('Cooler', '-80', '0', '460'), undefined, options);
    expect(low.values).toEqual({});
    expect(low.errors.boxC?.message).toMatch(/^Box temperature must be at least [−-]76(\.0)? °F\.$/);
    expect(low.errors.chargeKg?.message).toBe('Charge must be above 0 lb.');
    const high = await resolve(typed('Cooler', '90', '1', '460'), undefined, options);
    expect(high.errors.boxC?.message).toMatch(/^Box temperature must be at most 86(\.0)? °F\.$/);
    const metricHigh = await schemaResolver(schema, toInput(metric), { unitFields, prefs: metric })(typed('Cooler', '31', '1', '460'), undefined, options);
    expect(metricHigh.errors.boxC?.message).toMatch(/^Box temperature must be at most 30(\.0)? °C\.$/);
  });

  it('keeps the schema’s own message elsewhere, nests dotted paths and lets the form reword last', async () => {
    const resolve = schemaResolver(schema, toInput(metric), {
      adjust: (errors) => {
        if (errors.name) errors.name.message = 'Give it a name.';
      },
    });
    const result = await resolve(typed('', '', '', '700'), undefined, options);
    expect(result.errors.name?.message).toBe('Give it a name.');
    expect(result.errors.nameplate?.volts?.message).toBe('Volts must be at most 600.');
    expect(result.errors.boxC).toBeUndefined();
  });
});

describe('pathErrors', () => {
  it('keeps the first issue at each path and reads a plain union’s branches', () => {
    const union = z.object({ v: z.union([z.object({ a: z.string() }), z.object({ a: z.number().max(1, 'At most one.') })]) });
    const parsed = union.safeParse({ v: { a: 5 } });
    expect(parsed.success).toBe(false);
    const errors = pathErrors(parsed.success ? [] : parsed.error.issues);
    expect(Object.keys(errors)).toContain('v.a');
    const twice = z.object({ n: z.number().min(5, 'First.').refine(() => false, 'Second.') }).safeParse({ n: 1 });
    expect(pathErrors(twice.success ? [] : twice.error.issues).n?.message).toBe('First.');
  });

  it('puts an issue about the whole form (no path) at react-hook-form’s root', () => {
    const atLeastOne = z.object({ a: z.number().optional() }).refine((d) => d.a !== undefined, 'Enter at least one reading.');
    const parsed = atLeastOne.safeParse({});
    const errors = pathErrors(parsed.success ? [] : parsed.error.issues);
    expect(errors.root?.message).toBe('Enter at least one reading.');
    expect(errors['']).toBeUndefined();
  });
});
