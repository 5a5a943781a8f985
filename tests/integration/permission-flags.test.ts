// Permission flags sent with the data (lib/visits/permissions.ts, the follow-ups and requests
// services): what each role may do on a visit, an entry, a follow-up and a request, as the page
// reads it and as the API sends it, and the service refusing exactly what a flag says no to.
import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import type { Actor } from '@/lib/auth/actor';
import { createFollowUp, getFollowUp, listFollowUps, updateFollowUp } from '@/lib/follow-ups/service';
import { createRequest, getRequest, listRequests } from '@/lib/requests/service';
import { closeVisit } from '@/lib/visits/close';
import { addEntry, voidEntry } from '@/lib/visits/entries';
import { equipmentHistory } from '@/lib/visits/history';
import { getVisit, listVisits, markReviewed, startVisit } from '@/lib/visits/service';
import { actorFor, createTestDb, demoEmails, resetToDemo } from '@/tests/helpers/db';
import { createCoolerCircuit } from '@/tests/helpers/registry';
import { call, mockAuthModule, session } from '@/tests/helpers/session';

vi.mock('@/lib/auth', () => mockAuthModule());

const db = createTestDb();
let tech: Actor, office: Actor, admin: Actor, owner: Actor;
let circuit: Awaited<ReturnType<typeof createCoolerCircuit>>;
const note = (equipmentId: string, text: string) => ({ equipmentId, clientEntryId: randomUUID(), kind: 'note' as const, data: { text } });
const flags = (v: { canAddEntries: boolean; canClose: boolean; canReview: boolean; canReopen: boolean }) => ({
  canAddEntries: v.canAddEntries,
  canClose: v.canClose,
  canReview: v.canReview,
  canReopen: v.canReopen,
});
const none = { canAddEntries: false, canClose: false, canReview: false, canReopen: false };

beforeAll(async () => {
  await resetToDemo(db);
  tech = await actorFor(db, demoEmails.technician);
  office = await actorFor(db, demoEmails.office);
  admin = await actorFor(db, demoEmails.admin);
  owner = await actorFor(db, demoEmails.client);
  circuit = await createCoolerCircuit(db);
});
afterAll(async () => {
  session.actor = null;
  await db.destroy();
});

async function apiVisit(actor: Actor, id: string) {
  const route = await import('@/app/api/visits/[id]/route');
  session.actor = actor;
  const res = await call(route.GET as never, { path: `/api/visits/${id}`, params: { id } });
  expect(res.status).toBe(200);
  return res.body as Awaited<ReturnType<typeof getVisit>>;
}

describe('visit and entry flags', () => {
  it('follow the visit through open, closed and reviewed for every role, and the services refuse what a flag denies', async () => {
    const visit = await startVisit(tech, { siteId: circuit.siteId, reason: 'maintenance' });
    const own = await addEntry(tech, visit.id, note(circuit.condensingUnitId, 'Coil cleaned.'));
    const byOffice = await addEntry(office, visit.id, note(circuit.condensingUnitId, 'Office note for the record.'));
    expect(own.canVoid).toBe(true);

    // Open: the technician and the office work on it; the owner does not see it at all.
    const open = { canAddEntries: true, canClose: true, canReview: false, canReopen: false };
    expect(flags(await getVisit(tech, visit.id))).toEqual(open);
    expect(flags(await getVisit(office, visit.id))).toEqual(open);
    expect(flags(await getVisit(admin, visit.id))).toEqual(open);
    await expect(getVisit(owner, visit.id)).rejects.toMatchObject({ code: 'not_found' });

    // An entry is struck out by its author or the office: not by the technician when the office wrote it.
    const voidable = async (actor: Actor) => Object.fromEntries((await getVisit(actor, visit.id)).entries.map((e) => [e.id, e.canVoid]));
    expect(await voidable(tech)).toEqual({ [own.id]: true, [byOffice.id]: false });
    expect(await voidable(office)).toEqual({ [own.id]: true, [byOffice.id]: true });
    await expect(voidEntry(tech, byOffice.id, 'Not mine to keep')).rejects.toMatchObject({ code: 'forbidden' });

    // The API sends the very flags the page reads.
    const viaApi = await apiVisit(tech, visit.id);
    expect(flags(viaApi)).toEqual(open);
    expect(viaApi.entries.map((e) => [e.id, e.canVoid])).toEqual([
      [own.id, true],
      [byOffice.id, false],
    ]);
    // The list carries them too.
    const listed = (await listVisits(tech, { siteId: circuit.siteId, limit: 10 })).items.find((v) => v.id === visit.id)!;
    expect(flags(listed)).toEqual(open);

    await closeVisit(tech, visit.id, { summary: 'Routine maintenance.', confirmBypassRemoved: false }, db, { report: 'on-download' });

    // Closed, not reviewed: the office reviews or reopens; nobody adds entries; the owner only reads.
    expect(flags(await getVisit(tech, visit.id))).toEqual(none);
    expect(flags(await getVisit(office, visit.id))).toEqual({ ...none, canReview: true, canReopen: true });
    expect(flags(await apiVisit(owner, visit.id))).toEqual(none);
    expect((await getVisit(owner, visit.id)).entries.every((e) => !e.canVoid)).toBe(true);
    await expect(addEntry(office, visit.id, note(circuit.evaporatorId, 'Too late.'))).rejects.toMatchObject({ code: 'conflict' });
    // Until the review, the author may still strike out their own entry (as voidEntry allows).
    expect(await voidable(tech)).toEqual({ [own.id]: true, [byOffice.id]: false });

    await markReviewed(office, visit.id);

    // Reviewed: nothing is struck out until a reopen; review is done, reopen stays the office's.
    expect(flags(await getVisit(office, visit.id))).toEqual({ ...none, canReopen: true });
    expect(await voidable(tech)).toEqual({ [own.id]: false, [byOffice.id]: false });
    expect(await voidable(office)).toEqual({ [own.id]: false, [byOffice.id]: false });
    await expect(voidEntry(tech, own.id, 'Typo')).rejects.toMatchObject({ code: 'conflict' });
    // History carries the same flag as the visit page.
    const history = await equipmentHistory(tech, circuit.condensingUnitId, { limit: 50 });
    expect(history.items.filter((e) => e.visitId === visit.id).map((e) => e.canVoid)).toEqual([false, false]);
  });

  it('a struck-out entry cannot be struck out again', async () => {
    const visit = await startVisit(tech, { siteId: circuit.siteId, reason: 'no_cooling' });
    const entry = await addEntry(tech, visit.id, note(circuit.evaporatorId, 'Wrong unit.'));
    const voided = await voidEntry(tech, entry.id, 'Wrong unit');
    expect(voided.canVoid).toBe(false);
    expect((await getVisit(office, visit.id)).entries.find((e) => e.id === entry.id)?.canVoid).toBe(false);
    await closeVisit(tech, visit.id, { summary: 'Nothing found.', confirmBypassRemoved: false }, db, { report: 'on-download' });
  });
});

