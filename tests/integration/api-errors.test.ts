// The one error shape: bad JSON 400, wrong content type 415, oversized 413, invalid fields 422,
// duplicate 409; and none of them changes anything.
import { describe, expect, it, vi } from 'vitest';
import { createTestDb } from '@/tests/helpers/db';
import { signInOnDemo } from '@/tests/helpers/demo-session';
import { call, mockAuthModule } from '@/tests/helpers/session';

vi.mock('@/lib/auth', () => mockAuthModule());
const db = createTestDb();

signInOnDemo(db, 'office');

async function clientCount(): Promise<number> {
  return (await db.selectFrom('clients').select((eb) => eb.fn.countAll<number>().as('n')).executeTakeFirstOrThrow()).n;
}

describe('error shape', () => {
  it('invalid JSON → 400 and nothing stored', async () => {
    const { POST } = await import('@/app/api/clients/route');
    const before = await clientCount();
    const res = await call(POST as never, { method: 'POST', rawBody: '{"name": "Half', headers: { 'content-type': 'application/json' } });
    expect(res.status).toBe(400);
    expect(res.body).toEqual({ error: { code: 'bad_request', message: 'The request body is not valid JSON.' } });
    expect(await clientCount()).toBe(before);
  });

  it('a body that is not JSON → 415', async () => {
    const { POST } = await import('@/app/api/clients/route');
    const res = await call(POST as never, { method: 'POST', rawBody: 'name=x', headers: { 'content-type': 'application/x-www-form-urlencoded' } });
    expect(res.status).toBe(415);
    expect(res.body).toMatchObject({ error: { code: 'unsupported_media_type' } });
  });

  it('an oversized body → 413', async () => {
    const { POST } = await import('@/app/api/clients/route');
    const res = await call(POST as never, { method: 'POST', json: { name: 'x', notes: 'n'.repeat(1_100_000) } });
    expect(res.status).toBe(413);
  });

  it('invalid field values → 422 with issues per field, and nothing stored', async () => {
    const { POST } = await import('@/app/api/sites/route');
    const before = await db.selectFrom('sites').select((eb) => eb.fn.countAll<number>().as('n')).executeTakeFirstOrThrow();
    const res = await call(POST as never, { method: 'POST', json: { clientId: 'nope', name: '', elevationM: 'high', country: 'USA' } });
    expect(res.status).toBe(422);
    const issues = (res.body as { error: { issues: { path: string }[] } }).error.issues.map((i) => i.path).sort();
    expect(issues).toEqual(['clientId', 'country', 'elevationM', 'name']);
    const after = await db.selectFrom('sites').select((eb) => eb.fn.countAll<number>().as('n')).executeTakeFirstOrThrow();
    expect(after.n).toBe(before.n);
  });

  it('a duplicate → 409', async () => {
    const { POST } = await import('@/app/api/clients/route');
    const res = await call(POST as never, { method: 'POST', json: { name: 'Tidewell Family Grocers' } });
    expect(res.status).toBe(409);
    expect(res.body).toMatchObject({ error: { code: 'conflict' } });
  });

  it('an unknown query value → 422, a bad cursor → 400', async () => {
    const { GET } = await import('@/app/api/sites/route');
    expect((await call(GET as never, { path: '/api/sites?limit=5000' })).status).toBe(422);
    expect((await call(GET as never, { path: '/api/sites?cursor=garbage' })).status).toBe(400);
  });
});
