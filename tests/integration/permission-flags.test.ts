// Permission flags sent with the data (lib/*/permissions.ts, the follow-ups and requests
// services): what each role may do on a visit, an entry, a follow-up, a request, a site, a unit
// and its tag, a system, a client, a plan and a scanned blank tag, as the page reads it and as
// the API sends it, and the service refusing exactly what a flag says no to.
import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import type { Actor } from '@/lib/auth/actor';
import { createFollowUp, getFollowUp, listFollowUps, updateFollowUp } from '@/lib/follow-ups/service';
import { createRequest, getRequest, listRequests } from '@/lib/requests/service';
import { closeVisit } from '@/lib/visits/close';
import { addEntry, voidEntry } from '@/lib/visits/entries';
import { equipmentHistory } from '@/lib/visits/history';
import { getVisit, listVisits, markReviewed, startVisit } from '@/lib/visits/service';
import { actorFor, createTestDb, demoEmails } from '@/tests/helpers/db';
import { demoWithCircuit, type CoolerCircuit } from '@/tests/helpers/registry';
import { call, mockAuthModule, session } from '@/tests/helpers/session';
import type { ClientFlags } from '@/lib/clients/permissions';
import { createEquipmentSchema, createRelationSchema } from '@/lib/equipment/schemas';
import { createSiteSchema } from '@/lib/sites/schemas';
import type { EquipmentFlags } from '@/lib/equipment/permissions';
import type { PlanFlags } from '@/lib/plans/permissions';
import type { SystemFlags } from '@/lib/systems/permissions';

vi.mock('@/lib/auth', () => mockAuthModule());

const db = createTestDb();
let tech: Actor, office: Actor, admin: Actor, owner: Actor;
let circuit: CoolerCircuit;
const note = (equipmentId: string, text: string) => ({ equipmentId, clientEntryId: randomUUID(), kind: 'note' as const, data: { text } });
const flags = (v: { canAddEntries: boolean; canClose: boolean; canReview: boolean; canReopen: boolean }) => ({
  canAddEntries: v.canAddEntries,
  canClose: v.canClose,
  canReview: v.canReview,
  canReopen: v.canReopen,
});
const none = { canAddEntries: false, canClose: false, canReview: false, canReopen: false };

beforeAll(async () => {
  ({ tech, office, owner, circuit } = await demoWithCircuit(db));
  admin = await actorFor(db, demoEmails.admin);
});

/** GET a record through its route handler as `actor`, as the browser's hooks would. */
async function apiGet<T>(actor: Actor, routeModule: Promise<{ GET: unknown }>, path: string, id: string): Promise<T> {
  const route = await routeModule;
  session.actor = actor;
  const res = await call(route.GET as never, { path, params: { id } });
  expect(res.status).toBe(200);
  return res.body as T;
}
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

