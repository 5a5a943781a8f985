// The role × action matrix of DEVELOPERS.md, checked on every route handler of the foundation.
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { actorFor, createTestDb, demoEmails, resetToDemo } from '@/tests/helpers/db';
import { call, mockAuthModule, session } from '@/tests/helpers/session';

vi.mock('@/lib/auth', () => mockAuthModule());

const db = createTestDb();
type RoleName = 'admin' | 'office' | 'technician' | 'client';
const roles: RoleName[] = ['admin', 'office', 'technician', 'client'];

interface Ids {
  company: string;
  clientOne: string;
  siteOne: string;
  areaOne: string;
  techUser: string;
  system: string;
  equipment: string;
  closedVisit: string;
  followUp: string;
  siteTwo: string;
}
let ids: Ids;
let counter = 0;

/** The id of the row an insert returns. */
const idOf = async (insert: { executeTakeFirstOrThrow(): Promise<{ id: string }> }): Promise<string> => (await insert.executeTakeFirstOrThrow()).id;

beforeAll(async () => {
  await resetToDemo(db);
  const client = await db.selectFrom('clients').select('id').where('name', '=', 'Marrowgate Eatery Group').executeTakeFirstOrThrow();
  const site = await db.selectFrom('sites').select('id').where('client_id', '=', client.id).orderBy('name').executeTakeFirstOrThrow();
  const area = await db.selectFrom('areas').select('id').where('site_id', '=', site.id).executeTakeFirstOrThrow();
  const tech = await db.selectFrom('users').select('id').where('email', '=', demoEmails.technician).executeTakeFirstOrThrow();
  const company = (await db.selectFrom('clients').select('company_id').where('id', '=', client.id).executeTakeFirstOrThrow()).company_id;
  const system = await idOf(db.insertInto('systems').values({ company_id: company, site_id: site.id, name: 'Matrix circuit', refrigerant: 'R-404A', application: 'commercial_refrigeration' }).returning('id'));
  const siteTwo = await db.selectFrom('sites').select('id').where('client_id', '=', client.id).where('id', '<>', site.id).executeTakeFirstOrThrow();
  ids = { company, clientOne: client.id, siteOne: site.id, areaOne: area.id, techUser: tech.id, system, equipment: '', closedVisit: '', followUp: '', siteTwo: siteTwo.id };
  ids.equipment = await newEquipment();
  ids.closedVisit = await newVisit('closed');
  ids.followUp = await newFollowUp();
});

/** A visit with a technician of its own, so the one-open-visit rule never collides between rows. */
async function newVisit(status: 'open' | 'closed', technicianId?: string): Promise<string> {
  const techId = technicianId ?? (await idOf(db.insertInto('users').values({ company_id: ids.company, email: `visit-tech-${++counter}@example.test`, name: 'Visit Tech', role: 'technician' }).returning('id')));
  // One open visit per technician per site: an earlier row's visit for the same person is closed first.
  await db.updateTable('visits').set({ status: 'closed', ended_at: new Date() }).where('technician_id', '=', techId).where('site_id', '=', ids.siteOne).where('status', '=', 'open').execute();
  return idOf(db.insertInto('visits').values({ company_id: ids.company, site_id: ids.siteOne, technician_id: techId, reason: 'maintenance', status, started_at: new Date(), ended_at: status === 'closed' ? new Date() : null, summary: status === 'closed' ? 'Matrix' : null }).returning('id'));
}

async function newEntry(visitId: string, authorId: string): Promise<string> {
  return idOf(db.insertInto('entries').values({ company_id: ids.company, visit_id: visitId, equipment_id: ids.equipment, kind: 'note', data: JSON.stringify({ text: 'Matrix' }), recorded_at: new Date(), created_by: authorId, client_entry_id: crypto.randomUUID() }).returning('id'));
}

async function newFollowUp(): Promise<string> {
  return idOf(db.insertInto('follow_ups').values({ company_id: ids.company, site_id: ids.siteOne, equipment_id: ids.equipment, title: 'Matrix follow-up', severity: 'minor', created_by: ids.techUser }).returning('id'));
}

