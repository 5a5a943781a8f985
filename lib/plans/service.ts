import 'server-only';
import { sql, type Kysely, type Transaction, type Updateable } from 'kysely';
import { db as defaultDb } from '@/db';
import type { DB } from '@/db/schema.gen';
import type { Db, QueryRow } from '@/db/types';
import { assertCan } from '@/lib/auth/access';
import type { Actor } from '@/lib/auth/actor';
import { recordAudit } from '@/lib/audit/service';
import { AppError, foundOr404 } from '@/lib/errors';
import { localDate } from '@/lib/format/dates';
import { kickMailDelivery } from '@/lib/mail/outbox';
import { addDays, isOverdue } from '@/lib/plans/days';
import type { PlanDto, PlanPage } from '@/lib/plans/dto';
import { planFlags, planListFlags } from '@/lib/plans/permissions';
import { queuePlanMail, type PlanMailEvent } from '@/lib/plans/mail';
import type { CancelPlanInput, CreatePlanInput, ListPlansQuery, MovePlanInput } from '@/lib/plans/schemas';
import { atVisibleSite, planVisibleTo, visitVisibleTo } from '@/lib/auth/scope';
import type { PlanStatus } from '@/lib/plans/terms';
import type { VisitReason } from '@/lib/visits/terms';

// Planned visits: the office plans, moves and cancels; a technician starts one (through
// startVisit, which calls linkPlanToVisit in its transaction). Every change is audited in the same
// transaction, and the client's contacts' e-mail is queued there too when the company wants it.

function planQuery(actor: Actor, db: Db) {
  return db
    .selectFrom('visit_plans')
    .$call(atVisibleSite(actor, 'visit_plans', planVisibleTo(actor)))
    .innerJoin('clients', 'clients.id', 'sites.client_id')
    .innerJoin('users as tech', 'tech.id', 'visit_plans.technician_id')
    .leftJoin('visits', 'visits.id', 'visit_plans.visit_id')
    .select([
      'visit_plans.id',
      'visit_plans.site_id',
      'sites.name as site_name',
      'clients.name as client_name',
      'sites.time_zone',
      'visit_plans.reason',
      'visit_plans.technician_id',
      'tech.name as technician_name',
      'visit_plans.day',
      sql<string>`to_char(visit_plans.window_start, 'HH24:MI')`.as('window_start'),
      sql<string>`to_char(visit_plans.window_end, 'HH24:MI')`.as('window_end'),
      'visit_plans.status',
      'visit_plans.note',
      // The started visit only when the viewer may open it (scope.ts: an owner, once it is closed).
      sql<string | null>`case when ${visitVisibleTo(actor)()} then visits.id end`.as('visit_id'),
      'visit_plans.cancel_reason',
      'visit_plans.updated_at',
      sql<{ id: string; name: string }[]>`coalesce((select json_agg(json_build_object('id', s.id, 'name', s.name) order by s.name)
        from visit_plan_systems ps join systems s on s.id = ps.system_id where ps.plan_id = visit_plans.id), '[]'::json)`.as('systems'),
      sql<{ id: string; name: string }[]>`coalesce((select json_agg(json_build_object('id', e.id, 'name', e.name) order by e.name)
        from visit_plan_equipment pe join equipment e on e.id = pe.equipment_id where pe.plan_id = visit_plans.id), '[]'::json)`.as('equipment'),
    ]);
}

type PlanRow = QueryRow<typeof planQuery>;

function toPlanDto(actor: Actor, r: PlanRow, now: Date): PlanDto {
  const status = r.status as PlanStatus;
  const siteToday = localDate(now, r.time_zone);
  return {
    id: r.id,
    siteId: r.site_id,
    siteName: r.site_name,
    clientName: r.client_name,
    timeZone: r.time_zone,
    reason: r.reason as VisitReason,
    technicianId: r.technician_id,
    technicianName: r.technician_name,
    day: r.day,
    windowStart: r.window_start,
    windowEnd: r.window_end,
    status,
    overdue: isOverdue({ status, day: r.day }, siteToday),
    siteToday,
    note: r.note,
    visitId: r.visit_id,
    cancelReason: r.cancel_reason,
    systems: r.systems,
    equipment: r.equipment,
    ...planFlags(actor, { status, technicianId: r.technician_id, day: r.day }, siteToday),
    updatedAt: r.updated_at.toISOString(),
  };
}

export async function getPlan(actor: Actor, id: string, db: Db = defaultDb, now = new Date()): Promise<PlanDto> {
  assertCan(actor, 'plans.read');
  const row = foundOr404(await planQuery(actor, db).where('visit_plans.id', '=', id).executeTakeFirst(), 'Planned visit not found.');
  return toPlanDto(actor, row, now);
}

