// The registry through its services: search by partial serial, relations from both ends,
// CSV export → import round trip, an import with one bad row changing nothing, scoping, audit.
import { afterAll, beforeEach, describe, expect, it } from 'vitest';
import { exportEquipmentCsv, importEquipmentCsv } from '@/lib/equipment/import';
import { createEquipmentSchema } from '@/lib/equipment/schemas';
import { createSystemSchema } from '@/lib/systems/schemas';
import { addRelation, createEquipment, deleteEquipment, getEquipment, listEquipment, updateEquipment } from '@/lib/equipment/service';
import { createSite, listSites } from '@/lib/sites/service';
import { createSiteSchema } from '@/lib/sites/schemas';
import { createSystem } from '@/lib/systems/service';
import type { Actor } from '@/lib/auth/actor';
import { actorFor, createTestDb, demoEmails, resetToDemo } from '@/tests/helpers/db';

const db = createTestDb();
let office: Actor;
let siteId: string;
let clientOneSiteIds: string[];

beforeEach(async () => {
  await resetToDemo(db);
  office = await actorFor(db, demoEmails.office);
  const sites = await listSites(office, { limit: 50, archived: 'exclude' });
  siteId = sites.items.find((s) => s.name === 'Pell Street Kitchen')!.id;
  clientOneSiteIds = sites.items.filter((s) => s.clientName === 'Marrowgate Eatery Group').map((s) => s.id);
});
afterAll(async () => {
  await db.destroy();
});

async function registerWalkIn() {
  const areas = await db.selectFrom('areas').select(['id', 'name']).where('site_id', '=', siteId).execute();
  const cooler = areas.find((a) => a.name === 'Walk-in cooler')!.id;
  const roof = areas.find((a) => a.name === 'Roof')!.id;
  const system = await createSystem(office, createSystemSchema.parse({ siteId, areaId: cooler, name: 'Walk-in cooler circuit', refrigerant: 'R-448A', fullChargeKg: 6.8, application: 'commercial_refrigeration', designBoxTempC: 2 }));
  const make = (input: Record<string, unknown>) => createEquipment(office, createEquipmentSchema.parse({ siteId, systemId: system.id, ...input }));
  const cu = await make({ type: 'condensing_unit', name: 'Cooler condensing unit', areaId: roof, make: 'Kelvrin', model: 'KCU-300', serial: 'CU-7Q4-88213', condition: 4, nameplate: { voltage: 230, phase: '3', refrigerant: 'R-448A' } });
  const evapA = await make({ type: 'evaporator', name: 'Evaporator A', areaId: cooler, make: 'Polarwick', model: 'UC-2', serial: 'EV-1001' });
  const evapB = await make({ type: 'evaporator', name: 'Evaporator B', areaId: cooler, make: 'Polarwick', model: 'UC-2', serial: 'EV-1002' });
  const tstat = await make({ type: 'thermostat', name: 'Box thermostat', areaId: cooler, nameplate: { setpointC: 2, differentialK: 2 } });
  const sol = await make({ type: 'solenoid_valve', name: 'Liquid-line solenoid', areaId: roof, nameplate: { coilVoltage: 24, normally: 'closed', line: 'liquid' } });
  return { system, cu, evapA, evapB, tstat, sol };
}

