// Photos through their route handlers against a real database and a private S3 fake that this
// file starts and stops itself: uploads, every refused input changing nothing, location removal
// read back from storage, scoping by URL, deletion, and an upload while the store is down.
import { NextRequest } from 'next/server';
import sharp from 'sharp';
import { beforeEach, describe, expect, it, vi } from 'vitest';
import type { Actor } from '@/lib/auth/actor';
import { actorFor, createOtherCompany, createTestDb, demoActors } from '@/tests/helpers/db';
import { cameraImage, gifImage, hasLocation, heicHeader, isRed, pixelAt, pngBomb, readBack } from '@/tests/helpers/photo-images';
import { freshDemoAndBucket } from '@/tests/helpers/private-object-store';
import { mockAuthModule, session } from '@/tests/helpers/session';

// A private object store on a port of its own (port 0 behind a front that stays put while the
// store stops and starts), set before any app module reads the environment.
const objects = await vi.hoisted(async () =>
  (await import('@/tests/helpers/private-object-store')).openPrivateObjectStore('photos-api-test'),
);
vi.mock('@/lib/auth', () => mockAuthModule());

const { GET: listRoute, POST: uploadRoute } = await import('@/app/api/equipment/[id]/photos/route');
const { GET: getRoute, PATCH: patchRoute, DELETE: deleteRoute } = await import('@/app/api/photos/[id]/route');
const { GET: fileRoute } = await import('@/app/api/photos/[id]/[variant]/route');
const { listObjects } = await import('@/storage/objects');

const db = createTestDb();
let tech: Actor;
let office: Actor;
let admin: Actor;
let clientOne: Actor;
let clientTwo: Actor;
let companyId: string;
let equipmentOne: string; // on a site of client one
let equipmentTwo: string; // on a site of client two

async function newEquipment(clientName: string, name: string): Promise<string> {
  const site = await db
    .selectFrom('sites')
    .innerJoin('clients', 'clients.id', 'sites.client_id')
    .select(['sites.id', 'sites.company_id'])
    .where('clients.name', '=', clientName)
    .orderBy('sites.name')
    .executeTakeFirstOrThrow();
  const row = await db.insertInto('equipment').values({ company_id: site.company_id, site_id: site.id, type: 'condensing_unit', name }).returning('id').executeTakeFirstOrThrow();
  return row.id;
}

freshDemoAndBucket(objects, db);
beforeEach(async () => {
  ({ technician: tech, office, admin, client: clientOne, clientTwo } = await demoActors(db));
  companyId = tech.companyId;
  equipmentOne = await newEquipment('Marrowgate Eatery Group', 'Walk-in condensing unit');
  equipmentTwo = await newEquipment('Tidewell Family Grocers', 'Produce case condensing unit');
  session.actor = tech;
});

type Handler = (req: NextRequest, ctx: { params: Promise<Record<string, string>> }) => Promise<Response>;

async function send(handler: Handler, url: string, params: Record<string, string>, init: ConstructorParameters<typeof NextRequest>[1] = {}) {
  const res = await handler(new NextRequest(`http://localhost${url}`, init), { params: Promise.resolve(params) });
  const type = res.headers.get('content-type') ?? '';
  const body: unknown = type.includes('json') ? await res.json() : Buffer.from(await res.arrayBuffer());
  return { status: res.status, headers: res.headers, body };
}

function form(fields: Record<string, string>, file?: { bytes: Buffer; name?: string; type?: string }): FormData {
  const f = new FormData();
  for (const [k, v] of Object.entries(fields)) f.set(k, v);
  if (file) f.set('file', new Blob([new Uint8Array(file.bytes)], { type: file.type ?? 'image/jpeg' }), file.name ?? 'photo.jpg');
  return f;
}

function upload(equipmentId: string, body: FormData | string | Blob, headers: Record<string, string> = {}) {
  return send(uploadRoute, `/api/equipment/${equipmentId}/photos`, { id: equipmentId }, { method: 'POST', body, headers });
}