async function newEquipment(): Promise<string> {
  return idOf(db.insertInto('equipment').values({ company_id: ids.company, site_id: ids.siteOne, system_id: ids.system, type: 'contactor', name: `Matrix contactor ${++counter}` }).returning('id'));
}

async function newRelation(): Promise<string> {
  return idOf(db.insertInto('equipment_relations').values({ company_id: ids.company, from_equipment_id: ids.equipment, to_equipment_id: await newEquipment(), kind: 'controls' }).returning('id'));
}

afterAll(async () => {
  await db.destroy();
});

async function newContact(): Promise<string> {
  return idOf(db.insertInto('client_contacts').values({ company_id: ids.company, client_id: ids.clientOne, name: `Temp ${++counter}` }).returning('id'));
}

async function newInvitation(): Promise<string> {
  const admin = await actorFor(db, demoEmails.admin);
  return idOf(db.insertInto('invitations').values({ company_id: admin.companyId, email: `temp${++counter}@example.test`, name: 'Temp', role: 'technician', token_hash: `hash-${counter}-${Date.now()}`, invited_by: admin.id, expires_at: new Date(Date.now() + 86_400_000) }).returning('id'));
}

interface Case {
  name: string;
  path?: string;
  route: () => Promise<Record<string, (...args: never[]) => Promise<Response>>>;
  method: 'GET' | 'POST' | 'PATCH' | 'DELETE';
  params?: () => Promise<Record<string, string>>;
  body?: () => unknown;
  expect: Record<RoleName, number>;
}

const all = (status: number): Record<RoleName, number> => ({ admin: status, office: status, technician: status, client: status });
const officeUp = (ok: number): Record<RoleName, number> => ({ admin: ok, office: ok, technician: 403, client: 403 });
const staffRead = (ok: number): Record<RoleName, number> => ({ admin: ok, office: ok, technician: ok, client: 403 });
const staffWrite = (ok: number): Record<RoleName, number> => ({ admin: ok, office: ok, technician: ok, client: 403 });
const adminOnly = (ok: number): Record<RoleName, number> => ({ admin: ok, office: 403, technician: 403, client: 403 });

