// The API routes skip proxy.ts (a second pass through the framework per request, and a buffered
// copy of every body); withApi does the proxy's work for them: the address check (400 before the
// handler or the session is looked at), the request id and every security header, on answers
// and errors alike. Unknown API paths answer the same way (app/api/[...path]).
import { unstable_doesMiddlewareMatch } from 'next/experimental/testing/server';
import { NextRequest } from 'next/server';
import { describe, expect, it, vi } from 'vitest';
import { API_CSP, staticSecurityHeaders } from '@/lib/api/security-headers';
import { mockAuthModule, session } from '@/tests/helpers/session';

vi.mock('@/lib/auth', () => mockAuthModule());

const { config } = await import('@/proxy');
const { withApi } = await import('@/lib/api/handler');
const unknownApiPath = await import('@/app/api/[...path]/route');

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-4[0-9a-f]{3}-[89ab][0-9a-f]{3}-[0-9a-f]{12}$/;
const ctx = { params: Promise.resolve({}) };

function expectSecured(res: Response): void {
  for (const [name, value] of Object.entries(staticSecurityHeaders)) expect(res.headers.get(name), name).toBe(value);
  expect(res.headers.get('content-security-policy')).toBe(API_CSP);
}

describe('which requests pass through proxy.ts', () => {
  const through = (url: string) => unstable_doesMiddlewareMatch({ config, url });
  it('pages and the two unwrapped API routes do; withApi routes and hashed files do not', () => {
    for (const url of ['/', '/sign-in?callbackUrl=%2F', '/clients/abc', '/api/auth/csrf', '/api/auth/signin/email', '/api/health', '/manifest.webmanifest']) expect(through(url), url).toBe(true);
    for (const url of ['/api/me', '/api/equipment/abc/photos', '/api/nothing-here', '/_next/static/chunks/a.js', '/favicon.ico']) expect(through(url), url).toBe(false);
  });
});

describe('withApi without the proxy', () => {
  let calls = 0;
  const route = withApi({}, async () => {
    calls++;
    return { ok: true };
  });

  it('sets the security headers and a request id on a success and on an error', async () => {
    session.actor = null;
    const refused = await route(new NextRequest('http://localhost/api/me'), ctx);
    expect(refused.status).toBe(401);
    expectSecured(refused);
    expect(refused.headers.get('x-request-id')).toMatch(UUID);
    expect(refused.headers.get('strict-transport-security')).toBeNull();
    session.actor = { id: '00000000-0000-4000-8000-000000000001', companyId: '00000000-0000-4000-8000-000000000002', role: 'office', clientId: null, name: 'Office', email: 'office@rimeline.test', units: 'imperial', metricPressure: 'kPa' };
    const ok = await route(new NextRequest('http://localhost/api/me', { headers: { 'x-request-id': 'from-the-balancer-9', 'x-forwarded-proto': 'https' } }), ctx);
    expect(ok.status).toBe(200);
    expectSecured(ok);
    expect(ok.headers.get('x-request-id')).toBe('from-the-balancer-9');
    expect(ok.headers.get('strict-transport-security')).toMatch(/max-age=\d+/);
  });

  it('refuses a malformed address with 400 before the handler or the session is looked at', async () => {
    session.actor = null;
    calls = 0;
    for (const [query, message] of [
      ['?q=%ZZ', 'malformed percent-escape'],
      ['?q=%ED%A0%80', 'malformed percent-escape'],
      ['/%00?q=1', 'NUL character'],
      ['?callbackUrl=http%3A%2F%2F%5B', 'callbackUrl'],
    ] as const) {
      const res = await route(new NextRequest(`http://localhost/api/me${query}`, { headers: { 'x-request-id': 'refused-request-2' } }), ctx);
      expect(res.status, query).toBe(400);
      const body = (await res.json()) as { error: { code: string; message: string } };
      expect(body.error.code).toBe('bad_request');
      expect(body.error.message).toContain(message);
      expectSecured(res);
      expect(res.headers.get('x-request-id')).toBe('refused-request-2');
    }
    expect(calls).toBe(0);
  });

  it('leaves a NUL in a query value to the handler, which names the field (422)', async () => {
    session.actor = { id: '00000000-0000-4000-8000-000000000001', companyId: '00000000-0000-4000-8000-000000000002', role: 'office', clientId: null, name: 'Office', email: 'office@rimeline.test', units: 'imperial', metricPressure: 'kPa' };
    calls = 0;
    const res = await route(new NextRequest('http://localhost/api/me?q=a%00b'), ctx);
    expect(res.status).toBe(422);
    expectSecured(res);
    expect(calls).toBe(0);
  });
});

describe('an unknown API path', () => {
  it('is a JSON 404 with the request id and the security headers, for every method', async () => {
    for (const method of ['GET', 'POST', 'PUT', 'PATCH', 'DELETE'] as const) {
      const res = await unknownApiPath[method](new NextRequest('http://localhost/api/nothing-here', { method }), { params: Promise.resolve({ path: ['nothing-here'] }) });
      expect(res.status).toBe(404);
      expect(((await res.json()) as { error: { code: string } }).error.code).toBe('not_found');
      expectSecured(res);
      expect(res.headers.get('x-request-id')).toMatch(UUID);
    }
  });
});
