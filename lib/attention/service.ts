import 'server-only';
import { sql } from 'kysely';
import { z } from 'zod';
import { db as defaultDb } from '@/db';
import { keptRowsVisibleTo, siteVisibleTo } from '@/lib/auth/scope';
import type { Db } from '@/db/types';
import { assertCan } from '@/lib/auth/access';
import type { Actor } from '@/lib/auth/actor';
import { openLeaks } from '@/lib/attention/open-leaks';
import { compareRankKeys, describeUnit, PRIORITIES, rankKey, rankUnits, scoreUnits, type RankedUnit, type RankKey, type Signal, type UnitSignals } from '@/lib/attention/rank';
import { medianServiceLife, type EquipmentType } from '@/lib/calc/service-life';
import { ageYearsSql, pastExpectedLifeSql, serviceLifeTable } from '@/lib/overview/service-life-sql';
import { decodeCursor, encodeCursor } from '@/lib/api/cursor';
import { AppError } from '@/lib/errors';

const YEAR_MS = 365.25 * 86_400_000;

type Found = { id: string | null; signal: Signal };

function visibleUnits(actor: Actor, siteId: string | null, db: Db) {
  let q = db.selectFrom('equipment').innerJoin('sites', 'sites.id', 'equipment.site_id').where(siteVisibleTo(actor)).where('equipment.deleted_at', 'is', null).where('equipment.status', '<>', 'removed');
  if (siteId) q = q.where('equipment.site_id', '=', siteId);
  return q;
}

/**
 * Every signal but age, found from the few rows that carry one (follow-ups, entries, visits). The
 * unit itself (visible, not deleted, on the site asked for) is checked once, when the units are
 * loaded: a signal on a unit that fails it is dropped there, so these queries need not join it.
 */
async function findSignals(actor: Actor, siteId: string | null, db: Db, today: Date): Promise<Found[]> {
  const found: Found[] = [];
  const push = (id: string | null, signal: Signal) => found.push({ id, signal });

  const safetyQuery = visibleUnits(actor, siteId, db)
    .innerJoin('follow_ups', 'follow_ups.equipment_id', 'equipment.id')
    .where('follow_ups.status', 'in', ['open', 'scheduled'])
    .where('follow_ups.severity', '=', 'safety')
    .select(['equipment.id', 'follow_ups.id as follow_up_id', 'follow_ups.title', 'follow_ups.created_at'])
    .execute();

  // Two no-cooling visits within 90 days, from each unit's kept list of such visits as this actor
  // may see them (migration 2026_12_05_0800): only units whose second latest one is recent are
  // read, and their visits inside the window are picked and sorted as text in SQL.
  const noCoolingSince = new Date(today.getTime() - 90 * 86_400_000);
  const noCoolingQuery = db
    .selectFrom('no_cooling_visits')
    .where(keptRowsVisibleTo(actor, 'no_cooling_visits'))
    .where('no_cooling_visits.second_started_at', '>', noCoolingSince)
    .select([
      'no_cooling_visits.equipment_id as id',
      sql<string[]>`array(select w.v::text from unnest(no_cooling_visits.visit_ids, no_cooling_visits.started_ats) as w(v, s) where w.s > ${noCoolingSince} order by w.v::text)`.as('visit_ids'),
    ])
    .execute();

  // The last two ratings of each unit as this actor may see them, kept up to date by triggers
  // (migration 2026_12_05_0430), so only the units that got worse are read.
  const ratingsQuery = db
    .selectFrom('condition_trends')
    .where(keptRowsVisibleTo(actor, 'condition_trends'))
    .whereRef('condition_trends.latest_rating', '<', 'condition_trends.previous_rating')
    .$if(Boolean(siteId), (q) => q.where('condition_trends.equipment_id', 'in', (eb) => eb.selectFrom('equipment').select('equipment.id').where('equipment.site_id', '=', siteId!)))
    .select(['condition_trends.equipment_id', 'condition_trends.latest_visit_id as visit_id', 'condition_trends.latest_rating as to', 'condition_trends.previous_rating as from'])
    .execute();
  // Independent lookups: sent at once, pushed in a fixed order (ties among a unit's reasons keep it).
  const [safety, leaks, noCooling, ratings] = await Promise.all([safetyQuery, openLeaks(actor, siteId, db, today), noCoolingQuery, ratingsQuery]);
  for (const r of safety) push(r.id, { kind: 'open_safety_finding', followUpId: r.follow_up_id, title: r.title, since: r.created_at.toISOString().slice(0, 10) });
  for (const l of leaks) {
    push(l.equipmentId, {
      kind: 'leak_over_threshold',
      visitId: l.visitId,
      ratePct: l.ratePct,
      thresholdPct: l.thresholdPct,
      repairDueDate: l.repairDueDate,
      on: l.recordedAt.toISOString().slice(0, 10),
      repairedOn: l.standing.state === 'repaired' ? l.standing.repairedOn : null,
      verificationFailed: l.standing.state === 'repaired' && l.standing.failedTest,
    });
  }

  for (const r of noCooling) push(r.id, { kind: 'repeat_no_cooling', visitIds: r.visit_ids });
  for (const r of ratings) push(r.equipment_id, { kind: 'condition_worsening', from: Number(r.from), to: Number(r.to), visitId: r.visit_id });
  return found;
}

