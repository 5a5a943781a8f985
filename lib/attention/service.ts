import 'server-only';
import { sql } from 'kysely';
import { db as defaultDb } from '@/db';
import { entryVisibleTo, siteVisibleTo, visitVisibleTo } from '@/lib/auth/scope';
import type { Db } from '@/db/types';
import { assertCan } from '@/lib/auth/access';
import type { Actor } from '@/lib/auth/actor';
import { openLeaks } from '@/lib/attention/open-leaks';
import { rankUnits, type RankedUnit, type Signal, type UnitSignals } from '@/lib/attention/rank';
import { medianServiceLife, type EquipmentType } from '@/lib/calc/service-life';
import { pastExpectedLifeSql, serviceLifeTable } from '@/lib/overview/service-life-sql';

const YEAR_MS = 365.25 * 86_400_000;

/** Signals of the units the actor can see (optionally one site) that have any, gathered in a few grouped queries (no per-unit round trips). */
export async function gatherSignals(actor: Actor, siteId: string | null, db: Db = defaultDb, today = new Date()): Promise<UnitSignals[]> {
  const base = () => {
    let q = db.selectFrom('equipment').innerJoin('sites', 'sites.id', 'equipment.site_id').where(siteVisibleTo(actor)).where('equipment.deleted_at', 'is', null).where('equipment.status', '<>', 'removed');
    if (siteId) q = q.where('equipment.site_id', '=', siteId);
    return q;
  };
  // Signals first, then only the units that have one (or are past their expected life, found in
  // SQL): at tens of thousands of units most have none, and loading them all was the cost.
  const found: { id: string | null; signal: Signal }[] = [];
  const push = (id: string | null, signal: Signal) => found.push({ id, signal });

  const safety = await base()
    .innerJoin('follow_ups', 'follow_ups.equipment_id', 'equipment.id')
    .where('follow_ups.status', 'in', ['open', 'scheduled'])
    .where('follow_ups.severity', '=', 'safety')
    .select(['equipment.id', 'follow_ups.id as follow_up_id', 'follow_ups.title', 'follow_ups.created_at'])
    .execute();
  for (const r of safety) push(r.id, { kind: 'open_safety_finding', followUpId: r.follow_up_id, title: r.title, since: r.created_at.toISOString().slice(0, 10) });

  for (const l of await openLeaks(actor, siteId, db, today)) {
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

  const noCooling = await base()
    .innerJoin('entries', 'entries.equipment_id', 'equipment.id')
    .innerJoin('visits', 'visits.id', 'entries.visit_id')
    .where(visitVisibleTo(actor))
    .where('visits.reason', '=', 'no_cooling')
    .where('visits.started_at', '>', new Date(today.getTime() - 90 * 86_400_000))
    .select(['equipment.id', sql<string[]>`array_agg(distinct visits.id::text)`.as('visit_ids')])
    .groupBy('equipment.id')
    .having(sql<boolean>`count(distinct visits.id) >= 2`)
    .execute();
  for (const r of noCooling) push(r.id, { kind: 'repeat_no_cooling', visitIds: r.visit_ids });

  const ratings = await db
    .with('ranked', (w) =>
      w
        .selectFrom('entries')
        .innerJoin('equipment', 'equipment.id', 'entries.equipment_id')
        .innerJoin('sites', 'sites.id', 'equipment.site_id')
        .where(siteVisibleTo(actor))
        .where(entryVisibleTo(actor))
        .where('entries.kind', '=', 'condition')
        .where('entries.voided_at', 'is', null)
        .$if(Boolean(siteId), (q) => q.where('equipment.site_id', '=', siteId!))
        .select([
          'entries.equipment_id',
          'entries.visit_id',
          sql<number>`(entries.data->>'rating')::int`.as('rating'),
          sql<number>`row_number() over (partition by entries.equipment_id order by entries.recorded_at desc, entries.id desc)`.as('n'),
        ]),
    )
    .selectFrom('ranked as latest')
    .innerJoin('ranked as previous', (j) => j.onRef('previous.equipment_id', '=', 'latest.equipment_id').on('previous.n', '=', 2))
    .where('latest.n', '=', 1)
    .whereRef('latest.rating', '<', 'previous.rating')
    .select(['latest.equipment_id', 'latest.visit_id', 'latest.rating as to', 'previous.rating as from'])
    .execute();
  for (const r of ratings) push(r.equipment_id, { kind: 'condition_worsening', from: Number(r.from), to: Number(r.to), visitId: r.visit_id });

  const withSignal = [...new Set(found.flatMap((f) => (f.id ? [f.id] : [])))];
  const units = await base()
    .leftJoin(serviceLifeTable().as('life'), 'life.type', 'equipment.type')
    .where((eb) => eb.or([eb(pastExpectedLifeSql(today), '=', true), ...(withSignal.length > 0 ? [eb('equipment.id', 'in', withSignal)] : [])]))
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

export async function needsAttention(actor: Actor, siteId: string | null = null, db: Db = defaultDb, today = new Date()): Promise<RankedUnit[]> {
  assertCan(actor, 'overview.read');
  return rankUnits(await gatherSignals(actor, siteId, db, today));
}
