import 'server-only';
import { sql, type Kysely } from 'kysely';
import { db as defaultDb } from '@/db';
import { atVisibleSite, visitVisibleTo } from '@/lib/auth/scope';
import type { DB } from '@/db/schema.gen';
import type { Db, QueryRow } from '@/db/types';
import type { Page } from '@/lib/api/cursor';
import { keysetPage } from '@/lib/api/paging';
import { assertCan } from '@/lib/auth/access';
import type { Actor } from '@/lib/auth/actor';
import { auditedChange } from '@/lib/audit/change';
import { recordAudit } from '@/lib/audit/service';
import { AppError } from '@/lib/errors';
import { linkPlanToVisit } from '@/lib/plans/service';
import { getSite } from '@/lib/sites/service';
import type { EntryDto, VisitDetailDto, VisitDto } from '@/lib/visits/dto';
import { entryCanVoid, mayWorkOnVisit, visitFlags } from '@/lib/visits/permissions';
import { entryQuery } from '@/lib/visits/queries';
import type { EntryKind, ListVisitsQuery, StartVisitInput, VisitReason } from '@/lib/visits/schemas';

// Visits: starting, reading, listing, reopening and reviewing. Entries are lib/visits/entries.ts,
// closing (with its report and e-mail) lib/visits/close.ts, history lib/visits/history.ts.


function visitQuery(actor: Actor, db: Db) {
  return db
    .selectFrom('visits')
    .$call(atVisibleSite(actor, 'visits'))
    .innerJoin('clients', 'clients.id', 'sites.client_id')
    .innerJoin('users as tech', 'tech.id', 'visits.technician_id')
    .select((eb) => [
      'visits.id',
      'visits.site_id',
      'sites.name as site_name',
      'clients.name as client_name',
      'sites.time_zone',
      'visits.technician_id',
      'tech.name as technician_name',
      'visits.reason',
      'visits.status',
      'visits.started_at',
      'visits.ended_at',
      'visits.summary',
      'visits.reviewed_at',
      'visits.reopened_at',
      'visits.report_key',
      eb.selectFrom('entries').whereRef('entries.visit_id', '=', 'visits.id').where('entries.voided_at', 'is', null).select(eb.fn.countAll<number>().as('n')).as('entry_count'),
    ]);
}

type VisitRow = QueryRow<typeof visitQuery>;

function toVisitDto(actor: Actor, r: VisitRow): VisitDto {
  const facts = {
    id: r.id,
    siteId: r.site_id,
    siteName: r.site_name,
    clientName: r.client_name,
    timeZone: r.time_zone,
    technicianId: r.technician_id,
    technicianName: r.technician_name,
    reason: r.reason as VisitReason,
    status: r.status as VisitDto['status'],
    startedAt: r.started_at.toISOString(),
    endedAt: r.ended_at?.toISOString() ?? null,
    summary: r.summary,
    reviewedAt: r.reviewed_at?.toISOString() ?? null,
    reopenedAt: r.reopened_at?.toISOString() ?? null,
    hasReport: Boolean(r.report_key),
    entryCount: Number(r.entry_count ?? 0),
  };
  return { ...facts, ...visitFlags(actor, facts) };
}

/** Owners see a visit only once it is closed (lib/auth/scope.ts). */
function visibleVisits(actor: Actor, db: Db) {
  return visitQuery(actor, db).where(visitVisibleTo(actor));
}

export async function getVisitSummary(actor: Actor, id: string, db: Db = defaultDb): Promise<VisitDto> {
  assertCan(actor, 'visits.read');
  const row = await visibleVisits(actor, db).where('visits.id', '=', id).executeTakeFirst();
  if (!row) throw new AppError('not_found', 'Visit not found.');
  return toVisitDto(actor, row);
}

export type EntryRow = QueryRow<typeof entryQuery>;

/** `canVoid` comes from `entryCanVoid` (lib/visits/permissions.ts), which the caller runs with the entry's visit. */
export function toEntryDto(r: EntryRow, canVoid: boolean): EntryDto {
  return {
    id: r.id,
    visitId: r.visit_id,
    equipmentId: r.equipment_id,
    equipmentName: r.equipment_name,
    equipmentType: r.equipment_type,
    kind: r.kind as EntryKind,
    data: r.data as Record<string, unknown>,
    computed: (r.computed as Record<string, unknown> | null) ?? null,
    recordedAt: r.recorded_at.toISOString(),
    createdBy: r.created_by,
    createdByName: r.author_name,
    voidedAt: r.voided_at?.toISOString() ?? null,
    voidReason: r.void_reason,
    clientEntryId: r.client_entry_id,
    canVoid,
  };
}

function openBypasses(entries: EntryDto[]): VisitDetailDto['openBypasses'] {
  const removed = new Set(entries.filter((e) => e.kind === 'action' && typeof e.data.bypassRemovalOf === 'string').map((e) => e.data.bypassRemovalOf as string));
  return entries
    .filter((e) => e.kind === 'action' && e.data.bypassedControl === true && !e.voidedAt && !removed.has(e.id))
    .map((e) => ({ entryId: e.id, description: String(e.data.bypassDescription ?? 'a control') }));
}

