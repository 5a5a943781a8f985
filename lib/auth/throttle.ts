import 'server-only';
import { sql } from 'kysely';
import { db as defaultDb } from '@/db';
import type { Kysely } from 'kysely';
import type { DB } from '@/db/schema.gen';

// Failed sign-ins are counted per account and per client address in the database (not in
// memory), so the limit holds across several app copies. After the free failures inside the
// window each further failure doubles the wait, up to MAX_LOCK_SECONDS. An address gets more
// free failures than an account: a whole office can sit behind one address.
const FREE_FAILURES = 5;
const FREE_FAILURES_PER_ADDRESS = 20;
const WINDOW_SECONDS = 15 * 60;
const BASE_LOCK_SECONDS = 30;
const MAX_LOCK_SECONDS = 15 * 60;

export function lockSecondsAfter(failures: number, free = FREE_FAILURES): number {
  if (failures < free) return 0;
  return Math.min(MAX_LOCK_SECONDS, BASE_LOCK_SECONDS * 2 ** (failures - free));
}

function freeFailuresFor(key: string): number {
  return key.startsWith('ip:') ? FREE_FAILURES_PER_ADDRESS : FREE_FAILURES;
}

/** Seconds the caller must still wait for any of the keys, or 0. */
export async function secondsLocked(keys: string[], db: Kysely<DB> = defaultDb): Promise<number> {
  if (keys.length === 0) return 0;
  const row = await db
    .selectFrom('sign_in_throttles')
    .select(sql<number>`coalesce(max(extract(epoch from locked_until - now())), 0)`.as('wait'))
    .where('key', 'in', keys)
    .where('locked_until', '>', new Date())
    .executeTakeFirst();
  return Math.max(0, Math.ceil(Number(row?.wait ?? 0)));
}

export async function recordFailure(keys: string[], db: Kysely<DB> = defaultDb): Promise<number> {
  let longest = 0;
  for (const key of keys) {
    const row = await db
      .insertInto('sign_in_throttles')
      .values({ key, failures: 1 })
      .onConflict((oc) =>
        oc.column('key').doUpdateSet({
          // A failure outside the window starts a fresh count.
          failures: sql`case when sign_in_throttles.first_failure_at < now() - make_interval(secs => ${WINDOW_SECONDS}) then 1 else sign_in_throttles.failures + 1 end`,
          first_failure_at: sql`case when sign_in_throttles.first_failure_at < now() - make_interval(secs => ${WINDOW_SECONDS}) then now() else sign_in_throttles.first_failure_at end`,
        }),
      )
      .returning('failures')
      .executeTakeFirstOrThrow();
    const lock = lockSecondsAfter(row.failures, freeFailuresFor(key));
    if (lock > 0) {
      await db
        .updateTable('sign_in_throttles')
        .set({ locked_until: sql`now() + make_interval(secs => ${lock})` })
        .where('key', '=', key)
        .execute();
      longest = Math.max(longest, lock);
    }
  }
  return longest;
}

export async function clearFailures(keys: string[], db: Kysely<DB> = defaultDb): Promise<void> {
  if (keys.length) await db.deleteFrom('sign_in_throttles').where('key', 'in', keys).execute();
}

export function throttleKeys(email: string, address: string | null): string[] {
  return [`email:${email.toLowerCase()}`, ...(address ? [`ip:${address}`] : [])];
}
