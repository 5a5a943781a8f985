// Finding 1: a page of another origin (another port on the same host counts) must not be able to
// make a signed-in browser change anything. Refusal is 403 in the usual shape, before any lookup.
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { allowedOrigins, isSameOriginRequest } from '@/lib/api/origin';
import { actorFor, createTestDb, demoEmails, resetToDemo } from '@/tests/helpers/db';
import { call, mockAuthModule, session } from '@/tests/helpers/session';

vi.mock('@/lib/auth', () => mockAuthModule());
const db = createTestDb();
const appUrl = process.env.APP_URL ?? 'http://localhost:3000';
const otherPort = `http://localhost:${Number(new URL(appUrl).port || 80) + 50}`;
let siteId: string;

beforeAll(async () => {
  await resetToDemo(db);
  session.actor = await actorFor(db, demoEmails.office);
  siteId = (await db.selectFrom('sites').select('id').where('archived_at', 'is', null).orderBy('name').executeTakeFirstOrThrow()).id;
});
afterAll(async () => {
  await db.destroy();
});

const archivedAt = async () => (await db.selectFrom('sites').select('archived_at').where('id', '=', siteId).executeTakeFirstOrThrow()).archived_at;
const requestCount = async () => (await db.selectFrom('service_requests').select((eb) => eb.fn.countAll<number>().as('n')).executeTakeFirstOrThrow()).n;

describe('origin check in withApi', () => {
  it('refuses a body-less archive posted from another port, before any lookup', async () => {
    const { POST } = await import('@/app/api/sites/[id]/archive/route');
    const res = await call(POST as never, { method: 'POST', params: { id: siteId }, headers: { origin: otherPort, 'sec-fetch-site': 'same-site' } });
    expect(res.status).toBe(403);
    expect(res.body).toEqual({ error: { code: 'forbidden', message: 'This request came from another site and was refused.' } });
    expect(await archivedAt()).toBeNull();
    // Before any lookup: even a signed-out caller and a malformed id get the same 403, not 401/404.
    const saved = session.actor;
    session.actor = null;
    const anon = await call(POST as never, { method: 'POST', params: { id: 'not-a-uuid' }, headers: { origin: otherPort } });
    session.actor = saved;
    expect(anon.status).toBe(403);
  });

  it('refuses Sec-Fetch-Site other than same-origin/none when no Origin is sent', async () => {
    const { POST } = await import('@/app/api/sites/[id]/archive/route');
    for (const site of ['same-site', 'cross-site']) {
      const res = await call(POST as never, { method: 'POST', params: { id: siteId }, headers: { 'sec-fetch-site': site } });
      expect(res.status).toBe(403);
    }
    expect(await archivedAt()).toBeNull();
  });

  it('refuses a multipart service request from another origin and stores nothing', async () => {
    session.actor = await actorFor(db, demoEmails.client);
    const { POST } = await import('@/app/api/requests/route');
    const form = new FormData();
    form.set('siteId', siteId);
    form.set('description', 'Forged from another page');
    const { NextRequest } = await import('next/server');
    const before = await requestCount();
    const res = await POST(new NextRequest('http://localhost/api/requests', { method: 'POST', body: form, headers: { origin: 'null' } }), { params: Promise.resolve({}) });
    expect(res.status).toBe(403);
    expect(await requestCount()).toBe(before);
    session.actor = await actorFor(db, demoEmails.office);
  });

  it('lets the app itself, and clients without browser headers, through', async () => {
    const { POST } = await import('@/app/api/sites/[id]/archive/route');
    const own = await call(POST as never, { method: 'POST', params: { id: siteId }, headers: { origin: appUrl, 'sec-fetch-site': 'same-origin' } });
    expect(own.status).toBe(200);
    const { POST: restore } = await import('@/app/api/sites/[id]/restore/route');
    const plain = await call(restore as never, { method: 'POST', params: { id: siteId } });
    expect(plain.status).toBe(200);
    expect(await archivedAt()).toBeNull();
  });
});

describe('isSameOriginRequest', () => {
  const allowed = allowedOrigins('https://app.example.test/base', 'https://alt.example.test, http://localhost:3000');
  const h = (entries: Record<string, string>) => new Headers(entries);
  it('reads APP_URL and the extra list as origins', () => {
    expect([...allowed].sort()).toEqual(['http://localhost:3000', 'https://alt.example.test', 'https://app.example.test']);
  });
  it.each([
    ['POST', {}, true],
    ['GET', { origin: 'https://evil.example.test' }, true],
    ['POST', { origin: 'https://alt.example.test' }, true],
    ['POST', { origin: 'https://app.example.test', 'sec-fetch-site': 'cross-site' }, true],
    ['POST', { origin: 'https://evil.example.test', 'sec-fetch-site': 'same-origin' }, false],
    ['POST', { origin: 'http://app.example.test' }, false],
    ['DELETE', { origin: 'null' }, false],
    ['PATCH', { origin: 'not a url' }, false],
    ['POST', { 'sec-fetch-site': 'same-origin' }, true],
    ['POST', { 'sec-fetch-site': 'none' }, true],
    ['PUT', { 'sec-fetch-site': 'same-site' }, false],
  ] as const)('%s %j → %s', (method, headers, expected) => {
    expect(isSameOriginRequest(method, h(headers), allowed)).toBe(expected);
  });
});
