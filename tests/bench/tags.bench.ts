// Tags: (1) a 1,000-label sheet PDF next to the same 1,000 QR symbols rendered as PNG images alone;
// (2) p50/p95 of resolving a scanned code to the equipment page's data with 100,000 tags in the
// database — the same SQL straight through pg, and POST /api/scan over HTTP when the app runs
// (BENCH_APP_URL, set by `npm run bench -- --with-app`). Goals: under 2 s for 1,000 labels; p95 under 30 ms.
import { performance } from 'node:perf_hooks';
import { sql } from 'kysely';
import * as QRCode from 'qrcode';
import { seedDemo } from '@/docker-free-scripts/demo/scenario';
import type { Actor } from '@/lib/auth/actor';
import { equipmentBaseQuery, refrigerantExpr, selection } from '@/lib/equipment/queries';
import { generateCode } from '@/lib/tags/code';
import { renderLabelSheet, type LabelContent } from '@/lib/tags/pdf';
import { chooseErrorCorrection, tagUrl } from '@/lib/tags/qr';
import { lastScanQuery, layoutQuery, tagByCodeQuery, toLayout } from '@/lib/tags/queries';
import { benchDatabase, demoActor, demoClient } from '@/tests/bench/support/db';
import { benchRow, floorRow, percentile, signedInFetch, timeFloor } from '@/tests/bench/support/http';

const LABELS = 1_000;
const TAGS = 100_000;
const SITES = 1_000;
const SAMPLES = 400;
const appUrl = process.env.BENCH_APP_URL;
const APP_URL = process.env.APP_URL ?? 'http://localhost:3100';
const { db } = benchDatabase();
const fmt = (ms: number) => (ms >= 1000 ? `${(ms / 1000).toFixed(2)} s` : `${ms.toFixed(1)} ms`);

function median(xs: number[]): number {
  const s = [...xs].sort((a, b) => a - b);
  return s[Math.floor(s.length / 2)]!;
}

async function benchPdf(): Promise<void> {
  const layout = toLayout((await layoutQuery(db).where('id', '=', 'letter-30').executeTakeFirstOrThrow()));
  const ec = chooseErrorCorrection(APP_URL);
  const labels: LabelContent[] = Array.from({ length: LABELS }, (_, i) => {
    const code = generateCode();
    return {
      code,
      url: tagUrl(APP_URL, code),
      equipment: i % 2 ? { type: 'Condensing unit', name: `Walk-in cooler condensing unit ${i}`, site: 'Pell Street Kitchen', area: 'Roof' } : null,
    };
  });
  const company = { name: 'Brackenfield Refrigeration Service', servicePhone: '555-0100', labelLine: 'Service: 555-0100 · call before opening' };
  // Warm both paths (JIT, font metrics) on a few labels first.
  await renderLabelSheet({ layout, labels: labels.slice(0, 30), company, errorCorrection: ec });
  for (const l of labels.slice(0, 30)) await QRCode.toBuffer(l.url, { errorCorrectionLevel: ec, margin: 4, scale: 4 });

  const pdfTimes: number[] = [];
  const pngTimes: number[] = [];
  let bytes = 0;
  for (let r = 0; r < 3; r++) {
    let t = performance.now();
    const sheet = await renderLabelSheet({ layout, labels, company, errorCorrection: ec });
    pdfTimes.push(performance.now() - t);
    bytes = sheet.bytes.byteLength;
    t = performance.now();
    for (const l of labels) await QRCode.toBuffer(l.url, { errorCorrectionLevel: ec, margin: 4, scale: 4 });
    pngTimes.push(performance.now() - t);
  }
  const pdf = median(pdfTimes);
  const png = median(pngTimes);
  benchRow(
    `label sheet PDF, ${LABELS.toLocaleString('en-US')} labels (${Math.round(bytes / 1024)} KB)`,
    `PDF ${fmt(pdf)}`,
    `${LABELS.toLocaleString('en-US')} QR PNGs ${fmt(png)}`,
    `${(pdf / png).toFixed(2)}×`,
    '< 2 s',
  );
}

