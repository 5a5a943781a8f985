import 'server-only';
import { sql } from 'kysely';
import { db as defaultDb } from '@/db';
import { siteVisibleTo, visitVisibleTo } from '@/lib/auth/scope';
import type { Db } from '@/db/types';
import { openLeaks } from '@/lib/attention/open-leaks';
import { assertCan } from '@/lib/auth/access';
import type { Actor } from '@/lib/auth/actor';
import { ageYearsSql, pastExpectedLifeSql as pastExpectedLife, serviceLifeTable } from '@/lib/overview/service-life-sql';
import type { Severity } from '@/lib/visits/schemas';


export interface SiteSummary {
  siteId: string;
  siteName: string;
  clientName: string;
  /** The site's own zone, to show its last visit on its calendar. */
  timeZone: string;
  equipmentCount: number;
  /** Count per condition rating 1–5, and units not yet rated. */
  byCondition: { 1: number; 2: number; 3: number; 4: number; 5: number; unrated: number };
  openFollowUps: Record<Severity, number>;
  systemsOverLeakThreshold: number;
  pastExpectedLife: number;
  lastVisitAt: string | null;
}

/**
 * The visible units counted per site (archived sites too): in all, per condition rating, and past
 * their expected life. Counted in SQL, so an owner with thousands of units gets a row per site;
 * one scan serves both the site cards and the condition chart.
 */
function unitCountsBySite(actor: Actor, siteId: string | null, db: Db, today: Date) {
  return db
    .selectFrom('equipment')
    .innerJoin('sites', 'sites.id', 'equipment.site_id')
    .leftJoin(serviceLifeTable().as('life'), 'life.type', 'equipment.type')
    .where(siteVisibleTo(actor))
    .where('equipment.deleted_at', 'is', null)
    .where('equipment.status', '<>', 'removed')
    .$if(Boolean(siteId), (q) => q.where('equipment.site_id', '=', siteId!))
    .select([
      'equipment.site_id',
      sql<number>`count(*)::int`.as('n'),
      sql<number>`(count(*) filter (where equipment.condition = 1))::int`.as('c1'),
      sql<number>`(count(*) filter (where equipment.condition = 2))::int`.as('c2'),
      sql<number>`(count(*) filter (where equipment.condition = 3))::int`.as('c3'),
      sql<number>`(count(*) filter (where equipment.condition = 4))::int`.as('c4'),
      sql<number>`(count(*) filter (where equipment.condition = 5))::int`.as('c5'),
      sql<number>`(count(*) filter (where ${pastExpectedLife(today)}))::int`.as('past_life'),
    ])
    .groupBy('equipment.site_id')
    .execute();
}

type UnitCounts = Awaited<ReturnType<typeof unitCountsBySite>>;

/** One row per visible site, from a handful of grouped queries sent at once (no per-site round trips). */
export async function siteSummaries(actor: Actor, db: Db = defaultDb, today = new Date()): Promise<SiteSummary[]> {
  assertCan(actor, 'overview.read');
  return summariesFrom(actor, db, today, unitCountsBySite(actor, null, db, today));
}