const cases: Case[] = [
  { name: 'GET /api/me', route: () => import('@/app/api/me/route'), method: 'GET', expect: all(200) },
  { name: 'PATCH /api/me', route: () => import('@/app/api/me/route'), method: 'PATCH', body: () => ({ units: 'imperial' }), expect: all(200) },
  { name: 'GET /api/clients', route: () => import('@/app/api/clients/route'), method: 'GET', expect: all(200) },
  { name: 'POST /api/clients', route: () => import('@/app/api/clients/route'), method: 'POST', body: () => ({ name: `Matrix client ${++counter}` }), expect: officeUp(201) },
  { name: 'GET /api/clients/:id', route: () => import('@/app/api/clients/[id]/route'), method: 'GET', params: async () => ({ id: ids.clientOne }), expect: all(200) },
  { name: 'PATCH /api/clients/:id', route: () => import('@/app/api/clients/[id]/route'), method: 'PATCH', params: async () => ({ id: ids.clientOne }), body: () => ({ notes: 'Matrix note' }), expect: officeUp(200) },
  { name: 'POST /api/clients/:id/archive', route: () => import('@/app/api/clients/[id]/archive/route'), method: 'POST', params: async () => ({ id: ids.clientOne }), expect: officeUp(200) },
  { name: 'POST /api/clients/:id/restore', route: () => import('@/app/api/clients/[id]/restore/route'), method: 'POST', params: async () => ({ id: ids.clientOne }), expect: officeUp(200) },
  { name: 'GET /api/clients/:id/contacts', route: () => import('@/app/api/clients/[id]/contacts/route'), method: 'GET', params: async () => ({ id: ids.clientOne }), expect: staffRead(200) },
  { name: 'POST /api/clients/:id/contacts', route: () => import('@/app/api/clients/[id]/contacts/route'), method: 'POST', params: async () => ({ id: ids.clientOne }), body: () => ({ name: 'Matrix contact' }), expect: officeUp(201) },
  { name: 'PATCH /api/clients/:id/contacts/:contactId', route: () => import('@/app/api/clients/[id]/contacts/[contactId]/route'), method: 'PATCH', params: async () => ({ id: ids.clientOne, contactId: await newContact() }), body: () => ({ phone: '555-0199' }), expect: officeUp(200) },
  { name: 'DELETE /api/clients/:id/contacts/:contactId', route: () => import('@/app/api/clients/[id]/contacts/[contactId]/route'), method: 'DELETE', params: async () => ({ id: ids.clientOne, contactId: await newContact() }), expect: officeUp(204) },
  { name: 'GET /api/sites', route: () => import('@/app/api/sites/route'), method: 'GET', expect: all(200) },
  { name: 'POST /api/sites', route: () => import('@/app/api/sites/route'), method: 'POST', body: () => ({ clientId: ids.clientOne, name: `Matrix site ${++counter}` }), expect: officeUp(201) },
  { name: 'GET /api/sites/:id', route: () => import('@/app/api/sites/[id]/route'), method: 'GET', params: async () => ({ id: ids.siteOne }), expect: all(200) },
  { name: 'PATCH /api/sites/:id', route: () => import('@/app/api/sites/[id]/route'), method: 'PATCH', params: async () => ({ id: ids.siteOne }), body: () => ({ accessNotes: 'Matrix' }), expect: officeUp(200) },
  { name: 'POST /api/sites/:id/archive', route: () => import('@/app/api/sites/[id]/archive/route'), method: 'POST', params: async () => ({ id: ids.siteOne }), expect: officeUp(200) },
  { name: 'POST /api/sites/:id/restore', route: () => import('@/app/api/sites/[id]/restore/route'), method: 'POST', params: async () => ({ id: ids.siteOne }), expect: officeUp(200) },
  { name: 'GET /api/sites/:id/pack', route: () => import('@/app/api/sites/[id]/pack/route'), method: 'GET', params: async () => ({ id: ids.siteOne }), expect: staffRead(200) },
  { name: 'GET /api/sites/:id/areas', route: () => import('@/app/api/sites/[id]/areas/route'), method: 'GET', params: async () => ({ id: ids.siteOne }), expect: all(200) },
  { name: 'POST /api/sites/:id/areas', route: () => import('@/app/api/sites/[id]/areas/route'), method: 'POST', params: async () => ({ id: ids.siteOne }), body: () => ({ name: `Matrix area ${++counter}`, kind: 'roof' }), expect: officeUp(201) },
  { name: 'PATCH /api/sites/:id/areas/:areaId', route: () => import('@/app/api/sites/[id]/areas/[areaId]/route'), method: 'PATCH', params: async () => ({ id: ids.siteOne, areaId: ids.areaOne }), body: () => ({ notes: 'Matrix' }), expect: officeUp(200) },
  { name: 'POST /api/sites/:id/areas/:areaId/archive', route: () => import('@/app/api/sites/[id]/areas/[areaId]/archive/route'), method: 'POST', params: async () => ({ id: ids.siteOne, areaId: ids.areaOne }), expect: officeUp(200) },
  { name: 'POST /api/sites/:id/areas/:areaId/restore', route: () => import('@/app/api/sites/[id]/areas/[areaId]/restore/route'), method: 'POST', params: async () => ({ id: ids.siteOne, areaId: ids.areaOne }), expect: officeUp(200) },
  { name: 'GET /api/users', route: () => import('@/app/api/users/route'), method: 'GET', expect: adminOnly(200) },
  { name: 'GET /api/users/:id', route: () => import('@/app/api/users/[id]/route'), method: 'GET', params: async () => ({ id: ids.techUser }), expect: adminOnly(200) },
  { name: 'PATCH /api/users/:id', route: () => import('@/app/api/users/[id]/route'), method: 'PATCH', params: async () => ({ id: ids.techUser }), body: () => ({ role: 'technician', clientId: null }), expect: adminOnly(200) },
  { name: 'GET /api/invitations', route: () => import('@/app/api/invitations/route'), method: 'GET', expect: adminOnly(200) },
  { name: 'POST /api/invitations', route: () => import('@/app/api/invitations/route'), method: 'POST', body: () => ({ email: `matrix${++counter}@example.test`, name: 'Matrix', role: 'office' }), expect: adminOnly(201) },
  { name: 'DELETE /api/invitations/:id', route: () => import('@/app/api/invitations/[id]/route'), method: 'DELETE', params: async () => ({ id: await newInvitation() }), expect: adminOnly(204) },
  { name: 'GET /api/systems', route: () => import('@/app/api/systems/route'), method: 'GET', expect: all(200) },
  { name: 'POST /api/systems', route: () => import('@/app/api/systems/route'), method: 'POST', body: () => ({ siteId: ids.siteOne, name: `Matrix system ${++counter}`, refrigerant: 'R-448A', application: 'commercial_refrigeration' }), expect: officeUp(201) },
  { name: 'GET /api/systems/:id', route: () => import('@/app/api/systems/[id]/route'), method: 'GET', params: async () => ({ id: ids.system }), expect: all(200) },
  { name: 'PATCH /api/systems/:id', route: () => import('@/app/api/systems/[id]/route'), method: 'PATCH', params: async () => ({ id: ids.system }), body: () => ({ notes: 'Matrix' }), expect: officeUp(200) },
  { name: 'POST /api/systems/:id/archive', route: () => import('@/app/api/systems/[id]/archive/route'), method: 'POST', params: async () => ({ id: ids.system }), expect: officeUp(200) },
  { name: 'POST /api/systems/:id/restore', route: () => import('@/app/api/systems/[id]/restore/route'), method: 'POST', params: async () => ({ id: ids.system }), expect: officeUp(200) },
  { name: 'GET /api/equipment', route: () => import('@/app/api/equipment/route'), method: 'GET', expect: all(200) },
  { name: 'POST /api/equipment', route: () => import('@/app/api/equipment/route'), method: 'POST', body: () => ({ siteId: ids.siteOne, type: 'thermostat', name: `Matrix thermostat ${++counter}`, nameplate: { setpointC: 2 } }), expect: staffWrite(201) },
  { name: 'GET /api/equipment/:id', route: () => import('@/app/api/equipment/[id]/route'), method: 'GET', params: async () => ({ id: ids.equipment }), expect: all(200) },
  { name: 'PATCH /api/equipment/:id', route: () => import('@/app/api/equipment/[id]/route'), method: 'PATCH', params: async () => ({ id: ids.equipment }), body: () => ({ condition: 3 }), expect: staffWrite(200) },
  { name: 'DELETE /api/equipment/:id', route: () => import('@/app/api/equipment/[id]/route'), method: 'DELETE', params: async () => ({ id: await newEquipment() }), expect: officeUp(204) },
  { name: 'GET /api/equipment/:id/relations', route: () => import('@/app/api/equipment/[id]/relations/route'), method: 'GET', params: async () => ({ id: ids.equipment }), expect: all(200) },
  { name: 'POST /api/equipment/:id/relations', route: () => import('@/app/api/equipment/[id]/relations/route'), method: 'POST', params: async () => ({ id: ids.equipment }), body: () => ({ kind: 'serves', otherId: pendingOther.shift() }), expect: staffWrite(201) },
  { name: 'DELETE /api/equipment/:id/relations/:relationId', route: () => import('@/app/api/equipment/[id]/relations/[relationId]/route'), method: 'DELETE', params: async () => ({ id: ids.equipment, relationId: await newRelation() }), expect: staffWrite(204) },
  { name: 'GET /api/equipment/export', route: () => import('@/app/api/equipment/export/route'), method: 'GET', expect: all(200) },
  { name: 'POST /api/sites/:id/equipment-import', route: () => import('@/app/api/sites/[id]/equipment-import/route'), method: 'POST', params: async () => ({ id: ids.siteOne }), body: () => ({ csv: 'type,name\ncontactor,Imported contactor', commit: false }), expect: officeUp(200) },
  { name: 'GET /api/visits', route: () => import('@/app/api/visits/route'), method: 'GET', expect: all(200) },
  { name: 'POST /api/visits', route: () => import('@/app/api/visits/route'), method: 'POST', body: () => ({ siteId: ids.siteTwo, reason: 'maintenance' }), expect: staffWrite(201) },
  { name: 'GET /api/visits/:id', route: () => import('@/app/api/visits/[id]/route'), method: 'GET', params: async () => ({ id: ids.closedVisit }), expect: all(200) },
  { name: 'POST /api/visits/:id/entries', route: () => import('@/app/api/visits/[id]/entries/route'), method: 'POST', params: async () => ({ id: await newVisit('open', session.actor?.id) }), body: () => ({ kind: 'note', equipmentId: ids.equipment, clientEntryId: crypto.randomUUID(), data: { text: 'Matrix note' } }), expect: staffWrite(201) },
  { name: 'POST /api/visits/:id/close', route: () => import('@/app/api/visits/[id]/close/route'), method: 'POST', params: async () => ({ id: await newVisit('open', session.actor?.id) }), body: () => ({ summary: 'Matrix close' }), expect: staffWrite(200) },
  { name: 'POST /api/visits/:id/reopen', route: () => import('@/app/api/visits/[id]/reopen/route'), method: 'POST', params: async () => ({ id: await newVisit('closed') }), expect: officeUp(200) },
  { name: 'POST /api/visits/:id/review', route: () => import('@/app/api/visits/[id]/review/route'), method: 'POST', params: async () => ({ id: await newVisit('closed') }), expect: officeUp(200) },
  { name: 'GET /api/visits/:id/report', route: () => import('@/app/api/visits/[id]/report/route'), method: 'GET', params: async () => ({ id: ids.closedVisit }), expect: all(200) },
  { name: 'POST /api/entries/:id/void', route: () => import('@/app/api/entries/[id]/void/route'), method: 'POST', params: async () => ({ id: await newEntry(await newVisit('open'), session.actor?.id ?? ids.techUser) }), body: () => ({ reason: 'Matrix' }), expect: staffWrite(200) },
  { name: 'GET /api/equipment/:id/history', route: () => import('@/app/api/equipment/[id]/history/route'), method: 'GET', params: async () => ({ id: ids.equipment }), expect: all(200) },
  { name: 'GET /api/equipment/:id/readings', route: () => import('@/app/api/equipment/[id]/readings/route'), method: 'GET', params: async () => ({ id: ids.equipment }), path: '/api/x?key=superheatK', expect: all(200) },
  { name: 'GET /api/systems/:id/history', route: () => import('@/app/api/systems/[id]/history/route'), method: 'GET', params: async () => ({ id: ids.system }), expect: all(200) },
  { name: 'GET /api/follow-ups', route: () => import('@/app/api/follow-ups/route'), method: 'GET', expect: all(200) },
  { name: 'POST /api/follow-ups', route: () => import('@/app/api/follow-ups/route'), method: 'POST', body: () => ({ siteId: ids.siteOne, title: 'Matrix raised', severity: 'minor' }), expect: staffWrite(201) },
  { name: 'GET /api/follow-ups/:id', route: () => import('@/app/api/follow-ups/[id]/route'), method: 'GET', params: async () => ({ id: ids.followUp }), expect: all(200) },
  { name: 'PATCH /api/follow-ups/:id', route: () => import('@/app/api/follow-ups/[id]/route'), method: 'PATCH', params: async () => ({ id: await newFollowUp() }), body: () => ({ status: 'scheduled', scheduledFor: '2027-01-15' }), expect: staffWrite(200) },
  { name: 'GET /api/tags/layouts', route: () => import('@/app/api/tags/layouts/route'), method: 'GET', expect: officeUp(200) },
  { name: 'GET /api/print-runs', route: () => import('@/app/api/print-runs/route'), method: 'GET', expect: officeUp(200) },
  { name: 'GET /api/tags?equipmentId=', route: () => import('@/app/api/tags/route'), method: 'GET', path: '/api/x?equipmentId=EQUIPMENT', expect: all(200) },
  { name: 'GET /api/equipment/:id/photos', route: () => import('@/app/api/equipment/[id]/photos/route'), method: 'GET', params: async () => ({ id: ids.equipment }), expect: all(200) },
  { name: 'GET /api/photos/consistency', route: () => import('@/app/api/photos/consistency/route'), method: 'GET', expect: adminOnly(200) },
  { name: 'GET /api/company', route: () => import('@/app/api/company/route'), method: 'GET', expect: adminOnly(200) },
  { name: 'PATCH /api/company', route: () => import('@/app/api/company/route'), method: 'PATCH', body: () => ({ servicePhone: '555-0100' }), expect: adminOnly(200) },
];

