import 'server-only';
import { sql, type Kysely, type Transaction } from 'kysely';
import { db as defaultDb } from '@/db';
import { siteVisibleTo } from '@/db/helpers';
import type { DB } from '@/db/schema.gen';
import { assertCan } from '@/lib/auth/access';
import type { Actor } from '@/lib/auth/actor';
import { leakFollowThrough, type LeakWorkItem } from '@/lib/attention/leak-follow-through';
import { rankUnits, type RankedUnit, type Signal, type UnitSignals } from '@/lib/attention/rank';
import { medianServiceLife, type EquipmentType } from '@/lib/calc/service-life';

type Db = Kysely<DB> | Transaction<DB>;

const YEAR_MS = 365.25 * 86_400_000;

/** Signals for every unit the actor can see (optionally one site), gathered in five queries. */
export async function gatherSignals(actor: Actor, siteId: string | null, db: Db = defaultDb, today = new Date()): Promise<UnitSignals[]> {
  const base = () => {
    let q = db.selectFrom('equipment').innerJoin('sites', 'sites.id', 'equipment.site_id').where(siteVisibleTo(actor)).where('equipment.deleted_at', 'is', null).where('equipment.status', '<>', 'removed');
    if (siteId) q = q.where('equipment.site_id', '=', siteId);
    return q;
  };
  const units = await base().select(['equipment.id', 'equipment.name', 'equipment.type', 'equipment.installed_on', 'equipment.site_id', 'sites.name as site_name']).execute();
  const byId = new Map<string, UnitSignals>(
    units.map((u) => [u.id, { equipmentId: u.id, equipmentName: u.name, equipmentType: u.type, siteId: u.site_id, siteName: u.site_name, signals: [] as Signal[] }]),
  );
  const push = (id: string | null, s: Signal) => {
    if (id) byId.get(id)?.signals.push(s);
  };

  const safety = await base()
    .innerJoin('follow_ups', 'follow_ups.equipment_id', 'equipment.id')
    .where('follow_ups.status', 'in', ['open', 'scheduled'])
    .where('follow_ups.severity', '=', 'safety')
    .select(['equipment.id', 'follow_ups.id as follow_up_id', 'follow_ups.title', 'follow_ups.created_at'])
    .execute();
  for (const r of safety) push(r.id, { kind: 'open_safety_finding', followUpId: r.follow_up_id, title: r.title, since: r.created_at.toISOString().slice(0, 10) });

  const leaks = await base()
    .innerJoin('entries', 'entries.equipment_id', 'equipment.id')
    .where('entries.kind', '=', 'refrigerant')
    .where('entries.voided_at', 'is', null)
    .where('entries.recorded_at', '>', new Date(today.getTime() - YEAR_MS))
    .where(sql<boolean>`(entries.computed->'leak'->>'exceedsThreshold')::boolean`)
    .select([
      'equipment.id',
      'entries.visit_id',
      'entries.recorded_at',
      'entries.system_id',
      sql<number>`(entries.computed->'leak'->>'ratePct')::float8`.as('rate'),
      sql<number>`(entries.computed->'leak'->>'thresholdPct')::float8`.as('threshold'),
      sql<string | null>`entries.computed->'leak'->>'repairDueDate'`.as('due'),
    ])
    .orderBy('entries.recorded_at', 'desc')
    .execute();
  // Repairs and verification tests on the same systems (any unit of the circuit), for where each leak stands.
  const leakSystems = [...new Set(leaks.map((l) => l.system_id).filter((id): id is string => Boolean(id)))];
  const leakWork = leakSystems.length
    ? await db
        .selectFrom('entries')
        .where('entries.system_id', 'in', leakSystems)
        .where('entries.company_id', '=', actor.companyId)
        .where('entries.kind', '=', 'leak')
        .where('entries.voided_at', 'is', null)
        .where('entries.recorded_at', '>', new Date(today.getTime() - 2 * YEAR_MS))
        .select(['entries.system_id', 'entries.visit_id', 'entries.recorded_at', sql<string>`entries.data->>'activity'`.as('activity'), sql<string | null>`entries.data->>'result'`.as('result')])
        .execute()
    : [];
  const workBySystem = new Map<string, LeakWorkItem[]>();
  for (const w of leakWork) {
    const list = workBySystem.get(w.system_id!) ?? [];
    list.push({ at: w.recorded_at.toISOString(), visitId: w.visit_id, activity: w.activity as LeakWorkItem['activity'], result: w.result as LeakWorkItem['result'] });
    workBySystem.set(w.system_id!, list);
  }
  const seenLeak = new Set<string>();
  for (const r of leaks) {
    if (seenLeak.has(r.id)) continue;
    seenLeak.add(r.id);
    const standing = leakFollowThrough({ at: r.recorded_at.toISOString(), visitId: r.visit_id }, (r.system_id && workBySystem.get(r.system_id)) || []);
    if (standing.state === 'verified') continue;
    push(r.id, {
      kind: 'leak_over_threshold',
      visitId: r.visit_id,
      ratePct: Number(r.rate),
      thresholdPct: Number(r.threshold),
      repairDueDate: r.due,
      on: r.recorded_at.toISOString().slice(0, 10),
      repairedOn: standing.state === 'repaired' ? standing.repairedOn : null,
      verificationFailed: standing.state === 'repaired' && standing.failedTest,
    });
  }

  const noCooling = await base()
    .innerJoin('entries', 'entries.equipment_id', 'equipment.id')
    .innerJoin('visits', 'visits.id', 'entries.visit_id')
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

  for (const u of units) {
    if (!u.installed_on) continue;
    const life = medianServiceLife(u.type as EquipmentType);
    if (!life) continue;
    const age = (today.getTime() - Date.parse(`${u.installed_on}T00:00:00Z`)) / YEAR_MS;
    if (age > life.medianYears) push(u.id, { kind: 'past_expected_life', ageYears: age, medianYears: life.medianYears });
  }
  return [...byId.values()];
}

export async function needsAttention(actor: Actor, siteId: string | null = null, db: Db = defaultDb, today = new Date()): Promise<RankedUnit[]> {
  assertCan(actor, 'overview.read');
  return rankUnits(await gatherSignals(actor, siteId, db, today));
}
