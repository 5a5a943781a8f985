import 'server-only';
import type { Kysely, Transaction } from 'kysely';
import type { DB } from '@/db/schema.gen';
import type { Db } from '@/db/types';
import type { Actor } from '@/lib/auth/actor';
import { recordAudit, type AuditInput } from '@/lib/audit/service';

/**
 * Changes one record in one transaction, audited with the record as `read` returns it before and
 * after (so `read` also checks the caller may see it). `change` may refuse by throwing; nothing is
 * then written. The caller checks the permission first.
 */
export async function auditedChange<T>(
  db: Kysely<DB>,
  actor: Actor,
  record: { entityType: string; id: string; action?: AuditInput['action'] },
  read: (trx: Db) => Promise<T>,
  change: (trx: Transaction<DB>, before: T) => Promise<unknown>,
): Promise<T> {
  return db.transaction().execute(async (trx) => {
    const before = await read(trx);
    await change(trx, before);
    const after = await read(trx);
    await recordAudit(trx, actor, { action: record.action ?? 'update', entityType: record.entityType, entityId: record.id, before, after });
    return after;
  });
}

/**
 * Creates one record in one transaction: `insert` checks and writes it and returns its id (or
 * throws, writing nothing), `read` gives the record as the caller gets it and the audit keeps it.
 */
export async function auditedCreate<T>(
  db: Kysely<DB>,
  actor: Actor,
  entityType: string,
  insert: (trx: Transaction<DB>) => Promise<string>,
  read: (trx: Db, id: string) => Promise<T>,
): Promise<T> {
  return db.transaction().execute(async (trx) => {
    const id = await insert(trx);
    const created = await read(trx, id);
    await recordAudit(trx, actor, { action: 'create', entityType, entityId: id, after: created });
    return created;
  });
}