interface PhotoBody {
  id: string;
  kind: string;
  caption: string | null;
  width: number;
  height: number;
  takenAt: string | null;
  contentType: string;
  canEdit: boolean;
  urls: Record<string, string>;
}

const photoRows = async () => (await db.selectFrom('photos').selectAll().execute()).length;
const photoAudits = async () => (await db.selectFrom('audit_events').select('action').where('entity_type', '=', 'photo').execute()).map((r) => r.action);
const storedKeys = async () => (await listObjects(`${companyId}/photos/`)).map((o) => o.key);

async function file(photoId: string, variant: string, query = '') {
  return send(fileRoute, `/api/photos/${photoId}/${variant}${query}`, { id: photoId, variant });
}

describe('uploading a photo', () => {
  it('stores the original, a display copy and a thumbnail under unguessable keys, and writes a row and an audit event', async () => {
    const bytes = await cameraImage({ orientation: 6, gps: true, takenAt: '2024:06:14 09:31:07', offset: '-05:00' });
    const res = await upload(equipmentOne, form({ kind: 'nameplate', caption: ' Nameplate on the roof unit ' }, { bytes, name: 'IMG_0412.jpg' }));
    expect(res.status).toBe(201);
    const photo = res.body as PhotoBody;
    expect(photo).toMatchObject({ kind: 'nameplate', caption: 'Nameplate on the roof unit', width: 480, height: 640, takenAt: '2024-06-14T14:31:07.000Z', contentType: 'image/jpeg', canEdit: true });
    expect(photo.urls.thumb).toBe(`/api/photos/${photo.id}/thumb`);

    const keys = await storedKeys();
    expect(keys).toHaveLength(3);
    for (const variant of ['original', 'display', 'thumb']) {
      const key = keys.find((k) => k.includes(`/${variant}/`))!;
      // company / photos / equipment / photo / variant / random
      expect(key).toMatch(new RegExp(`^${companyId}/photos/${equipmentOne}/${photo.id}/${variant}/[0-9a-f-]{36}$`));
    }
    expect(await photoAudits()).toEqual(['create']);

    const thumb = await file(photo.id, 'thumb');
    expect(thumb.status).toBe(200);
    expect(thumb.headers.get('content-type')).toBe('image/webp');
    expect(thumb.headers.get('cache-control')).toMatch(/^private/);
    expect((await sharp(thumb.body as Buffer).metadata()).width).toBe(400);
    const display = await file(photo.id, 'display');
    expect(isRed(await pixelAt(display.body as Buffer, 470, 10))).toBe(true);
    // Every stored copy, read back from the store, carries no location.
    const original = await file(photo.id, 'original', '?download=1');
    expect(original.headers.get('content-type')).toBe('image/jpeg');
    expect(original.headers.get('content-disposition')).toMatch(/^attachment; filename="IMG_0412.jpg"/);
    for (const copy of [original, display, thumb]) expect(hasLocation(await readBack(copy.body as Buffer))).toBe(false);
    expect((await readBack(original.body as Buffer)).tags.Make).toBe('Kelvrin Optics');

    const list = await send(listRoute, `/api/equipment/${equipmentOne}/photos`, { id: equipmentOne });
    expect(list.status).toBe(200);
    expect(list.body).toMatchObject({ total: 1, kindCounts: { nameplate: 1, damage: 0 }, canUpload: true, items: [{ id: photo.id }] });
  });

  it('keeps location in the original only when the company chose to', async () => {
    await db.updateTable('companies').set({ keep_photo_location: true }).where('id', '=', companyId).execute();
    const res = await upload(equipmentOne, form({ kind: 'general' }, { bytes: await cameraImage({ gps: true }) }));
    const photo = res.body as PhotoBody & { locationKept: boolean };
    expect(photo.locationKept).toBe(true);
    expect((await readBack((await file(photo.id, 'original')).body as Buffer)).tags.latitude).toBeCloseTo(41.875, 3);
    expect(hasLocation(await readBack((await file(photo.id, 'display')).body as Buffer))).toBe(false);
  });

  it('a retry with the same upload key returns the first photo instead of storing it twice', async () => {
    const uploadKey = '7f1d5c8e-2b4a-4c1e-9a77-3f0e8d9b6a21';
    const bytes = await cameraImage();
    const first = await upload(equipmentOne, form({ kind: 'damage', uploadKey }, { bytes }));
    const second = await upload(equipmentOne, form({ kind: 'damage', uploadKey }, { bytes }));
    expect(first.status).toBe(201);
    expect((second.body as PhotoBody).id).toBe((first.body as PhotoBody).id);
    expect(await photoRows()).toBe(1);
    expect(await storedKeys()).toHaveLength(3);
  });
});

