// npm run backup → npm run restore into a fresh database and bucket: the same row counts, the same
// object checksums, a photo served from the restored copy; a non-empty target is refused and left
// as it was; objects written after the snapshot are noted and not restored.
// Uses the profile's PostgreSQL (a second database beside the test one) and its S3 fake (two
// buckets of its own), so it needs no port of its own.
import { execFile } from 'node:child_process';
import { createHash } from 'node:crypto';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { promisify } from 'node:util';
import { sql } from 'kysely';
import pg from 'pg';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import type { Actor } from '@/lib/auth/actor';
import { parseManifest, type BackupManifest } from '@/lib/ops/backup-manifest';
import { actorFor, createTestDb, demoEmails, resetToDemo, testDatabaseUrl } from '@/tests/helpers/db';
import { cameraImage } from '@/tests/helpers/photo-images';
import { mockAuthModule, session } from '@/tests/helpers/session';

const buckets = vi.hoisted(() => {
  const base = process.env.S3_BUCKET ?? 'rimeline-test';
  const previous = { S3_BUCKET: process.env.S3_BUCKET, DATABASE_URL: process.env.DATABASE_URL };
  // The app's modules in this file store into the backup's source bucket.
  process.env.S3_BUCKET = `${base}-backup-from`;
  delete (globalThis as { rimelineS3?: unknown }).rimelineS3;
  return { source: `${base}-backup-from`, target: `${base}-backup-to`, previous };
});
vi.mock('@/lib/auth', () => mockAuthModule());

const { uploadPhoto } = await import('@/lib/photos/service');
const { deleteObject, ensureBucket, getObjectBytes, listObjects, objectKey, putObject } = await import('@/storage/objects');
const { createBackup } = await import('@/docker-free-scripts/backup/create');
const { bucketConfigFromEnv, bucketClient, listAll } = await import('@/docker-free-scripts/backup/bucket');
const { countRows } = await import('@/docker-free-scripts/backup/postgres');
const { RestoreRefused, restoreBackup } = await import('@/docker-free-scripts/backup/restore');

const sourceUrl = testDatabaseUrl;
const targetName = `${new URL(sourceUrl).pathname.slice(1)}_restored`;
const targetUrl = sourceUrl.replace(/\/[^/]+$/, `/${targetName}`);
const adminUrl = sourceUrl.replace(/\/[^/]+$/, '/postgres');
const sourceBucket = bucketConfigFromEnv({ ...process.env, S3_BUCKET: buckets.source });
const targetBucket = { ...sourceBucket, bucket: buckets.target };
const minio = bucketClient(sourceBucket);
const work = mkdtempSync(path.join(tmpdir(), 'rimeline-backup-'));
const db = createTestDb();

let tech: Actor;
let equipmentId: string;
let companyId: string;
let keptPhotoId: string;
let thumbLessPhotoId: string;
let lostThumbKey: string;
let leftoverKey: string;

const sha256 = (bytes: Uint8Array) => createHash('sha256').update(bytes).digest('hex');

/** The scripts as a person runs them, pointed at one database and bucket (no lane variable, so the environment decides). */
async function runScript(script: 'backup' | 'restore', args: string[], target: { url: string; bucket: string }) {
  const env: NodeJS.ProcessEnv = { ...process.env, DATABASE_URL: target.url, S3_BUCKET: target.bucket };
  delete env.RIMELINE_TEST_PROFILE;
  try {
    const { stdout, stderr } = await promisify(execFile)('node_modules/.bin/tsx', [`docker-free-scripts/${script}.ts`, ...args], { env, timeout: 120_000 });
    return { code: 0, stdout, stderr };
  } catch (error) {
    const e = error as { code?: number; stdout?: string; stderr?: string };
    return { code: e.code ?? -1, stdout: e.stdout ?? '', stderr: e.stderr ?? '' };
  }
}

async function rowCounts(url: string): Promise<Record<string, number>> {
  const client = new pg.Client({ connectionString: url });
  await client.connect();
  try {
    return await countRows(client);
  } finally {
    await client.end();
  }
}

