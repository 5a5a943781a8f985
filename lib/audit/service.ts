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

// Dates and other values become plain JSON so the stored snapshot reads the same years later.
function snapshot(value: unknown): string | null {
  return value === undefined || value === null ? null : JSON.stringify(value);
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