async function seedTags(companyId: string): Promise<void> {
  const have = await db.selectFrom('tags').select((eb) => eb.fn.countAll<number>().as('n')).executeTakeFirstOrThrow();
  if (have.n >= TAGS) return;
  const client = await demoClient(db);
  const attached = Math.round(TAGS * 0.9);
  const equipmentCount = await db.selectFrom('equipment').select((eb) => eb.fn.countAll<number>().as('n')).executeTakeFirstOrThrow();
  if (equipmentCount.n < attached) {
    // Invented names; generated in SQL so 90,000 units take seconds.
    await sql`
      insert into sites (company_id, client_id, name, city)
      select ${companyId}, ${client.id}, 'Tag bench site ' || g, 'Benchton' from generate_series(1, ${SITES}) g`.execute(db);
    await sql`
      with s as (select id, row_number() over (order by id) - 1 as n from sites where name like 'Tag bench site %')
      insert into equipment (company_id, site_id, type, name, make, serial)
      select ${companyId}, s.id, (array['condensing_unit','evaporator','pressure_control','thermostat'])[1 + g % 4], 'Tagged unit ' || g,
        (array['Kelvrin','Polarwick','Frostmere','Coldhaven'])[1 + g % 4], 'TB-' || g
      from generate_series(1, ${attached - Number(equipmentCount.n)}) g join s on s.n = g % ${SITES}`.execute(db);
  }
  const missing = TAGS - Number(have.n);
  const equipmentIds = await db
    .selectFrom('equipment')
    .select(['id', 'site_id'])
    .where('company_id', '=', companyId)
    .where(({ not, exists, selectFrom }) => not(exists(selectFrom('tags').select('tags.id').whereRef('tags.equipment_id', '=', 'equipment.id').where('tags.state', '=', 'attached'))))
    .limit(Math.min(attached, missing))
    .execute();
  const codes = new Set<string>();
  while (codes.size < missing) codes.add(generateCode());
  const all = [...codes];
  for (let start = 0; start < missing; start += 10_000) {
    const chunk = all.slice(start, start + 10_000);
    const eq = chunk.map((_, k) => equipmentIds[start + k] ?? null);
    await sql`
      insert into tags (company_id, code, state, site_id, equipment_id, attached_at)
      select ${companyId}, c, case when e is null then 'blank' else 'attached' end, s, e, case when e is null then null else now() end
      from unnest(${chunk}::text[], ${eq.map((e) => e?.id ?? null)}::uuid[], ${eq.map((e) => e?.site_id ?? equipmentIds[0]!.site_id)}::uuid[]) as t(c, e, s)`.execute(db);
  }
  await sql`analyze`.execute(db);
}

/** What a scan needs before the equipment page can render: the tag, the unit, its last scan; and the scan written. */
async function resolveViaSql(actor: Actor, code: string): Promise<void> {
  const tag = await tagByCodeQuery(db, actor.companyId, code).executeTakeFirst();
  if (!tag?.equipment_id) throw new Error(`bench code ${code} has no equipment`);
  await equipmentBaseQuery(actor, db).where('equipment.id', '=', tag.equipment_id).select([...selection, refrigerantExpr.as('refrigerant')]).executeTakeFirstOrThrow();
  await lastScanQuery(db, actor.companyId, tag.equipment_id).executeTakeFirst();
  await db.insertInto('tag_scans').values({ company_id: actor.companyId, tag_id: tag.id, equipment_id: tag.equipment_id, user_id: actor.id, via: 'camera' }).execute();
}

async function benchScan(): Promise<void> {
  await seedDemo(db);
  const actor = await demoActor(db, 'tech@rimeline.test');
  await seedTags(actor.companyId);
  const count = await db.selectFrom('tags').select((eb) => eb.fn.countAll<number>().as('n')).executeTakeFirstOrThrow();
  const codes = (
    await db.selectFrom('tags').select('code').where('state', '=', 'attached').where('company_id', '=', actor.companyId).orderBy(sql`md5(code)`).limit(SAMPLES).execute()
  ).map((r) => r.code);
  for (const c of codes.slice(0, 20)) await resolveViaSql(actor, c);
  const sqlTimes: number[] = [];
  for (const c of codes) {
    const t = performance.now();
    await resolveViaSql(actor, c);
    sqlTimes.push(performance.now() - t);
  }
  sqlTimes.sort((a, b) => a - b);
  const label = `${Number(count.n).toLocaleString('en-US')} tags`;

  if (appUrl) {
    const api = await signedInFetch(appUrl, 'tech@rimeline.test');
    const scan = (code: string) => api('/api/scan', { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ code, via: 'camera' }) });
    for (const c of codes.slice(0, 20)) await (await scan(c)).json();
    const apiTimes: number[] = [];
    const floorTimes: number[] = [];
    for (const c of codes) {
      floorTimes.push(await timeFloor(api));
      const t = performance.now();
      const res = await scan(c);
      const body = (await res.json()) as { equipment?: { id: string } };
      if (!res.ok || !body.equipment) throw new Error(`POST /api/scan answered ${res.status}`);
      apiTimes.push(performance.now() - t);
    }
    apiTimes.sort((a, b) => a - b);
    floorTimes.sort((a, b) => a - b);
    for (const p of [50, 95]) {
      const a = percentile(apiTimes, p);
      const s = percentile(sqlTimes, p);
      benchRow(`scan → equipment page data p${p} (${label})`, `API ${fmt(a)}`, `SQL via pg ${fmt(s)}`, `${(a / s).toFixed(2)}×`, p === 95 ? 'p95 < 30 ms' : '-');
    }
    floorRow('scan → equipment page data', apiTimes, floorTimes, sqlTimes);
  } else {
    for (const p of [50, 95]) {
      benchRow(`scan → equipment page data p${p} (${label}, SQL only: no app)`, `SQL via pg ${fmt(percentile(sqlTimes, p))}`, '-', '-', p === 95 ? 'p95 < 30 ms' : '-');
    }
  }
}

async function main(): Promise<void> {
  try {
    await benchPdf();
    await benchScan();
  } finally {
    await db.destroy();
  }
}

await main();
