import 'server-only';
import { sql, type Kysely, type Transaction } from 'kysely';
import type { DB } from '@/db/schema.gen';
import type { Actor } from '@/lib/auth/actor';
import { atVisibleSite, planVisibleTo } from '@/lib/auth/scope';
import type { VisitReason } from '@/lib/visits/terms';

export interface PlannedCover {
  planId: string;
  systemId: string;
  day: string;
  reason: VisitReason;
  technicianName: string;
}

/**
 * Plans that cover each system, for the due list: a plan still to be done (planned, or started
 * with its visit open) covers the systems it names, the systems of the units it names, and, when
 * it names neither, every system of its site. Earliest day first.
 */
export async function plannedCover(actor: Actor, systemIds: string[], db: Kysely<DB> | Transaction<DB>): Promise<PlannedCover[]> {
  if (systemIds.length === 0) return [];
  return db
    .selectFrom('visit_plans')
    .$call(atVisibleSite(actor, 'visit_plans', planVisibleTo(actor)))
    .innerJoin('systems', 'systems.site_id', 'visit_plans.site_id')
    .innerJoin('users as tech', 'tech.id', 'visit_plans.technician_id')
    .where('systems.id', 'in', systemIds)
    .where(
      sql<boolean>`(visit_plans.status = 'planned'
        or (visit_plans.status = 'started' and exists (select 1 from visits v where v.id = visit_plans.visit_id and v.status = 'open')))`,
    )
    .where(
      sql<boolean>`(exists (select 1 from visit_plan_systems ps where ps.plan_id = visit_plans.id and ps.system_id = systems.id)
        or exists (select 1 from visit_plan_equipment pe join equipment e on e.id = pe.equipment_id where pe.plan_id = visit_plans.id and e.system_id = systems.id)
        or (not exists (select 1 from visit_plan_systems ps where ps.plan_id = visit_plans.id)
            and not exists (select 1 from visit_plan_equipment pe where pe.plan_id = visit_plans.id)))`,
    )
    .select(['visit_plans.id as planId', 'systems.id as systemId', 'visit_plans.day', 'visit_plans.reason', 'tech.name as technicianName'])
    .orderBy('visit_plans.day')
    .execute() as Promise<PlannedCover[]>;
}