/** The units named by `found` (and, with `pastLife`, every unit past its expected life), with their signals. */
async function unitsWithSignals(actor: Actor, siteId: string | null, db: Db, today: Date, found: Found[], pastLife: boolean): Promise<UnitSignals[]> {
  const withSignal = [...new Set(found.flatMap((f) => (f.id ? [f.id] : [])))];
  if (!pastLife && withSignal.length === 0) return [];
  const units = await visibleUnits(actor, siteId, db)
    .leftJoin(serviceLifeTable().as('life'), 'life.type', 'equipment.type')
    .where((eb) => eb.or([...(pastLife ? [eb(pastExpectedLifeSql(today), '=', true)] : []), ...(withSignal.length > 0 ? [eb('equipment.id', 'in', withSignal)] : [])]))
    .select(['equipment.id', 'equipment.name', 'equipment.type', 'equipment.installed_on', 'equipment.site_id', 'sites.name as site_name'])
    .execute();
  const byId = new Map<string, UnitSignals>(
    units.map((u) => [u.id, { equipmentId: u.id, equipmentName: u.name, equipmentType: u.type, siteId: u.site_id, siteName: u.site_name, signals: [] as Signal[] }]),
  );
  for (const f of found) if (f.id) byId.get(f.id)?.signals.push(f.signal);

  for (const u of units) {
    if (!u.installed_on) continue;
    const life = medianServiceLife(u.type as EquipmentType);
    if (!life) continue;
    const age = (today.getTime() - Date.parse(`${u.installed_on}T00:00:00Z`)) / YEAR_MS;
    if (age > life.medianYears) byId.get(u.id)?.signals.push({ kind: 'past_expected_life', ageYears: age, medianYears: life.medianYears });
  }
  return [...byId.values()];
}

/** Signals of the units the actor can see (optionally one site) that have any, gathered in a few grouped queries (no per-unit round trips). */
export async function gatherSignals(actor: Actor, siteId: string | null, db: Db = defaultDb, today = new Date()): Promise<UnitSignals[]> {
  return unitsWithSignals(actor, siteId, db, today, await findSignals(actor, siteId, db, today), true);
}

/** The whole ranked list; for a page of it, `attentionPage`. */
export async function needsAttention(actor: Actor, siteId: string | null = null, db: Db = defaultDb, today = new Date()): Promise<RankedUnit[]> {
  assertCan(actor, 'overview.read');
  return rankUnits(await gatherSignals(actor, siteId, db, today));
}

const cursorKeySchema = z.tuple([z.number().int().min(0).max(2), z.number().finite(), z.string().max(10), z.string().max(500)]);

function encodeRankCursor(key: RankKey): string {
  return encodeCursor({ k: JSON.stringify([key.priority, key.score, key.oldest, key.name]), id: key.id });
}

function decodeRankCursor(value: string | null | undefined): RankKey | null {
  const cursor = decodeCursor(value ?? undefined);
  if (!cursor) return null;
  try {
    const [priority, score, oldest, name] = cursorKeySchema.parse(JSON.parse(String(cursor.k)));
    return { priority, score, oldest, name, id: cursor.id };
  } catch {
    throw new AppError('bad_request', 'The page cursor is not valid; start from the first page.');
  }
}

/** A unit's points when its only signal is its age: `scoreSignal` of past_expected_life, in SQL. */
function pastLifeScoreSql(today: Date) {
  return sql<number>`least(40, 15 + 2 * floor(greatest(0, ${ageYearsSql(today)} - life.median_years)))`;
}

export interface AttentionPage {
  items: RankedUnit[];
  /** Units on the whole list; left out when not asked for (it costs a count over every unit). */
  total: number | null;
  nextCursor: string | null;
}

