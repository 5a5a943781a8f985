// The site pack a phone keeps (GET /api/sites/:id/pack) for a 30-unit and a 300-unit site, each unit
// with 25 entries (so the 20-entry cap applies), a tag and some follow-ups: its size and its download
// time over HTTP next to the same SQL through pg; then, in Chromium without signal, the time from a
// typed tag code on the Scan page to the unit's page from the phone's copy.
import { performance } from 'node:perf_hooks';
import { gzipSync } from 'node:zlib';
import { chromium } from '@playwright/test';
import { sql } from 'kysely';
import { seedDemo } from '@/docker-free-scripts/demo/scenario';
import { packFollowUpsQuery, packHistoryQuery, packOpenVisitQuery, packUnitsQuery } from '@/lib/sites/pack-queries';
import { checkSymbol, formatCode } from '@/lib/tags/code';
import { benchDatabase, demoActor, demoClient, requireAppUrl } from '@/tests/bench/support/db';
import { benchRow, percentile, signedInFetch } from '@/tests/bench/support/http';

const SAMPLES = 30;
const ENTRIES_PER_UNIT = 25;
const { db, pool } = benchDatabase();

/** A site of `units` units with tags, history and follow-ups; returns its id and one tag code. */
async function seedSite(units: number): Promise<{ siteId: string; code: string; unitName: string }> {
  const name = `Pack bench site ${units}`;
  const client = await demoClient(db);
  const tech = await db.selectFrom('users').select('id').where('email', '=', 'tech@rimeline.test').executeTakeFirstOrThrow();
  const existing = await db.selectFrom('sites').select('id').where('name', '=', name).executeTakeFirst();
  const siteId =
    existing?.id ??
    (await db.insertInto('sites').values({ company_id: client.company_id, client_id: client.id, name, time_zone: 'America/Chicago', elevation_m: 180 }).returning('id').executeTakeFirstOrThrow()).id;
  if (!existing) {
    const c = client.company_id;
    await sql`
      insert into equipment (company_id, site_id, type, name, make, model, serial, nameplate)
      select ${c}, ${siteId}, (array['evaporator','condensing_unit','pressure_control','thermostat'])[1 + g % 4],
        'Bench unit ' || lpad(g::text, 3, '0'), 'Kelvrin', 'KV-' || g, 'SN' || g,
        case g % 4 when 2 then jsonb_build_object('controlKind', 'low', 'lowCutInKpa', 200, 'lowDifferentialKpa', 70) else '{}'::jsonb end
      from generate_series(1, ${units}) g`.execute(db);
    await sql`
      insert into visits (company_id, site_id, technician_id, reason, status, started_at, ended_at, summary)
      select ${c}, ${siteId}, ${tech.id}, 'maintenance', 'closed', now() - g * interval '14 days', now() - g * interval '14 days' + interval '2 hours', 'Bench visit'
      from generate_series(1, ${ENTRIES_PER_UNIT}) g`.execute(db);
    await sql`
      insert into entries (company_id, visit_id, equipment_id, kind, data, recorded_at, created_by, client_entry_id)
      select ${c}, v.id, e.id,
        (array['note','reading','condition'])[1 + (row_number() over ()) % 3],
        case (row_number() over ()) % 3 when 0 then jsonb_build_object('text', 'Coil cleaned, drain clear, door gasket checked on ' || e.name)
             when 1 then jsonb_build_object('suctionKpaG', 150, 'dischargeKpaG', 1650, 'boxTempC', 2.5)
             else jsonb_build_object('rating', 4) end,
        v.started_at + interval '10 minutes', ${tech.id}, gen_random_uuid()
      from equipment e cross join visits v
      where e.site_id = ${siteId} and v.site_id = ${siteId}`.execute(db);
    await sql`
      insert into follow_ups (company_id, site_id, equipment_id, title, severity, created_by)
      select ${c}, ${siteId}, e.id, 'Replace cracked fan guard on ' || e.name, 'minor', ${tech.id}
      from equipment e where e.site_id = ${siteId} and e.name like '%0'`.execute(db);
    // One attached tag per unit; codes made with the product's own check symbol.
    const ids = await db.selectFrom('equipment').select(['id']).where('site_id', '=', siteId).orderBy('name').execute();
    const alphabet = '0123456789ABCDEFGHJKMNPQRSTVWXYZ';
    let next = units * 100_000;
    const code = (): string => {
      // Like issued codes: letters and digits only, so a check symbol of * ~ $ = is skipped.
      for (;;) {
        let data = '';
        let n = next++;
        for (let k = 0; k < 8; k++) {
          data = alphabet[n % 32]! + data;
          n = Math.floor(n / 32);
        }
        const check = checkSymbol(data);
        if (alphabet.includes(check)) return data + check;
      }
    };
    const rows = ids.map((u) => ({ company_id: c, code: code(), state: 'attached', equipment_id: u.id, site_id: siteId, attached_at: new Date() }));
    await db.insertInto('tags').values(rows).execute();
    await sql`analyze`.execute(db);
  }
  const last = await db
    .selectFrom('equipment')
    .innerJoin('tags', 'tags.equipment_id', 'equipment.id')
    .select(['tags.code', 'equipment.name'])
    .where('equipment.site_id', '=', siteId)
    .orderBy('equipment.name', 'desc')
    .executeTakeFirstOrThrow();
  return { siteId, code: last.code, unitName: last.name };
}