/** Plans by day, window and technician; `from`/`to` are calendar days (inclusive). */
export async function listPlans(actor: Actor, query: ListPlansQuery, db: Db = defaultDb, now = new Date()): Promise<PlanPage> {
  assertCan(actor, 'plans.read');
  let q = planQuery(actor, db);
  if (query.from) q = q.where('visit_plans.day', '>=', query.from);
  if (query.to) q = q.where('visit_plans.day', '<=', query.to);
  if (query.siteId) q = q.where('visit_plans.site_id', '=', query.siteId);
  if (query.technicianId) q = q.where('visit_plans.technician_id', '=', query.technicianId);
  if (query.status?.length) q = q.where('visit_plans.status', 'in', query.status);
  const rows = await q.orderBy('visit_plans.day').orderBy('visit_plans.window_start').orderBy('tech.name').orderBy('visit_plans.id').limit(query.limit).execute();
  return { items: rows.map((r) => toPlanDto(actor, r, now)), nextCursor: null, ...planListFlags(actor) };
}

/** What a site's page shows: plans from the site's today on, planned or started. */
export async function upcomingPlansForSite(actor: Actor, siteId: string, db: Db = defaultDb, now = new Date()): Promise<PlanDto[]> {
  const today = now.toISOString().slice(0, 10);
  const page = await listPlans(actor, { siteId, status: ['planned', 'started'], from: addDays(today, -1), limit: 20 }, db, now);
  return page.items.filter((p) => p.day >= p.siteToday);
}

function invalid(path: string, message: string): AppError {
  return new AppError('validation_failed', 'Some fields need attention.', [{ path, message }]);
}

async function checkTechnician(actor: Actor, technicianId: string, trx: Db): Promise<void> {
  const tech = await trx
    .selectFrom('users')
    .select('id')
    .where('id', '=', technicianId)
    .where('company_id', '=', actor.companyId)
    .where('role', '=', 'technician')
    .where('deactivated_at', 'is', null)
    .executeTakeFirst();
  if (!tech) throw invalid('technicianId', 'Choose one of your technicians.');
}

function checkDay(day: string, siteToday: string): void {
  if (day < siteToday) throw invalid('day', 'Choose today or a later day (site time).');
  if (day > addDays(siteToday, 731)) throw invalid('day', 'Choose a day within the next two years.');
}

/** Locks the plan row and reads its site's time zone; outside the caller's scope it is not found. */
async function lockPlan(actor: Actor, id: string, trx: Db) {
  const row = await trx
    .selectFrom('visit_plans')
    .$call(atVisibleSite(actor, 'visit_plans', planVisibleTo(actor)))
    .where('visit_plans.id', '=', id)
    .select(['visit_plans.id', 'visit_plans.status', 'visit_plans.site_id', 'sites.time_zone'])
    .forUpdate()
    .executeTakeFirst();
  if (!row) throw new AppError('not_found', 'Planned visit not found.');
  return row;
}

function refuseUnlessPlanned(status: string, doing: string): void {
  if (status === 'started') throw new AppError('conflict', `This visit was already started, so it cannot be ${doing}.`);
  if (status === 'cancelled') throw new AppError('conflict', `This plan was cancelled, so it cannot be ${doing}.`);
}

async function afterCommit<T>(result: { value: T; mailed: boolean }): Promise<T> {
  if (result.mailed) kickMailDelivery();
  return result.value;
}

async function notify(actor: Actor, plan: PlanDto, event: PlanMailEvent, trx: Db, before?: PlanDto): Promise<boolean> {
  return (await queuePlanMail(actor, plan, event, trx, before)) > 0;
}

export async function createPlan(actor: Actor, input: CreatePlanInput, db: Kysely<DB> = defaultDb, now = new Date()): Promise<PlanDto> {
  assertCan(actor, 'plans.write');
  const result = await db.transaction().execute(async (trx) => {
    const site = await trx
      .selectFrom('sites')
      .select(['id', 'time_zone', 'archived_at'])
      .where('id', '=', input.siteId)
      .where('company_id', '=', actor.companyId)
      .executeTakeFirst();
    if (!site) throw invalid('siteId', 'Choose one of your sites.');
    if (site.archived_at) throw invalid('siteId', 'This site is archived; restore it to plan a visit.');
    checkDay(input.day, localDate(now, site.time_zone));
    await checkTechnician(actor, input.technicianId, trx);
    const systemIds = [...new Set(input.systemIds)];
    const equipmentIds = [...new Set(input.equipmentIds)];
    if (systemIds.length) {
      const found = await trx.selectFrom('systems').select('id').where('id', 'in', systemIds).where('site_id', '=', site.id).where('archived_at', 'is', null).execute();
      if (found.length !== systemIds.length) throw invalid('systemIds', 'Choose systems of this site.');
    }
    if (equipmentIds.length) {
      const found = await trx
        .selectFrom('equipment')
        .select('id')
        .where('id', 'in', equipmentIds)
        .where('site_id', '=', site.id)
        .where('deleted_at', 'is', null)
        .where('status', '<>', 'removed')
        .execute();
      if (found.length !== equipmentIds.length) throw invalid('equipmentIds', 'Choose units of this site.');
    }
    const row = await trx
      .insertInto('visit_plans')
      .values({
        company_id: actor.companyId,
        site_id: site.id,
        reason: input.reason,
        technician_id: input.technicianId,
        day: input.day,
        window_start: input.windowStart,
        window_end: input.windowEnd,
        note: input.note ?? null,
        created_by: actor.id,
        updated_by: actor.id,
      })
      .returning('id')
      .executeTakeFirstOrThrow();
    if (systemIds.length) await trx.insertInto('visit_plan_systems').values(systemIds.map((system_id) => ({ plan_id: row.id, system_id }))).execute();
    if (equipmentIds.length) await trx.insertInto('visit_plan_equipment').values(equipmentIds.map((equipment_id) => ({ plan_id: row.id, equipment_id }))).execute();
    const plan = await getPlan(actor, row.id, trx, now);
    await recordAudit(trx, actor, { action: 'create', entityType: 'visit_plan', entityId: row.id, after: plan });
    return { value: plan, mailed: await notify(actor, plan, 'planned', trx) };
  });
  return afterCommit(result);
}

