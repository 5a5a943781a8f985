// Request ids: the proxy keeps a well-formed incoming x-request-id and replaces anything else,
// passes it on to the handler and returns it; withApi puts it on every response (errors too)
// and on every log line written while the request is handled, including work it starts.
import { NextRequest } from 'next/server';
import { describe, expect, it, vi } from 'vitest';
import { isWellFormedRequestId, requestIdFrom } from '@/lib/api/request-id';
import { captureLog, overlapping } from '@/tests/helpers/log-capture';
import { mockAuthModule, session } from '@/tests/helpers/session';

vi.mock('@/lib/auth', () => mockAuthModule());

const { proxy } = await import('@/proxy');
const { withApi } = await import('@/lib/api/handler');
const { currentRequestId, runWithRequestId } = await import('@/lib/request-context');

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-4[0-9a-f]{3}-[89ab][0-9a-f]{3}-[0-9a-f]{12}$/;

describe('well-formed request ids', () => {
  it('accepts 8–128 letters, digits and . _ : - and nothing else', () => {
    for (const ok of ['abcd1234', 'f47ac10b-58cc-4372-a567-0e02b2c3d479', 'lb:trace.01_x-2', 'a'.repeat(128)]) expect(isWellFormedRequestId(ok)).toBe(true);
    for (const bad of [null, '', 'short', 'a'.repeat(129), 'has space12', 'line\nbreak1', 'semi;colon1', 'ünïcode123', '<script>ab']) expect(isWellFormedRequestId(bad)).toBe(false);
  });

  it('keeps a well-formed incoming id and replaces a malformed one with a fresh UUID', () => {
    expect(requestIdFrom(new Headers({ 'x-request-id': 'upstream-0001' }))).toBe('upstream-0001');
    const fresh = requestIdFrom(new Headers({ 'x-request-id': 'bad id' }));
    expect(fresh).toMatch(UUID);
    expect(requestIdFrom(new Headers())).not.toBe(requestIdFrom(new Headers()));
  });
});

describe('the proxy', () => {
  const headerPassedOn = (res: Response) => res.headers.get('x-middleware-request-x-request-id');

  it('returns the incoming id on API and page responses and passes it on to the handler', () => {
    for (const path of ['/api/me', '/clients']) {
      const res = proxy(new NextRequest(`http://localhost${path}`, { headers: { 'x-request-id': 'from-the-balancer-7' } }));
      expect(res.headers.get('x-request-id')).toBe('from-the-balancer-7');
      expect(headerPassedOn(res)).toBe('from-the-balancer-7');
    }
  });

  it('gives a request without a usable id a new one, the same in both directions, and one per request', () => {
    const a = proxy(new NextRequest('http://localhost/api/me', { headers: { 'x-request-id': 'no spaces allowed' } }));
    const b = proxy(new NextRequest('http://localhost/api/me'));
    expect(a.headers.get('x-request-id')).toMatch(UUID);
    expect(headerPassedOn(a)).toBe(a.headers.get('x-request-id'));
    expect(b.headers.get('x-request-id')).toMatch(UUID);
    expect(b.headers.get('x-request-id')).not.toBe(a.headers.get('x-request-id'));
  });

  it('puts the id on a refused address too', () => {
    const res = proxy(new NextRequest('http://localhost/api/me?q=%ZZ', { headers: { 'x-request-id': 'refused-request-1' } }));
    expect(res.status).toBe(400);
    expect(res.headers.get('x-request-id')).toBe('refused-request-1');
  });
});

describe('withApi', () => {
  it('tags every log line written during the request, and the response, with the request id', async () => {
    const { lines, log } = await captureLog();
    const route = withApi({}, async () => {
      log.info('inside the handler');
      // Work started by the request and finished later keeps the id.
      await new Promise((r) => setTimeout(r, 1));
      await Promise.resolve().then(() => log.warn('after an await'));
      return { seen: currentRequestId() };
    });
    session.actor = { id: 'u1' } as never;
    const res = await route(new NextRequest('http://localhost/api/x', { headers: { 'x-request-id': 'req-logs-0001' } }), { params: Promise.resolve({}) });
    expect(res.headers.get('x-request-id')).toBe('req-logs-0001');
    expect(await res.json()).toEqual({ seen: 'req-logs-0001' });
    expect(lines.map((l) => [l.msg, l.reqId])).toEqual([
      ['inside the handler', 'req-logs-0001'],
      ['after an await', 'req-logs-0001'],
    ]);
  });

  it('puts the id on error responses and on the logged internal error', async () => {
    session.actor = null;
    const refused = await withApi({}, async () => 'never')(new NextRequest('http://localhost/api/x', { headers: { 'x-request-id': 'req-refused-01' } }), { params: Promise.resolve({}) });
    expect(refused.status).toBe(401);
    expect(refused.headers.get('x-request-id')).toBe('req-refused-01');

    session.actor = { id: 'u1' } as never;
    const { logger } = await import('@/lib/logger');
    const seen: unknown[] = [];
    const spy = vi.spyOn(logger, 'error').mockImplementation(((obj: unknown) => void seen.push([obj, currentRequestId()])) as never);
    try {
      const broken = await withApi({}, async () => {
        throw new Error('boom');
      })(new NextRequest('http://localhost/api/x'), { params: Promise.resolve({}) });
      expect(broken.status).toBe(500);
      const id = broken.headers.get('x-request-id');
      expect(id).toMatch(UUID);
      // The error was logged inside the request's context, so its line carries the same id.
      expect(seen).toHaveLength(1);
      expect((seen[0] as unknown[])[1]).toBe(id);
    } finally {
      spy.mockRestore();
    }
  });

  it('two requests at once keep their own ids', async () => {
    const { lines, log } = await captureLog();
    session.actor = { id: 'u1' } as never;
    let firstHeld: Promise<void> | undefined;
    const route = withApi({}, async ({ req }) => {
      if (req.headers.get('x-request-id') === 'first-request') await firstHeld;
      log.info(req.headers.get('x-request-id')!);
      return null;
    });
    const send = (id: string) => route(new NextRequest('http://localhost/api/x', { headers: { 'x-request-id': id } }), { params: Promise.resolve({}) });
    await overlapping(
      (held) => {
        firstHeld = held;
        return send('first-request');
      },
      () => send('second-request'),
    );
    expect(lines.map((l) => [l.msg, l.reqId])).toEqual([
      ['second-request', 'second-request'],
      ['first-request', 'first-request'],
    ]);
  });

  it('lines outside any request say none; a background job has its own id', async () => {
    const { lines, log } = await captureLog();
    log.info('at start-up');
    runWithRequestId('job-1234-abcd', () => log.info('outbox pass'));
    expect(lines.map((l) => l.reqId)).toEqual(['none', 'job-1234-abcd']);
  });
});
