import 'server-only';
import { sql, type Kysely } from 'kysely';
import { db as defaultDb } from '@/db';
import { atVisibleSite } from '@/lib/auth/scope';
import type { DB } from '@/db/schema.gen';
import type { Db, QueryRow } from '@/db/types';
import type { Page } from '@/lib/api/cursor';
import { keysetPage } from '@/lib/api/paging';
import { assertCan, can } from '@/lib/auth/access';
import type { Actor } from '@/lib/auth/actor';
import { recordAudit } from '@/lib/audit/service';
import { getEquipment } from '@/lib/equipment/service';
import { AppError, foundOr404 } from '@/lib/errors';
import type { CreateFollowUpInput, FollowUpStatus, ListFollowUpsQuery, UpdateFollowUpInput } from '@/lib/follow-ups/schemas';
import { getSite } from '@/lib/sites/service';
import type { FollowUpDto } from '@/lib/follow-ups/dto';
import type { Severity } from '@/lib/visits/schemas';

function followUpQuery(actor: Actor, db: Db) {
  return db
    .selectFrom('follow_ups')
    .$call(atVisibleSite(actor, 'follow_ups'))
    .leftJoin('equipment', 'equipment.id', 'follow_ups.equipment_id')
    .innerJoin('users as author', 'author.id', 'follow_ups.created_by')
    .leftJoin('users as closer', 'closer.id', 'follow_ups.closed_by')
    .select([
      'follow_ups.id',
      'follow_ups.site_id',
      'sites.name as site_name',
      'follow_ups.equipment_id',
      'equipment.name as equipment_name',
      'follow_ups.title',
      'follow_ups.severity',
      'follow_ups.status',
      'follow_ups.scheduled_for',
      'follow_ups.raised_visit_id',
      'follow_ups.closed_visit_id',
      'follow_ups.closed_at',
      'closer.name as closer_name',
      'follow_ups.resolution',
      'follow_ups.created_at',
      'author.name as author_name',
      sql<number>`floor(extract(epoch from (coalesce(follow_ups.closed_at, now()) - follow_ups.created_at)) / 86400)::int`.as('age_days'),
    ]);
}

type Row = QueryRow<typeof followUpQuery>;

function toDto(actor: Actor, r: Row): FollowUpDto {
  return {
    id: r.id,
    siteId: r.site_id,
    siteName: r.site_name,
    equipmentId: r.equipment_id,
    equipmentName: r.equipment_name,
    title: r.title,
    severity: r.severity as Severity,
    status: r.status as FollowUpStatus,
    scheduledFor: r.scheduled_for,
    raisedVisitId: r.raised_visit_id,
    closedVisitId: r.closed_visit_id,
    closedAt: r.closed_at?.toISOString() ?? null,
    closedByName: r.closer_name,
    resolution: r.resolution,
    createdAt: r.created_at.toISOString(),
    createdByName: r.author_name,
    ageDays: Number(r.age_days),
    canUpdate: can(actor, 'followups.write') && allowed[r.status as FollowUpStatus].length > 0,
  };
}

const severityRank = sql<number>`case follow_ups.severity when 'safety' then 0 when 'down' then 1 when 'degraded' then 2 else 3 end`;

/** Oldest first within the list; open and scheduled by default. */
export async function listFollowUps(actor: Actor, query: ListFollowUpsQuery, db: Db = defaultDb): Promise<Page<FollowUpDto>> {
  assertCan(actor, 'followups.read');
  let q = followUpQuery(actor, db);
  q = q.where('follow_ups.status', 'in', query.status ?? ['open', 'scheduled']);
  if (query.siteId) q = q.where('follow_ups.site_id', '=', query.siteId);
  if (query.equipmentId) q = q.where('follow_ups.equipment_id', '=', query.equipmentId);
  if (query.severity?.length) q = q.where('follow_ups.severity', 'in', query.severity);
  const oldestFirst = { key: 'follow_ups.created_at', id: 'follow_ups.id', direction: 'asc', cast: 'timestamptz' } as const;
  return keysetPage(q, oldestFirst, query, (r) => toDto(actor, r));
}

