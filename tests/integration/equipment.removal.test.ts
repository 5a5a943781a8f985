// Removed equipment: the removal date and replacement are recorded (by the service and, for older
// rows, by the migration's backfill), lists keep removed units apart, pickers never get them, and
// the unit page's header facts (last visit, open follow-ups, the viewer's open visit, tag).
import { randomUUID } from 'node:crypto';
import { afterAll, beforeEach, describe, expect, it } from 'vitest';
import * as removalMigration from '@/db/migrations/2026_12_04_1600_add_equipment_removal';
import type { Actor } from '@/lib/auth/actor';
import { createEquipmentSchema } from '@/lib/equipment/schemas';
import { addRelation, createEquipment, getEquipment, getUnitFacts, listEquipment, updateEquipment } from '@/lib/equipment/service';
import { listSites } from '@/lib/sites/service';
import { actorFor, createTestDb, demoEmails, resetToDemo } from '@/tests/helpers/db';

const db = createTestDb();
let office: Actor;
let tech: Actor;
let owner: Actor;
let siteId: string;

beforeEach(async () => {
  await resetToDemo(db);
  office = await actorFor(db, demoEmails.office);
  tech = await actorFor(db, demoEmails.technician);
  owner = await actorFor(db, demoEmails.client);
  const sites = await listSites(office, { limit: 50, archived: 'exclude' });
  siteId = sites.items.find((s) => s.name === 'Pell Street Kitchen')!.id;
});
afterAll(async () => {
  await db.destroy();
});

const make = (name: string, type = 'contactor') => createEquipment(office, createEquipmentSchema.parse({ siteId, type, name, nameplate: {} }));
const list = (removed?: 'exclude' | 'only' | 'include') => listEquipment(office, { siteId, limit: 50, sort: 'name', dir: 'asc', ...(removed ? { removed } : {}) });

describe('removed equipment', () => {
  it('gets its removal date when its status becomes removed, and loses it when it is brought back', async () => {
    const unit = await make('Freezer compressor contactor');
    expect(unit.removedAt).toBeNull();
    const before = Date.now();
    const removed = await updateEquipment(office, unit.id, { status: 'removed' });
    expect(removed.removedAt).not.toBeNull();
    expect(Date.parse(removed.removedAt!)).toBeGreaterThanOrEqual(before - 5_000);
    // Saving it again as removed keeps the first date.
    const again = await updateEquipment(office, unit.id, { status: 'removed', name: 'Freezer compressor contactor (old)' });
    expect(again.removedAt).toBe(removed.removedAt);
    const back = await updateEquipment(office, unit.id, { status: 'in_service' });
    expect(back.removedAt).toBeNull();
    expect(back.replacedById).toBeNull();
  });

  it('is left out of lists and pickers by default, and listed on its own when asked for', async () => {
    const current = await make('Freezer compressor contactor');
    const old = await make('Freezer compressor contactor');
    await updateEquipment(office, old.id, { status: 'removed' });
    await db.updateTable('equipment').set({ replaced_by_id: current.id }).where('id', '=', old.id).execute();

    expect((await list()).items.map((e) => e.id)).toEqual([current.id]);
    expect((await list('exclude')).items.map((e) => e.id)).toEqual([current.id]);
    const only = (await list('only')).items;
    expect(only.map((e) => e.id)).toEqual([old.id]);
    expect(only[0]).toMatchObject({ status: 'removed', replacedById: current.id, replacedByName: 'Freezer compressor contactor' });
    expect((await list('include')).items.map((e) => e.id).sort()).toEqual([current.id, old.id].sort());
    // An explicit status filter for removed units still finds them, as it did before the view existed.
    expect((await listEquipment(office, { siteId, status: ['removed'], limit: 50, sort: 'name', dir: 'asc' })).items.map((e) => e.id)).toEqual([old.id]);
  });

  it('names no replacement that was deleted', async () => {
    const current = await make('Walk-in fan motor', 'fan_motor');
    const old = await make('Walk-in fan motor', 'fan_motor');
    await updateEquipment(office, old.id, { status: 'removed' });
    await db.updateTable('equipment').set({ replaced_by_id: current.id }).where('id', '=', old.id).execute();
    await db.updateTable('equipment').set({ deleted_at: new Date() }).where('id', '=', current.id).execute();
    const dto = await getEquipment(office, old.id);
    expect(dto.replacedById).toBeNull();
    expect(dto.replacedByName).toBeNull();
  });

  it('cannot be related to new equipment', async () => {
    const thermostat = await make('Box thermostat', 'thermostat');
    const old = await make('Old solenoid', 'solenoid_valve');
    await updateEquipment(office, old.id, { status: 'removed' });
    await expect(addRelation(office, thermostat.id, { kind: 'controls', otherId: old.id, direction: 'from' })).rejects.toMatchObject({ code: 'validation_failed' });
    const count = await db.selectFrom('equipment_relations').select(db.fn.countAll<string>().as('n')).executeTakeFirstOrThrow();
    expect(Number(count.n)).toBe(0);
  });

  it('is backfilled by the migration from replace events, and from the last change otherwise', async () => {
    const replaced = await make('Condenser fan motor', 'fan_motor');
    const successor = await make('Condenser fan motor', 'fan_motor');
    const removedPlain = await make('Old defrost timer', 'defrost_control');
    const replaceAt = new Date('2026-03-14T15:00:00Z');
    const lastChange = new Date('2026-05-02T09:30:00Z');
    await db.updateTable('equipment').set({ status: 'removed' }).where('id', 'in', [replaced.id, removedPlain.id]).execute();
    await db.updateTable('equipment').set({ updated_at: lastChange }).where('id', '=', removedPlain.id).execute();
    await db
      .insertInto('audit_events')
      .values({ company_id: office.companyId, actor_id: office.id, action: 'replace', entity_type: 'equipment', entity_id: replaced.id, after: JSON.stringify({ replacedBy: successor.id }), created_at: replaceAt })
      .execute();

    await removalMigration.down(db);
    await removalMigration.up(db);

    const rows = await db.selectFrom('equipment').select(['id', 'removed_at', 'replaced_by_id']).where('id', 'in', [replaced.id, successor.id, removedPlain.id]).execute();
    const byId = new Map(rows.map((r) => [r.id, r]));
    expect(byId.get(replaced.id)).toMatchObject({ replaced_by_id: successor.id });
    expect(new Date(byId.get(replaced.id)!.removed_at!).toISOString()).toBe(replaceAt.toISOString());
    expect(byId.get(removedPlain.id)!.replaced_by_id).toBeNull();
    expect(new Date(byId.get(removedPlain.id)!.removed_at!).toISOString()).toBe(lastChange.toISOString());
    expect(byId.get(successor.id)).toMatchObject({ removed_at: null, replaced_by_id: null });
  });
});

