import 'server-only';
import { sql } from 'kysely';
import { db as defaultDb } from '@/db';
import type { Kysely } from 'kysely';
import type { DB } from '@/db/schema.gen';

// Password sign-in throttling, in the database so every app copy agrees. Three counters:
// - `pair:<account>|<address>` — one address guessing one account: after 5 failures each further
//   failure doubles the wait (30 s … 15 min). Only this counter can pause an account for long,
//   and only for that address, so a stranger cannot lock the owner out.
// - `ip:<address>` — one address across accounts: 20 free, then doubling.
// - `email:<account>` — every address together: after 10 failures the account is slowed to one
//   password check per 30 s, never blocked for longer. The e-mailed link is never throttled.
// Without a trusted client address (TRUSTED_PROXY_COUNT=0, see clientAddress) only the account
// counter applies. Every attempt is counted before the password is checked, in one transaction
// whose row locks serialise parallel attempts, so a burst cannot pass the limit; a success
// clears the pair and account counters again.

const WINDOW_SECONDS = 15 * 60;
const BASE_LOCK_SECONDS = 30;
const MAX_LOCK_SECONDS = 15 * 60;

interface Policy {
  free: number;
  /** true: the wait doubles after each further failure; false: a fixed slow-down. */
  doubling: boolean;
}

const policies: Record<'pair' | 'ip' | 'email', Policy> = {
  pair: { free: 5, doubling: true },
  ip: { free: 20, doubling: true },
  email: { free: 10, doubling: false },
};

export function lockSecondsAfter(failures: number, free = policies.pair.free, doubling = true): number {
  if (failures < free) return 0;
  if (!doubling) return BASE_LOCK_SECONDS;
  return Math.min(MAX_LOCK_SECONDS, BASE_LOCK_SECONDS * 2 ** (failures - free));
}

function policyFor(key: string): Policy {
  return policies[key.slice(0, key.indexOf(':')) as keyof typeof policies] ?? policies.pair;
}

export function throttleKeys(email: string, address: string | null): string[] {
  const account = email.toLowerCase();
  return address ? [`pair:${account}|${address}`, `ip:${address}`, `email:${account}`] : [`email:${account}`];
}

/**
 * The client address for throttling. `X-Forwarded-For` is only believed for the hops our own
 * proxies appended: with `trustedProxies` = N the client is the N-th entry from the right.
 * With 0 (the default) the header is ignored: Next keeps a client-sent header as it is, so it
 * could be anything.
 */
export function clientAddress(forwardedFor: string | null | undefined, trustedProxies: number): string | null {
  if (trustedProxies <= 0 || !forwardedFor) return null;
  const hops = forwardedFor.split(',').map((h) => h.trim()).filter(Boolean);
  const address = hops[hops.length - trustedProxies];
  return address && /^[0-9a-fA-F:.]{2,45}$/.test(address) ? address : null;
}

/**
 * Counts one attempt on every key, or none when any key is paused. Returns 0 when the password
 * may be checked, else the seconds to wait.
 */
export async function beginAttempt(keys: string[], db: Kysely<DB> = defaultDb): Promise<number> {
  if (keys.length === 0) return 0;
  const refused = await db
    .transaction()
    .execute(async (trx) => {
      for (const key of keys) {
        const { free, doubling } = policyFor(key);
        const expired = sql<boolean>`sign_in_throttles.first_failure_at < now() - make_interval(secs => ${WINDOW_SECONDS})`;
        const failures = sql<number>`case when ${expired} then 1 else sign_in_throttles.failures + 1 end`;
        const lockFor = doubling
          ? sql`least(${MAX_LOCK_SECONDS}, ${BASE_LOCK_SECONDS} * power(2, greatest(0, ${failures} - ${free})))`
          : sql`${BASE_LOCK_SECONDS}`;
        const row = await trx
          .insertInto('sign_in_throttles')
          .values({ key, failures: 1 })
          .onConflict((oc) =>
            oc
              .column('key')
              .doUpdateSet({
                failures,
                first_failure_at: sql`case when ${expired} then now() else sign_in_throttles.first_failure_at end`,
                locked_until: sql`case when ${failures} >= ${free} then now() + make_interval(secs => ${lockFor}::int) else null end`,
              })
              // A paused key is not counted: the attempt is refused before its password is read.
              .where(sql<boolean>`sign_in_throttles.locked_until is null or sign_in_throttles.locked_until <= now()`),
          )
          .returning('failures')
          .executeTakeFirst();
        if (!row) throw new Refused();
      }
      return false;
    })
    .catch((error) => {
      if (error instanceof Refused) return true;
      throw error;
    });
  return refused ? Math.max(1, await secondsLocked(keys, db)) : 0;
}

class Refused extends Error {}

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

/**
 * After a right password: the pair and account start again; the address only takes back this
 * attempt, so a good sign-in from an address does not wipe another account's guesses from it.
 */
export async function clearFailures(keys: string[], db: Kysely<DB> = defaultDb): Promise<void> {
  const clear = keys.filter((k) => !k.startsWith('ip:'));
  const address = keys.filter((k) => k.startsWith('ip:'));
  if (clear.length) await db.deleteFrom('sign_in_throttles').where('key', 'in', clear).execute();
  if (address.length) {
    await db
      .updateTable('sign_in_throttles')
      .set({ failures: sql`greatest(0, failures - 1)` })
      .where('key', 'in', address)
      .execute();
  }
}