export async function getFollowUp(actor: Actor, id: string, db: Db = defaultDb): Promise<FollowUpDto> {
  assertCan(actor, 'followups.read');
  const row = foundOr404(await followUpQuery(actor, db).where('follow_ups.id', '=', id).executeTakeFirst(), 'Follow-up not found.');
  return toDto(actor, row);
}

export async function countOpenBySeverity(actor: Actor, siteId: string | null, db: Db = defaultDb): Promise<Record<Severity, number>> {
  assertCan(actor, 'followups.read');
  let q = db
    .selectFrom('follow_ups')
    .$call(atVisibleSite(actor, 'follow_ups'))
    .where('follow_ups.status', 'in', ['open', 'scheduled'])
    .select(['follow_ups.severity', (eb) => eb.fn.countAll<number>().as('n')])
    .groupBy('follow_ups.severity')
    .orderBy(severityRank);
  if (siteId) q = q.where('follow_ups.site_id', '=', siteId);
  const out: Record<Severity, number> = { safety: 0, down: 0, degraded: 0, minor: 0 };
  for (const r of await q.execute()) out[r.severity as Severity] = Number(r.n);
  return out;
}

export async function createFollowUp(actor: Actor, input: CreateFollowUpInput, db: Kysely<DB> = defaultDb): Promise<FollowUpDto> {
  assertCan(actor, 'followups.write');
  return db.transaction().execute(async (trx) => {
    await getSite(actor, input.siteId, trx);
    if (input.equipmentId) {
      const e = await getEquipment(actor, input.equipmentId, trx);
      if (e.siteId !== input.siteId) throw new AppError('validation_failed', 'That equipment is on another site.', [{ path: 'equipmentId', message: 'Choose equipment on this site.' }]);
    }
    const row = await trx
      .insertInto('follow_ups')
      .values({ company_id: actor.companyId, site_id: input.siteId, equipment_id: input.equipmentId ?? null, title: input.title, severity: input.severity, created_by: actor.id })
      .returning('id')
      .executeTakeFirstOrThrow();
    const dto = await getFollowUp(actor, row.id, trx);
    await recordAudit(trx, actor, { action: 'create', entityType: 'follow_up', entityId: row.id, after: dto });
    return dto;
  });
}

const allowed: Record<FollowUpStatus, FollowUpStatus[]> = {
  open: ['scheduled', 'resolved', 'declined'],
  scheduled: ['open', 'scheduled', 'resolved', 'declined'],
  resolved: [],
  declined: [],
};

export async function updateFollowUp(actor: Actor, id: string, input: UpdateFollowUpInput, db: Kysely<DB> = defaultDb): Promise<FollowUpDto> {
  assertCan(actor, 'followups.write');
  return db.transaction().execute(async (trx) => {
    const before = await getFollowUp(actor, id, trx);
    if (!allowed[before.status].includes(input.status)) {
      throw new AppError('conflict', `A ${before.status} follow-up cannot become ${input.status}.`);
    }
    let closedVisitId: string | null = null;
    if ((input.status === 'resolved' || input.status === 'declined') && input.visitId) {
      const visit = await trx.selectFrom('visits').select(['id', 'site_id']).where('id', '=', input.visitId).where('company_id', '=', actor.companyId).executeTakeFirst();
      if (!visit || visit.site_id !== before.siteId) throw new AppError('validation_failed', 'Choose a visit at this site.', [{ path: 'visitId', message: 'That visit is not at this site.' }]);
      closedVisitId = visit.id;
    }
    const closing = input.status === 'resolved' || input.status === 'declined';
    await trx
      .updateTable('follow_ups')
      .set({
        status: input.status,
        scheduled_for: input.status === 'scheduled' ? input.scheduledFor : input.status === 'open' ? null : sql`scheduled_for`,
        resolution: 'resolution' in input ? (input.resolution ?? null) : sql`resolution`,
        closed_at: closing ? sql`now()` : null,
        closed_by: closing ? actor.id : null,
        closed_visit_id: closing ? closedVisitId : null,
        updated_at: sql`now()`,
      })
      .where('id', '=', id)
      .execute();
    const after = await getFollowUp(actor, id, trx);
    await recordAudit(trx, actor, { action: 'update', entityType: 'follow_up', entityId: id, before, after });
    return after;
  });
}