async function summariesFrom(actor: Actor, db: Db, today: Date, unitCounts: Promise<UnitCounts>): Promise<SiteSummary[]> {
  // Each site's last closed visit found through its own index entry (visits_closed_site_idx), not by
  // grouping every visit of the company.
  const sitesQuery = db
    .selectFrom('sites')
    .innerJoin('clients', 'clients.id', 'sites.client_id')
    .leftJoinLateral(
      (eb) => eb.selectFrom('visits').whereRef('visits.site_id', '=', 'sites.id').where('visits.status', '=', 'closed').select('visits.started_at').orderBy('visits.started_at', 'desc').limit(1).as('last_visit'),
      (join) => join.onTrue(),
    )
    .where(siteVisibleTo(actor))
    .where('sites.archived_at', 'is', null)
    .select(['sites.id', 'sites.name', 'sites.time_zone', 'clients.name as client_name', 'last_visit.started_at as last_visit_at'])
    .orderBy('clients.name')
    .orderBy('sites.name')
    .execute();

  const followQuery = db
    .selectFrom('follow_ups')
    .innerJoin('sites', 'sites.id', 'follow_ups.site_id')
    .where(siteVisibleTo(actor))
    .where('follow_ups.status', 'in', ['open', 'scheduled'])
    .select(['follow_ups.site_id', 'follow_ups.severity', (eb) => eb.fn.countAll<number>().as('n')])
    .groupBy(['follow_ups.site_id', 'follow_ups.severity'])
    .execute();

  // Independent lookups: sent at once rather than one round trip after another.
  const [sites, equipment, follow, leaks] = await Promise.all([sitesQuery, unitCounts, followQuery, openLeaks(actor, null, db, today)]);
  if (sites.length === 0) return [];
  const out = new Map<string, SiteSummary>(
    sites.map((s) => [
      s.id,
      {
        siteId: s.id,
        siteName: s.name,
        clientName: s.client_name,
        timeZone: s.time_zone,
        equipmentCount: 0,
        byCondition: { 1: 0, 2: 0, 3: 0, 4: 0, 5: 0, unrated: 0 },
        openFollowUps: { safety: 0, down: 0, degraded: 0, minor: 0 },
        systemsOverLeakThreshold: 0,
        pastExpectedLife: 0,
        lastVisitAt: s.last_visit_at ? new Date(s.last_visit_at).toISOString() : null,
      },
    ]),
  );
  for (const e of equipment) {
    const s = out.get(e.site_id);
    if (!s) continue;
    s.equipmentCount = e.n;
    s.byCondition = { 1: e.c1, 2: e.c2, 3: e.c3, 4: e.c4, 5: e.c5, unrated: e.n - e.c1 - e.c2 - e.c3 - e.c4 - e.c5 };
    s.pastExpectedLife = e.past_life;
  }
  for (const f of follow) {
    const s = out.get(f.site_id);
    if (s) s.openFollowUps[f.severity as Severity] = Number(f.n);
  }

  // Systems with a leak over the threshold that is not yet repaired and verified.
  const leakingSystems = new Map<string, Set<string>>();
  for (const l of leaks) {
    const set = leakingSystems.get(l.siteId) ?? new Set<string>();
    set.add(l.systemId ?? l.equipmentId);
    leakingSystems.set(l.siteId, set);
  }
  for (const [siteId, set] of leakingSystems) {
    const s = out.get(siteId);
    if (s) s.systemsOverLeakThreshold = set.size;
  }
  return [...out.values()];
}

/** Live units with an install day, as the age chart counts them. */
function agedUnits(actor: Actor, db: Db) {
  return db
    .selectFrom('equipment')
    .innerJoin('sites', 'sites.id', 'equipment.site_id')
    .where(siteVisibleTo(actor))
    .where('equipment.company_id', '=', actor.companyId)
    .where('equipment.deleted_at', 'is', null)
    .where('equipment.installed_on', 'is not', null)
    .where('equipment.status', '<>', 'removed');
}

/**
 * The 40 oldest for their expected life among an owner's units or one site's: a few thousand at
 * most, ranked directly. Walking each type's install-order index instead would pass over every
 * other client's units of the company first (about 50 ms at 5,000 of 105,000 units).
 */
function oldestAmongFew(actor: Actor, siteId: string | null, db: Db, today: Date) {
  return agedUnits(actor, db)
    .innerJoin(serviceLifeTable().as('life'), 'life.type', 'equipment.type')
    .$if(Boolean(siteId), (q) => q.where('equipment.site_id', '=', siteId!))
    .select(['equipment.name', ageYearsSql(today).as('age_years'), 'life.median_years'])
    .orderBy(sql`${ageYearsSql(today)} / life.median_years`, 'desc')
    .orderBy('equipment.name')
    .limit(40)
    .execute();
}

/**
 * The same for staff, who see every unit of the company: within one type the oldest for its life
 * is the earliest installed, so each type's first 40 in install order (index
 * equipment_type_age_idx) are merged and cut to 40.
 */
function oldestOfCompany(actor: Actor, db: Db, today: Date) {
  return db
    .selectFrom(serviceLifeTable().as('life'))
    .innerJoinLateral(
      () =>
        agedUnits(actor, db)
          .where(sql<boolean>`equipment.type = life.type`)
          .select(['equipment.name', ageYearsSql(today).as('age_years')])
          .orderBy('equipment.installed_on')
          .orderBy('equipment.name')
          .limit(40)
          .as('oldest'),
      (join) => join.onTrue(),
    )
    .select(['oldest.name', 'oldest.age_years', 'life.median_years'])
    .orderBy(sql`oldest.age_years / life.median_years`, 'desc')
    .orderBy('oldest.name')
    .limit(40)
    .execute();
}

export interface ChartData {
  conditionDistribution: { rating: string; count: number }[];
  ageVsLife: { name: string; ageYears: number; medianYears: number }[];
  /** Per circuit (its system, or the unit when it has none) and the site it is on. */
  refrigerantAddedByYear: { year: number; system: string; site: string; kg: number }[];
  visitsPerMonth: { month: string; visits: number }[];
}

/** What the owner's charts plot, for all visible sites or one. */
export async function chartData(actor: Actor, siteId: string | null, db: Db = defaultDb, today = new Date()): Promise<ChartData> {
  assertCan(actor, 'overview.read');
  return chartsFrom(actor, siteId, db, today, unitCountsBySite(actor, siteId, db, today));
}

