// Entry kinds through the entries service: a dual pressure control in one entry sets both sides of
// the unit's record; settings follow the entries' time order when a late entry arrives; a reviewed
// visit's entries are struck out only after the office reopens it; the kinds offered fit the unit.
import { randomUUID } from 'node:crypto';
import { describe, expect, it } from 'vitest';
import type { Actor } from '@/lib/auth/actor';
import { lowPressureControl, highPressureControl } from '@/lib/calc/pressure-controls';
import { KPA_PER_PSI } from '@/lib/calc/units';
import { getEquipment } from '@/lib/equipment/service';
import { closeVisit } from '@/lib/visits/close';
import { addEntry, voidEntry } from '@/lib/visits/entries';
import { kindsFor } from '@/lib/visits/kinds';
import { controlsFor } from '@/lib/visits/kinds/setting-change';
import { markReviewed, reopenVisit, startVisit } from '@/lib/visits/service';
import { createTestDb } from '@/tests/helpers/db';
import { resetDemoWithCircuitEach, type CoolerCircuit } from '@/tests/helpers/registry';

const db = createTestDb();
let tech: Actor, office: Actor, circuit: CoolerCircuit;
resetDemoWithCircuitEach(db, (demo) => ({ tech, office, circuit } = demo));

const psig = (v: number) => v * KPA_PER_PSI;

async function dualControl(): Promise<string> {
  const row = await db
    .insertInto('equipment')
    .values({ company_id: circuit.companyId, site_id: circuit.siteId, system_id: circuit.systemId, type: 'pressure_control', name: 'Dual pressure control', nameplate: JSON.stringify({ controlKind: 'dual' }) })
    .returning('id')
    .executeTakeFirstOrThrow();
  return row.id;
}