describe('equipment flags', () => {
  const pick = (e: EquipmentFlags) => ({
    edit: e.canEdit,
    delete: e.canDelete,
    relations: e.canEditRelations,
    visit: e.canStartVisit,
    photo: e.canUploadPhoto,
    ask: e.canAskForService,
    log: e.canLogRequest,
    tag: e.canAttachTag,
    print: e.canPrintTag,
  });
  const live = {
    tech: { edit: true, delete: false, relations: true, visit: true, photo: true, ask: false, log: false, tag: true, print: false },
    office: { edit: true, delete: true, relations: true, visit: true, photo: true, ask: false, log: true, tag: true, print: true },
    owner: { edit: false, delete: false, relations: false, visit: false, photo: false, ask: true, log: false, tag: false, print: false },
  };

  it('say who edits, deletes, works on, tags and asks for service on a unit, page and API alike; a removed unit takes no new work', async () => {
    const { getEquipment, addRelation, removeRelation, updateEquipment } = await import('@/lib/equipment/service');
    const { getEquipmentTagInfo } = await import('@/lib/tags/service');
    const id = circuit.evaporatorId;
    expect(pick(await getEquipment(tech, id))).toEqual(live.tech);
    expect(pick(await getEquipment(office, id))).toEqual(live.office);
    expect(pick(await getEquipment(admin, id))).toEqual(live.office);
    expect(pick(await getEquipment(owner, id))).toEqual(live.owner);
    // The API sends the same flags the page reads, and the tag panel's flags follow the unit's.
    expect(pick(await apiGet<EquipmentFlags>(owner, import('@/app/api/equipment/[id]/route'), `/api/equipment/${id}`, id))).toEqual(live.owner);
    expect(pick(await apiGet<EquipmentFlags>(tech, import('@/app/api/equipment/[id]/route'), `/api/equipment/${id}`, id))).toEqual(live.tech);
    const tagFlags = async (actor: Actor) => {
      const info = await getEquipmentTagInfo(actor, id);
      return { attach: info.canAttach, print: info.canPrint };
    };
    expect(await tagFlags(tech)).toEqual({ attach: true, print: false });
    expect(await tagFlags(office)).toEqual({ attach: true, print: true });
    expect(await tagFlags(owner)).toEqual({ attach: false, print: false });

    // A connection made while the unit is in service; then the unit is removed.
    const relations = await addRelation(office, id, createRelationSchema.parse({ kind: 'controls', otherId: circuit.thermostatId, direction: 'to' }));
    await updateEquipment(office, id, { status: 'removed' });
    const removed = { relations: false, visit: false, ask: false, log: false, tag: false, print: false };
    expect(pick(await getEquipment(office, id))).toEqual({ ...live.office, ...removed });
    expect(pick(await getEquipment(tech, id))).toEqual({ ...live.tech, ...removed });
    expect(pick(await getEquipment(owner, id))).toEqual({ ...live.owner, ...removed });
    expect(await tagFlags(office)).toEqual({ attach: false, print: false });
    // The services refuse what the flags now deny.
    await expect(addRelation(office, id, createRelationSchema.parse({ kind: 'serves', otherId: circuit.condensingUnitId, direction: 'from' }))).rejects.toMatchObject({ code: 'validation_failed' });
    await expect(removeRelation(office, id, relations[0]!.id)).rejects.toMatchObject({ code: 'conflict' });
    await expect(createRequest(owner, { siteId: circuit.siteId, equipmentId: id, description: 'The old unit is warm.', urgency: 'soon' })).rejects.toMatchObject({ code: 'validation_failed' });
    // Editing stays open: it is how a unit is brought back.
    const back = await updateEquipment(office, id, { status: 'in_service' });
    expect(pick(back)).toEqual(live.office);
  });

  it('a removed unit gets no new tag, and the scan of a blank tag says who may register a unit with it', async () => {
    const { createPrintRun, getPrintRun } = await import('@/lib/tags/print-runs');
    const { attachTag, resolveTag } = await import('@/lib/tags/service');
    const { updateEquipment } = await import('@/lib/equipment/service');
    const run = await createPrintRun(office, { kind: 'blank', siteId: circuit.siteId, count: 2, layoutId: 'letter-30', startPosition: 1 });
    const [code, spare] = (await getPrintRun(office, run.id)).tags.map((t) => t.code) as [string, string];
    const blank = async (actor: Actor) => {
      const r = await resolveTag(actor, code);
      return r.state === 'blank' ? { claim: r.canClaim, create: r.canCreateEquipment } : r.state;
    };
    expect(await blank(tech)).toEqual({ claim: true, create: true });
    expect(await blank(office)).toEqual({ claim: true, create: true });
    expect(await blank(admin)).toEqual({ claim: true, create: true });
    expect(await blank(owner)).toEqual({ claim: false, create: false });
    await expect(attachTag(owner, code, { equipmentId: circuit.lowControlId })).rejects.toMatchObject({ code: 'forbidden' });

    await updateEquipment(office, circuit.lowControlId, { status: 'removed' });
    await expect(attachTag(tech, code, { equipmentId: circuit.lowControlId })).rejects.toMatchObject({ code: 'validation_failed' });
    expect(await blank(tech)).toEqual({ claim: true, create: true });
    // A unit in service takes it.
    expect((await attachTag(tech, spare, { equipmentId: circuit.thermostatId })).equipmentId).toBe(circuit.thermostatId);
  });
});

describe('system flags', () => {
  it('say who edits, archives, registers units on and plans for a system; an archived one takes no new unit', async () => {
    const { getSystem, setSystemArchived } = await import('@/lib/systems/service');
    const { createEquipment } = await import('@/lib/equipment/service');
    const pick = (s: SystemFlags) => ({ edit: s.canEdit, archive: s.canArchive, register: s.canRegisterEquipment, plan: s.canPlan });
    const id = circuit.systemId;
    expect(pick(await getSystem(tech, id))).toEqual({ edit: false, archive: false, register: true, plan: false });
    expect(pick(await getSystem(office, id))).toEqual({ edit: true, archive: true, register: true, plan: true });
    expect(pick(await getSystem(admin, id))).toEqual({ edit: true, archive: true, register: true, plan: true });
    expect(pick(await getSystem(owner, id))).toEqual({ edit: false, archive: false, register: false, plan: false });
    expect(pick(await apiGet<SystemFlags>(owner, import('@/app/api/systems/[id]/route'), `/api/systems/${id}`, id))).toEqual({ edit: false, archive: false, register: false, plan: false });
    await expect(setSystemArchived(tech, id, true)).rejects.toMatchObject({ code: 'forbidden' });

    await setSystemArchived(office, id, true);
    expect(pick(await getSystem(office, id))).toEqual({ edit: true, archive: true, register: false, plan: false });
    expect(pick(await getSystem(tech, id))).toEqual({ edit: false, archive: false, register: false, plan: false });
    const second = createEquipmentSchema.parse({ siteId: circuit.siteId, systemId: id, type: 'evaporator', name: 'Second evaporator', nameplate: {} });
    await expect(createEquipment(tech, second)).rejects.toMatchObject({ code: 'validation_failed' });
    await setSystemArchived(office, id, false);
    expect((await createEquipment(tech, second)).systemId).toBe(id);
  });
});

