// The first history page of one equipment item with 5,000 entries, in a database of 2,000,000
// entries: p50/p95 of GET /api/equipment/:id/history over HTTP next to the same SQL through pg.
import { sql } from 'kysely';
import { seedDemo } from '@/docker-free-scripts/demo/scenario';
import { buildHistoryQuery } from '@/lib/visits/queries';
import { historyQuerySchema } from '@/lib/visits/schemas';
import { benchDatabase, demoActor, requireAppUrl, sendSql, timeApiBesideSql } from '@/tests/bench/support/db';
import { benchRow, floorRow, percentile, signedInFetch } from '@/tests/bench/support/http';

const TOTAL = 2_000_000;
const TARGET = 5_000;
const VISITS = 40_000;
const SAMPLES = 200;
const { db, pool } = benchDatabase();

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
  const appUrl = requireAppUrl();
  const equipmentId = await seed();
  const actor = await demoActor(db, 'office@rimeline.test');
  const api = await signedInFetch(appUrl, 'office@rimeline.test');
  const compiled = buildHistoryQuery(actor, db, historyQuerySchema.parse({}), { equipmentId }).compile();
  for (let i = 0; i < 20; i++) {
    await (await api(`/api/equipment/${equipmentId}/history`)).json();
    await sendSql(pool, compiled);
  }
  const sample = {
    call: async () => {
      const res = await api(`/api/equipment/${equipmentId}/history`);
      const body = (await res.json()) as { items: unknown[] };
      if (!res.ok || body.items.length !== 25) throw new Error(`history answered ${res.status} with ${body.items?.length} items`);
    },
    sql: () => sendSql(pool, compiled),
  };
  const { apiTimes, sqlTimes, floorTimes } = await timeApiBesideSql(api, Array.from({ length: SAMPLES }, () => sample));
  for (const p of [50, 95]) {
    const a = percentile(apiTimes, p);
    const s = percentile(sqlTimes, p);
    benchRow(`history first page p${p} (5k of 2M entries)`, `API ${a.toFixed(1)} ms`, `SQL via pg ${s.toFixed(1)} ms`, `${(a / s).toFixed(2)}×`, p === 95 ? 'p95 < 50 ms, ratio < 2' : 'ratio < 2');
  }
  floorRow('history first page', apiTimes, floorTimes, sqlTimes);
  await db.destroy();
}

await main();
