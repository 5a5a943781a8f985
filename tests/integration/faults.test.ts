// Faults while the app is busy, through the route handlers in one process (as one app copy):
// - PostgreSQL (this test profile's own cluster) is stopped and started again during a stream of
//   writes: every acknowledged write is in the database afterwards, writes while it is down are
//   refused with 503, and the same process answers again without a restart;
// - the object store (a private S3 fake of this file) is stopped during a stream of uploads:
//   every acknowledged photo has its row and objects, no refused upload leaves a row, and an
//   upload that started after the stop leaves no object either.
// Progress is awaited by polling counters with generous limits, never by timing.
import { execFile } from 'node:child_process';
import { promisify } from 'node:util';
import { NextRequest } from 'next/server';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { Kysely, PostgresDialect } from 'kysely';
import { pg } from '@/db/pg-types';
import type { DB } from '@/db/schema.gen';
import { actorFor, demoEmails, resetToDemo, testDatabaseUrl } from '@/tests/helpers/db';
import { cameraImage } from '@/tests/helpers/photo-images';
import { mockAuthModule, session } from '@/tests/helpers/session';

const { store, close: closeStore } = await vi.hoisted(async () =>
  (await import('@/tests/helpers/private-object-store')).openPrivateObjectStore('faults-test'),
);
vi.mock('@/lib/auth', () => mockAuthModule());

const { POST: createClientRoute } = await import('@/app/api/clients/route');
const { POST: uploadRoute } = await import('@/app/api/equipment/[id]/photos/route');
const { GET: healthRoute } = await import('@/app/api/health/route');
const { ensureBucket, listObjects } = await import('@/storage/objects');

const run = promisify(execFile);
// The test's own pool: its idle connections die with the server too, which without a listener
// is an uncaught error.
const pool = new pg.Pool({ connectionString: testDatabaseUrl, max: 3 });
pool.on('error', () => {});
const db = new Kysely<DB>({ dialect: new PostgresDialect({ pool }) });

// The profile under test (npm test exports it): its own cluster is the one restarted, never
// another profile's. Without it the test cannot know which cluster is its own, so it fails.
const profile = process.env.RIMELINE_PROFILE ?? '';
function assertOwnCluster(): void {
  expect(profile, 'run this through npm test (RIMELINE_TEST_PROFILE=laneN), which names the profile').toMatch(/^(test|lane[1-9])$/);
  expect(new URL(process.env.DATABASE_URL ?? '').port, 'DATABASE_URL must be the profile’s own PostgreSQL').toBe(process.env.PG_PORT);
}
const dbScript = (name: 'db-stop.sh' | 'db-start.sh') =>
  run('bash', [`docker-free-scripts/${name}`, profile, ...(name === 'db-stop.sh' ? ['--quiet'] : [])], { cwd: process.cwd(), timeout: 120_000 });

/** Waits until `ready()` is true, checking every 50 ms for up to `limitMs` (generous: a busy machine). */
async function until(what: string, ready: () => boolean | Promise<boolean>, limitMs = 90_000): Promise<void> {
  const start = Date.now();
  while (!(await ready())) {
    if (Date.now() - start > limitMs) throw new Error(`gave up waiting for ${what}`);
    await new Promise((r) => setTimeout(r, 50));
  }
}

type Outcome = { status: number; body: { id?: string; error?: { code: string; message: string } }; startedAt: number; endedAt: number };

/**
 * Runs `once` from `workers` loops until stopped, numbering each call. `phase` is a counter the
 * test moves forward (0 before the fault, 1 while stopping, 2 stopped, 3 starting, 4 back); each
 * outcome records the phase in which its call started and ended.
 */