export async function getVisit(actor: Actor, id: string, db: Db = defaultDb): Promise<VisitDetailDto> {
  const visit = await getVisitSummary(actor, id, db);
  const rows = await entryQuery(db).where('entries.visit_id', '=', id).orderBy('entries.recorded_at').orderBy('entries.id').execute();
  const entries = rows.map((r) => toEntryDto(r, entryCanVoid(actor, visit, { createdBy: r.created_by, voidedAt: r.voided_at?.toISOString() ?? null })));
  return { ...visit, entries, openBypasses: openBypasses(entries) };
}

export async function listVisits(actor: Actor, query: ListVisitsQuery, db: Db = defaultDb): Promise<Page<VisitDto>> {
  assertCan(actor, 'visits.read');
  let q = visibleVisits(actor, db);
  if (query.siteId) q = q.where('visits.site_id', '=', query.siteId);
  if (query.status) q = q.where('visits.status', '=', query.status);
  if (query.technicianId) q = q.where('visits.technician_id', '=', query.technicianId);
  if (query.review === 'needed') q = q.where('visits.status', '=', 'closed').where('visits.reviewed_at', 'is', null);
  const newestFirst = { key: 'visits.started_at', id: 'visits.id', direction: 'desc', cast: 'timestamptz' } as const;
  return keysetPage(q, newestFirst, query, (r) => toVisitDto(actor, r));
}

export async function startVisit(actor: Actor, input: StartVisitInput, db: Kysely<DB> = defaultDb): Promise<VisitDto> {
  assertCan(actor, 'visits.start');
  return db.transaction().execute(async (trx) => {
    if (input.id) {
      // A start sent again (made without signal, or its answer lost): the first one stands.
      const earlier = await trx.selectFrom('visits').select(['technician_id', 'site_id']).where('id', '=', input.id).where('company_id', '=', actor.companyId).executeTakeFirst();
      if (earlier) {
        if (earlier.technician_id !== actor.id || earlier.site_id !== input.siteId) throw new AppError('conflict', 'This visit id is already in use.');
        return getVisitSummary(actor, input.id, trx);
      }
    }
    const site = await getSite(actor, input.siteId, trx);
    if (site.archivedAt) throw new AppError('validation_failed', 'This site is archived.');
    const open = await openVisitOf(trx, actor.id, input.siteId);
    if (open) throw new AppError('conflict', `You already have an open visit at this site (${open.id}). Continue it or close it first.`);
    const row = await trx
      .insertInto('visits')
      .values({
        ...(input.id ? { id: input.id } : {}),
        company_id: actor.companyId,
        site_id: input.siteId,
        technician_id: actor.id,
        reason: input.reason,
        started_at: input.startedAt ? new Date(input.startedAt) : sql`now()`,
      })
      .returning('id')
      .executeTakeFirstOrThrow();
    if (input.planId) await linkPlanToVisit(actor, input.planId, { id: row.id, siteId: input.siteId }, trx);
    const visit = await getVisitSummary(actor, row.id, trx);
    await recordAudit(trx, actor, { action: 'create', entityType: 'visit', entityId: row.id, after: visit });
    return visit;
  });
}

/** The technician works on their own open visit; office and admin may add to any open one. */
export async function openVisitForWriting(actor: Actor, visitId: string, trx: Db): Promise<VisitDto> {
  const visit = await getVisitSummary(actor, visitId, trx);
  if (visit.status !== 'open') throw new AppError('conflict', 'This visit is closed. Ask the office to reopen it to add entries.');
  if (!mayWorkOnVisit(actor, visit)) throw new AppError('forbidden', 'Only the visit’s technician can add entries.');
  return visit;
}

export async function reopenVisit(actor: Actor, visitId: string, db: Kysely<DB> = defaultDb): Promise<VisitDto> {
  assertCan(actor, 'visits.review');
  return auditedChange(db, actor, { entityType: 'visit', id: visitId, action: 'reopen' }, (trx) => getVisitSummary(actor, visitId, trx), async (trx, before) => {
    if (before.status === 'open') throw new AppError('conflict', 'This visit is already open.');
    if (await openVisitOf(trx, before.technicianId, before.siteId)) throw new AppError('conflict', 'The technician has another open visit at this site; close it first.');
    await trx.updateTable('visits').set({ status: 'open', reopened_at: sql`now()`, reopened_by: actor.id, updated_at: sql`now()` }).where('id', '=', visitId).execute();
  });
}

/** A technician's open visit at a site: at most one (the unique index visits_one_open_idx), checked first for a clear message. */
function openVisitOf(trx: Db, technicianId: string, siteId: string) {
  return trx.selectFrom('visits').select('id').where('technician_id', '=', technicianId).where('site_id', '=', siteId).where('status', '=', 'open').executeTakeFirst();
}

export async function markReviewed(actor: Actor, visitId: string, db: Kysely<DB> = defaultDb): Promise<VisitDto> {
  assertCan(actor, 'visits.review');
  return auditedChange(db, actor, { entityType: 'visit', id: visitId, action: 'review' }, (trx) => getVisitSummary(actor, visitId, trx), async (trx, before) => {
    if (before.status !== 'closed') throw new AppError('conflict', 'Only a closed visit can be reviewed.');
    await trx.updateTable('visits').set({ reviewed_at: sql`now()`, reviewed_by: actor.id }).where('id', '=', visitId).execute();
  });
}
