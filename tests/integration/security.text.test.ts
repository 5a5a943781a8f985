// Finding 5 and the bidi finding: NUL and lone surrogates are refused with 422 by one guard (the
// shared text schema and withApi: query strings, JSON bodies, multipart forms) and change
// nothing; bidirectional controls are removed from names and captions.
import { NextRequest } from 'next/server';
import { describe, expect, it, vi } from 'vitest';
import { readMultipart } from '@/lib/api/multipart';
import { optionalText, requiredText } from '@/lib/api/schemas';
import { AppError } from '@/lib/errors';
import { createTestDb } from '@/tests/helpers/db';
import { signInOnDemo } from '@/tests/helpers/demo-session';
import { call, mockAuthModule } from '@/tests/helpers/session';

vi.mock('@/lib/auth', () => mockAuthModule());
const db = createTestDb();

signInOnDemo(db, 'office');

const clientCount = async () => (await db.selectFrom('clients').select((eb) => eb.fn.countAll<number>().as('n')).executeTakeFirstOrThrow()).n;

describe('invalid text', () => {
  it('a NUL or a lone surrogate in a JSON body is a 422 naming the field, and nothing is stored', async () => {
    const { POST } = await import('@/app/api/clients/route');
    const before = await clientCount();
    for (const rawBody of ['{"name":"Cold\\u0000Store"}', '{"name":"Cold\\ud800Store"}', '{"name":"ok","notes":["\\u0000"]}', '{"\\u0000":"x","name":"ok"}']) {
      const res = await call(POST as never, { method: 'POST', rawBody, headers: { 'content-type': 'application/json' } });
      expect(res.status).toBe(422);
      expect(res.body).toMatchObject({ error: { code: 'validation_failed', message: 'Text may not contain NUL characters or broken Unicode.' } });
    }
    expect(await clientCount()).toBe(before);
  });

  it('a NUL in a query string is a 422, not a 500', async () => {
    const { GET } = await import('@/app/api/clients/route');
    const res = await call(GET as never, { path: '/api/clients?q=%00' });
    expect(res.status).toBe(422);
    const { GET: equipment } = await import('@/app/api/equipment/route');
    expect((await call(equipment as never, { path: '/api/equipment?q=a%00b' })).status).toBe(422);
  });

  it('a NUL in a multipart field or file name is a 422', async () => {
    const form = new FormData();
    form.set('description', 'Leaking\u0000');
    const req = new NextRequest('http://localhost/api/requests', { method: 'POST', body: form });
    await expect(readMultipart(req, 1_000_000, () => new AppError('payload_too_large'))).rejects.toMatchObject({ code: 'validation_failed' });
    const withFile = new FormData();
    withFile.set('file', new File([new Uint8Array([1, 2])], 'a\u0000.jpg', { type: 'image/jpeg' }));
    const req2 = new NextRequest('http://localhost/api/x', { method: 'POST', body: withFile });
    await expect(readMultipart(req2, 1_000_000, () => new AppError('payload_too_large'))).rejects.toMatchObject({ code: 'validation_failed' });
  });

  it('the shared text schema refuses the same, in forms and server actions alike', () => {
    expect(requiredText('Name', 50).safeParse('a\u0000b').success).toBe(false);
    expect(optionalText(50).safeParse('\udc00').success).toBe(false);
    expect(requiredText('Name', 50).safeParse('Kühlraum 😀').success).toBe(true);
  });
});

describe('bidirectional controls', () => {
  it('are removed from names stored through the API', async () => {
    const { POST } = await import('@/app/api/clients/route');
    const res = await call(POST as never, { method: 'POST', json: { name: 'Market \u202Egpj.exe\u202C Hall' } });
    expect(res.status).toBe(201);
    expect((res.body as { name: string }).name).toBe('Market gpj.exe Hall');
    expect(optionalText(100).parse('photo\u202Egpj.exe')).toBe('photogpj.exe');
  });

  it('are removed from uploaded file names', async () => {
    const form = new FormData();
    form.set('file', new File([new Uint8Array([1, 2])], 'photo\u202Egpj.exe', { type: 'image/jpeg' }));
    const parsed = await readMultipart(new NextRequest('http://localhost/api/x', { method: 'POST', body: form }), 1_000_000, () => new AppError('payload_too_large'));
    expect((parsed.get('file') as File).name).toBe('photogpj.exe');
  });
});
