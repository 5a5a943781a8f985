// The first history page of one equipment item with 5,000 entries, in a database of 2,000,000
// entries: p50/p95 of GET /api/equipment/:id/history over HTTP next to the same SQL through pg.
import { performance } from 'node:perf_hooks';
import { Kysely, PostgresDialect, sql } from 'kysely';
import { pg } from '@/db/pg-types';
import type { DB } from '@/db/schema.gen';
import { seedDemo } from '@/docker-free-scripts/demo/scenario';
import type { Actor } from '@/lib/auth/actor';
import { buildHistoryQuery } from '@/lib/visits/queries';
import { historyQuerySchema } from '@/lib/visits/schemas';
import { benchRow, floorRow, percentile, signedInFetch, timeFloor } from '@/tests/bench/support/http';

const TOTAL = 2_000_000;
const TARGET = 5_000;
const VISITS = 40_000;
const SAMPLES = 200;
const appUrl = process.env.BENCH_APP_URL;
const pool = new pg.Pool({ connectionString: process.env.DATABASE_URL, max: 4 });
const db = new Kysely<DB>({ dialect: new PostgresDialect({ pool }) });

async function seed(): Promise<string> {
  await seedDemo(db);
  const site = await db.selectFrom('sites').select(['id', 'company_id']).orderBy('name').executeTakeFirstOrThrow();
  const tech = await db.selectFrom('users').select('id').where('email', '=', 'tech@rimeline.test').executeTakeFirstOrThrow();
  const marker = 'History bench unit';
  const existing = await db.selectFrom('equipment').select('id').where('name', '=', marker).executeTakeFirst();
  if (existing) return existing.id;
  const target = await db
    .insertInto('equipment')
    .values({ company_id: site.company_id, site_id: site.id, type: 'condensing_unit', name: marker })
    .returning('id')
    .executeTakeFirstOrThrow();
  // Background equipment so the 2,000,000 entries spread over many units, as in a real company.
  await sql`
    insert into equipment (company_id, site_id, type, name)
    select ${site.company_id}, ${site.id}, 'evaporator', 'History filler ' || g from generate_series(1, 4000) g`.execute(db);
  await sql`
    insert into visits (company_id, site_id, technician_id, reason, status, started_at, ended_at, summary)
    select ${site.company_id}, ${site.id}, ${tech.id}, 'maintenance', 'closed',
      timestamptz '2016-01-01' + g * interval '2 hours', timestamptz '2016-01-01' + g * interval '2 hours' + interval '1 hour', 'Bench visit'
    from generate_series(1, ${VISITS}) g`.execute(db);
  await sql`
    with v as (select array_agg(id order by started_at) a from visits where summary = 'Bench visit'),
         e as (select array_agg(id) a from equipment where name like 'History filler %')
    insert into entries (company_id, visit_id, equipment_id, kind, data, recorded_at, created_by, client_entry_id)
    select ${site.company_id}, v.a[1 + (g % ${VISITS})],
      case when g <= ${TARGET} then ${target.id}::uuid else e.a[1 + (g % 4000)] end,
      (array['note','reading','condition','finding'])[1 + g % 4],
      case g % 4 when 0 then jsonb_build_object('text', 'Bench note ' || g)
                 when 1 then jsonb_build_object('suctionKpaG', 150 + g % 50, 'dischargeKpaG', 1600 + g % 300)
                 when 2 then jsonb_build_object('rating', 1 + g % 5)
                 else jsonb_build_object('text', 'Bench finding ' || g, 'severity', 'minor', 'raiseFollowUp', false) end,
      timestamptz '2016-01-01' + (g % ${VISITS}) * interval '2 hours' + (g % 50) * interval '1 minute',
      ${tech.id}, gen_random_uuid()
    from generate_series(1, ${TOTAL}) g, v, e`.execute(db);
  await sql`analyze`.execute(db);
  return target.id;
}

async function main(): Promise<void> {
  if (!appUrl) {
    console.error('BENCH_APP_URL is not set: run through `npm run bench` (it starts the app).');
    process.exit(1);
  }
  const equipmentId = await seed();
  const office = await db.selectFrom('users').selectAll().where('email', '=', 'office@rimeline.test').executeTakeFirstOrThrow();
  const actor: Actor = { id: office.id, companyId: office.company_id, role: 'office', clientId: null, name: office.name, email: office.email, units: 'imperial', metricPressure: 'kPa' };
  const api = await signedInFetch(appUrl, 'office@rimeline.test');
  const compiled = buildHistoryQuery(actor, db, historyQuerySchema.parse({}), { equipmentId }).compile();
  for (let i = 0; i < 20; i++) {
    await (await api(`/api/equipment/${equipmentId}/history`)).json();
    await pool.query(compiled.sql, compiled.parameters as unknown[]);
  }
  const apiTimes: number[] = [];
  const sqlTimes: number[] = [];
  const floorTimes: number[] = [];
  for (let i = 0; i < SAMPLES; i++) {
    floorTimes.push(await timeFloor(api));
    let t = performance.now();
    const res = await api(`/api/equipment/${equipmentId}/history`);
    const body = (await res.json()) as { items: unknown[] };
    if (!res.ok || body.items.length !== 25) throw new Error(`history answered ${res.status} with ${body.items?.length} items`);
    apiTimes.push(performance.now() - t);
    t = performance.now();
    await pool.query(compiled.sql, compiled.parameters as unknown[]);
    sqlTimes.push(performance.now() - t);
  }
  apiTimes.sort((a, b) => a - b);
  sqlTimes.sort((a, b) => a - b);
  floorTimes.sort((a, b) => a - b);
  for (const p of [50, 95]) {
    const a = percentile(apiTimes, p);
    const s = percentile(sqlTimes, p);
    benchRow(`history first page p${p} (5k of 2M entries)`, `API ${a.toFixed(1)} ms`, `SQL via pg ${s.toFixed(1)} ms`, `${(a / s).toFixed(2)}×`, p === 95 ? 'p95 < 50 ms, ratio < 2' : 'ratio < 2');
  }
  floorRow('history first page', apiTimes, floorTimes, sqlTimes);
  await db.destroy();
}

await main();