function stream(workers: number, once: (n: number) => Promise<Omit<Outcome, 'startedAt' | 'endedAt'>>) {
  const state = { phase: 0, stopped: false, outcomes: [] as (Outcome & { n: number })[] };
  let n = 0;
  const loops = Array.from({ length: workers }, async () => {
    while (!state.stopped) {
      const mine = n++;
      const startedAt = state.phase;
      const result = await once(mine);
      state.outcomes.push({ ...result, n: mine, startedAt, endedAt: state.phase });
      // A refused call returns at once; a short pause keeps the loop from hogging the CPU that
      // the restarting service needs. (Pacing only: nothing is asserted about time.)
      if (result.status >= 500) await new Promise((r) => setTimeout(r, 25));
    }
  });
  return {
    state,
    count: (f: (o: Outcome) => boolean) => state.outcomes.filter(f).length,
    async stop() {
      state.stopped = true;
      await Promise.all(loops);
    },
  };
}

async function post(handler: typeof createClientRoute, url: string, params: Record<string, string>, body: BodyInit, headers: Record<string, string> = {}) {
  const res = await handler(new NextRequest(`http://localhost${url}`, { method: 'POST', body, headers }), { params: Promise.resolve(params) } as never);
  return { status: res.status, body: (await res.json()) as Outcome['body'] };
}

beforeAll(async () => {
  assertOwnCluster();
  await resetToDemo(db);
  await store.start();
  await ensureBucket();
});
afterAll(async () => {
  await closeStore();
  await db.destroy();
});

