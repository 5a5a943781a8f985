import { sql, type Expression, type SqlBool } from 'kysely';
import type { Db } from '@/db/types';
import type { Actor } from '@/lib/auth/actor';
import { equipmentBaseQuery, refrigerantExpr } from '@/lib/equipment/queries';
import { PACK_HISTORY_PER_UNIT } from '@/lib/sites/pack-schema';

// Query builders of the site pack (no connection of their own): the service runs them, and the
// benchmark times the very same SQL through pg. One query per kind of thing, never one per unit.

/**
 * The units the pack carries: still on the site (removed and deleted ones left out). Stated once
 * so that the units and their history agree; `unit` is the name the query gives the equipment.
 */
function stillOnSite(siteId: string, unit: 'equipment' | 'unit') {
  const column = (name: 'site_id' | 'deleted_at' | 'status') => sql.ref(`${unit}.${name}`);
  return (): Expression<SqlBool> => sql<SqlBool>`(${column('site_id')} = ${siteId} and ${column('deleted_at')} is null and ${column('status')} != 'removed')`;
}

/** Units still on the site, with their attached tag's code. */
export function packUnitsQuery(actor: Actor, db: Db, siteId: string) {
  return equipmentBaseQuery(actor, db)
    .leftJoin('tags', (join) => join.onRef('tags.equipment_id', '=', 'equipment.id').on('tags.state', '=', 'attached'))
    .where(stillOnSite(siteId, 'equipment'))
    .select([
      'equipment.id',
      'equipment.name',
      'equipment.type',
      'equipment.area_id',
      'areas.name as area_name',
      'equipment.system_id',
      'systems.name as system_name',
      refrigerantExpr.as('refrigerant'),
      'equipment.make',
      'equipment.model',
      'equipment.serial',
      'equipment.nameplate',
      'tags.code as tag_code',
      'equipment.condition',
      'equipment.condition_note',
      'equipment.status',
    ])
    .orderBy(sql`lower(equipment.name)`)
    .orderBy('equipment.id');
}

/**
 * The newest PACK_HISTORY_PER_UNIT live entries of every current unit on the site, in one query: a
 * lateral join walks entries_equipment_time_idx once per unit and stops at the cap.
 */
export function packHistoryQuery(actor: Actor, db: Db, siteId: string) {
  return db
    .selectFrom('equipment as unit')
    .innerJoinLateral(
      (eb) =>
        eb
          .selectFrom('entries')
          .whereRef('entries.equipment_id', '=', 'unit.id')
          .where('entries.voided_at', 'is', null)
          .select(['entries.id', 'entries.visit_id', 'entries.kind', 'entries.data', 'entries.computed', 'entries.recorded_at', 'entries.created_by'])
          .orderBy('entries.recorded_at', 'desc')
          .orderBy('entries.id', 'desc')
          .limit(PACK_HISTORY_PER_UNIT)
          .as('e'),
      (join) => join.onTrue(),
    )
    .innerJoin('visits', 'visits.id', 'e.visit_id')
    .innerJoin('users as author', 'author.id', 'e.created_by')
    .innerJoin('users as tech', 'tech.id', 'visits.technician_id')
    .innerJoin('sites as visit_site', 'visit_site.id', 'visits.site_id')
    .where('unit.company_id', '=', actor.companyId)
    .where(stillOnSite(siteId, 'unit'))
    .select([
      'e.id',
      'e.visit_id',
      'unit.id as equipment_id',
      'e.kind',
      'e.data',
      'e.computed',
      'e.recorded_at',
      'author.name as author_name',
      'visits.reason as visit_reason',
      'visits.started_at as visit_started_at',
      'visits.status as visit_status',
      'tech.name as technician_name',
      'visit_site.time_zone as visit_time_zone',
    ])
    .orderBy('unit.id')
    .orderBy('e.recorded_at', 'desc')
    .orderBy('e.id', 'desc');
}

/** Follow-ups still to do at the site, oldest first. */
export function packFollowUpsQuery(actor: Actor, db: Db, siteId: string) {
  return db
    .selectFrom('follow_ups')
    .where('follow_ups.company_id', '=', actor.companyId)
    .where('follow_ups.site_id', '=', siteId)
    .where('follow_ups.status', 'in', ['open', 'scheduled'])
    .select(['id', 'equipment_id', 'title', 'severity', 'status', 'scheduled_for', 'created_at'])
    .orderBy('created_at')
    .orderBy('id');
}

/** The viewer's own newest open visit at the site. */
export function packOpenVisitQuery(actor: Actor, db: Db, siteId: string) {
  return db
    .selectFrom('visits')
    .where('site_id', '=', siteId)
    .where('company_id', '=', actor.companyId)
    .where('technician_id', '=', actor.id)
    .where('status', '=', 'open')
    .select(['id', 'reason', 'started_at'])
    .orderBy('started_at', 'desc')
    .limit(1);
}
