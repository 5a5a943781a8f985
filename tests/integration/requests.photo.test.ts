// A service request with a photo, through the route handler against the real database and the
// shared S3 fake: the photo and the request are stored together or not at all.
import { sql } from 'kysely';
import { NextRequest } from 'next/server';
import { afterAll, beforeEach, describe, expect, it, vi } from 'vitest';
import type { Actor } from '@/lib/auth/actor';
import { actorFor, createTestDb, demoEmails, resetToDemo } from '@/tests/helpers/db';
import { cameraImage } from '@/tests/helpers/photo-images';
import { createCoolerCircuit } from '@/tests/helpers/registry';
import { mockAuthModule, session } from '@/tests/helpers/session';

vi.mock('@/lib/auth', () => mockAuthModule());

const { POST: createRoute } = await import('@/app/api/requests/route');
const { GET: photoRoute } = await import('@/app/api/photos/[id]/route');
const { deleteObject, ensureBucket, listObjects } = await import('@/storage/objects');

const db = createTestDb();
let owner: Actor;
let stranger: Actor;
let office: Actor;
let circuit: Awaited<ReturnType<typeof createCoolerCircuit>>;
let jpeg: Buffer;
let otherSiteId: string; // another site of the same client

beforeEach(async () => {
  await resetToDemo(db);
  await ensureBucket();
  for (const o of await listObjects('')) await deleteObject(o.key);
  owner = await actorFor(db, demoEmails.client);
  stranger = await actorFor(db, demoEmails.clientTwo);
  office = await actorFor(db, demoEmails.office);
  circuit = await createCoolerCircuit(db);
  jpeg ??= await cameraImage();
  otherSiteId = (await db.selectFrom('sites').select('id').where('name', '=', 'Orchard Row Bistro').executeTakeFirstOrThrow()).id;
  session.actor = owner;
});
afterAll(async () => {
  await db.destroy();
});

function requestForm(fields: Record<string, string>, file?: { bytes: Buffer | string; name?: string; type?: string }): FormData {
  const form = new FormData();
  for (const [k, v] of Object.entries(fields)) form.set(k, v);
  if (file) form.set('file', new Blob([typeof file.bytes === 'string' ? file.bytes : new Uint8Array(file.bytes)], { type: file.type ?? 'image/jpeg' }), file.name ?? 'coil.jpg');
  return form;
}

async function post(body: FormData) {
  const res = await createRoute(new NextRequest('http://localhost/api/requests', { method: 'POST', body }), { params: Promise.resolve({}) });
  return { status: res.status, body: (await res.json()) as Record<string, unknown> & { error?: { code: string; issues?: { path: string; message: string }[] } } };
}

const counts = async () => ({
  requests: (await db.selectFrom('service_requests').select('id').execute()).length,
  photos: (await db.selectFrom('photos').select('id').execute()).length,
  mail: (await db.selectFrom('mail_outbox').select('id').where('kind', '=', 'service_request').execute()).length,
  objects: (await listObjects('')).length,
});

