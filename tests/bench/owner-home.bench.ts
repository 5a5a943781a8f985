// Rendering the owner home (server-rendered HTML, all summaries, attention and chart data) for a
// client with 50 sites and 5,000 equipment items, next to a minimal signed-in page (/settings)
// as the framework's own floor.
import { performance } from 'node:perf_hooks';
import bcrypt from 'bcryptjs';
import { Kysely, PostgresDialect, sql } from 'kysely';
import { pg } from '@/db/pg-types';
import type { DB } from '@/db/schema.gen';
import { DEMO_PASSWORD, seedDemo } from '@/docker-free-scripts/demo/scenario';
import { benchRow, percentile, signedInFetch, timeFloor } from '@/tests/bench/support/http';

const SITES = 50;
const UNITS = 5_000;
const BIG_UNITS = 50_000;
const SAMPLES = 40;
const OWNER = 'bench-owner@client-bench.test';
const appUrl = process.env.BENCH_APP_URL;
const db = new Kysely<DB>({ dialect: new PostgresDialect({ pool: new pg.Pool({ connectionString: process.env.DATABASE_URL, max: 2 }) }) });

async function seed(): Promise<void> {
  await seedDemo(db);
  if (await db.selectFrom('users').select('id').where('email', '=', OWNER).executeTakeFirst()) return;
  const company = await db.selectFrom('companies').select('id').executeTakeFirstOrThrow();
  const client = await db.insertInto('clients').values({ company_id: company.id, name: 'Bench Provisions Cooperative' }).returning('id').executeTakeFirstOrThrow();
  await db
    .insertInto('users')
    .values({ company_id: company.id, email: OWNER, name: 'Bench Owner', role: 'client', client_id: client.id, password_hash: await bcrypt.hash(DEMO_PASSWORD, 11) })
    .execute();
  await sql`insert into sites (company_id, client_id, name, city) select ${company.id}, ${client.id}, 'Bench store ' || g, 'Benchton' from generate_series(1, ${SITES}) g`.execute(db);
  await insertUnits(company.id, client.id, 1, UNITS);
  const tech = await db.selectFrom('users').select('id').where('email', '=', 'tech@rimeline.test').executeTakeFirstOrThrow();
  // Some history so the summaries and the ranking have work to do: a closed visit per site with
  // condition ratings, and open follow-ups.
  await sql`
    insert into visits (company_id, site_id, technician_id, reason, status, started_at, ended_at, summary)
    select ${company.id}, id, ${tech.id}, 'no_cooling', 'closed', now() - interval '10 days', now() - interval '9 days', 'Bench' from sites where client_id = ${client.id}`.execute(db);
  await sql`
    insert into entries (company_id, visit_id, equipment_id, kind, data, recorded_at, created_by, client_entry_id)
    select ${company.id}, v.id, e.id, 'condition', jsonb_build_object('rating', 1 + (row_number() over ()) % 5), now() - interval '10 days', ${tech.id}, gen_random_uuid()
    from equipment e join visits v on v.site_id = e.site_id where v.summary = 'Bench' and e.name like 'Bench unit %'`.execute(db);
  await sql`
    insert into follow_ups (company_id, site_id, equipment_id, title, severity, created_by)
    select ${company.id}, site_id, id, 'Bench follow-up', (array['safety','down','degraded','minor'])[1 + (row_number() over ()) % 4], ${tech.id}
    from equipment where name like 'Bench unit %' and condition = 1`.execute(db);
  await sql`analyze`.execute(db);
}

/**
 * Units `from`…`to` (numbered in their names), spread over the bench client's sites in turn, with
 * every type, rating (every seventh unrated) and install day from 1998 on.
 */
