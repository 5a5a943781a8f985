// The planned-visit routes for every role and for a signed-out caller, as the access matrix says
// (plans.read: everyone within their scope; plans.write: admin and office), with the one error shape.
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import type { Actor } from '@/lib/auth/actor';
import { localDate } from '@/lib/format/dates';
import { addDays } from '@/lib/plans/days';
import { createPlan } from '@/lib/plans/service';
import { actorFor, createTestDb, demoEmails, resetToDemo } from '@/tests/helpers/db';
import { call, mockAuthModule, session } from '@/tests/helpers/session';

vi.mock('@/lib/auth', () => mockAuthModule());

const db = createTestDb();
type RoleName = 'admin' | 'office' | 'technician' | 'client';
const roles: RoleName[] = ['admin', 'office', 'technician', 'client'];
let office: Actor;
let tech: Actor;
let siteId: string;
let day: string;

const newPlan = async () => (await createPlan(office, { siteId, systemIds: [], equipmentIds: [], reason: 'inspection', technicianId: tech.id, day, windowStart: '09:00', windowEnd: '11:00' })).id;
const body = () => ({ siteId, reason: 'maintenance', technicianId: tech.id, day, windowStart: '08:00', windowEnd: '09:00' });

beforeAll(async () => {
  await resetToDemo(db);
  office = await actorFor(db, demoEmails.office);
  tech = await actorFor(db, demoEmails.technician);
  const owner = await actorFor(db, demoEmails.client);
  const site = await db.selectFrom('sites').select(['id', 'time_zone']).where('client_id', '=', owner.clientId!).orderBy('name').executeTakeFirstOrThrow();
  siteId = site.id;
  day = addDays(localDate(new Date(), site.time_zone), 2);
});
afterAll(async () => {
  await db.destroy();
});

interface Case {
  name: string;
  route: () => Promise<Record<string, unknown>>;
  method: 'GET' | 'POST' | 'PATCH';
  params?: () => Promise<Record<string, string>>;
  body?: () => unknown;
  expect: Record<RoleName, number>;
}

const officeUp = (ok: number): Record<RoleName, number> => ({ admin: ok, office: ok, technician: 403, client: 403 });
const all = (ok: number): Record<RoleName, number> => ({ admin: ok, office: ok, technician: ok, client: ok });

const cases: Case[] = [
  { name: 'GET /api/plans', route: () => import('@/app/api/plans/route'), method: 'GET', expect: all(200) },
  { name: 'POST /api/plans', route: () => import('@/app/api/plans/route'), method: 'POST', body, expect: officeUp(201) },
  { name: 'GET /api/plans/:id', route: () => import('@/app/api/plans/[id]/route'), method: 'GET', params: async () => ({ id: await newPlan() }), expect: all(200) },
  {
    name: 'PATCH /api/plans/:id',
    route: () => import('@/app/api/plans/[id]/route'),
    method: 'PATCH',
    params: async () => ({ id: await newPlan() }),
    body: () => ({ technicianId: tech.id, day: addDays(day, 1), windowStart: '12:00', windowEnd: '13:00' }),
    expect: officeUp(200),
  },
  { name: 'POST /api/plans/:id/cancel', route: () => import('@/app/api/plans/[id]/cancel/route'), method: 'POST', params: async () => ({ id: await newPlan() }), body: () => ({ reason: 'Closed that day.' }), expect: officeUp(200) },
];

describe('planned-visit routes', () => {
  for (const c of cases) {
    it(`${c.name}: signed out → 401`, async () => {
      session.actor = null;
      const mod = await c.route();
      const res = await call(mod[c.method] as never, { method: c.method, params: c.params ? await c.params() : {}, json: c.body?.() });
      expect(res.status).toBe(401);
      expect(res.body).toMatchObject({ error: { code: 'unauthorized' } });
    });
    for (const role of roles) {
      it(`${c.name}: ${role} → ${c.expect[role]}`, async () => {
        session.actor = await actorFor(db, demoEmails[role]);
        const mod = await c.route();
        const res = await call(mod[c.method] as never, { method: c.method, params: c.params ? await c.params() : {}, json: c.body?.() });
        expect(res.status, JSON.stringify(res.body)).toBe(c.expect[role]);
        if (res.status >= 400) expect(res.body).toMatchObject({ error: { code: expect.any(String), message: expect.any(String) } });
      });
    }
  }

  it('another client’s owner gets 404 for the plan and an empty list', async () => {
    const id = await newPlan();
    session.actor = await actorFor(db, demoEmails.clientTwo);
    const one = await import('@/app/api/plans/[id]/route');
    expect((await call(one.GET as never, { params: { id } })).status).toBe(404);
    const list = await import('@/app/api/plans/route');
    const res = await call(list.GET as never, { path: '/api/plans' });
    expect((res.body as { items: unknown[] }).items).toEqual([]);
  });

  it('a bad window is a 422 naming the field, and nothing is planned', async () => {
    session.actor = office;
    const before = (await db.selectFrom('visit_plans').select('id').execute()).length;
    const list = await import('@/app/api/plans/route');
    const res = await call(list.POST as never, { method: 'POST', json: { ...body(), windowStart: '10:00', windowEnd: '09:30' } });
    expect(res.status).toBe(422);
    expect(res.body).toMatchObject({ error: { code: 'validation_failed', issues: [{ path: 'windowEnd', message: 'The window must end after it starts.' }] } });
    expect((await db.selectFrom('visit_plans').select('id').execute()).length).toBe(before);
  });
});