describe('refused uploads change nothing', () => {
  const cases: { name: string; status: number; code: string; request: () => Promise<{ status: number; body: unknown }> }[] = [
    { name: 'not multipart', status: 415, code: 'unsupported_media_type', request: () => upload(equipmentOne, JSON.stringify({ kind: 'general' }), { 'content-type': 'application/json' }) },
    {
      name: 'declared length over the limit',
      status: 413,
      code: 'payload_too_large',
      request: async () => upload(equipmentOne, 'x', { 'content-type': 'multipart/form-data; boundary=abc', 'content-length': String(40 * 1024 * 1024) }),
    },
    {
      name: 'body over the limit without a declared length',
      status: 413,
      code: 'payload_too_large',
      request: async () => {
        const big = Buffer.concat([await cameraImage(), Buffer.alloc(26 * 1024 * 1024)]);
        return upload(equipmentOne, form({ kind: 'general' }, { bytes: big }));
      },
    },
    { name: 'no file', status: 422, code: 'validation_failed', request: () => upload(equipmentOne, form({ kind: 'general' })) },
    { name: 'unknown kind', status: 422, code: 'validation_failed', request: async () => upload(equipmentOne, form({ kind: 'selfie' }, { bytes: await cameraImage() })) },
    {
      name: 'caption too long',
      status: 422,
      code: 'validation_failed',
      request: async () => upload(equipmentOne, form({ kind: 'general', caption: 'x'.repeat(501) }, { bytes: await cameraImage() })),
    },
    { name: 'a text file named .jpg', status: 415, code: 'unsupported_media_type', request: () => upload(equipmentOne, form({ kind: 'general' }, { bytes: Buffer.from('not a photo') })) },
    { name: 'HEIC', status: 415, code: 'unsupported_media_type', request: () => upload(equipmentOne, form({ kind: 'general' }, { bytes: heicHeader(), name: 'IMG_1.HEIC', type: 'image/heic' })) },
    { name: 'GIF', status: 415, code: 'unsupported_media_type', request: async () => upload(equipmentOne, form({ kind: 'general' }, { bytes: await gifImage() })) },
    { name: 'decompression bomb', status: 422, code: 'validation_failed', request: async () => upload(equipmentOne, form({ kind: 'general' }, { bytes: await pngBomb(), type: 'image/png' })) },
    {
      name: 'JPEG cut off',
      status: 422,
      code: 'validation_failed',
      request: async () => {
        const whole = await cameraImage({ width: 800, height: 600, grain: 20 });
        return upload(equipmentOne, form({ kind: 'general' }, { bytes: whole.subarray(0, whole.length >> 1) }));
      },
    },
    {
      name: 'a client user',
      status: 403,
      code: 'forbidden',
      request: async () => {
        session.actor = clientOne;
        return upload(equipmentOne, form({ kind: 'general' }, { bytes: await cameraImage() }));
      },
    },
    {
      name: 'equipment of another company',
      status: 404,
      code: 'not_found',
      request: async () => {
        const other = await createOtherCompany(db);
        const eq = await db.insertInto('equipment').values({ company_id: other.companyId, site_id: other.siteId, type: 'other', name: 'Theirs' }).returning('id').executeTakeFirstOrThrow();
        return upload(eq.id, form({ kind: 'general' }, { bytes: await cameraImage() }));
      },
    },
    {
      name: 'deleted equipment',
      status: 404,
      code: 'not_found',
      request: async () => {
        await db.updateTable('equipment').set({ deleted_at: new Date() }).where('id', '=', equipmentOne).execute();
        return upload(equipmentOne, form({ kind: 'general' }, { bytes: await cameraImage() }));
      },
    },
  ];

  for (const c of cases) {
    it(`${c.name} → ${c.status}`, async () => {
      const res = await c.request();
      expect(res.status).toBe(c.status);
      expect(res.body).toMatchObject({ error: { code: c.code, message: expect.any(String) } });
      expect(await photoRows()).toBe(0);
      expect(await photoAudits()).toEqual([]);
      expect(await listObjects('')).toEqual([]);
    });
  }
});