// Each relation POST needs a partner it is not yet related to; created in the row's params step.
const pendingOther: string[] = [];

describe('access matrix', () => {
  for (const c of cases) {
    it(`${c.name}: signed out → 401`, async () => {
      session.actor = null;
      if (c.name === 'POST /api/equipment/:id/relations') pendingOther.push(await newEquipment());
      const mod = await c.route();
      const res = await call(mod[c.method] as never, { method: c.method, path: c.path?.replace('EQUIPMENT', ids.equipment), params: c.params ? await c.params() : {}, json: c.body?.() });
      expect(res.status).toBe(401);
      expect(res.body).toMatchObject({ error: { code: 'unauthorized' } });
    });
    for (const role of roles) {
      it(`${c.name}: ${role} → ${c.expect[role]}`, async () => {
        session.actor = await actorFor(db, demoEmails[role]);
        if (c.name === 'POST /api/equipment/:id/relations') pendingOther.push(await newEquipment());
        const mod = await c.route();
        const res = await call(mod[c.method] as never, { method: c.method, path: c.path?.replace('EQUIPMENT', ids.equipment), params: c.params ? await c.params() : {}, json: c.body?.() });
        expect(res.status, JSON.stringify(res.body)).toBe(c.expect[role]);
        if (res.status >= 400) expect(res.body).toMatchObject({ error: { code: expect.any(String), message: expect.any(String) } });
      });
    }
  }
});