describe('entry kinds', () => {
  it('records a dual pressure control in one entry and sets both sides of the unit’s settings', async () => {
    const id = await dualControl();
    const visit = await startVisit(tech, { siteId: circuit.siteId, reason: 'no_cooling' });
    const asFound = { low: { cutInKpaG: psig(20), differentialKpa: psig(10) }, high: { cutOutKpaG: psig(400), differentialKpa: psig(100) } };
    const asLeft = { low: { cutInKpaG: psig(22), differentialKpa: psig(12) }, high: { cutOutKpaG: psig(380), differentialKpa: psig(90) } };
    const saved = await addEntry(tech, visit.id, { equipmentId: id, clientEntryId: randomUUID(), kind: 'setting_change', data: { control: 'dual', asFound, asLeft } });
    const c = saved.computed as { sides: { low: { asLeftOtherKpaG: number }; high: { asLeftOtherKpaG: number } } };
    // Each side is the calculation module's own answer (cut-out = cut-in − differential, and so on).
    const low = lowPressureControl({ refrigerant: 'R-404A', unit: 'kPaG', temperatureUnit: 'C', elevationM: 0, cutIn: asLeft.low.cutInKpaG, differential: asLeft.low.differentialKpa });
    const high = highPressureControl({ refrigerant: 'R-404A', unit: 'kPaG', temperatureUnit: 'C', elevationM: 0, cutOut: asLeft.high.cutOutKpaG, differential: asLeft.high.differentialKpa });
    expect(c.sides.low.asLeftOtherKpaG).toBeCloseTo(low.cutOut, 6);
    expect(c.sides.high.asLeftOtherKpaG).toBeCloseTo(high.cutIn, 6);
    expect(c.sides.low.asLeftOtherKpaG).toBeCloseTo(psig(10), 6);
    expect(c.sides.high.asLeftOtherKpaG).toBeCloseTo(psig(290), 6);
    const unit = await getEquipment(tech, id);
    expect(unit.nameplate).toMatchObject({ lowCutInKpa: asLeft.low.cutInKpaG, lowDifferentialKpa: asLeft.low.differentialKpa, highCutOutKpa: asLeft.high.cutOutKpaG, highDifferentialKpa: asLeft.high.differentialKpa });
    const entries = await db.selectFrom('entries').select('id').where('visit_id', '=', visit.id).execute();
    expect(entries).toHaveLength(1);
  });

  it('refuses a dual entry missing one side, and stores nothing', async () => {
    const id = await dualControl();
    const visit = await startVisit(tech, { siteId: circuit.siteId, reason: 'no_cooling' });
    const { createEntrySchema } = await import('@/lib/visits/schemas');
    const parsed = createEntrySchema.safeParse({
      equipmentId: id,
      clientEntryId: randomUUID(),
      kind: 'setting_change',
      data: { control: 'dual', asFound: { low: { cutInKpaG: 100, differentialKpa: 50 } }, asLeft: { low: { cutInKpaG: 100, differentialKpa: 50 } } },
    });
    expect(parsed.success).toBe(false);
    expect(await db.selectFrom('entries').select('id').where('visit_id', '=', visit.id).execute()).toHaveLength(0);
  });

  it('keeps the settings of the latest change when an earlier one arrives late', async () => {
    const visit = await startVisit(tech, { siteId: circuit.siteId, reason: 'maintenance' });
    const side = (cutIn: number) => ({ cutInKpaG: psig(cutIn), differentialKpa: psig(10) });
    const at = (minutes: number) => new Date(Date.now() - minutes * 60_000).toISOString();
    await addEntry(tech, visit.id, { equipmentId: circuit.lowControlId, clientEntryId: randomUUID(), recordedAt: at(5), kind: 'setting_change', data: { control: 'low', asFound: side(20), asLeft: side(25) } });
    // Made offline twenty minutes ago, sent only now.
    await addEntry(tech, visit.id, { equipmentId: circuit.lowControlId, clientEntryId: randomUUID(), recordedAt: at(20), kind: 'setting_change', data: { control: 'low', asFound: side(18), asLeft: side(20) } });
    const unit = await getEquipment(tech, circuit.lowControlId);
    expect(unit.nameplate.lowCutInKpa).toBeCloseTo(psig(25), 6);
  });

  it('strikes out entries of a reviewed visit only after the office reopens it', async () => {
    const visit = await startVisit(tech, { siteId: circuit.siteId, reason: 'maintenance' });
    const note = await addEntry(tech, visit.id, { equipmentId: circuit.evaporatorId, clientEntryId: randomUUID(), kind: 'note', data: { text: 'Coil cleaned' } });
    await closeVisit(tech, visit.id, { summary: 'Done', confirmBypassRemoved: false }, undefined, { report: 'on-download' });
    await markReviewed(office, visit.id);
    await expect(voidEntry(tech, note.id, 'Wrong unit')).rejects.toMatchObject({ code: 'conflict' });
    await expect(voidEntry(office, note.id, 'Wrong unit')).rejects.toMatchObject({ code: 'conflict' });
    const row = await db.selectFrom('entries').select('voided_at').where('id', '=', note.id).executeTakeFirstOrThrow();
    expect(row.voided_at).toBeNull();
    await reopenVisit(office, visit.id);
    const voided = await voidEntry(tech, note.id, 'Wrong unit');
    expect(voided.voidedAt).not.toBeNull();
  });

  it('offers the kinds and controls that fit the unit', () => {
    expect(kindsFor({ type: 'pressure_control', nameplate: { controlKind: 'dual' } })).toContain('setting_change');
    expect(kindsFor({ type: 'pressure_control', nameplate: {} })).not.toContain('reading');
    expect(kindsFor({ type: 'condensing_unit', nameplate: {} })).toEqual(expect.arrayContaining(['reading', 'refrigerant', 'leak']));
    expect(kindsFor({ type: 'condensing_unit', nameplate: {} })).not.toContain('setting_change');
    expect(kindsFor({ type: 'thermostat', nameplate: {} })).not.toContain('leak');
    // No thermostat setting on a pressure control, and no pressure setting on a thermostat.
    expect(controlsFor({ type: 'pressure_control', nameplate: {} })).toEqual(['low', 'high', 'dual']);
    expect(controlsFor({ type: 'pressure_control', nameplate: { controlKind: 'dual' } })).toEqual(['dual']);
    expect(controlsFor({ type: 'thermostat', nameplate: {} })).toEqual(['thermostat']);
  });
});
