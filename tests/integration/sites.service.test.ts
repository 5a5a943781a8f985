// Clients, sites and areas through their services: audit trail, validation that changes nothing,
// client scoping, archive and restore.
import { describe, expect, it } from 'vitest';
import { createClient, getClient, listClients, setClientArchived, updateClient } from '@/lib/clients/service';
import { createArea, createSite, getSite, listSites, setAreaArchived, setSiteArchived, updateSite } from '@/lib/sites/service';
import { createSiteSchema } from '@/lib/sites/schemas';
import { actorFor, createOtherCompany, createTestDb, demoEmails } from '@/tests/helpers/db';
import { resetDemoEach } from '@/tests/helpers/registry';

const db = createTestDb();

resetDemoEach(db);

async function counts() {
  const [clients, sites, areas, audits] = await Promise.all(
    ['clients', 'sites', 'areas', 'audit_events'].map((t) =>
      db.selectFrom(t as 'clients').select((eb) => eb.fn.countAll<number>().as('n')).executeTakeFirstOrThrow(),
    ),
  );
  return { clients: clients!.n, sites: sites!.n, areas: areas!.n, audits: audits!.n };
}

describe('clients and sites', () => {
  it('create and update write audit events with before and after', async () => {
    const office = await actorFor(db, demoEmails.office);
    const client = await createClient(office, { name: 'Juniper Hollow Deli', notes: null });
    await updateClient(office, client.id, { name: 'Juniper Hollow Deli & Market' });
    const events = await db.selectFrom('audit_events').selectAll().where('entity_id', '=', client.id).orderBy('created_at').execute();
    expect(events.map((e) => e.action)).toEqual(['create', 'update']);
    expect(events[0]?.actor_id).toBe(office.id);
    expect((events[1]?.before as { name: string }).name).toBe('Juniper Hollow Deli');
    expect((events[1]?.after as { name: string }).name).toBe('Juniper Hollow Deli & Market');
    // The record as it was, without what this viewer happened to be allowed to do with it.
    expect(client.canEdit).toBe(true);
    expect(Object.keys(events[1]?.after as object).filter((k) => k.startsWith('can'))).toEqual([]);
    expect(Object.keys(events[0]?.after as object).filter((k) => k.startsWith('can'))).toEqual([]);
  });

  it('audit events cannot be edited or deleted', async () => {
    const office = await actorFor(db, demoEmails.office);
    const client = await createClient(office, { name: 'Audit Check Cafe', notes: null });
    await expect(db.updateTable('audit_events').set({ action: 'x' }).where('entity_id', '=', client.id).execute()).rejects.toThrow(/never edited/);
    await expect(db.deleteFrom('audit_events').where('entity_id', '=', client.id).execute()).rejects.toThrow(/never edited/);
  });

  it('a duplicate client name is a conflict and changes nothing', async () => {
    const office = await actorFor(db, demoEmails.office);
    const before = await counts();
    await expect(createClient(office, { name: 'marrowgate eatery group', notes: null })).rejects.toMatchObject({ code: '23505' });
    expect(await counts()).toEqual(before);
  });

  it('a site for a client of another company is refused and nothing is stored', async () => {
    const office = await actorFor(db, demoEmails.office);
    const other = await createOtherCompany(db);
    const before = await counts();
    await expect(createSite(office, createSiteSchema.parse({ clientId: other.clientId, name: 'Sneaky site' }))).rejects.toMatchObject({ code: 'validation_failed' });
    expect(await counts()).toEqual(before);
  });

  it('site validation rejects bad time zones and elevations with clear messages', () => {
    const bad = createSiteSchema.safeParse({ clientId: '00000000-0000-4000-8000-000000000000', name: 'X', timeZone: 'Mars/Olympus', elevationM: 9000 });
    expect(bad.success).toBe(false);
    const messages = bad.error!.issues.map((i) => i.message);
    expect(messages).toContain('Choose a valid time zone, e.g. America/Denver.');
    expect(messages).toContain('Elevation must be at most 6000 m.');
  });

  it('staff of another company see none of this company’s records', async () => {
    const other = await createOtherCompany(db);
    const stranger = await actorFor(db, other.adminEmail);
    const office = await actorFor(db, demoEmails.office);
    const site = (await listSites(office, { limit: 1, archived: 'exclude' })).items[0]!;
    await expect(getSite(stranger, site.id)).rejects.toMatchObject({ code: 'not_found' });
    expect((await listSites(stranger, { limit: 50, archived: 'exclude' })).items.map((s) => s.name)).toEqual(['Other Site']);
  });

  it('archived clients leave the default list and come back on restore', async () => {
    const office = await actorFor(db, demoEmails.office);
    const client = (await listClients(office, { limit: 50, archived: 'exclude' })).items[0]!;
    await setClientArchived(office, client.id, true);
    expect((await listClients(office, { limit: 50, archived: 'exclude' })).items.map((c) => c.id)).not.toContain(client.id);
    expect((await listClients(office, { limit: 50, archived: 'only' })).items.map((c) => c.id)).toEqual([client.id]);
    await setClientArchived(office, client.id, false);
    expect((await getClient(office, client.id)).archivedAt).toBeNull();
  });

  it('keyset pages cover every site exactly once', async () => {
    const office = await actorFor(db, demoEmails.office);
    const client = (await listClients(office, { limit: 1, archived: 'exclude' })).items[0]!;
    for (let i = 0; i < 7; i++) await createSite(office, createSiteSchema.parse({ clientId: client.id, name: `Page test ${i}` }));
    const seen: string[] = [];
    let cursor: string | undefined;
    do {
      const page = await listSites(office, { limit: 3, cursor, archived: 'exclude' });
      seen.push(...page.items.map((s) => s.id));
      cursor = page.nextCursor ?? undefined;
    } while (cursor);
    expect(seen.length).toBe(12);
    expect(new Set(seen).size).toBe(12);
  });

  it('a client counts its sites and a site its areas, archived ones left out', async () => {
    const office = await actorFor(db, demoEmails.office);
    const client = await createClient(office, { name: 'Counting Corner Grocer', notes: null });
    const kept = await createSite(office, createSiteSchema.parse({ clientId: client.id, name: 'Counted site' }));
    const gone = await createSite(office, createSiteSchema.parse({ clientId: client.id, name: 'Archived site' }));
    await setSiteArchived(office, gone.id, true);
    expect((await getClient(office, client.id)).siteCount).toBe(1);
    const roof = await createArea(office, kept.id, { name: 'Roof', kind: 'roof', notes: null });
    await createArea(office, kept.id, { name: 'Back room', kind: 'mechanical_room', notes: null });
    await setAreaArchived(office, kept.id, roof.id, true);
    expect((await getSite(office, kept.id)).areaCount).toBe(1);
  });

  it('a technician cannot create sites or areas', async () => {
    const tech = await actorFor(db, demoEmails.technician);
    const office = await actorFor(db, demoEmails.office);
    const site = (await listSites(office, { limit: 1, archived: 'exclude' })).items[0]!;
    await expect(createArea(tech, site.id, { name: 'Roof 2', kind: 'roof', notes: null })).rejects.toMatchObject({ code: 'forbidden' });
    await expect(updateSite(tech, site.id, { name: 'Renamed' })).rejects.toMatchObject({ code: 'forbidden' });
  });
});
