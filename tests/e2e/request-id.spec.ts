// Against the built server: every response carries one x-request-id (pages, API routes, the
// auth routes and refused addresses), a well-formed incoming id comes back unchanged, and a
// malformed one is replaced.
import { expect, test } from '@playwright/test';

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-4[0-9a-f]{3}-[89ab][0-9a-f]{3}-[0-9a-f]{12}$/;

test('responses carry the request id', async ({ request }) => {
  for (const path of ['/sign-in', '/api/health', '/api/me', '/api/auth/csrf', '/api/me?q=%ZZ', '/manifest.webmanifest']) {
    const kept = await request.get(path, { headers: { 'x-request-id': 'balancer-id-0042' } });
    expect(kept.headers()['x-request-id'], path).toBe('balancer-id-0042');
    const replaced = await request.get(path, { headers: { 'x-request-id': 'not a good id' } });
    expect(replaced.headers()['x-request-id'], path).toMatch(UUID);
    const fresh = await request.get(path);
    expect(fresh.headers()['x-request-id'], path).toMatch(UUID);
    expect(fresh.headers()['x-request-id']).not.toBe(replaced.headers()['x-request-id']);
  }
});
