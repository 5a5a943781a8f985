import { sql, type Expression, type SqlBool } from 'kysely';
import { siteVisibleTo } from '@/lib/auth/scope';
import type { Actor } from '@/lib/auth/actor';

/**
 * Who sees which planned visits, in one place (for any query that joins `visit_plans` and
 * `sites`): staff see their company's plans, technicians included; an owner sees only their own
 * client's sites' plans, and never a cancelled one. Moves to lib/auth/scope.ts with the others.
 */
export function planVisibleTo(actor: Actor) {
  const site = siteVisibleTo(actor);
  return (): Expression<SqlBool> =>
    actor.role === 'client'
      ? sql<SqlBool>`(visit_plans.company_id = ${actor.companyId} and ${site()} and visit_plans.status <> 'cancelled')`
      : sql<SqlBool>`(visit_plans.company_id = ${actor.companyId} and ${site()})`;
}