describe('follow-up flags', () => {
  it('staff may move an open follow-up on; the owner may not; a resolved one is final for everyone', async () => {
    const raised = await createFollowUp(tech, { siteId: circuit.siteId, equipmentId: circuit.evaporatorId, title: 'Replace the door gasket', severity: 'minor' });
    expect(raised.canUpdate).toBe(true);
    expect((await getFollowUp(office, raised.id)).canUpdate).toBe(true);
    expect((await getFollowUp(owner, raised.id)).canUpdate).toBe(false);
    const ownerList = await listFollowUps(owner, { siteId: circuit.siteId, limit: 50 });
    expect(ownerList.items.find((f) => f.id === raised.id)?.canUpdate).toBe(false);

    const resolved = await updateFollowUp(office, raised.id, { status: 'resolved', resolution: 'Gasket replaced.' });
    expect(resolved.canUpdate).toBe(false);
    expect((await getFollowUp(admin, raised.id)).canUpdate).toBe(false);
    await expect(updateFollowUp(admin, raised.id, { status: 'open' })).rejects.toMatchObject({ code: 'conflict' });

    const route = await import('@/app/api/follow-ups/[id]/route');
    session.actor = tech;
    const res = await call(route.GET as never, { path: `/api/follow-ups/${raised.id}`, params: { id: raised.id } });
    expect((res.body as { canUpdate: boolean }).canUpdate).toBe(false);
  });
});

describe('request flags', () => {
  it('the office manages a request; the owner who sent it and the technician do not', async () => {
    const request = await createRequest(owner, { siteId: circuit.siteId, equipmentId: null, description: 'The cooler is warm.', urgency: 'soon' });
    expect(request.canManage).toBe(false);
    expect((await getRequest(office, request.id)).canManage).toBe(true);
    expect((await getRequest(admin, request.id)).canManage).toBe(true);
    expect((await getRequest(tech, request.id)).canManage).toBe(false);
    expect((await listRequests(owner, { limit: 50 })).find((r) => r.id === request.id)?.canManage).toBe(false);

    const route = await import('@/app/api/requests/[id]/route');
    const read = async (actor: Actor) => {
      session.actor = actor;
      const res = await call(route.GET as never, { path: `/api/requests/${request.id}`, params: { id: request.id } });
      expect(res.status).toBe(200);
      return (res.body as { canManage: boolean }).canManage;
    };
    expect(await read(office)).toBe(true);
    expect(await read(owner)).toBe(false);
    // And the owner's PATCH is refused, as the flag says.
    session.actor = owner;
    const patch = await call(route.PATCH as never, { method: 'PATCH', path: `/api/requests/${request.id}`, params: { id: request.id }, json: { status: 'done' } });
    expect(patch.status).toBe(403);
  });
});

describe('site flags', () => {
  it('say who works at, edits, plans and asks for service at a site; an archived site takes no new work', async () => {
    const { getSite } = await import('@/lib/sites/service');
    const pick = (s: Awaited<ReturnType<typeof getSite>>) => ({ edit: s.canEdit, visit: s.canStartVisit, ask: s.canAskForService, keep: s.canKeepOffline, plan: s.canPlan, register: s.canRegisterEquipment });
    expect(pick(await getSite(tech, circuit.siteId))).toEqual({ edit: false, visit: true, ask: false, keep: true, plan: false, register: true });
    expect(pick(await getSite(office, circuit.siteId))).toEqual({ edit: true, visit: true, ask: false, keep: true, plan: true, register: true });
    expect(pick(await getSite(owner, circuit.siteId))).toEqual({ edit: false, visit: false, ask: true, keep: false, plan: false, register: false });

    const route = await import('@/app/api/sites/[id]/route');
    session.actor = owner;
    const res = await call(route.GET as never, { path: `/api/sites/${circuit.siteId}`, params: { id: circuit.siteId } });
    expect(res.status).toBe(200);
    expect(pick(res.body as Awaited<ReturnType<typeof getSite>>)).toEqual({ edit: false, visit: false, ask: true, keep: false, plan: false, register: false });

    const other = await db.selectFrom('sites').select('id').where('company_id', '=', office.companyId).where('id', '!=', circuit.siteId).orderBy('name').executeTakeFirstOrThrow();
    await db.updateTable('sites').set({ archived_at: new Date() }).where('id', '=', other.id).execute();
    expect(pick(await getSite(office, other.id))).toEqual({ edit: true, visit: false, ask: false, keep: false, plan: false, register: false });
  });
});