describe('unit facts for the header', () => {
  it('give the last visit the viewer may read, open follow-ups, the viewer’s own open visit and the tag', async () => {
    const unit = await make('Reach-in thermostat', 'thermostat');
    const other = await make('Other unit', 'contactor');
    const visit = async (status: 'open' | 'closed', startedAt: string, technicianId = tech.id) => {
      const v = await db
        .insertInto('visits')
        .values({ company_id: tech.companyId, site_id: siteId, technician_id: technicianId, reason: 'maintenance', status, started_at: startedAt, ended_at: status === 'closed' ? startedAt : null })
        .returning('id')
        .executeTakeFirstOrThrow();
      return v.id;
    };
    const entry = (visitId: string, equipmentId: string, at: string) =>
      db
        .insertInto('entries')
        .values({ company_id: tech.companyId, visit_id: visitId, equipment_id: equipmentId, kind: 'note', data: JSON.stringify({ text: 'Checked' }), recorded_at: at, created_by: tech.id, client_entry_id: randomUUID() })
        .execute();

    expect(await getUnitFacts(tech, unit)).toEqual({ lastVisit: null, openFollowUps: 0, openVisitId: null, tagCode: null });

    const closed = await visit('closed', '2026-10-01T14:00:00Z');
    await entry(closed, unit.id, '2026-10-01T14:10:00Z');
    // A later visit that only touched another unit does not count.
    const elsewhere = await visit('closed', '2026-11-01T14:00:00Z', office.id);
    await entry(elsewhere, other.id, '2026-11-01T14:10:00Z');
    const open = await visit('open', '2026-12-01T14:00:00Z');
    await entry(open, unit.id, '2026-12-01T14:10:00Z');

    const followUp = (status: string) =>
      db.insertInto('follow_ups').values({ company_id: tech.companyId, site_id: siteId, equipment_id: unit.id, title: 'Fan noisy', severity: 'minor', status, created_by: tech.id }).execute();
    await followUp('open');
    await followUp('scheduled');
    await followUp('resolved');
    await db.insertInto('tags').values({ company_id: tech.companyId, code: 'K7QM3X9PA', state: 'attached', equipment_id: unit.id, site_id: siteId, attached_at: new Date() }).execute();

    const techFacts = await getUnitFacts(tech, unit);
    expect(techFacts.lastVisit?.id).toBe(open);
    expect(techFacts.openVisitId).toBe(open);
    expect(techFacts.openFollowUps).toBe(2);
    expect(techFacts.tagCode).toBe('K7QM3X9PA');
    // Owners see closed visits only, and never start one.
    const ownerFacts = await getUnitFacts(owner, unit);
    expect(ownerFacts.lastVisit?.id).toBe(closed);
    expect(ownerFacts.openVisitId).toBeNull();
    // The office has no open visit of its own here.
    expect((await getUnitFacts(office, unit)).openVisitId).toBeNull();
  });
});
