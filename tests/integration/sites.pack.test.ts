// GET /api/sites/:id/pack: what a phone keeps of a site, who may take it, and its limits.
import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import type { Actor } from '@/lib/auth/actor';
import { sitePackSchema, type SitePack } from '@/lib/sites/pack-schema';
import { actorFor, createOtherCompany, createTestDb, demoEmails, resetToDemo } from '@/tests/helpers/db';
import { call, mockAuthModule, session } from '@/tests/helpers/session';

vi.mock('@/lib/auth', () => mockAuthModule());

const db = createTestDb();
let tech: Actor;
let office: Actor;
let owner: Actor;
let siteId: string;
let otherClientSiteId: string;
let units: { cold: string; control: string; removed: string; deleted: string; elsewhere: string };
let route: typeof import('@/app/api/sites/[id]/pack/route');

async function make(name: string, type: string, site = siteId, extra: Record<string, unknown> = {}) {
  const row = await db
    .insertInto('equipment')
    .values({ company_id: tech.companyId, site_id: site, name, type, nameplate: JSON.stringify(extra.nameplate ?? {}), ...(extra.status ? { status: extra.status as string } : {}), ...(extra.deleted ? { deleted_at: new Date() } : {}) })
    .returning('id')
    .executeTakeFirstOrThrow();
  return row.id;
}

async function visit(status: 'open' | 'closed', startedAt: Date, site = siteId) {
  const v = await db
    .insertInto('visits')
    .values({ company_id: tech.companyId, site_id: site, technician_id: tech.id, reason: 'maintenance', status, started_at: startedAt, ended_at: status === 'closed' ? startedAt : null })
    .returning('id')
    .executeTakeFirstOrThrow();
  return v.id;
}

async function note(visitId: string, equipmentId: string, at: Date, text: string, voided = false) {
  await db
    .insertInto('entries')
    .values({
      company_id: tech.companyId,
      visit_id: visitId,
      equipment_id: equipmentId,
      kind: 'note',
      data: JSON.stringify({ text }),
      recorded_at: at,
      created_by: tech.id,
      client_entry_id: randomUUID(),
      ...(voided ? { voided_at: new Date(), void_reason: 'Wrong unit' } : {}),
    })
    .execute();
}

beforeAll(async () => {
  await resetToDemo(db);
  tech = await actorFor(db, demoEmails.technician);
  office = await actorFor(db, demoEmails.office);
  owner = await actorFor(db, demoEmails.client);
  const ownerClient = owner.clientId!;
  siteId = (await db.selectFrom('sites').select('id').where('client_id', '=', ownerClient).orderBy('name').executeTakeFirstOrThrow()).id;
  otherClientSiteId = (await db.selectFrom('sites').select('id').where('company_id', '=', tech.companyId).where('client_id', '<>', ownerClient).executeTakeFirstOrThrow()).id;
  units = {
    cold: await make('Walk-in evaporator', 'evaporator'),
    control: await make('Walk-in pressure control', 'pressure_control', siteId, { nameplate: { lowCutInKpa: 180, lowDifferentialKpa: 70 } }),
    removed: await make('Old condensing unit', 'condensing_unit', siteId, { status: 'removed' }),
    deleted: await make('Entered by mistake', 'contactor', siteId, { deleted: true }),
    elsewhere: await make('Other site unit', 'evaporator', otherClientSiteId),
  };
  await db.insertInto('tags').values({ company_id: tech.companyId, code: 'K7QM3X9PA', state: 'attached', equipment_id: units.control, site_id: siteId, attached_at: new Date() }).execute();
  // 25 entries on the evaporator over 25 closed visits, one struck out; 3 on the removed unit.
  const base = Date.parse('2026-06-01T12:00:00Z');
  for (let i = 0; i < 25; i++) {
    const at = new Date(base + i * 86_400_000);
    const v = await visit('closed', at);
    await note(v, units.cold, at, `Visit ${i}`, i === 24);
    if (i < 3) await note(v, units.removed, at, `Removed unit ${i}`);
  }
  await note(await visit('closed', new Date(base), otherClientSiteId), units.elsewhere, new Date(base), 'Elsewhere');
  const open = await visit('open', new Date(base + 30 * 86_400_000));
  await db.insertInto('follow_ups').values({ company_id: tech.companyId, site_id: siteId, equipment_id: units.cold, title: 'Fan blade chipped', severity: 'minor', created_by: tech.id }).execute();
  await db.insertInto('follow_ups').values({ company_id: tech.companyId, site_id: siteId, equipment_id: units.cold, title: 'Already fixed', severity: 'minor', status: 'resolved', closed_at: new Date(), created_by: tech.id }).execute();
  await db.updateTable('sites').set({ elevation_m: 1609, time_zone: 'America/Denver' }).where('id', '=', siteId).execute();
  units = { ...units, ...{ openVisit: open } };
  route = await import('@/app/api/sites/[id]/pack/route');
});

