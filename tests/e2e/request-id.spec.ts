// Against the built server: every response carries one x-request-id (pages, API routes, the
// auth routes and refused addresses), a well-formed incoming id comes back unchanged, and a
// malformed one is replaced.
import { expect, test } from '@playwright/test';
import { signIn } from './helpers';

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

// Signed-in pages are rendered by the server for a person; a server action is a POST to a page's
// address. Both pass through proxy.ts, which puts the id on the request (their log lines read it:
// tests/integration/request-id.pages.test.ts) and on the response.
test('signed-in pages and server action posts carry the request id', async ({ page }) => {
  await signIn(page, 'admin@rimeline.test');
  for (const path of ['/', '/clients', '/settings']) {
    const kept = await page.request.get(path, { headers: { 'x-request-id': 'page-balancer-0042' }, maxRedirects: 0 });
    expect(kept.status(), path).toBe(200);
    expect(kept.headers()['x-request-id'], path).toBe('page-balancer-0042');
    const fresh = await page.request.get(path, { maxRedirects: 0 });
    expect(fresh.status(), path).toBe(200);
    expect(fresh.headers()['x-request-id'], path).toMatch(UUID);
  }
  // An action id no build has: Next refuses it, and the refusal still carries the id.
  const origin = new URL(page.url()).origin;
  const action = await page.request.post('/settings', {
    headers: { 'next-action': '00'.repeat(21), origin, 'content-type': 'text/plain;charset=UTF-8', 'x-request-id': 'action-post-0042' },
    data: '[]',
    maxRedirects: 0,
  });
  expect(action.headers()['x-request-id']).toBe('action-post-0042');
});