/** The owner home's site cards and charts, with the units counted once for both. */
export async function ownerOverview(actor: Actor, db: Db = defaultDb, today = new Date()): Promise<{ summaries: SiteSummary[]; charts: ChartData }> {
  assertCan(actor, 'overview.read');
  const unitCounts = unitCountsBySite(actor, null, db, today);
  const [summaries, charts] = await Promise.all([summariesFrom(actor, db, today, unitCounts), chartsFrom(actor, null, db, today, unitCounts)]);
  return { summaries, charts };
}

async function chartsFrom(actor: Actor, siteId: string | null, db: Db, today: Date, unitCounts: Promise<UnitCounts>): Promise<ChartData> {
  // Counted and ranked in SQL: the charts need six counts (unitCounts) and the 40 oldest units
  // for their expected life, not every unit.
  const oldestQuery = actor.role === 'client' || siteId ? oldestAmongFew(actor, siteId, db, today) : oldestOfCompany(actor, db, today);
  const addedQuery = db
    .selectFrom('entries')
    .innerJoin('equipment', 'equipment.id', 'entries.equipment_id')
    .innerJoin('sites', 'sites.id', 'equipment.site_id')
    .leftJoin('systems', 'systems.id', 'entries.system_id')
    .innerJoin('visits', 'visits.id', 'entries.visit_id')
    .where(siteVisibleTo(actor))
    .where('entries.kind', '=', 'refrigerant')
    .where('entries.voided_at', 'is', null)
    .where(sql<boolean>`entries.data->>'direction' = 'added'`)
    .where(visitVisibleTo(actor))
    .$if(Boolean(siteId), (q) => q.where('equipment.site_id', '=', siteId!))
    .select([
      sql<number>`extract(year from entries.recorded_at)::int`.as('year'),
      sql<string>`coalesce(systems.name, equipment.name)`.as('system'),
      'sites.name as site',
      sql<number>`sum((entries.data->>'amountKg')::float8)`.as('kg'),
    ])
    .groupBy([sql`1`, sql`2`, 'sites.id', 'sites.name'])
    .orderBy(sql`1`)
    .execute();
  const since = new Date(Date.UTC(today.getUTCFullYear(), today.getUTCMonth() - 11, 1));
  const visitsQuery = db
    .selectFrom('visits')
    .innerJoin('sites', 'sites.id', 'visits.site_id')
    .where(siteVisibleTo(actor))
    .where('visits.status', '=', 'closed')
    .where('visits.started_at', '>=', since)
    .$if(Boolean(siteId), (q) => q.where('visits.site_id', '=', siteId!))
    .select([sql<string>`to_char(date_trunc('month', visits.started_at), 'YYYY-MM')`.as('month'), (eb) => eb.fn.countAll<number>().as('n')])
    .groupBy(sql`1`)
    .execute();
  // Independent queries: sent at once.
  const [perSite, oldest, added, visits] = await Promise.all([unitCounts, oldestQuery, addedQuery, visitsQuery]);
  const labels: Record<string, string> = { '5': '5 like new', '4': '4 good', '3': '3 fair', '2': '2 poor', '1': '1 failing', unrated: 'not rated' };
  const counts = new Map<string, number>(Object.keys(labels).map((k) => [k, 0]));
  const add = (key: string, n: number) => counts.set(key, counts.get(key)! + n);
  for (const c of perSite) {
    add('1', c.c1);
    add('2', c.c2);
    add('3', c.c3);
    add('4', c.c4);
    add('5', c.c5);
    add('unrated', c.n - c.c1 - c.c2 - c.c3 - c.c4 - c.c5);
  }
  const ageVsLife = oldest.map((e) => ({ name: e.name, ageYears: Math.round(Number(e.age_years) * 10) / 10, medianYears: Number(e.median_years) }));
  const perMonth = new Map(visits.map((v) => [v.month, Number(v.n)]));
  const months = Array.from({ length: 12 }, (_, i) => {
    const d = new Date(Date.UTC(since.getUTCFullYear(), since.getUTCMonth() + i, 1));
    return d.toISOString().slice(0, 7);
  });
  return {
    conditionDistribution: [...counts].map(([k, n]) => ({ rating: labels[k]!, count: n })),
    ageVsLife,
    refrigerantAddedByYear: added.map((a) => ({ year: Number(a.year), system: a.system, site: a.site, kg: Math.round(Number(a.kg) * 100) / 100 })),
    visitsPerMonth: months.map((m) => ({ month: m, visits: perMonth.get(m) ?? 0 })),
  };
}
