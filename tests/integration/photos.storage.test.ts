// The other side of a failed upload (the row fails after the objects were written), and the
// storage check with its repair: through the service, the admin route and the script.
import { execFile } from 'node:child_process';
import { promisify } from 'node:util';
import type { KyselyPlugin } from 'kysely';
import { NextRequest } from 'next/server';
import sharp from 'sharp';
import { beforeEach, describe, expect, it, vi } from 'vitest';
import type { Actor } from '@/lib/auth/actor';
import type { StorageReportDto, StorageRepairDto } from '@/lib/photos/dto';
import { createTestDb, demoActors } from '@/tests/helpers/db';
import { cameraImage } from '@/tests/helpers/photo-images';
import { freshDemoAndBucket } from '@/tests/helpers/private-object-store';
import { mockAuthModule, session } from '@/tests/helpers/session';

const objects = await vi.hoisted(async () =>
  (await import('@/tests/helpers/private-object-store')).openPrivateObjectStore('photos-storage-test'),
);
vi.mock('@/lib/auth', () => mockAuthModule());

const { uploadPhoto } = await import('@/lib/photos/service');
const { inspectPhotoStorage, repairPhotoStorage } = await import('@/lib/photos/consistency');
const { GET: checkRoute } = await import('@/app/api/photos/consistency/route');
const { POST: repairRoute } = await import('@/app/api/photos/consistency/repair/route');
const { deleteObject, getObjectBytes, listObjects, objectKey, putObject } = await import('@/storage/objects');

const db = createTestDb();
let tech: Actor;
let admin: Actor;
let equipmentId: string;
const later = () => new Date(Date.now() + 20 * 60_000);

freshDemoAndBucket(objects, db);
beforeEach(async () => {
  ({ technician: tech, admin } = await demoActors(db));
  const site = await db.selectFrom('sites').select(['id', 'company_id']).orderBy('name').executeTakeFirstOrThrow();
  equipmentId = (await db.insertInto('equipment').values({ company_id: site.company_id, site_id: site.id, type: 'evaporator', name: 'Unit cooler A' }).returning('id').executeTakeFirstOrThrow()).id;
});

const photo = async (kind: 'general' | 'corrosion' = 'general') =>
  uploadPhoto(tech, { equipmentId, kind, caption: null, fileName: 'p.jpg', bytes: await cameraImage({ width: 900, height: 600 }) });

async function keysOf(photoId: string) {
  return db.selectFrom('photos').select(['original_key', 'display_key', 'thumb_key', 'content_type']).where('id', '=', photoId).executeTakeFirstOrThrow();
}

describe('an upload whose row cannot be written', () => {
  it('removes the objects it had already stored, leaving nothing behind', async () => {
    // A database handle that refuses every insert into photos, as a constraint or outage would.
    const refusePhotoInsert: KyselyPlugin = {
      transformQuery(args) {
        const node = args.node as { kind: string; into?: { table?: { identifier?: { name?: string } } } };
        if (node.kind === 'InsertQueryNode' && node.into?.table?.identifier?.name === 'photos') throw new Error('insert refused for the test');
        return args.node;
      },
      async transformResult(args) {
        return args.result;
      },
    };
    const failing = db.withPlugin(refusePhotoInsert);
    await expect(uploadPhoto(tech, { equipmentId, kind: 'damage', caption: null, fileName: null, bytes: await cameraImage() }, failing)).rejects.toThrow(
      'insert refused for the test',
    );
    expect(await listObjects('')).toEqual([]);
    expect(await db.selectFrom('photos').select('id').execute()).toEqual([]);
    expect(await db.selectFrom('audit_events').select('id').where('entity_type', '=', 'photo').execute()).toEqual([]);
  });
});