afterAll(async () => {
  session.actor = null;
  await db.destroy();
});

async function pack(actor: Actor, id = siteId) {
  session.actor = actor;
  return call(route.GET as never, { params: { id } });
}

describe('site pack', () => {
  it('holds the site, its current units with tag and settings, their newest 20 entries, open follow-ups and contexts', async () => {
    const res = await pack(tech);
    expect(res.status).toBe(200);
    const body = sitePackSchema.parse(res.body) as SitePack;
    expect(body.site).toMatchObject({ id: siteId, timeZone: 'America/Denver', elevationM: 1609 });
    expect(body.viewer).toMatchObject({ id: tech.id, role: 'technician' });
    expect(body.units.map((u) => u.name)).toEqual(['Walk-in evaporator', 'Walk-in pressure control']);

    const control = body.units.find((u) => u.id === units.control)!;
    expect(control.tagCode).toBe('K7QM3X9PA');
    expect(control.nameplate).toMatchObject({ lowCutInKpa: 180, lowDifferentialKpa: 70 });
    expect(control.history).toEqual([]);

    const cold = body.units.find((u) => u.id === units.cold)!;
    expect(cold.tagCode).toBeNull();
    // 25 entries, the newest struck out: the 20 newest live ones, newest first.
    expect(cold.history).toHaveLength(20);
    expect(cold.history[0]!.data).toEqual({ text: 'Visit 23' });
    expect(cold.history.at(-1)!.data).toEqual({ text: 'Visit 4' });
    expect(body.visits[cold.history[0]!.visitId]).toMatchObject({ reason: 'maintenance', status: 'closed', technicianName: tech.name });
    // Each kept entry's visit is in the pack, and only those.
    expect(Object.keys(body.visits).sort()).toEqual([...new Set(cold.history.map((e) => e.visitId))].sort());
    expect(cold.history[0]!.createdByName).toBe(tech.name);

    expect(body.followUps.map((f) => f.title)).toEqual(['Fan blade chipped']);
    expect(Object.keys(body.contexts).sort()).toEqual([units.cold, units.control].sort());
    expect(body.contexts[units.cold]).toMatchObject({ elevationM: 1609 });
    expect(body.openVisitId).toBe((units as unknown as { openVisit: string }).openVisit);
    // The open visit itself and who the pack is for, so the phone can continue it without signal.
    expect(body.openVisit).toMatchObject({ id: body.openVisitId });
    expect(body.viewer.name).toBe(tech.name);
  });

  it('leaves removed and deleted units out, and units of other sites', async () => {
    const body = (await pack(office)).body as SitePack;
    const ids = body.units.map((u) => u.id);
    expect(ids).not.toContain(units.removed);
    expect(ids).not.toContain(units.deleted);
    expect(ids).not.toContain(units.elsewhere);
    expect(JSON.stringify(body)).not.toContain('Removed unit');
    expect(JSON.stringify(body)).not.toContain('Elsewhere');
    // The office has no open visit of its own here.
    expect(body.openVisitId).toBeNull();
    expect(body.openVisit).toBeNull();
  });

  it('refuses owners with 403, even for their own site', async () => {
    expect((await pack(owner)).status).toBe(403);
    expect((await pack(owner, otherClientSiteId)).status).toBe(403);
  });

  it('reads another company’s site and an unknown id as 404', async () => {
    const other = await createOtherCompany(db);
    expect((await pack(tech, other.siteId)).status).toBe(404);
    expect((await pack(tech, randomUUID())).status).toBe(404);
    expect((await pack(tech, 'not-a-uuid')).status).toBe(404);
    const otherAdmin = await actorFor(db, other.adminEmail);
    expect((await pack(otherAdmin, siteId)).status).toBe(404);
  });

  it('answers 401 when signed out', async () => {
    session.actor = null;
    expect((await call(route.GET as never, { params: { id: siteId } })).status).toBe(401);
  });
});
