import 'server-only';
import { sql } from 'kysely';
import { entryVisibleTo, siteVisibleTo } from '@/lib/auth/scope';
import type { Db } from '@/db/types';
import type { Actor } from '@/lib/auth/actor';
import { leakFollowThrough, type LeakFollowThrough, type LeakWorkItem } from '@/lib/attention/leak-follow-through';

const YEAR_MS = 365.25 * 86_400_000;

export interface OpenLeak {
  equipmentId: string;
  siteId: string;
  systemId: string | null;
  visitId: string;
  recordedAt: Date;
  ratePct: number;
  thresholdPct: number;
  repairDueDate: string | null;
  standing: Exclude<LeakFollowThrough, { state: 'verified' }>;
}

/**
 * The latest refrigerant addition over the leak-rate threshold in the last 12 months, per unit
 * the actor can see, unless the leak has since been repaired and both verification tests have
 * passed (lib/attention/leak-follow-through.ts). One source for the attention list and the site
 * summaries, so they never disagree.
 */
export async function openLeaks(actor: Actor, siteId: string | null, db: Db, today: Date): Promise<OpenLeak[]> {
  let q = db
    .selectFrom('entries')
    .innerJoin('equipment', 'equipment.id', 'entries.equipment_id')
    .innerJoin('sites', 'sites.id', 'equipment.site_id')
    .where(siteVisibleTo(actor))
    .where(entryVisibleTo(actor))
    .where('equipment.deleted_at', 'is', null)
    .where('equipment.status', '<>', 'removed')
    .where('entries.kind', '=', 'refrigerant')
    .where('entries.voided_at', 'is', null)
    .where('entries.recorded_at', '>', new Date(today.getTime() - YEAR_MS))
    .where(sql<boolean>`(entries.computed->'leak'->>'exceedsThreshold')::boolean`);
  if (siteId) q = q.where('equipment.site_id', '=', siteId);
  const additions = await q
    .select([
      'equipment.id',
      'equipment.site_id',
      'entries.visit_id',
      'entries.recorded_at',
      'entries.system_id',
      sql<number>`(entries.computed->'leak'->>'ratePct')::float8`.as('rate'),
      sql<number>`(entries.computed->'leak'->>'thresholdPct')::float8`.as('threshold'),
      sql<string | null>`entries.computed->'leak'->>'repairDueDate'`.as('due'),
    ])
    .orderBy('entries.recorded_at', 'desc')
    .execute();

  // Repairs and verification tests on the same systems (any unit of the circuit).
  const systems = [...new Set(additions.map((a) => a.system_id).filter((id): id is string => Boolean(id)))];
  const work = systems.length
    ? await db
        .selectFrom('entries')
        .where('entries.system_id', 'in', systems)
        .where(entryVisibleTo(actor))
        .where('entries.kind', '=', 'leak')
        .where('entries.voided_at', 'is', null)
        .where('entries.recorded_at', '>', new Date(today.getTime() - 2 * YEAR_MS))
        .select(['entries.system_id', 'entries.visit_id', 'entries.recorded_at', sql<string>`entries.data->>'activity'`.as('activity'), sql<string | null>`entries.data->>'result'`.as('result')])
        .execute()
    : [];
  const workBySystem = new Map<string, LeakWorkItem[]>();
  for (const w of work) {
    const list = workBySystem.get(w.system_id!) ?? [];
    list.push({ at: w.recorded_at.toISOString(), visitId: w.visit_id, activity: w.activity as LeakWorkItem['activity'], result: w.result as LeakWorkItem['result'] });
    workBySystem.set(w.system_id!, list);
  }

  const seen = new Set<string>();
  const open: OpenLeak[] = [];
  for (const a of additions) {
    if (seen.has(a.id)) continue;
    seen.add(a.id);
    const standing = leakFollowThrough({ at: a.recorded_at.toISOString(), visitId: a.visit_id }, (a.system_id && workBySystem.get(a.system_id)) || []);
    if (standing.state === 'verified') continue;
    open.push({
      equipmentId: a.id,
      siteId: a.site_id,
      systemId: a.system_id,
      visitId: a.visit_id,
      recordedAt: a.recorded_at,
      ratePct: Number(a.rate),
      thresholdPct: Number(a.threshold),
      repairDueDate: a.due,
      standing,
    });
  }
  return open;
}
