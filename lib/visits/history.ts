import 'server-only';
import { sql } from 'kysely';
import { db as defaultDb } from '@/db';
import type { Db } from '@/db/types';
import type { Page } from '@/lib/api/cursor';
import { printedKey, toPage } from '@/lib/api/paging';
import { assertCan } from '@/lib/auth/access';
import { entryVisibleTo } from '@/lib/auth/scope';
import type { Actor } from '@/lib/auth/actor';
import { assertEquipmentVisible } from '@/lib/equipment/service';
import type { EntryDto } from '@/lib/visits/dto';
import { buildHistoryQuery, type HistoryScope } from '@/lib/visits/queries';
import type { HistoryQuery, VisitReason } from '@/lib/visits/schemas';
import { entryCanVoid } from '@/lib/visits/permissions';
import { toEntryDto } from '@/lib/visits/service';

// A unit's or a system's history, newest first, and one reading over time for a chart.


/** Newest first, keyset on (recorded_at, id); owners see entries of closed visits only. */
export async function equipmentHistory(actor: Actor, equipmentId: string, query: HistoryQuery, db: Db = defaultDb): Promise<Page<EntryDto>> {
  assertCan(actor, 'visits.read');
  assertCan(actor, 'equipment.read');
  // The page's query holds the unit's scope check (buildHistoryQuery), so rows mean the viewer
  // sees the unit; only an empty page needs asking whether it is a unit they may not see.
  const page = await historyPage(actor, db, query, { equipmentId });
  if (page.items.length === 0) await assertEquipmentVisible(actor, equipmentId, db);
  return page;
}

export async function systemHistory(actor: Actor, systemId: string, query: HistoryQuery, db: Db = defaultDb): Promise<Page<EntryDto>> {
  assertCan(actor, 'visits.read');
  const { getSystem } = await import('@/lib/systems/service');
  await getSystem(actor, systemId, db);
  return historyPage(actor, db, query, { systemId });
}

async function historyPage(actor: Actor, db: Db, query: HistoryQuery, scope: HistoryScope): Promise<Page<EntryDto>> {
  const rows = await buildHistoryQuery(actor, db, query, scope).execute();
  const toDto = (r: (typeof rows)[number]): EntryDto => ({
    ...toEntryDto(r, entryCanVoid(actor, { status: r.visit_status as 'open' | 'closed', reviewedAt: r.visit_reviewed_at?.toISOString() ?? null }, { createdBy: r.created_by, voidedAt: r.voided_at?.toISOString() ?? null })),
    visit: {
      reason: r.visit_reason as VisitReason,
      startedAt: r.visit_started_at.toISOString(),
      technicianName: r.technician_name,
      status: r.visit_status as 'open' | 'closed',
      timeZone: r.visit_time_zone,
    },
  });
  return toPage(rows, query.limit, toDto, (r) => ({ k: printedKey(r), id: r.id }));
}

const COMPUTED_KEYS = new Set(['superheatK', 'subcoolingK', 'evaporatorTdK', 'condenserSplitK', 'compressionRatio', 'unbalancePct', 'evaporatingC', 'condensingC']);

/** One reading over time, for a chart. */
export async function readingSeries(actor: Actor, equipmentId: string, key: string, db: Db = defaultDb): Promise<{ recordedAt: string; value: number }[]> {
  assertCan(actor, 'visits.read');
  await assertEquipmentVisible(actor, equipmentId, db);
  const column = COMPUTED_KEYS.has(key) ? 'computed' : 'data';
  const q = db
    .selectFrom('entries')
    .innerJoin('visits', 'visits.id', 'entries.visit_id')
    .select(['entries.recorded_at', sql<number>`(entries.${sql.raw(column)}->>${key})::float8`.as('value')])
    .where(entryVisibleTo(actor))
    .where('entries.equipment_id', '=', equipmentId)
    .where('entries.kind', '=', 'reading')
    .where('entries.voided_at', 'is', null)
    .where(sql<boolean>`entries.${sql.raw(column)} ? ${key}`)
    .where(sql<boolean>`jsonb_typeof(entries.${sql.raw(column)}->${key}) = 'number'`);
  const rows = await q.orderBy('entries.recorded_at').limit(500).execute();
  return rows.map((r) => ({ recordedAt: r.recorded_at.toISOString(), value: Number(r.value) }));
}
