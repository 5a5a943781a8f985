// Equipment search at 100,000 rows across 2,000 sites: p50/p95 of GET /api/equipment over HTTP
// (session, validation, scoping, JSON) next to the same SQL sent straight through pg.
// Needs the app: bench.sh runs it with BENCH_APP_URL set.
import { sql } from 'kysely';
import { seedDemo } from '@/docker-free-scripts/demo/scenario';
import { buildEquipmentListQuery } from '@/lib/equipment/queries';
import { listEquipmentQuerySchema } from '@/lib/equipment/schemas';
import { benchDatabase, demoActor, demoClient, requireAppUrl, sendSql, timeApiBesideSql } from '@/tests/bench/support/db';
import { benchRow, floorRow, percentile, signedInFetch } from '@/tests/bench/support/http';

const SITES = 2_000;
const ROWS = 100_000;
const SAMPLES = 300;
const { db, pool } = benchDatabase();

async function seed(): Promise<void> {
  await seedDemo(db);
  const have = await db.selectFrom('equipment').select((eb) => eb.fn.countAll<number>().as('n')).executeTakeFirstOrThrow();
  if (have.n >= ROWS) return;
  const client = await demoClient(db);
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
  const appUrl = requireAppUrl();
  await seed();
  const serials = (await db.selectFrom('equipment').select('serial').where('serial', 'is not', null).orderBy(sql`md5(id::text)`).limit(100).execute()).map((r) => r.serial!);
  const siteIds = (await db.selectFrom('sites').select('id').where('name', 'like', 'Bench site %').limit(100).execute()).map((r) => r.id);
  const actor = await demoActor(db, 'office@rimeline.test');
  const api = await signedInFetch(appUrl, 'office@rimeline.test');
  const list = queries(serials, siteIds);
  const sqlOf = (q: Record<string, string>) => buildEquipmentListQuery(actor, listEquipmentQuerySchema.parse(q), db).compile();

  // Warm both paths (connection pools, plan caches, the app's route compilation).
  for (const q of list.slice(0, 20)) {
    await api(`/api/equipment?${new URLSearchParams(q)}`);
    await sendSql(pool, sqlOf(q));
  }

  const { apiTimes, sqlTimes, floorTimes } = await timeApiBesideSql(
    api,
    list.map((q) => {
      const compiled = sqlOf(q);
      return {
        call: async () => {
          const res = await api(`/api/equipment?${new URLSearchParams(q)}`);
          await res.json();
          if (!res.ok) throw new Error(`API answered ${res.status}`);
        },
        sql: () => sendSql(pool, compiled),
      };
    }),
  );
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
