// Planned visits through their service: who sees which plans (owners, a second client, another
// company, technicians of the company), the office alone plans, moves and cancels, each change
// audited, the e-mail to the client's contacts only when the company turns it on, starting a
// visit from a plan, overdue plans, and the due list counting covered work as planned.
import { sql } from 'kysely';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Actor } from '@/lib/auth/actor';
import { localDate } from '@/lib/format/dates';
import { dueWork } from '@/lib/overview/due';
import { addDays } from '@/lib/plans/days';
import { createPlanSchema, movePlanSchema } from '@/lib/plans/schemas';
import { officeToday, plansForTechnician } from '@/lib/plans/scheduling';
import { cancelPlan, createPlan, getPlan, listPlans, movePlan, upcomingPlansForSite } from '@/lib/plans/service';
import { startVisit } from '@/lib/visits/service';
import { actorFor, createOtherCompany, createTestDb, demoActors, demoEmails, resetToDemo } from '@/tests/helpers/db';

const db = createTestDb();
let office: Actor;
let tech: Actor;
let otherTech: Actor;
let owner: Actor;
let ownerTwo: Actor;
let otherAdmin: Actor;
let site: { id: string; time_zone: string };
let siteOfClientTwo: string;
let systemId: string;
let today: string;

const base = () => ({ siteId: site.id, systemIds: [systemId], equipmentIds: [], reason: 'maintenance' as const, technicianId: tech.id, day: addDays(today, 1), windowStart: '08:00', windowEnd: '10:00' });

async function auditActions(planId: string): Promise<string[]> {
  const rows = await db.selectFrom('audit_events').select('action').where('entity_type', '=', 'visit_plan').where('entity_id', '=', planId).orderBy('created_at').orderBy('id').execute();
  return rows.map((r) => r.action);
}

async function outboxFor(kind: string): Promise<{ to_addresses: string[]; subject: string; text_body: string }[]> {
  return db.selectFrom('mail_outbox').select(['to_addresses', 'subject', 'text_body']).where('kind', '=', kind).execute();
}

beforeAll(async () => {
  await resetToDemo(db);
  ({ office, technician: tech, client: owner, clientTwo: ownerTwo } = await demoActors(db));
  await db.insertInto('users').values({ company_id: office.companyId, email: 'second-tech@example.test', name: 'Second Technician', role: 'technician' }).execute();
  otherTech = await actorFor(db, 'second-tech@example.test');
  const other = await createOtherCompany(db);
  otherAdmin = await actorFor(db, other.adminEmail);
  site = await db.selectFrom('sites').select(['id', 'time_zone']).where('client_id', '=', owner.clientId!).orderBy('name').executeTakeFirstOrThrow();
  siteOfClientTwo = (await db.selectFrom('sites').select('id').where('client_id', '=', ownerTwo.clientId!).executeTakeFirstOrThrow()).id;
  today = localDate(new Date(), site.time_zone);
  // A system made today with a 14-day interval: its first maintenance is due in two weeks.
  systemId = (
    await db
      .insertInto('systems')
      .values({ company_id: office.companyId, site_id: site.id, name: 'Plan test circuit', refrigerant: 'R-404A', application: 'commercial_refrigeration', maintenance_interval_days: 14 })
      .returning('id')
      .executeTakeFirstOrThrow()
  ).id;
});
afterAll(async () => {
  await db.destroy();
});

