// Photo pipeline cost: a 12-megapixel phone JPEG (4000 × 3000, EXIF orientation 6, GPS) through
// the app's whole upload path, next to sharp alone doing the same two resizes; and photos per
// second for 20 parallel 3 MB uploads, next to sharp alone on the same 20 files.
// With BENCH_APP_URL (npm run bench -- --with-app photos) the path is HTTP: multipart upload to
// the running app as the demo technician (session, checks, processing, three S3 writes, row and
// audit). Without it the upload service runs in this process (the same path minus HTTP). Over
// HTTP two more rows (not goals) split off this bench's own client and the local S3 fake.
import { register } from 'node:module';
import { performance } from 'node:perf_hooks';
import { Kysely, PostgresDialect } from 'kysely';
import { pg } from '@/db/pg-types';
import type { DB } from '@/db/schema.gen';
import { seedDemo } from '@/docker-free-scripts/demo/scenario';
import type { Actor } from '@/lib/auth/actor';
import { checkPhoto, displayPipeline, thumbPipeline, uprightImage } from '@/lib/photos/process';
import { benchRow, signedInFetch } from '@/tests/bench/support/http';
import { cameraImage } from '@/tests/helpers/photo-images';

// The in-process path loads the server-only upload service outside Next; resolve 'server-only'
// the way a React server build does (as docker-free-scripts/photos-check.ts does).
register(
  'data:text/javascript,' +
    encodeURIComponent(
      `export async function resolve(s, c, n) { return s === 'server-only' ? n(s, { ...c, conditions: [...c.conditions, 'react-server'] }) : n(s, c); }`,
    ),
);

const RUNS = 5;
const PARALLEL = 20;
const appUrl = process.env.BENCH_APP_URL;
const pool = new pg.Pool({ connectionString: process.env.DATABASE_URL, max: 4 });
const db = new Kysely<DB>({ dialect: new PostgresDialect({ pool }) });

const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)]!;
/**
 * Runs `measured` and `baseline` in turn, RUNS times each, so the machine's load falls on both
 * alike; their median times in ms.
 */
async function mediansInTurn(measured: (run: number) => Promise<unknown>, baseline: () => Promise<unknown>): Promise<[number, number]> {
  const a: number[] = [];
  const b: number[] = [];
  for (let i = 0; i < RUNS; i++) {
    let t = performance.now();
    await measured(i);
    a.push(performance.now() - t);
    t = performance.now();
    await baseline();
    b.push(performance.now() - t);
  }
  return [median(a), median(b)];
}
const mb = (n: number) => `${(n / 1024 / 1024).toFixed(1)} MB`;

async function sharpAlone(bytes: Buffer): Promise<void> {
  await Promise.all([displayPipeline(uprightImage(bytes)).toBuffer(), thumbPipeline(uprightImage(bytes)).toBuffer()]);
}

async function setup(): Promise<{ actor: Actor; equipmentId: string }> {
  await seedDemo(db);
  const tech = await db.selectFrom('users').selectAll().where('email', '=', 'tech@rimeline.test').executeTakeFirstOrThrow();
  const site = await db.selectFrom('sites').select(['id', 'company_id']).where('company_id', '=', tech.company_id).orderBy('name').executeTakeFirstOrThrow();
  const equipment = await db
    .insertInto('equipment')
    .values({ company_id: site.company_id, site_id: site.id, type: 'condensing_unit', name: `Bench condensing unit ${Date.now()}` })
    .returning('id')
    .executeTakeFirstOrThrow();
  const actor: Actor = { id: tech.id, companyId: tech.company_id, role: 'technician', clientId: null, name: tech.name, email: tech.email, units: 'imperial', metricPressure: 'kPa' };
  return { actor, equipmentId: equipment.id };
}

type Upload = (bytes: Buffer, name: string) => Promise<void>;

async function uploader(actor: Actor, equipmentId: string): Promise<{ upload: Upload; path: string }> {
  if (appUrl) {
    const api = await signedInFetch(appUrl, 'tech@rimeline.test');
    return {
      path: 'HTTP upload to the app',
      upload: async (bytes, name) => {
        const body = new FormData();
        body.set('kind', 'nameplate');
        body.set('file', new Blob([new Uint8Array(bytes)], { type: 'image/jpeg' }), name);
        const res = await api(`/api/equipment/${equipmentId}/photos`, { method: 'POST', body });
        if (res.status !== 201) throw new Error(`upload answered ${res.status}: ${await res.text()}`);
        await res.arrayBuffer();
      },
    };
  }
  const { ensureBucket } = await import('@/storage/objects');
  const { uploadPhoto } = await import('@/lib/photos/service');
  await ensureBucket();
  return {
    path: 'upload service in-process',
    upload: async (bytes, name) => {
      await uploadPhoto(actor, { equipmentId, kind: 'nameplate', caption: null, fileName: name, bytes });
    },
  };
}

/**
 * Not goal rows: what of the HTTP pipeline is this bench's own client and the local S3 fake. The
 * same upload with its multipart body encoded before the timing starts (the client's FormData
 * copies and streaming out), and one put of the 12 MP original to the fake store from this
 * process (the store's share of an upload; a managed store is another machine's work).
 */
