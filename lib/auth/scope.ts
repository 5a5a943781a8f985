import { sql, type Expression, type SelectQueryBuilder, type SqlBool } from 'kysely';
import type { DB } from '@/db/schema.gen';
import type { Actor } from '@/lib/auth/actor';
import { AppError } from '@/lib/errors';

// Who sees what, stated once; every query that filters by visibility uses these.
// - Staff (admin, office, technician) see everything of their own company.
// - An owner (a client user) sees their own client, its sites and what hangs from them (areas,
//   systems, units, photos, follow-ups, requests), and of the visits only the closed ones: an open
//   visit is work in progress. So its entries reach an owner only once it closes, everywhere they
//   show: history, charts, reports, attention lists and site cards.
// Records outside the scope read as "not found". Each filter is SQL for `.where(…)`, written
// against the table names (clients, sites, visits, entries, photos), so it fits any query that has
// those tables, whatever else it joins.

/** The client an owner is tied to; null for staff, who see every client of their company. */
export function clientScope(actor: Actor): string | null {
  if (actor.role !== 'client') return null;
  if (!actor.clientId) throw new AppError('forbidden', 'This account is not linked to a client.');
  return actor.clientId;
}

/** Whether open visits (and their entries) are shown to this actor. */
export function seesOpenVisits(actor: Actor): boolean {
  return actor.role !== 'client';
}

/** Site access notes (keys, codes, who to ask on arrival) are for the people who go there. */
export function seesSiteAccessNotes(actor: Actor): boolean {
  return actor.role !== 'client';
}

/**
 * The rule clients and sites share: of the actor's company, and for an owner also of their own
 * client (`client` is the column naming it: a client's id, a site's client_id).
 */
function ofCompanyAndClient(actor: Actor, company: 'clients.company_id' | 'sites.company_id', client: 'clients.id' | 'sites.client_id') {
  const clientId = clientScope(actor);
  const companyRef = sql.ref(company);
  const clientRef = sql.ref(client);
  return (): Expression<SqlBool> =>
    clientId === null
      ? sql<SqlBool>`${companyRef} = ${actor.companyId}`
      : sql<SqlBool>`(${companyRef} = ${actor.companyId} and ${clientRef} = ${clientId})`;
}

/** Clients: needs `clients` in the query. */
export function clientVisibleTo(actor: Actor) {
  return ofCompanyAndClient(actor, 'clients.company_id', 'clients.id');
}

/** Sites, and anything reached through a site (areas, systems, units, follow-ups): needs `sites`. */
export function siteVisibleTo(actor: Actor) {
  return ofCompanyAndClient(actor, 'sites.company_id', 'sites.client_id');
}

/** The records that hang from one site, each with its own company column. */
export type SiteRecordTable = 'equipment' | 'follow_ups' | 'photos' | 'service_requests' | 'systems' | 'visit_plans' | 'visits';

/**
 * A record that hangs from a site (a system, a unit, a visit, a follow-up, a request, a plan, a
 * photo through its unit): of
 * the actor's company and at a site the actor sees. Needs `table` and `sites` (the record's own).
 */
export function siteRecordVisibleTo(actor: Actor, table: SiteRecordTable) {
  const site = siteVisibleTo(actor);
  const companyId = sql.ref(`${table}.company_id`);
  return (): Expression<SqlBool> => sql<SqlBool>`(${companyId} = ${actor.companyId} and ${site()})`;
}

/**
 * For `.$call(…)` straight after `selectFrom(table)`: joins the record's own site (its `site_id`)
 * and keeps the rows the actor sees, so the filter always has the `sites` it needs. The filter is
 * `siteRecordVisibleTo` unless the table has its own rule (plans: `planVisibleTo`).
 */
export function atVisibleSite<T extends Exclude<SiteRecordTable, 'photos'>>(actor: Actor, table: T, visible = siteRecordVisibleTo(actor, table)) {
  // Named through sql.ref: Kysely's typed join columns cannot be spelled for a table still generic.
  const onOwnSite = sql<SqlBool>`${sql.ref('sites.id')} = ${sql.ref(`${table}.site_id`)}`;
  return <O>(query: SelectQueryBuilder<DB, T, O>) => query.innerJoin('sites', (join) => join.on(onOwnSite)).where(visible);
}

/** Visits: needs `visits` and `sites` (the visit's own site) in the query. */
export function visitVisibleTo(actor: Actor) {
  const site = siteVisibleTo(actor);
  return (): Expression<SqlBool> =>
    seesOpenVisits(actor) ? site() : sql<SqlBool>`(${site()} and visits.status = 'closed')`;
}

/**
 * Entries: needs only `entries` in the query. An owner's filter looks the entry's visit and its
 * site up itself, so it holds whatever the query joins (or does not).
 */
export function entryVisibleTo(actor: Actor) {
  const clientId = clientScope(actor);
  return (): Expression<SqlBool> =>
    clientId === null
      ? sql<SqlBool>`entries.company_id = ${actor.companyId}`
      : sql<SqlBool>`(entries.company_id = ${actor.companyId} and exists (select 1 from visits as scope_visit inner join sites as scope_site on scope_site.id = scope_visit.site_id where scope_visit.id = entries.visit_id and scope_visit.status = 'closed' and scope_site.client_id = ${clientId}))`;
}

/**
 * Rows of a table the database keeps per audience (condition_trends: each unit's last two ratings;
 * no_cooling_visits: each unit's no-cooling visits; see their migrations): staff read the row built
 * from everything of their company (no client), an owner the one built from closed visits on their
 * client's sites, the same entries and visits `entryVisibleTo` and `visitVisibleTo` let each see.
 */
export function keptRowsVisibleTo(actor: Actor, table: 'condition_trends' | 'no_cooling_visits') {
  const clientId = clientScope(actor);
  const company = sql.ref(`${table}.company_id`);
  const client = sql.ref(`${table}.client_id`);
  return (): Expression<SqlBool> =>
    clientId === null
      ? sql<SqlBool>`(${company} = ${actor.companyId} and ${client} is null)`
      : sql<SqlBool>`(${company} = ${actor.companyId} and ${client} = ${clientId})`;
}

/** Photos belong to their unit and are seen with it: needs `photos` and `sites` (the unit's). */
export function photoVisibleTo(actor: Actor) {
  return siteRecordVisibleTo(actor, 'photos');
}

/**
 * Planned visits: needs `visit_plans` and `sites`. Staff see their company's plans, technicians
 * included; an owner sees their own client's sites' plans, and never a cancelled one.
 */
export function planVisibleTo(actor: Actor) {
  const plan = siteRecordVisibleTo(actor, 'visit_plans');
  return (): Expression<SqlBool> => (actor.role === 'client' ? sql<SqlBool>`(${plan()} and visit_plans.status <> 'cancelled')` : plan());
}