async function packFigures(label: string, siteId: string, api: Awaited<ReturnType<typeof signedInFetch>>): Promise<void> {
  const actor = await demoActor(db, 'tech@rimeline.test');
  const compiled = [packUnitsQuery(actor, db, siteId), packHistoryQuery(actor, db, siteId), packFollowUpsQuery(actor, db, siteId), packOpenVisitQuery(actor, db, siteId)].map((q) => q.compile());
  const runSql = () => Promise.all(compiled.map((c) => pool.query(c.sql, c.parameters as unknown[])));
  let bytes = 0;
  let gzipped = 0;
  for (let i = 0; i < 5; i++) {
    const body = Buffer.from(await (await api(`/api/sites/${siteId}/pack`)).arrayBuffer());
    bytes = body.byteLength;
    gzipped = gzipSync(body).byteLength;
    await runSql();
  }
  const apiTimes: number[] = [];
  const sqlTimes: number[] = [];
  for (let i = 0; i < SAMPLES; i++) {
    let t = performance.now();
    const res = await api(`/api/sites/${siteId}/pack`);
    const body = await res.arrayBuffer();
    if (!res.ok) throw new Error(`pack answered ${res.status}`);
    bytes = body.byteLength;
    apiTimes.push(performance.now() - t);
    t = performance.now();
    await runSql();
    sqlTimes.push(performance.now() - t);
  }
  apiTimes.sort((a, b) => a - b);
  sqlTimes.sort((a, b) => a - b);
  // The phone stores the JSON as it is; over the wire it travels compressed (server.ts: brotli, or gzip for a client without it).
  benchRow(`site pack size (${label})`, `${(bytes / 1024).toFixed(0)} KB JSON`, `${(gzipped / 1024).toFixed(0)} KB gzipped`, '-', '-');
  for (const p of [50, 95]) {
    const a = percentile(apiTimes, p);
    const s = percentile(sqlTimes, p);
    benchRow(`site pack download p${p} (${label})`, `API ${a.toFixed(1)} ms`, `its 4 queries via pg ${s.toFixed(1)} ms`, `${(a / s).toFixed(2)}×`, 'ratio < 3');
  }
}

/** In Chromium: keep the site, go offline, type the code on Scan, time until the unit's heading shows. */
async function offlineOpenTimes(appUrl: string, siteId: string, code: string, unitName: string): Promise<number[]> {
  const browser = await chromium.launch({ executablePath: '/usr/bin/chromium', args: ['--no-sandbox', '--disable-gpu'] });
  try {
    const context = await browser.newContext({ baseURL: appUrl, viewport: { width: 360, height: 740 }, isMobile: true, hasTouch: true });
    const page = await context.newPage();
    await page.goto('/sign-in?callbackUrl=%2Fscan');
    await page.getByLabel('E-mail').fill('tech@rimeline.test');
    await page.getByLabel('Password').fill('rimeline-demo');
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.waitForURL((u) => u.pathname === '/scan');
    await page.goto(`/sites/${siteId}`);
    await page.evaluate(async () => void (await navigator.serviceWorker.ready));
    await page.getByRole('button', { name: 'Keep this site on the phone' }).click();
    await page.getByText('Ready without signal').waitFor({ timeout: 60_000 });
    await page.goto('/scan');
    await page.reload();
    await page.waitForFunction(() => Boolean(navigator.serviceWorker.controller));
    await context.setOffline(true);
    const times: number[] = [];
    for (let i = 0; i < 12; i++) {
      await page.goto('/scan');
      await page.getByLabel('Tag code').fill(formatCode(code));
      const open = page.getByRole('button', { name: 'Open' });
      await open.waitFor();
      const t = performance.now();
      await open.click();
      await page.getByRole('heading', { level: 1, name: unitName }).waitFor({ timeout: 10_000 });
      times.push(performance.now() - t);
    }
    return times.slice(2).sort((a, b) => a - b);
  } finally {
    await browser.close();
  }
}

async function main(): Promise<void> {
  const appUrl = requireAppUrl();
  await seedDemo(db);
  const small = await seedSite(30);
  const large = await seedSite(300);
  const api = await signedInFetch(appUrl, 'tech@rimeline.test');
  await packFigures('30 units', small.siteId, api);
  await packFigures('300 units', large.siteId, api);
  try {
    const times = await offlineOpenTimes(appUrl, large.siteId, large.code, large.unitName);
    benchRow('typed code → unit page offline p50 (300-unit pack, Chromium)', `${percentile(times, 50).toFixed(0)} ms`, '-', '-', '≤ 300 ms');
    benchRow('typed code → unit page offline p95 (300-unit pack, Chromium)', `${percentile(times, 95).toFixed(0)} ms`, '-', '-', '≤ 300 ms');
  } catch (error) {
    console.error('offline timing failed:', error);
    benchRow('typed code → unit page offline (300-unit pack, Chromium)', 'error', '-', '-', '≤ 300 ms');
  }
  await db.destroy();
}

await main();
