import { sql, type Expression, type SelectQueryBuilder, type SqlBool } from 'kysely';
import { decodeCursor, encodeCursor, type Cursor, type Page } from '@/lib/api/cursor';

// Keyset paging for the list services: the filter after a cursor and the page from its rows.

/**
 * Rows after the cursor in a keyset order on (key, id). `key` is SQL written in code (a column or
 * an expression such as `lower(sites.name)`), never user text; `cast` is the key's SQL type; the
 * direction matches the query's ORDER BY. Row comparison keeps ties on the key in id order.
 */
export type CursorCast = 'text' | 'timestamptz' | 'date' | 'int';

export function afterCursor(cursor: Cursor, key: string, id: string, direction: 'asc' | 'desc', cast: CursorCast = 'text') {
  const value = cursor.k === null ? null : String(cursor.k);
  return (): Expression<SqlBool> =>
    sql<SqlBool>`(${sql.raw(key)}, ${sql.ref(id)}) ${sql.raw(direction === 'asc' ? '>' : '<')} (${value}::${sql.raw(cast)}, ${cursor.id}::uuid)`;
}

/**
 * One page from rows fetched with `limit + 1`: the extra row only says that another page follows,
 * and the cursor names the last row kept.
 */
/** A sort key's cursor value: times as ISO text, numbers as they are, anything else as text. */
export function cursorKey(value: unknown): string | number {
  if (value instanceof Date) return value.toISOString();
  if (typeof value === 'number') return value;
  return String(value ?? '');
}

export function toPage<R, T>(rows: R[], limit: number, map: (row: R) => T, cursorOf: (row: R) => Cursor): Page<T> {
  const kept = rows.slice(0, limit);
  const last = kept.at(-1);
  return { items: kept.map(map), nextCursor: rows.length > limit && last ? encodeCursor(cursorOf(last)) : null };
}

/** A list's keyset order: `key` and `id` as for `afterCursor`, in one direction. */
export interface KeysetOrder {
  key: string;
  id: string;
  direction: 'asc' | 'desc';
  cast?: CursorCast;
}

/**
 * One page of a list query: the rows after the page's cursor in the keyset order, `limit + 1`
 * fetched so the page knows whether another follows. The query brings its filters and columns.
 * The next cursor holds the key as Postgres prints it, so a time keeps its microseconds (a JS
 * Date would round them off and the next page would repeat the row) and a case-folded name is
 * folded as the ORDER BY folds it.
 */
export async function keysetPage<DB, TB extends keyof DB, O extends { id: string }, T>(
  query: SelectQueryBuilder<DB, TB, O>,
  order: KeysetOrder,
  page: { cursor?: string; limit: number },
  map: (row: O) => T,
): Promise<Page<T>> {
  const cursor = decodeCursor(page.cursor);
  const q = cursor ? query.where(afterCursor(cursor, order.key, order.id, order.direction, order.cast)) : query;
  const rows = await q
    .select(cursorKeyColumn(order.key))
    .orderBy(sql.raw(order.key), order.direction)
    .orderBy(sql.ref(order.id), order.direction)
    .limit(page.limit + 1)
    .execute();
  return toPage(rows, page.limit, (r) => map(r), (r) => ({ k: printedKey(r), id: r.id }));
}

/**
 * The sort key as Postgres prints it, for the next cursor: a time keeps its microseconds (a JS
 * Date would round them off, and the next page would repeat or skip rows within a millisecond).
 */
export function cursorKeyColumn(key: string) {
  return sql<string | null>`(${sql.raw(key)})::text`.as('cursor_key');
}

/** The key column `cursorKeyColumn` adds, read back with a check rather than a type assertion. */
export function printedKey(row: object): string | null {
  return 'cursor_key' in row && typeof row.cursor_key === 'string' ? row.cursor_key : null;
}

/** Name order, case folded (what a person scanning a list expects), for a table with `name`. */
export function byName(table: 'clients' | 'sites'): KeysetOrder {
  return { key: `lower(${table}.name)`, id: `${table}.id`, direction: 'asc' };
}