describe('faults during a stream of work', () => {
  it('a PostgreSQL restart loses no acknowledged write, refuses writes while it is down, and the app answers again', { timeout: 300_000 }, async () => {
    session.actor = await actorFor(db, demoEmails.office);
    const prefix = `Fault stream ${Date.now()}`;
    const writes = stream(3, (n) => post(createClientRoute, '/api/clients', {}, JSON.stringify({ name: `${prefix} #${n}` }), { 'content-type': 'application/json' }));
    const acked = (o: Outcome) => o.status === 201;
    try {
      await until('writes before the restart', () => writes.count(acked) >= 20);
      writes.state.phase = 1;
      await dbScript('db-stop.sh');
      writes.state.phase = 2;
      // Down: every write that starts now is refused, with the one error shape and a 503.
      await until('writes refused while the database is down', () => writes.count((o) => o.startedAt === 2 && o.endedAt === 2) >= 6);
      // The server accepts connections before db-start.sh has exited: from here on a write may
      // succeed again, so "while down" ends before the start begins.
      writes.state.phase = 3;
      await dbScript('db-start.sh');
      writes.state.phase = 4;
      // Back, in the same process: the pool reconnects by itself.
      await until('writes acknowledged after the restart', () => writes.count((o) => o.startedAt === 4 && acked(o)) >= 20);
    } finally {
      await writes.stop();
      // Whatever happened above, leave the cluster running for the next test files.
      if (writes.state.phase === 2) await dbScript('db-start.sh');
    }

    const outcomes = writes.state.outcomes;
    const whileDown = outcomes.filter((o) => o.startedAt === 2 && o.endedAt === 2);
    expect(whileDown.length).toBeGreaterThanOrEqual(6);
    for (const o of whileDown) {
      expect(o.status).toBe(503);
      expect(o.body).toEqual({ error: { code: 'unavailable', message: 'A service Rimeline needs cannot be reached right now. Try again in a moment.' } });
    }
    // Every answer is an acknowledgement or a clean 503, never a 500.
    expect(outcomes.filter((o) => o.status !== 201 && o.status !== 503)).toEqual([]);

    const ackedIds = outcomes.filter(acked).map((o) => o.body.id!);
    const stored = await db.selectFrom('clients').select(['id', 'name']).where('name', 'like', `${prefix} #%`).execute();
    const storedIds = new Set(stored.map((r) => r.id));
    expect(ackedIds.filter((id) => !storedIds.has(id))).toEqual([]);
    // A refused write that started while the database was down cannot have been stored.
    const refusedNames = new Set(whileDown.map((o) => `${prefix} #${(o as Outcome & { n: number }).n}`));
    expect(stored.filter((r) => refusedNames.has(r.name))).toEqual([]);

    const health = await healthRoute();
    expect(health.status).toBe(200);
  });

  it('the object store stopping during uploads leaves every acknowledged photo whole and nothing of a refused one', { timeout: 300_000 }, async () => {
    const tech = await actorFor(db, demoEmails.technician);
    session.actor = tech;
    const site = await db.selectFrom('sites').select(['id', 'company_id']).where('company_id', '=', tech.companyId).orderBy('name').executeTakeFirstOrThrow();
    const unit = await db.insertInto('equipment').values({ company_id: site.company_id, site_id: site.id, type: 'condensing_unit', name: 'Fault test condensing unit' }).returning('id').executeTakeFirstOrThrow();
    const image = await cameraImage();
    const upload = () => {
      const form = new FormData();
      form.set('kind', 'nameplate');
      form.set('file', new Blob([new Uint8Array(image)], { type: 'image/jpeg' }), 'photo.jpg');
      return post(uploadRoute as typeof createClientRoute, `/api/equipment/${unit.id}/photos`, { id: unit.id }, form);
    };
    const uploads = stream(2, upload);
    const acked = (o: Outcome) => o.status === 201;
    try {
      await until('uploads before the stop', () => uploads.count(acked) >= 4);
      uploads.state.phase = 1;
      await store.stop();
      uploads.state.phase = 2;
      await until('uploads refused while the store is down', () => uploads.count((o) => o.startedAt === 2) >= 4);
    } finally {
      await uploads.stop();
      uploads.state.phase = 3;
      await store.start();
    }

    const outcomes = uploads.state.outcomes;
    const afterStop = outcomes.filter((o) => o.startedAt === 2 && o.endedAt === 2);
    for (const o of afterStop) {
      expect(o.status).toBe(503);
      expect(o.body.error?.code).toBe('unavailable');
    }
    expect(outcomes.filter((o) => o.status !== 201 && o.status !== 503)).toEqual([]);

    // Rows: exactly the acknowledged photos, each with its three objects.
    const ackedIds = outcomes.filter(acked).map((o) => o.body.id!).sort();
    const rows = await db.selectFrom('photos').select(['id', 'original_key', 'display_key', 'thumb_key']).where('equipment_id', '=', unit.id).orderBy('id').execute();
    expect(rows.map((r) => r.id)).toEqual(ackedIds);
    const keys = new Set((await listObjects(`${tech.companyId}/photos/${unit.id}/`)).map((o) => o.key));
    for (const r of rows) expect([r.original_key, r.display_key, r.thumb_key].filter((k) => !keys.has(k))).toEqual([]);

    // Objects of refused uploads: none from an upload that started after the stop (the store
    // was down for all of it). One that was already writing when the store stopped may have
    // stored a file it could then not remove: at most its three, which the storage check lists
    // as orphans and its repair removes (lib/photos/consistency).
    const rowKeys = new Set(rows.flatMap((r) => [r.original_key, r.display_key, r.thumb_key]));
    const leftOver = [...keys].filter((k) => !rowKeys.has(k));
    const caughtByTheStop = outcomes.filter((o) => o.startedAt < 2 && o.endedAt >= 1 && !acked(o)).length;
    expect(leftOver.length).toBeLessThanOrEqual(3 * caughtByTheStop);
    if (leftOver.length > 0) {
      const { repairPhotoStorage } = await import('@/lib/photos/consistency');
      await repairPhotoStorage(db, tech.companyId, null, new Date(Date.now() + 24 * 3600_000));
      const after = new Set((await listObjects(`${tech.companyId}/photos/${unit.id}/`)).map((o) => o.key));
      expect([...after].sort()).toEqual([...rowKeys].sort());
    }

    // The store is back and the same process uploads again.
    const again = await upload();
    expect(again.status).toBe(201);
  });
});
