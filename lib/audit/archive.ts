import 'server-only';
import { sql, type Expression, type Kysely, type SqlBool } from 'kysely';
import type { DB } from '@/db/schema.gen';
import type { Db } from '@/db/types';
import type { Actor } from '@/lib/auth/actor';
import { auditedChange } from '@/lib/audit/change';

/** The records that are archived rather than deleted: they keep their history and leave the lists. */
export type ArchivableTable = 'clients' | 'sites' | 'systems';

/** A list's view of archived records: left out (the default), only them, or both; for `.where(…)`. */
export function archivedView(table: ArchivableTable, view: 'exclude' | 'only' | 'include') {
  const archivedAt = sql.ref(`${table}.archived_at`);
  return (): Expression<SqlBool> =>
    view === 'exclude' ? sql<SqlBool>`${archivedAt} is null` : view === 'only' ? sql<SqlBool>`${archivedAt} is not null` : sql<SqlBool>`true`;
}

/** The children a list counts beside each record: a client's sites, a site's areas. */
const childrenOf = { clients: { table: 'sites', key: 'client_id' }, sites: { table: 'areas', key: 'site_id' } } as const;

/** For `.select(…)`: how many of the record's children are not archived (an archived one has left the lists). */
export function liveChildCount(parent: keyof typeof childrenOf) {
  const { table, key } = childrenOf[parent];
  return sql<number>`(select count(*) from ${sql.table(table)} where ${sql.ref(`${table}.${key}`)} = ${sql.ref(`${parent}.id`)} and ${sql.ref(`${table}.archived_at`)} is null)`;
}

/**
 * Archives or restores one record of the caller's company in one transaction, audited with the
 * record as `read` returns it before and after (so `read` also checks the caller may see it).
 * Archiving twice keeps the first date. The caller checks the permission first.
 */
export async function setArchived<T>(
  db: Kysely<DB>,
  actor: Actor,
  record: { table: ArchivableTable; entityType: string; id: string },
  archived: boolean,
  read: (trx: Db) => Promise<T>,
): Promise<T> {
  const archivedAt = archived ? sql`coalesce(archived_at, now())` : sql`null`;
  return auditedChange(db, actor, { ...record, action: archived ? 'archive' : 'restore' }, read, (trx) =>
    sql`update ${sql.table(record.table)} set archived_at = ${archivedAt}, updated_at = now() where id = ${record.id} and company_id = ${actor.companyId}`.execute(trx),
  );
}
