import 'server-only';
import { sql, type Kysely } from 'kysely';
import { db as defaultDb } from '@/db';
import type { DB } from '@/db/schema.gen';
import { assertCan } from '@/lib/auth/access';
import { actorFromRow, type Actor } from '@/lib/auth/actor';
import { forgetSession, forgetUserSessions } from '@/lib/auth/actor-cache';
import { recordAudit } from '@/lib/audit/service';
import { AppError } from '@/lib/errors';

// Server-side sessions (table user_sessions, see its migration): the JWT names a row, the
// per-request actor lookup requires it live, and ending a session is an update of that row.

export async function startSession(userId: string, maxAgeSeconds: number, db: Kysely<DB> = defaultDb): Promise<string> {
  const row = await db
    .insertInto('user_sessions')
    .values({ user_id: userId, expires_at: sql`now() + make_interval(secs => ${maxAgeSeconds})` })
    .returning('id')
    .executeTakeFirstOrThrow();
  return row.id;
}

/** The active person behind a live session, in one query; null when either has ended. */
export async function actorForSession(userId: string, sessionId: string, db: Kysely<DB> = defaultDb): Promise<Actor | null> {
  return (await liveSession(userId, sessionId, db))?.actor ?? null;
}

/** actorForSession with the session's own end, so a cache never keeps it past that. */
export async function liveSession(userId: string, sessionId: string, db: Kysely<DB> = defaultDb): Promise<{ actor: Actor; expiresAtMs: number } | null> {
  if (!isUuid(userId) || !isUuid(sessionId)) return null;
  const row = await db
    .selectFrom('users')
    .innerJoin('user_sessions', 'user_sessions.user_id', 'users.id')
    .select(['users.id', 'users.company_id', 'users.role', 'users.client_id', 'users.name', 'users.email', 'users.units', 'users.metric_pressure', 'user_sessions.expires_at'])
    .where('users.id', '=', userId)
    .where('users.deactivated_at', 'is', null)
    .where('user_sessions.id', '=', sessionId)
    .where('user_sessions.revoked_at', 'is', null)
    .where('user_sessions.expires_at', '>', sql<Date>`now()`)
    .executeTakeFirst();
  return row ? { actor: actorFromRow(row), expiresAtMs: new Date(row.expires_at).getTime() } : null;
}

/** Sign-out: ends this one session. */
export async function endSession(sessionId: string, db: Kysely<DB> = defaultDb): Promise<void> {
  if (!isUuid(sessionId)) return;
  await db.updateTable('user_sessions').set({ revoked_at: sql`now()` }).where('id', '=', sessionId).where('revoked_at', 'is', null).execute();
  // This process at once; the others (and this one again) through the session notice.
  forgetSession(sessionId);
}

/**
 * "Sign out everywhere": ends every session of a person. Anyone may do it for themselves; an
 * admin may do it for anyone in their company (`users.manage`). Returns how many ended.
 */
export async function endAllSessions(actor: Actor, userId: string, db: Kysely<DB> = defaultDb): Promise<number> {
  if (userId !== actor.id) assertCan(actor, 'users.manage');
  if (!isUuid(userId)) throw new AppError('not_found');
  const ended = await db.transaction().execute(async (trx) => {
    const person = await trx.selectFrom('users').select('id').where('id', '=', userId).where('company_id', '=', actor.companyId).executeTakeFirst();
    if (!person) throw new AppError('not_found');
    const ended = await trx
      .updateTable('user_sessions')
      .set({ revoked_at: sql`now()` })
      .where('user_id', '=', userId)
      .where('revoked_at', 'is', null)
      .executeTakeFirst();
    await recordAudit(trx, actor, { action: 'sessions_end', entityType: 'user', entityId: userId, after: { ended: Number(ended.numUpdatedRows) } });
    return Number(ended.numUpdatedRows);
  });
  forgetUserSessions(userId);
  return ended;
}

function isUuid(value: string): boolean {
  return /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i.test(value);
}