describe('client scoping', () => {
  it('a client user gets 404 for another client’s site, areas and client record', async () => {
    session.actor = await actorFor(db, demoEmails.clientTwo);
    const siteRoute = await import('@/app/api/sites/[id]/route');
    const areasRoute = await import('@/app/api/sites/[id]/areas/route');
    const clientRoute = await import('@/app/api/clients/[id]/route');
    expect((await call(siteRoute.GET as never, { params: { id: ids.siteOne } })).status).toBe(404);
    expect((await call(areasRoute.GET as never, { params: { id: ids.siteOne } })).status).toBe(404);
    expect((await call(clientRoute.GET as never, { params: { id: ids.clientOne } })).status).toBe(404);
  });

  it('a client user’s lists hold only their own client’s sites', async () => {
    session.actor = await actorFor(db, demoEmails.clientTwo);
    const sitesRoute = await import('@/app/api/sites/route');
    const res = await call(sitesRoute.GET as never, { path: '/api/sites' });
    const items = (res.body as { items: { clientName: string }[] }).items;
    expect(items.length).toBe(2);
    expect(new Set(items.map((s) => s.clientName))).toEqual(new Set(['Tidewell Family Grocers']));
  });

  it('a malformed id is 404, not a server error', async () => {
    session.actor = await actorFor(db, demoEmails.admin);
    const siteRoute = await import('@/app/api/sites/[id]/route');
    const res = await call(siteRoute.GET as never, { params: { id: 'not-a-uuid' } });
    expect(res.status).toBe(404);
  });
});