/**
 * One change to a plan not yet started, in one transaction: the plan locked and refused unless
 * still planned, the columns `change` gives written (none: nothing changed, nothing recorded),
 * audited with before and after, and the client mailed when `mailFor` names an event.
 */
async function changePlanned(
  actor: Actor,
  id: string,
  step: { action: 'move' | 'cancel'; doing: string; db: Kysely<DB>; now: Date },
  change: (trx: Transaction<DB>, before: PlanDto, siteTimeZone: string) => Promise<Updateable<DB['visit_plans']> | null>,
  mailFor: (before: PlanDto, after: PlanDto) => PlanMailEvent | null,
): Promise<PlanDto> {
  assertCan(actor, 'plans.write');
  const result = await step.db.transaction().execute(async (trx) => {
    const locked = await lockPlan(actor, id, trx);
    refuseUnlessPlanned(locked.status, step.doing);
    const before = await getPlan(actor, id, trx, step.now);
    const columns = await change(trx, before, locked.time_zone);
    if (!columns) return { value: before, mailed: false };
    await trx.updateTable('visit_plans').set({ ...columns, updated_by: actor.id, updated_at: sql`now()` }).where('id', '=', id).execute();
    const after = await getPlan(actor, id, trx, step.now);
    await recordAudit(trx, actor, { action: step.action, entityType: 'visit_plan', entityId: id, before, after });
    const event = mailFor(before, after);
    return { value: after, mailed: event ? await notify(actor, after, event, trx, before) : false };
  });
  return afterCommit(result);
}

/** Another day, window or technician for a plan not yet started. */
export async function movePlan(actor: Actor, id: string, input: MovePlanInput, db: Kysely<DB> = defaultDb, now = new Date()): Promise<PlanDto> {
  return changePlanned(
    actor,
    id,
    { action: 'move', doing: 'moved', db, now },
    async (trx, before, siteTimeZone) => {
      if (before.day === input.day && before.windowStart === input.windowStart && before.windowEnd === input.windowEnd && before.technicianId === input.technicianId) {
        return null;
      }
      checkDay(input.day, localDate(now, siteTimeZone));
      await checkTechnician(actor, input.technicianId, trx);
      return { day: input.day, window_start: input.windowStart, window_end: input.windowEnd, technician_id: input.technicianId };
    },
    // The client cares about the day and hours, not which technician comes.
    (before, after) => (before.day !== after.day || before.windowStart !== after.windowStart || before.windowEnd !== after.windowEnd ? 'moved' : null),
  );
}

export async function cancelPlan(actor: Actor, id: string, input: CancelPlanInput, db: Kysely<DB> = defaultDb, now = new Date()): Promise<PlanDto> {
  return changePlanned(
    actor,
    id,
    { action: 'cancel', doing: 'cancelled', db, now },
    async () => ({ status: 'cancelled', cancel_reason: input.reason ?? null }),
    () => 'cancelled',
  );
}

/**
 * Marks a plan started by the visit just created, inside startVisit's transaction: the plan must
 * be the caller's company's, still planned, and for the same site.
 */
export async function linkPlanToVisit(actor: Actor, planId: string, visit: { id: string; siteId: string }, trx: Transaction<DB>): Promise<void> {
  assertCan(actor, 'visits.start');
  const locked = await lockPlan(actor, planId, trx).catch(() => {
    throw invalid('planId', 'This planned visit does not exist.');
  });
  refuseUnlessPlanned(locked.status, 'started again');
  if (locked.site_id !== visit.siteId) throw invalid('planId', 'This planned visit is for another site.');
  const before = await getPlan(actor, planId, trx);
  if (!before.canStart) throw invalid('planId', before.technicianId === actor.id ? 'This planned visit is for a later day.' : 'This planned visit is for another technician.');
  await trx.updateTable('visit_plans').set({ status: 'started', visit_id: visit.id, updated_by: actor.id, updated_at: sql`now()` }).where('id', '=', planId).execute();
  const after = await getPlan(actor, planId, trx);
  await recordAudit(trx, actor, { action: 'start', entityType: 'visit_plan', entityId: planId, before, after });
}