/**
 * One page of the ranked list, keyset-paged. Units with a signal besides age are few and ranked
 * in JavaScript; units past their expected life and nothing else can be most of a large estate,
 * so they are ordered and cut to the page in SQL (same score, then name and id in code-point
 * order) and merged in. The cursor is the last unit's rank key.
 *
 * The age-ordered units are asked for beside the signal lookups, not after them: `lookahead` more
 * rows than the page needs, from which the units with other signals (ranked with those) are
 * dropped; only when that leaves the page short is the query sent again without them. On a page
 * that starts before the age-only units, the same scan counts them all (a window count), so the
 * total needs no second pass over every unit.
 */
export async function attentionPage(
  actor: Actor,
  options: { siteId?: string | null; limit: number; cursor?: string | null; withTotal?: boolean; lookahead?: number },
  db: Db = defaultDb,
  today = new Date(),
): Promise<AttentionPage> {
  assertCan(actor, 'overview.read');
  const siteId = options.siteId ?? null;
  const after = decodeRankCursor(options.cursor);
  const wantTotal = options.withTotal !== false;
  const lookahead = options.lookahead ?? 50;
  const pastLife = () =>
    visibleUnits(actor, siteId, db)
      .innerJoin(serviceLifeTable().as('life'), 'life.type', 'equipment.type')
      .where(pastExpectedLifeSql(today));
  // Age-only units are all "watch" with no dated problem; a cursor before the watch units takes them all.
  const afterWatch = after?.priority === PRIORITIES.indexOf('watch');
  const score = pastLifeScoreSql(today);
  const ageOrdered = (exclude: string[], take: number, countAll: boolean) =>
    pastLife()
      .$if(exclude.length > 0, (q) => q.where('equipment.id', 'not in', exclude))
      .$if(afterWatch, (q) =>
        q.where(sql<boolean>`(-${score}, equipment.name collate "C", equipment.id) > (${-after!.score}::float8, ${after!.name}::text collate "C", ${after!.id}::uuid)`),
      )
      .select(['equipment.id', 'equipment.name', 'equipment.type', 'equipment.site_id', 'sites.name as site_name', ageYearsSql(today).as('age_years'), 'life.median_years'])
      .$if(countAll, (q) => q.select(sql<number>`(count(*) over ())::int`.as('matching')))
      .orderBy(score, 'desc')
      .orderBy(sql`equipment.name collate "C"`)
      .orderBy('equipment.id')
      .limit(take)
      .execute();
  const take = options.limit + 1 + lookahead;
  // Counted in the same scan when the page starts before the age-only units; else on its own.
  const countInScan = wantTotal && !afterWatch;
  const counting = wantTotal && afterWatch ? pastLife().select(sql<number>`count(*)::int`.as('n')).executeTakeFirstOrThrow() : null;
  const [found, ahead, counted] = await Promise.all([findSignals(actor, siteId, db, today), ageOrdered([], take, countInScan), counting]);
  const signalled = scoreUnits(await unitsWithSignals(actor, siteId, db, today, found, false));
  const signalledIds = new Set(signalled.map((u) => u.equipmentId));
  let rows: Omit<(typeof ahead)[number], 'matching'>[] = ahead.filter((r) => !signalledIds.has(r.id));
  if (rows.length < options.limit + 1 && ahead.length === take) rows = await ageOrdered([...signalledIds], options.limit + 1, false);
  const ageRanked = scoreUnits(
    rows.slice(0, options.limit + 1).map((r) => ({
      equipmentId: r.id,
      equipmentName: r.name,
      equipmentType: r.type,
      siteId: r.site_id,
      siteName: r.site_name,
      signals: [{ kind: 'past_expected_life', ageYears: Number(r.age_years), medianYears: Number(r.median_years) }],
    })),
  );
  const candidates = [...signalled.filter((u) => !after || compareRankKeys(rankKey(u), after) > 0), ...ageRanked]
    .map((u) => ({ u, key: rankKey(u) }))
    .sort((a, b) => compareRankKeys(a.key, b.key));
  const kept = candidates.slice(0, options.limit);
  const last = kept.at(-1);
  // Every unit past its life: the window count (or the count), which includes those with another reason too.
  const pastLifeCount = counted ? counted.n : countInScan ? ((ahead[0] as { matching?: number } | undefined)?.matching ?? 0) : null;
  return {
    // Only the page's units are put in words.
    items: kept.map((c) => describeUnit(c.u)),
    // Units past their life that also have another reason are in `signalled` already.
    total: pastLifeCount === null ? null : signalled.length + pastLifeCount - signalled.filter((u) => u.signals.some((x) => x.kind === 'past_expected_life')).length,
    nextCursor: candidates.length > options.limit && last ? encodeRankCursor(last.key) : null,
  };
}
