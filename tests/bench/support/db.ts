import { Kysely, PostgresDialect, type CompiledQuery } from 'kysely';
import { performance } from 'node:perf_hooks';
import { pg } from '@/db/pg-types';
import type { DB } from '@/db/schema.gen';
import { actorFromRow, type Actor } from '@/lib/auth/actor';
import { timeFloor } from '@/tests/bench/support/http';

// What the benches that set an API answer beside its own SQL share: the lane's database (as Kysely,
// and as the bare pg pool that times the SQL alone), the app's address and a demo person.

/** The bench database of DATABASE_URL: `db` to seed and build queries, `pool` to send their SQL with nothing around it. */
export function benchDatabase(max = 4): { db: Kysely<DB>; pool: pg.Pool } {
  const pool = new pg.Pool({ connectionString: process.env.DATABASE_URL, max });
  return { pool, db: new Kysely<DB>({ dialect: new PostgresDialect({ pool }) }) };
}

/** The app bench.sh started; without it the bench stops and says how to run it. */
export function requireAppUrl(): string {
  const url = process.env.BENCH_APP_URL;
  if (url) return url;
  console.error('BENCH_APP_URL is not set: run through `npm run bench` (it starts the app).');
  process.exit(1);
}

/** A demo person as the services see them, to build the very query their API call runs. */
export async function demoActor(db: Kysely<DB>, email: string): Promise<Actor> {
  return actorFromRow(await db.selectFrom('users').selectAll().where('email', '=', email).executeTakeFirstOrThrow());
}

/**
 * The demo's first client (by creation, then name), to put a bench's own sites under. Never the
 * first by name: that is the owner-home bench's client once it has run, and its home would then
 * be timed with every other bench's sites.
 */
export async function demoClient(db: Kysely<DB>): Promise<{ id: string; company_id: string }> {
  return db.selectFrom('clients').select(['id', 'company_id']).orderBy('created_at').orderBy('name').executeTakeFirstOrThrow();
}

/** Sends a compiled query through the bare pool: the SQL's own time, no app around it. */
export async function sendSql(pool: pg.Pool, compiled: CompiledQuery): Promise<void> {
  await pool.query(compiled.sql, compiled.parameters as unknown[]);
}

/**
 * Times each sample three ways, one after the other so that load falls on all alike: the app's
 * floor (a request that does no work), the API call, and the same SQL alone. Sorted, for percentiles.
 */
export async function timeApiBesideSql(
  api: (path: string) => Promise<Response>,
  samples: readonly { call: () => Promise<void>; sql: () => Promise<void> }[],
): Promise<{ apiTimes: number[]; sqlTimes: number[]; floorTimes: number[] }> {
  const apiTimes: number[] = [];
  const sqlTimes: number[] = [];
  const floorTimes: number[] = [];
  for (const s of samples) {
    floorTimes.push(await timeFloor(api));
    let t = performance.now();
    await s.call();
    apiTimes.push(performance.now() - t);
    t = performance.now();
    await s.sql();
    sqlTimes.push(performance.now() - t);
  }
  const up = (a: number, b: number) => a - b;
  return { apiTimes: apiTimes.sort(up), sqlTimes: sqlTimes.sort(up), floorTimes: floorTimes.sort(up) };
}