describe('equipment registry', () => {
  it('finds a unit by a partial, case-insensitive serial', async () => {
    const { cu } = await registerWalkIn();
    const found = await listEquipment(office, { q: '7q4-88', limit: 50, sort: 'name', dir: 'asc' });
    expect(found.items.map((e) => e.id)).toEqual([cu.id]);
    expect((await listEquipment(office, { q: 'kcu-3', limit: 50, sort: 'name', dir: 'asc' })).items).toHaveLength(1);
    expect((await listEquipment(office, { q: '100%', limit: 50, sort: 'name', dir: 'asc' })).items).toHaveLength(0);
    expect((await listEquipment(office, { q: 'zz-not-there', limit: 50, sort: 'name', dir: 'asc' })).items).toHaveLength(0);
  });

  it('filters by type, refrigerant (system or nameplate) and condition, and sorts with stable pages', async () => {
    await registerWalkIn();
    const evaps = await listEquipment(office, { type: ['evaporator'], limit: 50, sort: 'name', dir: 'asc' });
    expect(evaps.items.map((e) => e.name)).toEqual(['Evaporator A', 'Evaporator B']);
    expect((await listEquipment(office, { refrigerant: ['R-448A'], limit: 50, sort: 'name', dir: 'asc' })).items).toHaveLength(5);
    expect((await listEquipment(office, { refrigerant: ['R-404A'], limit: 50, sort: 'name', dir: 'asc' })).items).toHaveLength(0);
    expect((await listEquipment(office, { condition: [4], limit: 50, sort: 'name', dir: 'asc' })).items.map((e) => e.name)).toEqual(['Cooler condensing unit']);
    const seen: string[] = [];
    let cursor: string | undefined;
    do {
      const page = await listEquipment(office, { limit: 2, sort: 'serial', dir: 'desc', cursor });
      seen.push(...page.items.map((e) => e.serial ?? ''));
      cursor = page.nextCursor ?? undefined;
    } while (cursor);
    expect(seen).toEqual(['EV-1002', 'EV-1001', 'CU-7Q4-88213', '', '']);
  });

  it('shows relations from both ends', async () => {
    const { cu, evapA, evapB, tstat, sol } = await registerWalkIn();
    await addRelation(office, tstat.id, { kind: 'controls', otherId: sol.id, direction: 'from' });
    await addRelation(office, cu.id, { kind: 'serves', otherId: evapA.id, direction: 'from' });
    await addRelation(office, evapB.id, { kind: 'serves', otherId: cu.id, direction: 'to' });
    const unit = await getEquipment(office, cu.id);
    expect(unit.relations.map((r) => [r.kind, r.direction, r.other.name])).toEqual([
      ['serves', 'forward', 'Evaporator A'],
      ['serves', 'forward', 'Evaporator B'],
    ]);
    const valve = await getEquipment(office, sol.id);
    expect(valve.relations.map((r) => [r.kind, r.direction, r.other.name])).toEqual([['controls', 'backward', 'Box thermostat']]);
    await expect(addRelation(office, tstat.id, { kind: 'controls', otherId: sol.id, direction: 'from' })).rejects.toMatchObject({ code: '23505' });
    await expect(addRelation(office, tstat.id, { kind: 'controls', otherId: tstat.id, direction: 'from' })).rejects.toMatchObject({ code: 'validation_failed' });
  });

  it('refuses an area or system of another site, and a wrong nameplate on update, changing nothing', async () => {
    const { cu } = await registerWalkIn();
    const otherSite = clientOneSiteIds.find((id) => id !== siteId)!;
    const otherArea = await db.selectFrom('areas').select('id').where('site_id', '=', otherSite).executeTakeFirstOrThrow();
    await expect(updateEquipment(office, cu.id, { areaId: otherArea.id })).rejects.toMatchObject({ code: 'validation_failed' });
    await expect(updateEquipment(office, cu.id, { nameplate: { phase: '7' } })).rejects.toMatchObject({ code: 'validation_failed' });
    const after = await getEquipment(office, cu.id);
    expect(after.areaName).toBe('Roof');
    expect(after.nameplate.phase).toBe('3');
  });

  it('an owner sees their equipment, not another client’s; deleted equipment leaves lists but keeps its audit', async () => {
    const { cu } = await registerWalkIn();
    const owner = await actorFor(db, demoEmails.client);
    const stranger = await actorFor(db, demoEmails.clientTwo);
    expect((await listEquipment(owner, { limit: 50, sort: 'name', dir: 'asc' })).items).toHaveLength(5);
    expect((await listEquipment(stranger, { limit: 50, sort: 'name', dir: 'asc' })).items).toHaveLength(0);
    await expect(getEquipment(stranger, cu.id)).rejects.toMatchObject({ code: 'not_found' });
    await expect(updateEquipment(owner, cu.id, { name: 'x' })).rejects.toMatchObject({ code: 'forbidden' });

    await deleteEquipment(office, cu.id);
    await expect(getEquipment(office, cu.id)).rejects.toMatchObject({ code: 'not_found' });
    const actions = (await db.selectFrom('audit_events').select('action').where('entity_id', '=', cu.id).orderBy('created_at').execute()).map((a) => a.action);
    expect(actions).toEqual(['create', 'delete']);
    expect(await db.selectFrom('equipment').select('id').where('id', '=', cu.id).executeTakeFirst()).toBeDefined();
  });

  it('CSV export, then import into an empty site, gives the same equipment', async () => {
    await registerWalkIn();
    const csv = await exportEquipmentCsv(office, { siteId, sort: 'name', dir: 'asc' });
    const client = (await listSites(office, { limit: 50, archived: 'exclude' })).items.find((s) => s.id === siteId)!.clientId;
    const empty = await createSite(office, createSiteSchema.parse({ clientId: client, name: 'Empty annex' }));

    const preview = await importEquipmentCsv(office, empty.id, csv, false);
    expect(preview.problems).toEqual([]);
    expect(preview.rowCount).toBe(5);
    expect(preview.newAreas.sort()).toEqual(['Roof', 'Walk-in cooler']);
    expect(preview.newSystems).toEqual(['Walk-in cooler circuit']);
    expect(preview.imported).toBe(0);
    expect((await listEquipment(office, { siteId: empty.id, limit: 50, sort: 'name', dir: 'asc' })).items).toHaveLength(0);

    const done = await importEquipmentCsv(office, empty.id, csv, true);
    expect(done.imported).toBe(5);
    const strip = (items: Awaited<ReturnType<typeof listEquipment>>['items']) =>
      items.map(({ id: _id, siteId: _s, siteName: _n, siteTimeZone: _z, areaId: _a, systemId: _y, createdAt: _c, updatedAt: _u, ...rest }) => rest);
    const original = await listEquipment(office, { siteId, limit: 50, sort: 'name', dir: 'asc' });
    const copy = await listEquipment(office, { siteId: empty.id, limit: 50, sort: 'name', dir: 'asc' });
    expect(strip(copy.items)).toEqual(strip(original.items));
    expect(await exportEquipmentCsv(office, { siteId: empty.id, sort: 'name', dir: 'asc' })).toBe(csv);
  });

  it('an import with one bad row reports it by line and column and changes nothing', async () => {
    const before = await db.selectFrom('equipment').select((eb) => eb.fn.countAll<number>().as('n')).executeTakeFirstOrThrow();
    const csv = [
      'type,name,area,serial,condition,np.voltage',
      'contactor,Compressor contactor,Roof,CT-1,4,',
      'fan_motor,Condenser fan,Roof,FM-2,9,115',
      'evaporator,Freezer coil,Walk-in freezer,EV-9,3,',
    ].join('\n');
    const result = await importEquipmentCsv(office, siteId, csv, true);
    expect(result.imported).toBe(0);
    expect(result.problems).toEqual([{ line: 3, column: 'condition', message: 'Rate the condition from 1 (failing) to 5 (like new).' }]);
    const twoBad = csv.replace('EV-9,3,', 'EV-9,3,115');
    expect((await importEquipmentCsv(office, siteId, twoBad, true)).problems.map((p) => [p.line, p.column])).toEqual([
      [3, 'condition'],
      [4, 'np.voltage'],
    ]);
    const after = await db.selectFrom('equipment').select((eb) => eb.fn.countAll<number>().as('n')).executeTakeFirstOrThrow();
    expect(after.n).toBe(before.n);
  });

  it('an import whose header is wrong says which column', async () => {
    const result = await importEquipmentCsv(office, siteId, 'kind,name\ncontactor,A', true);
    expect(result.problems.map((p) => p.column)).toEqual(['type', 'kind']);
  });
});