/** key → sha256 of every object in a bucket, read back through the minio client. */
async function bucketChecksums(bucket: string): Promise<Record<string, string>> {
  const out: Record<string, string> = {};
  for (const o of await listAll(minio, bucket)) {
    const chunks: Buffer[] = [];
    for await (const c of await minio.getObject(bucket, o.key)) chunks.push(c as Buffer);
    out[o.key] = sha256(Buffer.concat(chunks));
  }
  return out;
}

async function emptyBucket(bucket: string): Promise<void> {
  if (!(await minio.bucketExists(bucket))) return;
  const keys = (await listAll(minio, bucket)).map((o) => o.key);
  if (keys.length) await minio.removeObjects(bucket, keys);
}

async function dropTarget(): Promise<void> {
  const admin = new pg.Client({ connectionString: adminUrl });
  await admin.connect();
  await admin.query(`drop database if exists "${targetName}" with (force)`);
  await admin.end();
}

const photo = async () => uploadPhoto(tech, { equipmentId, kind: 'general', caption: null, fileName: 'p.jpg', bytes: await cameraImage({ width: 640, height: 480 }) });
const keysOf = (id: string) => db.selectFrom('photos').select(['original_key', 'display_key', 'thumb_key']).where('id', '=', id).executeTakeFirstOrThrow();

beforeAll(async () => {
  await ensureBucket();
  for (const o of await listObjects('')) await deleteObject(o.key);
  await resetToDemo(db);
  await dropTarget();
  await emptyBucket(buckets.target);
  tech = await actorFor(db, demoEmails.technician);
  const site = await db.selectFrom('sites').select(['id', 'company_id']).orderBy('name').executeTakeFirstOrThrow();
  companyId = site.company_id;
  equipmentId = (await db.insertInto('equipment').values({ company_id: companyId, site_id: site.id, type: 'evaporator', name: 'Unit cooler A' }).returning('id').executeTakeFirstOrThrow()).id;
  keptPhotoId = (await photo()).id;
  // Two problems a real bucket can have; the backup lists them and goes on.
  thumbLessPhotoId = (await photo()).id;
  lostThumbKey = (await keysOf(thumbLessPhotoId)).thumb_key;
  await deleteObject(lostThumbKey);
  leftoverKey = objectKey(companyId, 'photos', equipmentId, 'leftover', 'original');
  await putObject(leftoverKey, await cameraImage({ width: 64, height: 48 }), 'image/jpeg');
  // The leftover must be older than the snapshot: S3 keeps times to the second, so wait (without
  // asserting anything about time) until the database clock is in a later second.
  const written = (await listObjects('')).find((o) => o.key === leftoverKey)!.lastModified!;
  for (;;) {
    const { rows } = await sql<{ now: Date }>`select now() as now`.execute(db);
    if (Math.floor(rows[0]!.now.getTime() / 1000) > Math.floor(written.getTime() / 1000)) break;
    await new Promise((r) => setTimeout(r, 100));
  }
}, 120_000);

afterAll(async () => {
  await db.destroy();
  await dropTarget().catch(() => undefined);
  await emptyBucket(buckets.target).catch(() => undefined);
  rmSync(work, { recursive: true, force: true });
  for (const [k, v] of Object.entries(buckets.previous)) {
    if (v === undefined) delete process.env[k];
    else process.env[k] = v;
  }
  delete (globalThis as { rimelineS3?: unknown }).rimelineS3;
  delete (globalThis as { rimelineDb?: unknown }).rimelineDb;
});

