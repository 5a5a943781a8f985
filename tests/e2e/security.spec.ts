// Browser checks of the security hardening: a page served from another port on localhost (the
// same site for SameSite cookies) cannot make a signed-in browser archive a site or send a
// multipart service request; every page, route and static file carries the security headers;
// and the pages still run under the nonce CSP (no console CSP violations while signing in).
import { createServer, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import { expect, request as playwrightRequest, test } from '@playwright/test';
import { apiAs, signIn } from './helpers';

const appPort = Number(process.env.APP_PORT || 3100);
// The other page's server listens on port 0 and reads back the port it got.
let otherPort = 0;
const appOrigin = `http://localhost:${appPort}`;

function serveOtherOrigin(html: string): Promise<Server> {
  const server = createServer((_req, res) => {
    res.writeHead(200, { 'content-type': 'text/html; charset=utf-8' });
    res.end(html);
  });
  return new Promise((resolve, reject) => {
    server.once('error', reject);
    server.listen(0, '127.0.0.1', () => {
      otherPort = (server.address() as AddressInfo).port;
      resolve(server);
    });
  });
}

test.describe('a page on another port', () => {
  let server: Server | null = null;
  test.afterEach(async () => {
    await new Promise<void>((r) => (server ? server.close(() => r()) : r()));
    server = null;
  });

  test('cannot archive a site with the office’s cookie', async ({ page }) => {
    const office = await apiAs(appOrigin, 'office@rimeline.test');
    const site = ((await (await office.get('/api/sites?q=Orchard')).json()) as { items: { id: string; name: string }[] }).items[0]!;
    server = await serveOtherOrigin(
      `<!doctype html><form method="post" action="${appOrigin}/api/sites/${site.id}/archive"><button>Win a prize</button></form>`,
    );
    await signIn(page, 'office@rimeline.test');
    await page.goto(`http://localhost:${otherPort}/`);
    const [response] = await Promise.all([page.waitForResponse(`${appOrigin}/api/sites/${site.id}/archive`), page.getByRole('button', { name: 'Win a prize' }).click()]);
    expect(response.status()).toBe(403);
    expect(await response.json()).toEqual({ error: { code: 'forbidden', message: 'This request came from another site and was refused.' } });
    const after = (await (await office.get(`/api/sites/${site.id}`)).json()) as { archivedAt: string | null };
    expect(after.archivedAt).toBeNull();
  });

  test('cannot send a multipart service request with an owner’s cookie', async ({ page }) => {
    const owner = await apiAs(appOrigin, 'owner@client-one.test');
    const site = ((await (await owner.get('/api/sites')).json()) as { items: { id: string }[] }).items[0]!;
    const count = async () => ((await (await owner.get('/api/requests?limit=200')).json()) as { items: unknown[] }).items.length;
    const before = await count();
    server = await serveOtherOrigin(
      `<!doctype html><form method="post" enctype="multipart/form-data" action="${appOrigin}/api/requests">
        <input name="siteId" value="${site.id}"><input name="description" value="Forged request"><input name="urgency" value="urgent">
        <button>Claim your reward</button></form>`,
    );
    await signIn(page, 'owner@client-one.test');
    await page.goto(`http://localhost:${otherPort}/`);
    const [response] = await Promise.all([page.waitForResponse(`${appOrigin}/api/requests`), page.getByRole('button', { name: 'Claim your reward' }).click()]);
    expect(response.status()).toBe(403);
    expect(await count()).toBe(before);
  });
});

test('pages, routes and static files carry the security headers; pages run under the nonce CSP', async ({ page, request }) => {
  const violations: string[] = [];
  page.on('console', (msg) => {
    if (/Content Security Policy|Refused to/i.test(msg.text())) violations.push(msg.text());
  });
  const signInPage = await page.goto('/sign-in');
  const headers = signInPage!.headers();
  expect(headers['content-security-policy']).toMatch(/script-src 'self' 'nonce-[A-Za-z0-9+/=]+' 'strict-dynamic'/);
  expect(headers['content-security-policy']).toContain("frame-ancestors 'none'");
  expect(headers['content-security-policy']).not.toContain('unsafe-eval');
  expect(headers['x-frame-options']).toBe('DENY');
  expect(headers['x-content-type-options']).toBe('nosniff');
  expect(headers['referrer-policy']).toBe('strict-origin-when-cross-origin');
  expect(headers['permissions-policy']).toContain('camera=(self)');
  // Next put the nonce on its own scripts, and they ran: the form is interactive.
  const nonce = /'nonce-([^']+)'/.exec(headers['content-security-policy']!)![1];
  expect(await page.locator(`script[nonce]`).count()).toBeGreaterThan(0);
  expect(await page.locator('script[nonce]').first().evaluate((s) => (s as HTMLScriptElement).nonce)).toBe(nonce);
  await signIn(page, 'office@rimeline.test');
  await expect(page.getByRole('navigation').first()).toBeVisible();
  expect(violations).toEqual([]);

  const api = await request.get('/api/health');
  expect(api.headers()['x-frame-options']).toBe('DENY');
  expect(api.headers()['content-security-policy']).toContain("frame-ancestors 'none'");
  const asset = (await page.locator('script[src*="/_next/static/"]').first().getAttribute('src'))!;
  const assetRes = await request.get(asset);
  expect(assetRes.headers()['x-content-type-options']).toBe('nosniff');
  // No HSTS over plain HTTP; a request forwarded as HTTPS gets it.
  expect(headers['strict-transport-security']).toBeUndefined();
  const viaHttps = await request.get('/sign-in', { headers: { 'x-forwarded-proto': 'https' } });
  expect(viaHttps.headers()['strict-transport-security']).toMatch(/max-age=\d+/);
});

test('a NUL or a malformed callbackUrl in an address is a 400, not a 500', async ({ request }) => {
  expect((await request.get('/sign-in?callbackUrl=http%3A%2F%2F%5B')).status()).toBe(400);
  expect((await request.get('/sign-in?callbackUrl=%E0%A4%A')).status()).toBe(400);
  expect((await request.get('/clients?q=%00')).status()).toBe(400);
  expect((await request.get('/api/auth/signin?callbackUrl=http%3A%2F%2F%5B')).status()).toBe(400);
});

test.describe('sessions end on the server', () => {
  test('a copied cookie stops working once its browser signs out', async ({ browser }) => {
    const context = await browser.newContext();
    const page = await context.newPage();
    await signIn(page, 'tech@rimeline.test');
    const copied = await context.storageState();
    const thief = await playwrightRequest.newContext({ baseURL: appOrigin, storageState: copied });
    expect((await thief.get('/api/me')).status()).toBe(200);
    await page.getByRole('button', { name: 'Sign out' }).click();
    await page.waitForURL(/\/sign-in/);
    expect((await thief.get('/api/me')).status()).toBe(401);
    await context.close();
  });

  test('“Sign out everywhere” on My preferences ends the other browsers too', async ({ browser }) => {
    const phone = await apiAs(appOrigin, 'tech@rimeline.test');
    const context = await browser.newContext();
    const page = await context.newPage();
    await signIn(page, 'tech@rimeline.test', undefined, '/settings');
    await page.getByRole('button', { name: 'Sign out everywhere' }).click();
    await page.waitForURL(/\/sign-in/);
    expect((await phone.get('/api/me')).status()).toBe(401);
    await context.close();
  });
});
