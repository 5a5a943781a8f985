// Equipment search at 100,000 rows across 2,000 sites: p50/p95 of GET /api/equipment over HTTP
// (session, validation, scoping, JSON) next to the same SQL sent straight through pg.
// Needs the app: bench.sh runs it with BENCH_APP_URL set.
import { performance } from 'node:perf_hooks';
import { Kysely, PostgresDialect, sql } from 'kysely';
import { pg } from '@/db/pg-types';
import type { DB } from '@/db/schema.gen';
import { seedDemo } from '@/docker-free-scripts/demo/scenario';
import type { Actor } from '@/lib/auth/actor';
import { buildEquipmentListQuery } from '@/lib/equipment/queries';
import { listEquipmentQuerySchema } from '@/lib/equipment/schemas';
import { benchRow, floorRow, percentile, signedInFetch, timeFloor } from '@/tests/bench/support/http';

const SITES = 2_000;
const ROWS = 100_000;
const SAMPLES = 300;
const appUrl = process.env.BENCH_APP_URL;
const pool = new pg.Pool({ connectionString: process.env.DATABASE_URL, max: 4 });
const db = new Kysely<DB>({ dialect: new PostgresDialect({ pool }) });

async function seed(): Promise<void> {
  await seedDemo(db);
  const have = await db.selectFrom('equipment').select((eb) => eb.fn.countAll<number>().as('n')).executeTakeFirstOrThrow();
  if (have.n >= ROWS) return;
  const client = await db.selectFrom('clients').select(['id', 'company_id']).orderBy('name').executeTakeFirstOrThrow();
  // Invented makes and serials; generated in SQL so 100,000 rows take seconds.
  await sql`
    insert into sites (company_id, client_id, name, city)
    select ${client.company_id}, ${client.id}, 'Bench site ' || g, 'Benchton' from generate_series(1, ${SITES}) g`.execute(db);
  await sql`
    with s as (select id, row_number() over (order by id) - 1 as n from sites where name like 'Bench site %')
    insert into equipment (company_id, site_id, type, name, make, model, serial, condition, installed_on)
    select ${client.company_id}, s.id,
      (array['condensing_unit','compressor','evaporator','condenser','pressure_control','thermostat','solenoid_valve','expansion_valve','defrost_control','contactor','fan_motor','other'])[1 + g % 12],
      'Unit ' || g,
      (array['Kelvrin','Polarwick','Frostmere','Coldhaven','Tundrel','Glacette','Borealis Works','Icefold'])[1 + g % 8],
      'M-' || (g % 500),
      upper(substr(md5(g::text), 1, 4) || '-' || substr(md5(g::text), 5, 6)),
      1 + g % 5,
      date '2005-01-01' + (g % 7000)
    from generate_series(1, ${ROWS}) g join s on s.n = g % ${SITES}`.execute(db);
  await sql`analyze`.execute(db);
}

/** A spread of what people type: serial fragments, a make, a model, plus a site filter. */
function queries(serials: string[], siteIds: string[]): Record<string, string>[] {
  const out: Record<string, string>[] = [];
  for (let i = 0; i < SAMPLES; i++) {
    const serial = serials[i % serials.length]!;
    const kind = i % 4;
    if (kind === 0) out.push({ q: serial.slice(2, 8).toLowerCase() });
    else if (kind === 1) out.push({ q: serial.slice(5, 10) });
    else if (kind === 2) out.push({ q: 'polarwick', sort: 'serial' });
    else out.push({ siteId: siteIds[i % siteIds.length]!, q: 'unit' });
  }
  return out;
}

async function main(): Promise<void> {
  if (!appUrl) {
    console.error('BENCH_APP_URL is not set: run through `npm run bench` (it starts the app).');
    process.exit(1);
  }
  await seed();
  const serials = (await db.selectFrom('equipment').select('serial').where('serial', 'is not', null).orderBy(sql`md5(id::text)`).limit(100).execute()).map((r) => r.serial!);
  const siteIds = (await db.selectFrom('sites').select('id').where('name', 'like', 'Bench site %').limit(100).execute()).map((r) => r.id);
  const office = await db.selectFrom('users').selectAll().where('email', '=', 'office@rimeline.test').executeTakeFirstOrThrow();
  const actor: Actor = { id: office.id, companyId: office.company_id, role: 'office', clientId: null, name: office.name, email: office.email, units: 'imperial', metricPressure: 'kPa' };
  const api = await signedInFetch(appUrl, 'office@rimeline.test');
  const list = queries(serials, siteIds);

  // Warm both paths (connection pools, plan caches, the app's route compilation).
  for (const q of list.slice(0, 20)) {
    await api(`/api/equipment?${new URLSearchParams(q)}`);
    const c = buildEquipmentListQuery(actor, listEquipmentQuerySchema.parse(q), db).compile();
    await pool.query(c.sql, c.parameters as unknown[]);
  }

  const apiTimes: number[] = [];
  const sqlTimes: number[] = [];
  const floorTimes: number[] = [];
  for (const q of list) {
    floorTimes.push(await timeFloor(api));
    let t = performance.now();
    const res = await api(`/api/equipment?${new URLSearchParams(q)}`);
    await res.json();
    if (!res.ok) throw new Error(`API answered ${res.status}`);
    apiTimes.push(performance.now() - t);

    const compiled = buildEquipmentListQuery(actor, listEquipmentQuerySchema.parse(q), db).compile();
    t = performance.now();
    await pool.query(compiled.sql, compiled.parameters as unknown[]);
    sqlTimes.push(performance.now() - t);
  }
  apiTimes.sort((a, b) => a - b);
  sqlTimes.sort((a, b) => a - b);
  floorTimes.sort((a, b) => a - b);
  const fmt = (ms: number) => `${ms.toFixed(1)} ms`;
  for (const p of [50, 95]) {
    const a = percentile(apiTimes, p);
    const s = percentile(sqlTimes, p);
    benchRow(`equipment search p${p} (100k rows, 2k sites)`, `API ${fmt(a)}`, `SQL via pg ${fmt(s)}`, `${(a / s).toFixed(2)}×`, p === 95 ? 'p95 < 50 ms, ratio < 2' : 'ratio < 2');
  }
  floorRow('equipment search', apiTimes, floorTimes, sqlTimes);
  await db.destroy();
}

await main();