describe('a backup', () => {
  it('notes objects written after its snapshot and lists leftovers and lost objects without failing', async () => {
    const photosBefore = await db.selectFrom('photos').select(db.fn.countAll<number>().as('n')).executeTakeFirstOrThrow();
    let late: { original_key: string; display_key: string; thumb_key: string } | undefined;
    const manifest = await createBackup({
      databaseUrl: sourceUrl,
      bucket: sourceBucket,
      out: path.join(work, 'with-late-photo'),
      afterSnapshot: async () => {
        late = await keysOf((await photo()).id);
      },
    });
    expect(Number(photosBefore.n)).toBe(2);
    expect(manifest.database.tables['public.photos']).toBe(2);
    expect(manifest.problems.afterSnapshot).toEqual([late!.original_key, late!.display_key, late!.thumb_key].sort());
    expect(manifest.objects.items.filter((o) => o.state === 'after_snapshot').map((o) => o.key).sort()).toEqual(manifest.problems.afterSnapshot);
    expect(manifest.problems.orphanObjects).toEqual([leftoverKey]);
    expect(manifest.problems.missingObjects).toEqual([{ table: 'photos', column: 'thumb_key', id: thumbLessPhotoId, key: lostThumbKey }]);
    // What the folder says is what it holds.
    const onDisk = parseManifest(readFileSync(path.join(work, 'with-late-photo', 'manifest.json'), 'utf8'));
    expect(onDisk).toEqual(manifest);
    for (const o of manifest.objects.items) expect(sha256(readFileSync(path.join(work, 'with-late-photo', o.file)))).toBe(o.sha256);
  }, 120_000);
});