async function transportSplit(equipmentId: string, twelve: Buffer): Promise<void> {
  const api = await signedInFetch(appUrl!, 'tech@rimeline.test');
  const form = new FormData();
  form.set('kind', 'nameplate');
  form.set('file', new Blob([new Uint8Array(twelve)], { type: 'image/jpeg' }), 'plate-prebuilt.jpg');
  const encoded = new Request('http://bench.invalid/', { method: 'POST', body: form });
  const type = encoded.headers.get('content-type')!;
  const body = Buffer.from(await encoded.arrayBuffer());
  const [p, s] = await mediansInTurn(async () => {
    const res = await api(`/api/equipment/${equipmentId}/photos`, { method: 'POST', body, headers: { 'content-type': type } });
    if (res.status !== 201) throw new Error(`upload answered ${res.status}: ${await res.text()}`);
    await res.arrayBuffer();
  }, () => sharpAlone(twelve));
  benchRow(`photo pipeline, 12 MP JPEG, body encoded before the timing (HTTP, median of ${RUNS})`, `${p.toFixed(0)} ms`, `sharp alone ${s.toFixed(0)} ms`, `${(p / s).toFixed(2)}×`, 'reported (client split)');

  const { ensureBucket, objectKey, putObject } = await import('@/storage/objects');
  await ensureBucket();
  const [put, s2] = await mediansInTurn(() => putObject(objectKey('bench', 'put-alone'), twelve, 'image/jpeg'), () => sharpAlone(twelve));
  benchRow(`S3 fake: one put of the 12 MP original (${mb(twelve.length)}) from the bench process (median of ${RUNS})`, `${put.toFixed(0)} ms`, `sharp alone ${s2.toFixed(0)} ms`, `${(put / s2).toFixed(2)}×`, 'reported (store split)');
}

async function main(): Promise<void> {
  const { actor, equipmentId } = await setup();
  const { upload, path } = await uploader(actor, equipmentId);
  const twelve = await cameraImage({ width: 4000, height: 3000, orientation: 6, gps: true, takenAt: '2026:11:30 09:12:00', grain: 20, quality: 90 });
  // Twenty different 12 MP files of about 3 MB (grain varies), so nothing is served from a cache.
  const files = await Promise.all(Array.from({ length: PARALLEL }, (_, i) => cameraImage({ width: 4000, height: 3000, orientation: 6, gps: true, grain: 14 + i * 0.05, quality: 88 })));
  console.log(`12 MP file ${mb(twelve.length)}; parallel files ${mb(Math.min(...files.map((f) => f.length)))}–${mb(Math.max(...files.map((f) => f.length)))}; path: ${path}`);

  // Warm both paths (route compilation, connection pools, libvips start-up).
  await upload(twelve, 'warm-up.jpg');
  await sharpAlone(twelve);

  const [p, s] = await mediansInTurn((i) => upload(twelve, `plate-${i}.jpg`), () => sharpAlone(twelve));
  benchRow(`photo pipeline, 12 MP JPEG (${path}, median of ${RUNS})`, `${p.toFixed(0)} ms`, `sharp alone ${s.toFixed(0)} ms`, `${(p / s).toFixed(2)}×`, '≤ 1.2');

  // The upload's checks and image work alone (type, size, pixel limit, both copies, EXIF facts,
  // location removal), in this process with no HTTP, storage or database: what the pipeline costs
  // beyond this is the transport (body, form parsing) and the stores.
  const [w, s2] = await mediansInTurn(
    async () => {
      const checked = await checkPhoto(twelve, { keepLocation: false, timeZone: 'America/Chicago' });
      await checked.display;
    },
    () => sharpAlone(twelve),
  );
  benchRow(`photo checks and image work only, 12 MP JPEG (in-process, median of ${RUNS})`, `${w.toFixed(0)} ms`, `sharp alone ${s2.toFixed(0)} ms`, `${(w / s2).toFixed(2)}×`, 'reported');

  if (appUrl) await transportSplit(equipmentId, twelve);

  let t = performance.now();
  await Promise.all(files.map((f, i) => upload(f, `parallel-${i}.jpg`)));
  const uploadsPerSecond = PARALLEL / ((performance.now() - t) / 1000);
  t = performance.now();
  await Promise.all(files.map((f) => sharpAlone(f)));
  const sharpPerSecond = PARALLEL / ((performance.now() - t) / 1000);
  benchRow(
    `photos per second, ${PARALLEL} parallel ~3 MB uploads (${path})`,
    `${uploadsPerSecond.toFixed(2)}/s`,
    `sharp alone ${sharpPerSecond.toFixed(2)}/s`,
    `${(sharpPerSecond / uploadsPerSecond).toFixed(2)}×`,
    'reported (2 cores)',
  );

  // The photos and their objects stay; npm run bench wipes its profile on the next run.
  await db.destroy();
  if (!appUrl) {
    const { db: appDb } = await import('@/db');
    await appDb.destroy();
  }
}

await main();
