// Throughput under load: autocannon holds 50, then 200, signed-in users each sending one request
// after another (no think time) to the equipment search (GET /api/equipment: session, actor
// lookup, zod, scoped keyset SQL, JSON), the route people lean on most from the phone. The
// figure is requests per second at 200 users as a share of that at 50: it should level off, not
// fall (issue 17, goal ≥ 90 %). The load tool runs on the same two cores as the app and the
// database, so the absolute rates are this machine's, not a server's.
import autocannon, { type Result } from 'autocannon';
import { Kysely, PostgresDialect, sql } from 'kysely';
import { pg } from '@/db/pg-types';
import type { DB } from '@/db/schema.gen';
import { seedDemo } from '@/docker-free-scripts/demo/scenario';
import { demoClient } from '@/tests/bench/support/db';
import { benchRow, sessionCookie } from '@/tests/bench/support/http';

const SITES = 200;
const UNITS = 10_000;
const SECONDS = Number(process.env.BENCH_THROUGHPUT_SECONDS ?? 20);
const appUrl = process.env.BENCH_APP_URL;
const db = new Kysely<DB>({ dialect: new PostgresDialect({ pool: new pg.Pool({ connectionString: process.env.DATABASE_URL, max: 2 }) }) });

async function seed(): Promise<string[]> {
  await seedDemo(db);
  const client = await demoClient(db);
  if (!(await db.selectFrom('sites').select('id').where('name', '=', 'Load site 1').executeTakeFirst())) {
    await sql`insert into sites (company_id, client_id, name, city) select ${client.company_id}, ${client.id}, 'Load site ' || g, 'Benchton' from generate_series(1, ${SITES}) g`.execute(db);
    await sql`
      with s as (select id, row_number() over (order by id) - 1 as n from sites where name like 'Load site %')
      insert into equipment (company_id, site_id, type, name, make, model, serial, condition, installed_on)
      select ${client.company_id}, s.id,
        (array['condensing_unit','evaporator','thermostat','solenoid_valve','fan_motor','contactor'])[1 + g % 6],
        'Load unit ' || g, (array['Kelvrin','Polarwick','Frostmere','Coldhaven'])[1 + g % 4], 'M-' || (g % 300),
        upper(substr(md5(g::text), 1, 4) || '-' || substr(md5(g::text), 5, 6)), 1 + g % 5, date '2005-01-01' + (g % 7000)
      from generate_series(1, ${UNITS}) g join s on s.n = g % ${SITES}`.execute(db);
    await sql`analyze`.execute(db);
  }
  const sites = await db.selectFrom('sites').select('id').where('name', 'like', 'Load site %').orderBy('name').limit(20).execute();
  // What people type: a make, a model, a serial fragment, and a site's units.
  const paths = ['/api/equipment?q=polarwick&limit=25', '/api/equipment?q=m-12&limit=25', '/api/equipment?q=load%20unit%2077&limit=25'];
  for (const s of sites) paths.push(`/api/equipment?siteId=${s.id}&limit=25`);
  return paths;
}

async function load(connections: number, seconds: number, cookie: string, paths: string[]): Promise<Result> {
  const result = await autocannon({
    url: appUrl!,
    connections,
    duration: seconds,
    timeout: 30,
    headers: { cookie, accept: 'application/json' },
    requests: paths.map((path) => ({ method: 'GET' as const, path })),
  });
  if (result.errors > 0 || result.non2xx > 0) console.log(`${connections} users: ${result.errors} errors, ${result.timeouts} timeouts, ${result.non2xx} answers other than 2xx`);
  return result;
}

function describe(r: Result): string {
  return `${r.requests.average.toFixed(0)} req/s (p50 ${r.latency.p50} ms, p99 ${r.latency.p99} ms, ${r.errors + r.non2xx} failed)`;
}

async function main(): Promise<void> {
  if (!appUrl) {
    console.error('BENCH_APP_URL is not set: run through `npm run bench` (it starts the app).');
    process.exit(1);
  }
  const paths = await seed();
  const cookie = await sessionCookie(appUrl, 'office@rimeline.test');
  const check = await fetch(`${appUrl}${paths[0]}`, { headers: { cookie } });
  if (!check.ok) throw new Error(`${paths[0]} answered ${check.status}`);
  await load(10, 5, cookie, paths); // warm: route compilation, plan caches, the app's pool
  const at50 = await load(50, SECONDS, cookie, paths);
  const at200 = await load(200, SECONDS, cookie, paths);
  console.log(JSON.stringify({ at50: { requests: at50.requests, latency: at50.latency }, at200: { requests: at200.requests, latency: at200.latency } }));
  const share = (100 * at200.requests.average) / at50.requests.average;
  benchRow(`throughput 50 users, equipment search (${SECONDS} s)`, describe(at50), '—', '—', '—');
  benchRow(`throughput 200 users vs 50, equipment search`, describe(at200), `50 users ${at50.requests.average.toFixed(0)} req/s`, `${share.toFixed(0)} %`, '≥ 90 %');
  await db.destroy();
}

await main();
