import { sql } from 'kysely';
import { escapeLike } from '@/db/helpers';
import { atVisibleSite } from '@/lib/auth/scope';
import type { Db } from '@/db/types';
import { decodeCursor } from '@/lib/api/cursor';
import { afterCursor, type CursorCast } from '@/lib/api/paging';
import type { Actor } from '@/lib/auth/actor';
import type { EquipmentSort, ListEquipmentQuery } from '@/lib/equipment/schemas';

// Query builders only (no connection of their own): the service executes them, and the
// benchmark compiles the very same SQL to time it straight through pg.

export function equipmentBaseQuery(actor: Actor, db: Db) {
  return db
    .selectFrom('equipment')
    .$call(atVisibleSite(actor, 'equipment'))
    .innerJoin('clients', 'clients.id', 'sites.client_id')
    .leftJoin('areas', 'areas.id', 'equipment.area_id')
    .leftJoin('systems', 'systems.id', 'equipment.system_id')
    // A deleted replacement is not linked to: its page would not open.
    .leftJoin('equipment as replacement', (join) => join.onRef('replacement.id', '=', 'equipment.replaced_by_id').on('replacement.deleted_at', 'is', null));
}

export const refrigerantExpr = sql<string | null>`coalesce(systems.refrigerant, equipment.nameplate->>'refrigerant')`;

export const selection = [
  'equipment.id',
  'equipment.site_id',
  'sites.name as site_name',
  'sites.time_zone as site_time_zone',
  'clients.name as client_name',
  'equipment.area_id',
  'areas.name as area_name',
  'equipment.system_id',
  'systems.name as system_name',
  'equipment.type',
  'equipment.name',
  'equipment.make',
  'equipment.model',
  'equipment.serial',
  'equipment.manufactured_on',
  'equipment.installed_on',
  'equipment.condition',
  'equipment.condition_note',
  'equipment.status',
  'equipment.nameplate',
  'equipment.removed_at',
  'equipment.replaced_by_id',
  'replacement.name as replaced_by_name',
  'equipment.deleted_at',
  'equipment.created_at',
  'equipment.updated_at',
] as const;

// Each sort key with the SQL it orders by (written here, never user text) and its cursor's type.
const sortKeys: Record<EquipmentSort, { key: string; cast: CursorCast }> = {
  name: { key: 'lower(equipment.name)', cast: 'text' },
  type: { key: 'equipment.type', cast: 'text' },
  make: { key: "lower(coalesce(equipment.make, ''))", cast: 'text' },
  model: { key: "lower(coalesce(equipment.model, ''))", cast: 'text' },
  serial: { key: "lower(coalesce(equipment.serial, ''))", cast: 'text' },
  condition: { key: 'coalesce(equipment.condition, 0)', cast: 'int' },
  installedOn: { key: "coalesce(equipment.installed_on, '0001-01-01'::date)", cast: 'date' },
  updatedAt: { key: 'equipment.updated_at', cast: 'timestamptz' },
};

/** Filters shared by the table, the CSV export and the benchmark. */
export function filteredEquipment(actor: Actor, query: Omit<ListEquipmentQuery, 'cursor' | 'limit' | 'sort' | 'dir'>, db: Db) {
  let q = equipmentBaseQuery(actor, db).where('equipment.deleted_at', 'is', null);
  // Removed units stay out of every list unless asked for, so pickers and current views never offer them.
  const removed = query.removed ?? (query.status?.includes('removed') ? 'include' : 'exclude');
  if (removed === 'exclude') q = q.where('equipment.status', '<>', 'removed');
  else if (removed === 'only') q = q.where('equipment.status', '=', 'removed');
  if (query.siteId) q = q.where('equipment.site_id', '=', query.siteId);
  if (query.areaId) q = q.where('equipment.area_id', '=', query.areaId);
  if (query.systemId) q = q.where('equipment.system_id', '=', query.systemId);
  if (query.type?.length) q = q.where('equipment.type', 'in', query.type);
  if (query.status?.length) q = q.where('equipment.status', 'in', query.status);
  if (query.condition?.length) q = q.where('equipment.condition', 'in', query.condition);
  if (query.refrigerant?.length) q = q.where(refrigerantExpr, 'in', query.refrigerant);
  if (query.q) q = q.where('equipment.search_text', 'like', `%${escapeLike(query.q.toLowerCase())}%`);
  return q;
}

/** The list query for one page: filters, sort, keyset cursor, one extra row to detect a next page. */
export function buildEquipmentListQuery(actor: Actor, query: ListEquipmentQuery, db: Db) {
  const cursor = decodeCursor(query.cursor);
  const sort = sortKeys[query.sort];
  const sortKey = sql.raw(sort.key);
  let q = filteredEquipment(actor, query, db).select([...selection, refrigerantExpr.as('refrigerant'), sortKey.as('sort_key')]);
  if (cursor) q = q.where(afterCursor(cursor, sort.key, 'equipment.id', query.dir, sort.cast));
  return q
    .orderBy(sortKey, query.dir)
    .orderBy('equipment.id', query.dir)
    .limit(query.limit + 1);
}