describe('storage check', () => {
  async function damage() {
    const regenerate = await photo();
    const restore = await photo('corrosion');
    const gone = await photo();
    const kept = await photo();
    const a = await keysOf(regenerate.id);
    const b = await keysOf(restore.id);
    const c = await keysOf(gone.id);
    await deleteObject(a.display_key);
    await deleteObject(a.thumb_key);
    await deleteObject(b.original_key);
    for (const k of [c.original_key, c.display_key, c.thumb_key]) await deleteObject(k);
    const orphan = objectKey(tech.companyId, 'photos', equipmentId, '0d6f1c52-9a1b-4d3e-8f7a-2b5c6d7e8f90', 'original');
    await putObject(orphan, Buffer.from('left behind'), 'image/jpeg');
    // Objects outside the photo layout are not the check's business.
    await putObject(`${tech.companyId}/reports/visit.pdf`, Buffer.from('%PDF'), 'application/pdf');
    return { regenerate, restore, gone, kept, orphan };
  }

  it('lists objects with no row (new ones only as in progress) and rows with missing objects', async () => {
    const { regenerate, restore, gone, orphan } = await damage();
    session.actor = admin;
    const res = await checkRoute(new NextRequest('http://localhost/api/photos/consistency'), { params: Promise.resolve({}) });
    expect(res.status).toBe(200);
    const report = (await res.json()) as StorageReportDto;
    expect(report.photoCount).toBe(4);
    expect(report.orphanObjects).toEqual([]);
    expect(report.recentObjects.map((o) => o.key)).toEqual([orphan]);
    expect(report.missing.map((m) => [m.photoId, m.missing, m.repair])).toEqual(
      expect.arrayContaining([
        [regenerate.id, ['display', 'thumb'], 'regenerate'],
        [restore.id, ['original'], 'restore_original'],
        [gone.id, ['original', 'display', 'thumb'], 'remove_record'],
      ]),
    );
    expect(report.missing).toHaveLength(3);
    const aged = await inspectPhotoStorage(db, tech.companyId, later());
    expect(aged.orphanObjects.map((o) => o.key)).toEqual([orphan]);

    session.actor = tech;
    expect((await checkRoute(new NextRequest('http://localhost/api/photos/consistency'), { params: Promise.resolve({}) })).status).toBe(403);
    expect((await repairRoute(new NextRequest('http://localhost/api/photos/consistency/repair', { method: 'POST' }), { params: Promise.resolve({}) })).status).toBe(403);
  });

  it('repairs: deletes old orphans, remakes small copies, rebuilds a lost original, removes an empty record', async () => {
    const { regenerate, restore, gone, kept, orphan } = await damage();
    const result = await repairPhotoStorage(db, tech.companyId, admin, later());
    expect(result).toMatchObject({ deletedObjects: 1, regenerated: 1, restored: 1, removedRecords: 1, failures: [] });
    expect(result.report.orphanObjects).toEqual([]);
    expect(result.report.missing).toEqual([]);
    expect((await listObjects('')).map((o) => o.key)).not.toContain(orphan);
    expect((await listObjects('')).map((o) => o.key)).toContain(`${tech.companyId}/reports/visit.pdf`);

    const a = await keysOf(regenerate.id);
    const thumb = await sharp(Buffer.from(await getObjectBytes(a.thumb_key))).metadata();
    expect([thumb.format, thumb.width, thumb.height]).toEqual(['webp', 400, 400]);
    const b = await keysOf(restore.id);
    expect(b.content_type).toBe('image/webp');
    expect((await sharp(Buffer.from(await getObjectBytes(b.original_key))).metadata()).width).toBe(900);
    expect(await db.selectFrom('photos').select('id').where('id', '=', gone.id).executeTakeFirst()).toBeUndefined();
    expect(await keysOf(kept.id)).toBeTruthy();
    const audits = await db.selectFrom('audit_events').select(['action', 'entity_id', 'actor_id']).where('entity_type', '=', 'photo').where('action', '!=', 'create').execute();
    expect(audits).toEqual(expect.arrayContaining([{ action: 'repair', entity_id: restore.id, actor_id: admin.id }, { action: 'delete', entity_id: gone.id, actor_id: admin.id }]));

    // The admin route runs the same repair; with nothing left to fix it changes nothing.
    session.actor = admin;
    const res = await repairRoute(new NextRequest('http://localhost/api/photos/consistency/repair', { method: 'POST' }), { params: Promise.resolve({}) });
    expect(res.status).toBe(200);
    expect((await res.json()) as StorageRepairDto).toMatchObject({ deletedObjects: 0, regenerated: 0, restored: 0, removedRecords: 0 });
  });

  it('the script reports (exit 1), repairs with --repair (exit 0), and reports a clean store (exit 0)', async () => {
    const { gone, orphan } = await damage();
    const run = async (...args: string[]) => {
      try {
        const { stdout } = await promisify(execFile)('node_modules/.bin/tsx', ['docker-free-scripts/photos-check.ts', ...args], { env: process.env, timeout: 60_000 });
        return { code: 0, stdout };
      } catch (error) {
        const e = error as { code?: number; stdout?: string; stderr?: string };
        return { code: e.code ?? -1, stdout: `${e.stdout ?? ''}${e.stderr ?? ''}` };
      }
    };
    const report = await run('--grace-minutes', '0');
    expect(report.code).toBe(1);
    expect(report.stdout).toContain(orphan);
    expect(report.stdout).toContain(`photo ${gone.id}`);
    const repaired = await run('--repair', '--grace-minutes', '0');
    expect(repaired.stdout).toMatch(/1 leftover object\(s\) deleted, 1 photo\(s\) given new small copies, 1 original\(s\) rebuilt/);
    expect(repaired.code).toBe(0);
    const clean = await run();
    expect(clean).toMatchObject({ code: 0, stdout: expect.stringContaining('Photo storage is consistent.') });
  }, 120_000);
});

describe('a put to the loopback store', () => {
  it('signs UNSIGNED-PAYLOAD instead of hashing the body, and the store keeps the exact bytes', async () => {
    const { PutObjectCommand } = await import('@aws-sdk/client-s3');
    const { bucket, s3 } = await import('@/storage/client');
    const body = await cameraImage({ width: 1200, height: 900, grain: 10 });
    const key = objectKey(tech.companyId, 'photos', 'signing-check');
    const command = new PutObjectCommand({ Bucket: bucket, Key: key, Body: body, ContentType: 'image/jpeg', ContentLength: body.byteLength });
    // The request as it leaves, signed: the deserialize step runs after signing.
    const sent: Record<string, string>[] = [];
    command.middlewareStack.add(
      (next) => (args) => {
        sent.push({ ...(args.request as { headers: Record<string, string> }).headers });
        return next(args);
      },
      { step: 'deserialize', name: 'captureSignedHeaders' },
    );
    await s3.send(command);
    expect(sent).toHaveLength(1);
    expect(sent[0]!['x-amz-content-sha256']).toBe('UNSIGNED-PAYLOAD');
    expect(sent[0]!.authorization).toMatch(/SignedHeaders=[^,]*x-amz-content-sha256/);
    expect(Buffer.from(await getObjectBytes(key)).equals(body)).toBe(true);
  });
});
