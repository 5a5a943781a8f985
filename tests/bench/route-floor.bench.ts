// The route floor: what every signed-in request costs before it does any work of its own. GET
// /api/me reads the session cookie, looks the person and their server-side session up (one query)
// and returns them; next to it the same route without a cookie (401: the framework, the proxy and
// the error shape only) and the actor query alone through pg. Samples interleaved, one run.
import { performance } from 'node:perf_hooks';
import { Kysely, PostgresDialect } from 'kysely';
import { pg } from '@/db/pg-types';
import type { DB } from '@/db/schema.gen';
import { seedDemo } from '@/docker-free-scripts/demo/scenario';
import { benchRow, percentile, signedInFetch, timeFloor } from '@/tests/bench/support/http';

const SAMPLES = 400;
const appUrl = process.env.BENCH_APP_URL;
const pool = new pg.Pool({ connectionString: process.env.DATABASE_URL, max: 2 });
const db = new Kysely<DB>({ dialect: new PostgresDialect({ pool }) });

async function main(): Promise<void> {
  if (!appUrl) {
    console.error('BENCH_APP_URL is not set: run through `npm run bench` (it starts the app).');
    process.exit(1);
  }
  await seedDemo(db);
  const api = await signedInFetch(appUrl, 'office@rimeline.test');
  const office = await db.selectFrom('users').select('id').where('email', '=', 'office@rimeline.test').executeTakeFirstOrThrow();
  const session = await db.selectFrom('user_sessions').select('id').where('user_id', '=', office.id).where('revoked_at', 'is', null).orderBy('created_at', 'desc').executeTakeFirstOrThrow();
  // The query of lib/auth/sessions.ts actorForSession, as the app sends it.
  const actorSql = `select users.id, users.company_id, users.role, users.client_id, users.name, users.email, users.units, users.metric_pressure
    from users inner join user_sessions on user_sessions.user_id = users.id
    where users.id = $1 and users.deactivated_at is null and user_sessions.id = $2 and user_sessions.revoked_at is null and user_sessions.expires_at > now()`;
  const signedOut = async () => {
    const t = performance.now();
    const res = await fetch(`${appUrl}/api/me`);
    await res.json();
    if (res.status !== 401) throw new Error(`GET /api/me without a cookie answered ${res.status}`);
    return performance.now() - t;
  };
  const actorQuery = async () => {
    const t = performance.now();
    const r = await pool.query(actorSql, [office.id, session.id]);
    if (r.rowCount !== 1) throw new Error('the actor query found no live session');
    return performance.now() - t;
  };
  for (let i = 0; i < 30; i++) {
    await timeFloor(api);
    await signedOut();
    await actorQuery();
  }
  const floor: number[] = [];
  const anonymous: number[] = [];
  const query: number[] = [];
  for (let i = 0; i < SAMPLES; i++) {
    floor.push(await timeFloor(api));
    anonymous.push(await signedOut());
    query.push(await actorQuery());
  }
  for (const xs of [floor, anonymous, query]) xs.sort((a, b) => a - b);
  for (const p of [50, 95]) {
    const f = percentile(floor, p);
    const a = percentile(anonymous, p);
    benchRow(`route floor p${p} (signed-in GET /api/me)`, `${f.toFixed(1)} ms`, `signed out (401) ${a.toFixed(1)} ms`, `${(f / a).toFixed(2)}×`, p === 50 ? '≤ 3 ms' : '-');
  }
  const f = percentile(floor, 50);
  const a = percentile(anonymous, 50);
  const q = percentile(query, 50);
  benchRow('route floor p50, session cost beyond a 401', `${(f - a).toFixed(1)} ms`, `actor query via pg ${q.toFixed(1)} ms`, `${((f - a) / q).toFixed(2)}×`, '-');
  await db.destroy();
}

await main();
