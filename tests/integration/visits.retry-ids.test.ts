// Sends repeated from a phone without signal: a visit started with an id made on the phone, and a
// close with its own id, both return the first result when sent again, and store nothing twice.
import { randomUUID } from 'node:crypto';
import { describe, expect, it } from 'vitest';
import type { Actor } from '@/lib/auth/actor';
import { closeVisit } from '@/lib/visits/close';
import { startVisit } from '@/lib/visits/service';
import { createTestDb } from '@/tests/helpers/db';
import { resetDemoWithCircuitEach, type CoolerCircuit } from '@/tests/helpers/registry';

const db = createTestDb();
let tech: Actor, office: Actor, circuit: CoolerCircuit;
resetDemoWithCircuitEach(db, (demo) => ({ tech, office, circuit } = demo));

describe('ids made on the phone', () => {
  it('a start sent twice is one visit; the id cannot be taken by someone else', async () => {
    const id = randomUUID();
    const first = await startVisit(tech, { id, siteId: circuit.siteId, reason: 'no_cooling' });
    const again = await startVisit(tech, { id, siteId: circuit.siteId, reason: 'no_cooling' });
    expect(first.id).toBe(id);
    expect(again).toEqual(first);
    expect(await db.selectFrom('visits').select('id').where('site_id', '=', circuit.siteId).execute()).toHaveLength(1);
    await expect(startVisit(office, { id, siteId: circuit.siteId, reason: 'maintenance' })).rejects.toMatchObject({ code: 'conflict' });
  });

  it('a close sent twice closes once; a close with another id is still refused', async () => {
    const visit = await startVisit(tech, { siteId: circuit.siteId, reason: 'maintenance' });
    const clientCloseId = randomUUID();
    const closed = await closeVisit(tech, visit.id, { summary: 'Done', confirmBypassRemoved: false, clientCloseId }, undefined, { report: 'on-download' });
    const repeat = await closeVisit(tech, visit.id, { summary: 'Done', confirmBypassRemoved: false, clientCloseId }, undefined, { report: 'on-download' });
    expect(repeat).toEqual(closed);
    const audits = await db.selectFrom('audit_events').select('id').where('entity_id', '=', visit.id).where('action', '=', 'close').execute();
    expect(audits).toHaveLength(1);
    const mails = await db.selectFrom('mail_outbox').select('id').where('kind', '=', 'visit_report').execute();
    expect(mails.length).toBeLessThanOrEqual(1);
    await expect(closeVisit(tech, visit.id, { summary: 'Done', confirmBypassRemoved: false, clientCloseId: randomUUID() })).rejects.toMatchObject({ code: 'conflict' });
  });
});

describe('a unit changed on the server while the phone was offline', () => {
  it('an entry on a unit marked removed still lands, and the office gets a follow-up to check it', async () => {
    const visit = await startVisit(tech, { siteId: circuit.siteId, reason: 'maintenance' });
    await db.updateTable('equipment').set({ status: 'removed' }).where('id', '=', circuit.evaporatorId).execute();
    const { addEntry } = await import('@/lib/visits/entries');
    const saved = await addEntry(tech, visit.id, { equipmentId: circuit.evaporatorId, clientEntryId: randomUUID(), kind: 'note', data: { text: 'Coil cleaned' } });
    expect(saved.equipmentId).toBe(circuit.evaporatorId);
    const notes = await db.selectFrom('follow_ups').select(['title', 'severity', 'entry_id']).where('equipment_id', '=', circuit.evaporatorId).execute();
    expect(notes).toEqual([{ title: 'Check: note recorded on Cooler evaporator after it was marked removed', severity: 'minor', entry_id: saved.id }]);
  });

  it('an entry made before the unit moved to another system lands on it, and the office gets a follow-up', async () => {
    const visit = await startVisit(tech, { siteId: circuit.siteId, reason: 'maintenance' });
    const madeOffline = new Date(Date.now() - 60_000).toISOString();
    const { createSystem } = await import('@/lib/systems/service');
    const { updateEquipment } = await import('@/lib/equipment/service');
    const other = await createSystem(office, { siteId: circuit.siteId, name: 'Prep cooler circuit', refrigerant: 'R-404A', application: 'commercial_refrigeration' });
    await updateEquipment(office, circuit.evaporatorId, { systemId: other.id });
    const { addEntry } = await import('@/lib/visits/entries');
    const saved = await addEntry(tech, visit.id, { equipmentId: circuit.evaporatorId, clientEntryId: randomUUID(), recordedAt: madeOffline, kind: 'note', data: { text: 'Coil cleaned' } });
    expect(saved.equipmentId).toBe(circuit.evaporatorId);
    const notes = await db.selectFrom('follow_ups').select(['title', 'entry_id']).where('equipment_id', '=', circuit.evaporatorId).execute();
    expect(notes).toEqual([{ title: 'Check: note on Cooler evaporator was recorded before it moved to Prep cooler circuit', entry_id: saved.id }]);
    // Recorded after the move: nothing to check.
    await addEntry(tech, visit.id, { equipmentId: circuit.evaporatorId, clientEntryId: randomUUID(), kind: 'note', data: { text: 'Fan guard refitted' } });
    expect(await db.selectFrom('follow_ups').select('id').where('equipment_id', '=', circuit.evaporatorId).execute()).toHaveLength(1);
  });

  it('another unit moved to another area says nothing about this one', async () => {
    const visit = await startVisit(tech, { siteId: circuit.siteId, reason: 'maintenance' });
    const madeOffline = new Date(Date.now() - 60_000).toISOString();
    const { createArea } = await import('@/lib/sites/service');
    const { updateEquipment } = await import('@/lib/equipment/service');
    const roof = await createArea(office, circuit.siteId, { name: 'North roof', kind: 'roof' });
    await updateEquipment(office, circuit.condensingUnitId, { areaId: roof.id });
    const { addEntry } = await import('@/lib/visits/entries');
    await addEntry(tech, visit.id, { equipmentId: circuit.thermostatId, clientEntryId: randomUUID(), recordedAt: madeOffline, kind: 'note', data: { text: 'Thermostat checked' } });
    expect(await db.selectFrom('follow_ups').select('title').where('equipment_id', '=', circuit.thermostatId).execute()).toEqual([]);
  });
});