describe('client flags', () => {
  it('say who edits, archives, adds sites to and keeps the contacts of a client; an archived one gets no new site', async () => {
    const { getClient, setClientArchived } = await import('@/lib/clients/service');
    const pick = (c: ClientFlags) => ({ edit: c.canEdit, archive: c.canArchive, site: c.canAddSite, contacts: c.canManageContacts });
    const id = owner.clientId!;
    const none = { edit: false, archive: false, site: false, contacts: false };
    expect(pick(await getClient(tech, id))).toEqual(none);
    expect(pick(await getClient(office, id))).toEqual({ edit: true, archive: true, site: true, contacts: true });
    expect(pick(await getClient(admin, id))).toEqual({ edit: true, archive: true, site: true, contacts: true });
    expect(pick(await getClient(owner, id))).toEqual(none);
    expect(pick(await apiGet<ClientFlags>(owner, import('@/app/api/clients/[id]/route'), `/api/clients/${id}`, id))).toEqual(none);
    expect(pick(await apiGet<ClientFlags>(office, import('@/app/api/clients/[id]/route'), `/api/clients/${id}`, id))).toEqual({ edit: true, archive: true, site: true, contacts: true });

    await setClientArchived(office, id, true);
    try {
      expect(pick(await getClient(office, id))).toEqual({ edit: true, archive: true, site: false, contacts: true });
      const { createSite } = await import('@/lib/sites/service');
      await expect(createSite(office, createSiteSchema.parse({ clientId: id, name: 'Annex flags' }))).rejects.toMatchObject({ code: 'validation_failed' });
    } finally {
      await setClientArchived(office, id, false);
    }
  });
});

describe('plan flags', () => {
  it('only the technician a plan names starts it, from its day on; the office changes it; an owner opens its visit once closed', async () => {
    const { createPlan, getPlan, listPlans } = await import('@/lib/plans/service');
    const { localDate } = await import('@/lib/format/dates');
    const { addDays } = await import('@/lib/plans/days');
    const site = await db.selectFrom('sites').select('time_zone').where('id', '=', circuit.siteId).executeTakeFirstOrThrow();
    const today = localDate(new Date(), site.time_zone);
    const plan = (day: string) =>
      createPlan(office, { siteId: circuit.siteId, systemIds: [circuit.systemId], equipmentIds: [], reason: 'maintenance', technicianId: tech.id, day, windowStart: '08:00', windowEnd: '10:00' });
    const todays = await plan(today);
    const later = await plan(addDays(today, 3));
    const pick = (p: { canChange: boolean; canStart: boolean }) => ({ change: p.canChange, start: p.canStart });
    expect(pick(await getPlan(tech, todays.id))).toEqual({ change: false, start: true });
    expect(pick(await getPlan(tech, later.id))).toEqual({ change: false, start: false });
    expect(pick(await getPlan(office, todays.id))).toEqual({ change: true, start: false });
    expect(pick(await getPlan(admin, todays.id))).toEqual({ change: true, start: false });
    expect(pick(await getPlan(owner, todays.id))).toEqual({ change: false, start: false });
    expect(pick(await apiGet<PlanFlags>(tech, import('@/app/api/plans/[id]/route'), `/api/plans/${todays.id}`, todays.id))).toEqual({ change: false, start: true });
    // The list says who may plan a new visit.
    expect((await listPlans(office, { limit: 10 })).canCreate).toBe(true);
    expect((await listPlans(admin, { limit: 10 })).canCreate).toBe(true);
    expect((await listPlans(tech, { limit: 10 })).canCreate).toBe(false);
    expect((await listPlans(owner, { limit: 10 })).canCreate).toBe(false);

    // Starting refuses what canStart denies: another person, or a later day.
    await expect(startVisit(office, { siteId: circuit.siteId, reason: 'maintenance', planId: todays.id })).rejects.toMatchObject({ code: 'validation_failed' });
    await expect(startVisit(tech, { siteId: circuit.siteId, reason: 'maintenance', planId: later.id })).rejects.toMatchObject({ code: 'validation_failed' });
    expect((await getPlan(office, later.id)).status).toBe('planned');
    const visit = await startVisit(tech, { siteId: circuit.siteId, reason: 'maintenance', planId: todays.id });

    // The started visit: staff open it; an owner only once it is closed (scope.ts), page and API alike.
    expect((await getPlan(office, todays.id)).visitId).toBe(visit.id);
    expect((await getPlan(owner, todays.id)).visitId).toBeNull();
    expect((await apiGet<{ visitId: string | null }>(owner, import('@/app/api/plans/[id]/route'), `/api/plans/${todays.id}`, todays.id)).visitId).toBeNull();
    await closeVisit(tech, visit.id, { summary: 'Planned maintenance done.', confirmBypassRemoved: false }, db, { report: 'on-download' });
    expect((await getPlan(owner, todays.id)).visitId).toBe(visit.id);
  });
});
