import { sql, type Expression, type SqlBool } from 'kysely';
import { encodeCursor, type Cursor, type Page } from '@/lib/api/cursor';

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