describe('planned visits', () => {
  it('only the office plans; the plan is audited and named as asked', async () => {
    await expect(createPlan(tech, base())).rejects.toMatchObject({ code: 'forbidden' });
    await expect(createPlan(owner, base())).rejects.toMatchObject({ code: 'forbidden' });
    const plan = await createPlan(office, { ...base(), note: 'Bring coil cleaner.' });
    expect(plan).toMatchObject({ status: 'planned', siteId: site.id, technicianId: tech.id, windowStart: '08:00', windowEnd: '10:00', overdue: false, canChange: true });
    expect(plan.systems.map((s) => s.id)).toEqual([systemId]);
    expect(await auditActions(plan.id)).toEqual(['create']);
  });

  it('scopes plans: the own client’s owner, the company’s technicians; not a second client or another company', async () => {
    const plan = await createPlan(office, base());
    expect((await listPlans(owner, { limit: 200 })).items.map((p) => p.id)).toContain(plan.id);
    expect((await listPlans(ownerTwo, { limit: 200 })).items.map((p) => p.id)).not.toContain(plan.id);
    await expect(getPlan(ownerTwo, plan.id)).rejects.toMatchObject({ code: 'not_found' });
    await expect(getPlan(otherAdmin, plan.id)).rejects.toMatchObject({ code: 'not_found' });
    expect((await listPlans(otherAdmin, { limit: 200 })).items).toEqual([]);
    // Technicians see their company's plans, their own and a colleague's alike.
    expect((await listPlans(otherTech, { limit: 200 })).items.map((p) => p.id)).toContain(plan.id);
    // Starting is the named technician's, from the plan's day on: this one is tomorrow (permission-flags.test.ts has the rest).
    expect((await getPlan(tech, plan.id)).canStart).toBe(false);
    expect((await getPlan(tech, plan.id)).canChange).toBe(false);
    // The technician's home lists their own plans only.
    expect((await plansForTechnician(tech)).map((p) => p.id)).toContain(plan.id);
    expect((await plansForTechnician(otherTech)).map((p) => p.id)).not.toContain(plan.id);
    // The owner's site page lists it; the other client's owner cannot reach that site's plans.
    expect((await upcomingPlansForSite(owner, site.id)).map((p) => p.id)).toContain(plan.id);
    expect(await upcomingPlansForSite(ownerTwo, site.id)).toEqual([]);
    // A plan at the second client's site is theirs alone.
    const theirs = await createPlan(office, { ...base(), siteId: siteOfClientTwo, systemIds: [] });
    expect((await listPlans(owner, { limit: 200 })).items.map((p) => p.id)).not.toContain(theirs.id);
    expect((await listPlans(ownerTwo, { limit: 200 })).items.map((p) => p.id)).toContain(theirs.id);
  });

  it('refuses bad input and changes nothing', async () => {
    const before = await db.selectFrom('visit_plans').select(sql<number>`count(*)`.as('n')).executeTakeFirstOrThrow();
    expect(createPlanSchema.safeParse({ ...base(), windowStart: '10:00', windowEnd: '09:00' }).success).toBe(false);
    expect(movePlanSchema.safeParse({ technicianId: tech.id, day: '2026-13-01', windowStart: '08:00', windowEnd: '09:00' }).success).toBe(false);
    await expect(createPlan(office, { ...base(), day: addDays(today, -1) })).rejects.toMatchObject({ code: 'validation_failed', issues: [{ path: 'day' }] });
    await expect(createPlan(office, { ...base(), technicianId: office.id })).rejects.toMatchObject({ code: 'validation_failed', issues: [{ path: 'technicianId' }] });
    await expect(createPlan(office, { ...base(), siteId: siteOfClientTwo })).rejects.toMatchObject({ code: 'validation_failed', issues: [{ path: 'systemIds' }] });
    await expect(createPlan(otherAdmin, base())).rejects.toMatchObject({ code: 'validation_failed', issues: [{ path: 'siteId' }] });
    const after = await db.selectFrom('visit_plans').select(sql<number>`count(*)`.as('n')).executeTakeFirstOrThrow();
    expect(after.n).toBe(before.n);
  });

  it('moves and cancels with an audit of each change; a cancelled plan stays cancelled', async () => {
    const plan = await createPlan(office, base());
    await expect(movePlan(tech, plan.id, { technicianId: tech.id, day: addDays(today, 3), windowStart: '13:00', windowEnd: '15:00' })).rejects.toMatchObject({ code: 'forbidden' });
    const moved = await movePlan(office, plan.id, { technicianId: otherTech.id, day: addDays(today, 3), windowStart: '13:00', windowEnd: '15:00' });
    expect(moved).toMatchObject({ day: addDays(today, 3), windowStart: '13:00', windowEnd: '15:00', technicianId: otherTech.id });
    const moveEvent = await db
      .selectFrom('audit_events')
      .select(['before', 'after', 'actor_id'])
      .where('entity_id', '=', plan.id)
      .where('action', '=', 'move')
      .executeTakeFirstOrThrow();
    expect(moveEvent.actor_id).toBe(office.id);
    expect(moveEvent.before).toMatchObject({ day: addDays(today, 1), windowStart: '08:00', technicianId: tech.id });
    expect(moveEvent.after).toMatchObject({ day: addDays(today, 3), windowStart: '13:00', technicianId: otherTech.id });
    const cancelled = await cancelPlan(office, plan.id, { reason: 'Store closed for inventory.' });
    expect(cancelled).toMatchObject({ status: 'cancelled', cancelReason: 'Store closed for inventory.', canChange: false, canStart: false });
    expect(await auditActions(plan.id)).toEqual(['create', 'move', 'cancel']);
    await expect(movePlan(office, plan.id, { technicianId: tech.id, day: addDays(today, 4), windowStart: '08:00', windowEnd: '09:00' })).rejects.toMatchObject({ code: 'conflict' });
    await expect(cancelPlan(office, plan.id, {})).rejects.toMatchObject({ code: 'conflict' });
    // Owners never see cancelled plans; staff do.
    await expect(getPlan(owner, plan.id)).rejects.toMatchObject({ code: 'not_found' });
    expect((await getPlan(tech, plan.id)).status).toBe('cancelled');
  });

  it('e-mails the client’s contacts when planned or moved only when the company turns it on', async () => {
    await db.deleteFrom('mail_outbox').execute();
    const quiet = await createPlan(office, base());
    await movePlan(office, quiet.id, { technicianId: tech.id, day: addDays(today, 2), windowStart: '08:00', windowEnd: '10:00' });
    expect(await outboxFor('visit_plan_planned')).toEqual([]);
    expect(await outboxFor('visit_plan_moved')).toEqual([]);

    await db.updateTable('companies').set({ mail_visit_plans: true }).where('id', '=', office.companyId).execute();
    const plan = await createPlan(office, base());
    const planned = await outboxFor('visit_plan_planned');
    expect(planned).toHaveLength(1);
    expect(planned[0]!.to_addresses).toEqual([demoEmails.client]);
    expect(planned[0]!.text_body).toContain('Technician: Tomas Rivane');
    expect(planned[0]!.text_body).toContain('8:00 AM – 10:00 AM (site time)');
    // Another technician at the same hours tells the client nothing new; another day does.
    await movePlan(office, plan.id, { technicianId: otherTech.id, day: plan.day, windowStart: '08:00', windowEnd: '10:00' });
    expect(await outboxFor('visit_plan_moved')).toEqual([]);
    await movePlan(office, plan.id, { technicianId: otherTech.id, day: addDays(today, 5), windowStart: '07:30', windowEnd: '09:00' });
    const moved = await outboxFor('visit_plan_moved');
    expect(moved).toHaveLength(1);
    expect(moved[0]!.text_body).toMatch(/When: .*7:30 AM – 9:00 AM \(site time\)/);
    expect(moved[0]!.text_body).toMatch(/Was: .*8:00 AM – 10:00 AM \(site time\)/);
    // The other client's contact hears nothing of this site.
    expect([...planned, ...moved].flatMap((m) => m.to_addresses)).not.toContain(demoEmails.clientTwo);
    await db.updateTable('companies').set({ mail_visit_plans: false }).where('id', '=', office.companyId).execute();
  });

  it('starting a visit from a plan links the two; a plan starts once', async () => {
    const plan = await createPlan(office, { ...base(), day: today });
    const visit = await startVisit(tech, { siteId: site.id, reason: 'maintenance', planId: plan.id });
    const started = await getPlan(office, plan.id);
    expect(started).toMatchObject({ status: 'started', visitId: visit.id, canChange: false, canStart: false });
    expect(await auditActions(plan.id)).toEqual(['create', 'start']);
    await expect(movePlan(office, plan.id, { technicianId: tech.id, day: addDays(today, 1), windowStart: '08:00', windowEnd: '09:00' })).rejects.toMatchObject({ code: 'conflict' });
    // A second start of the same plan is refused and leaves no visit behind.
    const visitsBefore = await db.selectFrom('visits').select(sql<number>`count(*)`.as('n')).executeTakeFirstOrThrow();
    await expect(startVisit(otherTech, { siteId: site.id, reason: 'maintenance', planId: plan.id })).rejects.toMatchObject({ code: 'conflict' });
    // A plan for one site cannot start a visit at another.
    const elsewhere = await createPlan(office, { ...base(), siteId: siteOfClientTwo, systemIds: [] });
    await expect(startVisit(otherTech, { siteId: site.id, reason: 'maintenance', planId: elsewhere.id })).rejects.toMatchObject({ code: 'validation_failed' });
    const visitsAfter = await db.selectFrom('visits').select(sql<number>`count(*)`.as('n')).executeTakeFirstOrThrow();
    expect(visitsAfter.n).toBe(visitsBefore.n);
    expect((await getPlan(office, elsewhere.id)).status).toBe('planned');
  });

  it('a plan not started by its day shows as overdue, and stays on the technician’s home', async () => {
    const plan = await createPlan(office, { ...base(), day: addDays(today, 1) });
    const twoDaysLater = new Date(Date.now() + 2 * 86_400_000);
    expect((await getPlan(office, plan.id)).overdue).toBe(false);
    expect((await getPlan(office, plan.id, db, twoDaysLater)).overdue).toBe(true);
    expect((await plansForTechnician(tech, 7, db, twoDaysLater)).find((p) => p.id === plan.id)?.overdue).toBe(true);
  });

  it('the due list counts planned work as planned, not as due', async () => {
    const dueItem = async () => (await dueWork(office)).find((d) => d.systemId === systemId && d.kind === 'maintenance');
    // The plan started above still covers it while its visit is open.
    const started = (await listPlans(office, { status: ['started'], limit: 10 })).items[0]!;
    expect((await dueItem())?.planned?.planId).toBe(started.id);
    await db.updateTable('visits').set({ status: 'closed', ended_at: new Date(), summary: 'Done.' }).where('id', '=', started.visitId!).execute();
    await db.updateTable('visit_plans').set({ status: 'cancelled' }).where('status', '=', 'planned').execute();
    expect((await dueItem())?.planned).toBeNull();
    // A leak check does not cover maintenance.
    await createPlan(office, { ...base(), reason: 'leak_check' });
    expect((await dueItem())?.planned).toBeNull();
    // A maintenance visit for the whole site (no systems named) covers it.
    const plan = await createPlan(office, { ...base(), systemIds: [], day: addDays(today, 6) });
    expect((await dueItem())?.planned).toEqual({ planId: plan.id, day: addDays(today, 6), technicianName: 'Tomas Rivane' });
    await cancelPlan(office, plan.id, {});
    expect((await dueItem())?.planned).toBeNull();
  });

  it('the office’s today is the calendar day where most of its sites are, not UTC’s', async () => {
    const zones = await db.selectFrom('sites').select(['time_zone', (eb) => eb.fn.countAll<number>().as('n')]).where('company_id', '=', office.companyId).where('archived_at', 'is', null).groupBy('time_zone').orderBy('n', 'desc').orderBy('time_zone').execute();
    // 03:30 UTC on 5 March is still 4 March anywhere in the Americas, where the demo's sites are.
    const lateEvening = new Date('2027-03-05T03:30:00Z');
    expect(zones[0]!.time_zone).toMatch(/^America\//);
    expect(await officeToday(office, db, lateEvening)).toBe('2027-03-04');
    expect(await officeToday(office, db, new Date('2027-03-05T18:00:00Z'))).toBe('2027-03-05');
    // Each company's own sites decide: the other company's one site is in Tokyo, already 5 March.
    await db.updateTable('sites').set({ time_zone: 'Asia/Tokyo' }).where('company_id', '=', otherAdmin.companyId).execute();
    expect(await officeToday(otherAdmin, db, lateEvening)).toBe('2027-03-05');
    expect(await officeToday(office, db, lateEvening)).toBe('2027-03-04');
  });
});