async function insertUnits(companyId: string, clientId: string, from: number, to: number): Promise<void> {
  await sql`
    with s as (select id, row_number() over (order by name) - 1 as n from sites where client_id = ${clientId})
    insert into equipment (company_id, site_id, type, name, condition, installed_on)
    select ${companyId}, s.id,
      (array['condensing_unit','evaporator','thermostat','solenoid_valve','fan_motor','contactor'])[1 + g % 6],
      'Bench unit ' || g, case when g % 7 = 0 then null else 1 + g % 5 end, date '1998-01-01' + (g % 9000)
    from generate_series(${from}::int, ${to}::int) g join s on s.n = g % ${SITES}`.execute(db);
}

/** More units, spread over the bench client's sites like the first 5,000. */
async function grow(count: number): Promise<void> {
  const company = await db.selectFrom('companies').select('id').executeTakeFirstOrThrow();
  const client = await db.selectFrom('clients').select('id').where('name', '=', 'Bench Provisions Cooperative').executeTakeFirstOrThrow();
  await insertUnits(company.id, client.id, UNITS + 1, UNITS + count);
  await sql`analyze`.execute(db);
}

/**
 * Back to the first 5,000 units: a run with --keep finds the last run's grown units, and would
 * otherwise time the home at 50,000 units and grow by 45,000 more. Benches that ran after it may
 * have tagged them (tags.bench.ts tags units of every client), so their tags go first.
 */
async function shrink(): Promise<void> {
  const grown = sql`select id from equipment where name like 'Bench unit %' and substring(name from 12)::int > ${UNITS}`;
  await sql`delete from tags where equipment_id in (${grown})`.execute(db);
  const gone = await sql`delete from equipment where id in (${grown})`.execute(db);
  if (Number(gone.numAffectedRows ?? 0) > 0) await sql`analyze`.execute(db);
}

async function time(fetcher: (p: string) => Promise<Response>, path: string): Promise<number[]> {
  const out: number[] = [];
  for (let i = 0; i < SAMPLES; i++) {
    const t = performance.now();
    const res = await fetcher(path);
    const html = await res.text();
    if (!res.ok || html.length < 1000) throw new Error(`${path} answered ${res.status}`);
    out.push(performance.now() - t);
  }
  return out.sort((a, b) => a - b);
}

async function main(): Promise<void> {
  if (!appUrl) {
    console.error('BENCH_APP_URL is not set: run through `npm run bench` (it starts the app).');
    process.exit(1);
  }
  await seed();
  await shrink();
  const owner = await signedInFetch(appUrl, OWNER);
  for (let i = 0; i < 5; i++) {
    await (await owner('/')).text();
    await (await owner('/settings')).text();
  }
  const home = await time(owner, '/');
  const floor = await time(owner, '/settings');
  for (const p of [50, 95]) {
    const h = percentile(home, p);
    const f = percentile(floor, p);
    benchRow(`owner home p${p} (50 sites, 5k units)`, `${h.toFixed(0)} ms`, `/settings ${f.toFixed(0)} ms`, `${(h / f).toFixed(2)}×`, p === 95 ? 'p95 ≤ 4× /settings' : '—');
  }

  // The attention list's first page at 50,000 units: 45,000 more in the same 50 sites.
  await grow(BIG_UNITS - UNITS);
  await (await owner('/api/overview/attention?limit=25')).json();
  const attention: number[] = [];
  const floor50k: number[] = [];
  for (let i = 0; i < SAMPLES; i++) {
    floor50k.push(await timeFloor(owner));
    const t = performance.now();
    const res = await owner('/api/overview/attention?limit=25');
    const body = (await res.json()) as { items: unknown[] };
    if (!res.ok || body.items.length === 0) throw new Error(`attention answered ${res.status}`);
    attention.push(performance.now() - t);
  }
  attention.sort((a, b) => a - b);
  floor50k.sort((a, b) => a - b);
  const a95 = percentile(attention, 95);
  const f95 = percentile(floor50k, 95);
  benchRow('attention list first page p95 (50k units)', `${a95.toFixed(0)} ms`, `GET /api/me ${f95.toFixed(1)} ms`, `${(a95 / f95).toFixed(1)}×`, 'p95 ≤ 300 ms');
  await db.destroy();
}

await main();