describe('a service request with a photo', () => {
  it('stores the photo on the unit with the request and tells the office', async () => {
    const before = await counts();
    const res = await post(
      requestForm({ siteId: circuit.siteId, equipmentId: circuit.evaporatorId, description: 'Thick ice on the coil, fans stopped', urgency: 'soon' }, { bytes: jpeg, name: 'coil.jpg' }),
    );
    expect(res.status).toBe(201);
    const photoId = res.body.photoId as string;
    expect(photoId).toMatch(/^[0-9a-f-]{36}$/);
    const photo = await db.selectFrom('photos').selectAll().where('id', '=', photoId).executeTakeFirstOrThrow();
    expect(photo.equipment_id).toBe(circuit.evaporatorId);
    expect(photo.uploaded_by).toBe(owner.id);
    expect(photo.kind).toBe('damage');
    expect(photo.caption).toBe('Sent with a service request: Thick ice on the coil, fans stopped');
    const after = await counts();
    expect(after).toEqual({ requests: before.requests + 1, photos: before.photos + 1, mail: before.mail + 1, objects: before.objects + 3 });
    const mail = await db.selectFrom('mail_outbox').select(['text_body as text']).where('kind', '=', 'service_request').orderBy('created_at', 'desc').executeTakeFirstOrThrow();
    expect(mail.text).toContain('A photo came with it');

    // It is among the site's recent photos for the owner, with its unit; not for another client.
    const { recentSitePhotos } = await import('@/lib/photos/service');
    expect((await recentSitePhotos(owner, circuit.siteId)).map((p) => [p.id, p.equipmentName])).toEqual([[photoId, 'Cooler evaporator']]);
    expect(await recentSitePhotos(stranger, circuit.siteId)).toEqual([]);

    // The owner and the office both see it; another client's owner does not.
    for (const [actor, status] of [[owner, 200], [office, 200], [stranger, 404]] as const) {
      session.actor = actor;
      const got = await photoRoute(new NextRequest(`http://localhost/api/photos/${photoId}`), { params: Promise.resolve({ id: photoId }) });
      expect(got.status, actor.email).toBe(status);
    }
  });

  it('a JSON request without a photo still works, and owners still cannot upload photos on their own', async () => {
    const res = await createRoute(
      new NextRequest('http://localhost/api/requests', {
        method: 'POST',
        headers: { 'content-type': 'application/json' },
        body: JSON.stringify({ siteId: circuit.siteId, description: 'Door gasket torn', urgency: 'routine' }),
      }),
      { params: Promise.resolve({}) },
    );
    expect(res.status).toBe(201);
    expect(((await res.json()) as { photoId: string | null }).photoId).toBeNull();
    const { POST: uploadRoute } = await import('@/app/api/equipment/[id]/photos/route');
    const upload = await uploadRoute(new NextRequest(`http://localhost/api/equipment/${circuit.evaporatorId}/photos`, { method: 'POST', body: requestForm({ kind: 'general' }, { bytes: jpeg }) }), {
      params: Promise.resolve({ id: circuit.evaporatorId }),
    });
    expect(upload.status).toBe(403);
  });

  const refusals: { name: string; status: number; code: string; path?: string; form: () => FormData }[] = [
    {
      name: 'a file that is not an image',
      status: 415,
      code: 'unsupported_media_type',
      form: () => requestForm({ siteId: circuit.siteId, equipmentId: circuit.evaporatorId, description: 'Coil iced', urgency: 'soon' }, { bytes: 'just some text, not a photo', name: 'notes.txt', type: 'text/plain' }),
    },
    {
      name: 'a photo without a unit',
      status: 422,
      code: 'validation_failed',
      path: 'equipmentId',
      form: () => requestForm({ siteId: circuit.siteId, description: 'Coil iced', urgency: 'soon' }, { bytes: jpeg }),
    },
    {
      name: 'a missing description',
      status: 422,
      code: 'validation_failed',
      path: 'description',
      form: () => requestForm({ siteId: circuit.siteId, equipmentId: circuit.evaporatorId, urgency: 'soon' }, { bytes: jpeg }),
    },
    {
      name: 'a unit on another site',
      status: 422,
      code: 'validation_failed',
      path: 'equipmentId',
      form: () => requestForm({ siteId: otherSiteId, equipmentId: circuit.evaporatorId, description: 'Coil iced', urgency: 'soon' }, { bytes: jpeg }),
    },
  ];

  it.each(refusals)('$name is refused with $status and stores nothing', async ({ status, code, path, form }) => {
    const before = await counts();
    const res = await post(form());
    expect(res.status).toBe(status);
    expect(res.body.error?.code).toBe(code);
    if (path) expect(res.body.error?.issues?.map((i) => i.path)).toContain(path);
    expect(await counts()).toEqual(before);
  });

  it('another client’s owner cannot send a photo to this unit', async () => {
    session.actor = stranger;
    const before = await counts();
    const res = await post(requestForm({ siteId: circuit.siteId, equipmentId: circuit.evaporatorId, description: 'Coil iced', urgency: 'soon' }, { bytes: jpeg }));
    expect(res.status).toBe(404);
    expect(await counts()).toEqual(before);
  });

  it('when the request cannot be written after the image was stored, the photo and its files go too', async () => {
    // A constraint the insert will break, standing in for any failure inside the transaction.
    await sql`alter table service_requests add constraint test_refuse_request check (description <> 'refuse me')`.execute(db);
    try {
      const before = await counts();
      const res = await post(requestForm({ siteId: circuit.siteId, equipmentId: circuit.evaporatorId, description: 'refuse me', urgency: 'soon' }, { bytes: jpeg }));
      expect(res.status).toBe(422);
      expect(await counts()).toEqual(before);
    } finally {
      await sql`alter table service_requests drop constraint if exists test_refuse_request`.execute(db);
    }
  });
});