describe('who sees which photo', () => {
  async function photoOn(equipmentId: string): Promise<string> {
    session.actor = tech;
    const res = await upload(equipmentId, form({ kind: 'corrosion' }, { bytes: await cameraImage() }));
    expect(res.status).toBe(201);
    return (res.body as PhotoBody).id;
  }

  it("a client user sees their own site's photos and gets 404 for another client's, by every URL", async () => {
    const mine = await photoOn(equipmentOne);
    const theirs = await photoOn(equipmentTwo);
    session.actor = clientOne;
    expect((await file(mine, 'thumb')).status).toBe(200);
    expect((await send(getRoute, `/api/photos/${mine}`, { id: mine })).body).toMatchObject({ id: mine, canEdit: false });
    for (const variant of ['thumb', 'display', 'original']) {
      const res = await file(theirs, variant);
      expect(res.status).toBe(404);
      expect(res.body).toMatchObject({ error: { code: 'not_found' } });
    }
    expect((await send(getRoute, `/api/photos/${theirs}`, { id: theirs })).status).toBe(404);
    expect((await send(listRoute, `/api/equipment/${equipmentTwo}/photos`, { id: equipmentTwo })).status).toBe(404);
    // The owner of the other client sees theirs and not client one's.
    session.actor = clientTwo;
    expect((await file(theirs, 'original')).status).toBe(200);
    expect((await file(mine, 'original')).status).toBe(404);
  });

  it('another company sees nothing; signed out is 401; a malformed id is 404', async () => {
    const mine = await photoOn(equipmentOne);
    const other = await createOtherCompany(db);
    session.actor = await actorFor(db, other.adminEmail);
    expect((await file(mine, 'display')).status).toBe(404);
    session.actor = null;
    expect((await file(mine, 'display')).status).toBe(401);
    session.actor = tech;
    expect((await file('not-a-uuid', 'display')).status).toBe(404);
    expect((await file(mine, 'poster')).status).toBe(404);
  });

  it('the uploader, the office and an admin may edit or delete; a client may not', async () => {
    const id = await photoOn(equipmentOne);
    session.actor = clientOne;
    expect((await send(patchRoute, `/api/photos/${id}`, { id }, { method: 'PATCH', body: JSON.stringify({ caption: 'x' }), headers: { 'content-type': 'application/json' } })).status).toBe(403);
    expect((await send(deleteRoute, `/api/photos/${id}`, { id }, { method: 'DELETE' })).status).toBe(403);
    session.actor = tech;
    const edited = await send(patchRoute, `/api/photos/${id}`, { id }, { method: 'PATCH', body: JSON.stringify({ kind: 'before', caption: 'Coil before cleaning' }), headers: { 'content-type': 'application/json' } });
    expect(edited.body).toMatchObject({ kind: 'before', caption: 'Coil before cleaning' });
    session.actor = office;
    expect((await send(getRoute, `/api/photos/${id}`, { id })).body).toMatchObject({ canEdit: true });
    session.actor = admin;
    expect((await send(deleteRoute, `/api/photos/${id}`, { id }, { method: 'DELETE' })).status).toBe(204);
    expect(await photoAudits()).toEqual(['create', 'update', 'delete']);
  });
});