describe('npm run backup → npm run restore', () => {
  const archive = path.join(work, 'archive');
  let manifest: BackupManifest;
  let sourceCounts: Record<string, number>;
  let sourceObjects: Record<string, string>;

  it('writes the dump, every object and a manifest that matches the source', async () => {
    sourceCounts = await rowCounts(sourceUrl);
    sourceObjects = await bucketChecksums(buckets.source);
    const run = await runScript('backup', ['--out', archive], { url: sourceUrl, bucket: buckets.source });
    expect(run.code, run.stderr).toBe(0);
    manifest = parseManifest(readFileSync(path.join(archive, 'manifest.json'), 'utf8'));
    expect(manifest.database.tables).toEqual(sourceCounts);
    expect(Object.fromEntries(manifest.objects.items.map((o) => [o.key, o.sha256]))).toEqual(sourceObjects);
    expect(manifest.problems.orphanObjects).toEqual([leftoverKey]);
    expect(manifest.problems.afterSnapshot).toEqual([]);
    expect(manifest.objects.items.find((o) => o.key === leftoverKey)?.contentType).toBe('image/jpeg');
  }, 120_000);

  it('restores into a fresh database and bucket: same row counts, same object checksums', async () => {
    const run = await runScript('restore', [archive], { url: targetUrl, bucket: buckets.target });
    expect(run.code, run.stderr).toBe(0);
    expect(run.stdout).toContain('the photo storage matches the backup');
    // The missing thumbnail and the leftover come back as they were, reported, not fixed.
    expect(run.stdout).toContain('2 problem(s) the backup already held');
    expect(await rowCounts(targetUrl)).toEqual(sourceCounts);
    expect(await bucketChecksums(buckets.target)).toEqual(sourceObjects);
  }, 120_000);

  it('serves a photo from the restored copy through the app', async () => {
    // The app's modules read their database and bucket once: load fresh ones on the restored pair.
    const old = { db: (globalThis as { rimelineDb?: { destroy(): Promise<void> } }).rimelineDb };
    vi.resetModules();
    process.env.DATABASE_URL = targetUrl;
    process.env.S3_BUCKET = buckets.target;
    delete (globalThis as { rimelineS3?: unknown }).rimelineS3;
    delete (globalThis as { rimelineDb?: unknown }).rimelineDb;
    const { GET } = await import('@/app/api/photos/[id]/[variant]/route');
    const { NextRequest } = await import('next/server');
    const restoredDb = createTestDb(targetUrl);
    try {
      session.actor = await actorFor(restoredDb, demoEmails.technician);
      const res = await GET(new NextRequest(`http://localhost/api/photos/${keptPhotoId}/display`), { params: Promise.resolve({ id: keptPhotoId, variant: 'display' }) });
      expect(res.status).toBe(200);
      expect(res.headers.get('content-type')).toBe('image/webp');
      const served = sha256(new Uint8Array(await res.arrayBuffer()));
      const displayKey = (await keysOf(keptPhotoId)).display_key;
      expect(served).toBe(sourceObjects[displayKey]);
      expect(served).toBe(sha256(await getObjectBytes(displayKey)));
    } finally {
      session.actor = null;
      await restoredDb.destroy();
      await (globalThis as { rimelineDb?: { destroy(): Promise<void> } }).rimelineDb?.destroy();
      await old.db?.destroy();
    }
  }, 120_000);

  it('refuses a target that holds anything, and changes nothing in it', async () => {
    const target = createTestDb(targetUrl);
    try {
      await target.insertInto('clients').values({ company_id: companyId, name: 'Added after the restore' }).execute();
    } finally {
      await target.destroy();
    }
    const countsBefore = await rowCounts(targetUrl);
    const objectsBefore = await bucketChecksums(buckets.target);
    const run = await runScript('restore', [archive], { url: targetUrl, bucket: buckets.target });
    expect(run.code).toBe(2);
    expect(run.stderr).toMatch(/Refused: the target is not empty: the database rimeline\w* on 127\.0\.0\.1:\d+ holds \d+ tables/);
    expect(run.stderr).toContain('--replace');
    expect(await rowCounts(targetUrl)).toEqual(countsBefore);
    expect(countsBefore['public.clients']).toBe(sourceCounts['public.clients']! + 1);
    expect(await bucketChecksums(buckets.target)).toEqual(objectsBefore);
  }, 120_000);

  it('with --replace, empties the target first and loads the backup as it was', async () => {
    await minio.fPutObject(buckets.target, 'stray-object', path.join(archive, 'manifest.json'));
    const run = await runScript('restore', [archive, '--replace'], { url: targetUrl, bucket: buckets.target });
    expect(run.code, run.stderr).toBe(0);
    expect(await rowCounts(targetUrl)).toEqual(sourceCounts);
    expect(await bucketChecksums(buckets.target)).toEqual(sourceObjects);
  }, 120_000);

  // The last two call the restore in-process: the command's refusal (exit 2) is checked above.
  it('refuses an empty database beside a bucket that holds objects, and creates no database', async () => {
    await dropTarget();
    const restore = restoreBackup({ archive, databaseUrl: targetUrl, bucket: targetBucket, replace: false });
    await expect(restore).rejects.toThrow(RestoreRefused);
    await expect(restore).rejects.toThrow(/bucket \S+-backup-to holds \d+ objects/);
    const admin = new pg.Client({ connectionString: adminUrl });
    await admin.connect();
    const exists = await admin.query('select 1 from pg_database where datname = $1', [targetName]);
    await admin.end();
    expect(exists.rowCount).toBe(0);
    expect(await bucketChecksums(buckets.target)).toEqual(sourceObjects);
  }, 120_000);

  it('refuses a folder whose files differ from its manifest, before touching the target', async () => {
    const damaged = path.join(work, 'damaged');
    await promisify(execFile)('cp', ['-r', archive, damaged]);
    const item = manifest.objects.items[0]!;
    writeFileSync(path.join(damaged, item.file), 'other bytes');
    // Even told to replace, it deletes nothing when the folder is not whole.
    const restore = restoreBackup({ archive: damaged, databaseUrl: targetUrl, bucket: targetBucket, replace: true });
    await expect(restore).rejects.toThrow(RestoreRefused);
    await expect(restore).rejects.toThrow('1 object file(s) are missing or damaged');
    expect(await bucketChecksums(buckets.target)).toEqual(sourceObjects);
  }, 120_000);

  it('puts back what the snapshot knew and leaves objects written after it in the folder', async () => {
    const folder = path.join(work, 'with-late-photo');
    const late = parseManifest(readFileSync(path.join(folder, 'manifest.json'), 'utf8'));
    await dropTarget();
    await emptyBucket(buckets.target);
    const result = await restoreBackup({ archive: folder, databaseUrl: targetUrl, bucket: targetBucket, replace: false });
    expect(result.objectsSkipped).toBe(3);
    expect((await rowCounts(targetUrl))['public.photos']).toBe(2);
    const restoredKeys = (await listAll(minio, buckets.target)).map((o) => o.key);
    expect(restoredKeys).toEqual(late.objects.items.filter((o) => o.state !== 'after_snapshot').map((o) => o.key));
    for (const key of late.problems.afterSnapshot) expect(restoredKeys).not.toContain(key);
  }, 120_000);
});
