import 'server-only';
import type { Kysely, Transaction } from 'kysely';
import type { DB } from '@/db/schema.gen';
import type { Actor } from '@/lib/auth/actor';

export interface AuditInput {
  action: 'create' | 'update' | 'archive' | 'restore' | 'delete' | 'invite' | 'role_change' | 'deactivate' | 'reactivate' | string;
  entityType: string;
  entityId: string;
  before?: unknown;
  after?: unknown;
}

// What the viewer may do (`canEdit`, `canArchive` … from the services' permission flags) is not
// part of the record: it depends on who asked, so the snapshot leaves it out.
const VIEWER_FLAG = /^can[A-Z]/;

// Dates and other values become plain JSON so the stored snapshot reads the same years later.
function snapshot(value: unknown): string | null {
  if (value === undefined || value === null) return null;
  return JSON.stringify(value, function (this: unknown, key: string, v: unknown) {
    return this === value && VIEWER_FLAG.test(key) ? undefined : v;
  });
}

/** Written inside the caller's transaction, so an audit event exists exactly when the change does. */
export async function recordAudit(
  db: Kysely<DB> | Transaction<DB>,
  actor: Pick<Actor, 'id' | 'companyId'> | { id: null; companyId: string },
  input: AuditInput,
): Promise<void> {
  await db
    .insertInto('audit_events')
    .values({
      company_id: actor.companyId,
      actor_id: actor.id,
      action: input.action,
      entity_type: input.entityType,
      entity_id: input.entityId,
      before: snapshot(input.before),
      after: snapshot(input.after),
    })
    .execute();
}