describe('deleting', () => {
  it('removes the row and all three stored objects', async () => {
    const res = await upload(equipmentOne, form({ kind: 'wiring' }, { bytes: await cameraImage() }));
    const id = (res.body as PhotoBody).id;
    expect(await storedKeys()).toHaveLength(3);
    expect((await send(deleteRoute, `/api/photos/${id}`, { id }, { method: 'DELETE' })).status).toBe(204);
    expect(await storedKeys()).toEqual([]);
    expect(await photoRows()).toBe(0);
    expect((await file(id, 'thumb')).status).toBe(404);
  });
});

describe('a photo on a visit record', () => {
  it('cannot be deleted while a visit entry shows it, and can once that entry is voided', async () => {
    const res = await upload(equipmentOne, form({ kind: 'after' }, { bytes: await cameraImage() }));
    const id = (res.body as PhotoBody).id;
    const equipment = await db.selectFrom('equipment').select(['site_id', 'company_id']).where('id', '=', equipmentOne).executeTakeFirstOrThrow();
    const visit = await db
      .insertInto('visits')
      .values({ company_id: equipment.company_id, site_id: equipment.site_id, technician_id: tech.id, reason: 'maintenance', started_at: new Date() })
      .returning('id')
      .executeTakeFirstOrThrow();
    const entry = await db
      .insertInto('entries')
      .values({
        company_id: equipment.company_id,
        visit_id: visit.id,
        equipment_id: equipmentOne,
        kind: 'photo',
        data: JSON.stringify({ photoId: id, caption: null }),
        recorded_at: new Date(),
        created_by: tech.id,
        client_entry_id: '3c9e2f1a-7b6d-4e5f-8a9b-0c1d2e3f4a5b',
      })
      .returning('id')
      .executeTakeFirstOrThrow();
    const refused = await send(deleteRoute, `/api/photos/${id}`, { id }, { method: 'DELETE' });
    expect(refused.status).toBe(409);
    expect(refused.body).toMatchObject({ error: { code: 'conflict', message: expect.stringMatching(/visit record/) } });
    expect(await storedKeys()).toHaveLength(3);
    expect(await photoAudits()).toEqual(['create']);
    await db.updateTable('entries').set({ voided_at: new Date(), voided_by: tech.id, void_reason: 'Wrong unit' }).where('id', '=', entry.id).execute();
    expect((await send(deleteRoute, `/api/photos/${id}`, { id }, { method: 'DELETE' })).status).toBe(204);
    expect(await storedKeys()).toEqual([]);
  });
});

describe('object store outage', () => {
  it('an upload while the store is down fails cleanly (503, nothing written) and succeeds once it is back', async () => {
    const bytes = await cameraImage({ gps: true });
    const before = await upload(equipmentOne, form({ kind: 'general' }, { bytes }));
    const id = (before.body as PhotoBody).id;
    await objects.store.stop();
    try {
      const failed = await upload(equipmentOne, form({ kind: 'damage' }, { bytes }));
      expect(failed.status).toBe(503);
      expect(failed.body).toMatchObject({ error: { code: 'unavailable', message: expect.stringMatching(/Nothing was saved/) } });
      expect(await photoRows()).toBe(1);
      expect(await photoAudits()).toEqual(['create']);
      // Reading a photo while the store is down is a plain 503 too, never a broken 500.
      expect((await file(id, 'thumb')).status).toBe(503);
    } finally {
      await objects.start();
    }
    expect(await storedKeys()).toHaveLength(3);
    const retried = await upload(equipmentOne, form({ kind: 'damage' }, { bytes }));
    expect(retried.status).toBe(201);
    expect(await photoRows()).toBe(2);
    expect(await storedKeys()).toHaveLength(6);
  });
});
