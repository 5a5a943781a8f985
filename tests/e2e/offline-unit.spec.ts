// Without signal at 360 px: a technician keeps a site on the phone, loses the connection, types the
// tag code of a unit never opened before on the Scan page and sees its page, settings and history
// from the phone's copy. Signing out wipes the copy. Sites, makes and people are invented.
import { randomUUID } from 'node:crypto';
import { expect, test, type APIRequestContext, type Page } from '@playwright/test';
import { formatCode } from '../../lib/tags/code';
import { api } from '../helpers/visits';
import { asOffice, shot, signIn } from './helpers';
import { keepSiteOnPhone } from './field';

// The phone's service worker is what answers without signal.
test.use({ serviceWorkers: 'allow' });

async function keptSite(request: APIRequestContext, label: string) {
  const clients = await api<{ items: { id: string }[] }>(request, 'GET', '/api/clients?limit=50');
  const site = await api<{ id: string; name: string }>(request, 'POST', '/api/sites', { clientId: clients.items[0]!.id, name: `Basement deli ${label}`, timeZone: 'America/Chicago', elevationM: 180 });
  const evaporator = await api<{ id: string; name: string }>(request, 'POST', '/api/equipment', { siteId: site.id, type: 'evaporator', name: `Deli walk-in evaporator ${label}`, make: 'Frostwell', nameplate: {} });
  const control = await api<{ id: string; name: string }>(request, 'POST', '/api/equipment', {
    siteId: site.id,
    type: 'pressure_control',
    name: `Deli low-pressure control ${label}`,
    make: 'Kelvrin',
    nameplate: { controlKind: 'low', lowCutInKpa: 200, lowDifferentialKpa: 70 },
  });
  const created = await request.post('/api/print-runs', { data: { kind: 'equipment', equipmentIds: [evaporator.id, control.id], layoutId: 'thermal-2x1' } });
  expect(created.status()).toBe(201);
  const run = await api<{ tags: { code: string; equipmentId: string | null }[] }>(request, 'GET', `/api/print-runs/${((await created.json()) as { id: string }).id}`);
  const codeOf = (id: string) => run.tags.find((t) => t.equipmentId === id)!.code;
  return { site, evaporator: { ...evaporator, code: codeOf(evaporator.id) }, control: { ...control, code: codeOf(control.id) } };
}

async function packDatabases(page: Page): Promise<string[]> {
  return page.evaluate(async () => (await indexedDB.databases()).map((d) => d.name ?? '').filter((n) => n.startsWith('rimeline-offline-')));
}

async function packCount(page: Page): Promise<number> {
  return page.evaluate(async () => {
    const names = (await indexedDB.databases()).map((d) => d.name ?? '').filter((n) => n.startsWith('rimeline-offline-'));
    let count = 0;
    for (const name of names) {
      count += await new Promise<number>((resolve, reject) => {
        const open = indexedDB.open(name);
        open.onerror = () => reject(open.error);
        open.onsuccess = () => {
          const db = open.result;
          if (!db.objectStoreNames.contains('packs')) {
            db.close();
            resolve(0);
            return;
          }
          const req = db.transaction('packs').objectStore('packs').count();
          req.onsuccess = () => {
            db.close();
            resolve(req.result);
          };
        };
      });
    }
    return count;
  });
}

test('a kept site opens a never-opened unit by typed code without signal; sign-out wipes the copy @phone', async ({ page, context }, info) => {
  test.setTimeout(180_000);
  const label = String(Date.now()).slice(-6);
  // The office registers the site, its units and their tags.
  const { site, evaporator, control } = await asOffice(info.project.use.baseURL, (office) => keptSite(office, label));

  await signIn(page, 'tech@rimeline.test');
  // History on the control: a visit with a note, recorded while online.
  const visit = await api<{ id: string }>(page.request, 'POST', '/api/visits', { siteId: site.id, reason: 'maintenance' });
  await api(page.request, 'POST', `/api/visits/${visit.id}/entries`, {
    equipmentId: control.id,
    clientEntryId: randomUUID(),
    recordedAt: new Date().toISOString(),
    kind: 'note',
    data: { text: 'Capillary line rubbing on the rack: strapped it.' },
  });
  await api(page.request, 'POST', `/api/visits/${visit.id}/close`, { summary: 'Checked.' });

  // Keep the site while there is signal; the worker is in control once the page is ready.
  const panel = await keepSiteOnPhone(page, site.id);
  await expect(panel.getByTestId('keep-site-status')).toContainText('2 units');
  await expect(panel.getByTestId('keep-site-status')).toContainText(/\d+(\.\d)? KB/);
  await shot(page, 'offline-keep-site');
  // The Scan page is opened once with signal (the worker keeps its copy); the unit page never is.
  await page.goto('/scan');
  await expect(page.getByLabel('Tag code')).toBeVisible();
  await page.reload();
  await expect.poll(() => page.evaluate(() => Boolean(navigator.serviceWorker.controller))).toBe(true);

  await context.setOffline(true);
  await page.reload();
  await expect(page.getByLabel('Tag code')).toBeVisible();
  await page.getByLabel('Tag code').fill(formatCode(control.code).toLowerCase());
  await page.getByRole('button', { name: 'Open' }).click();

  const unitPage = page.getByTestId('offline-unit');
  await expect(unitPage.getByRole('heading', { level: 1, name: control.name })).toBeVisible();
  await expect(page).toHaveURL(/\/offline\/unit\?code=/);
  await expect(page.getByTestId('offline-unit-source')).toContainText('From this phone’s copy');
  await expect(page.getByTestId('offline-unit-source')).toContainText(site.name);
  await expect(page.getByTestId('offline-tag-code')).toContainText(formatCode(control.code));
  await expect(page.getByTestId('offline-current-settings')).toContainText('cut-in');
  await expect(page.getByTestId('offline-unit-history')).toContainText('Capillary line rubbing on the rack');
  await expect(page.getByRole('link', { name: /Log a visit/ })).toHaveAttribute('href', `/visits/new?siteId=${site.id}&equipmentId=${control.id}`);
  await shot(page, 'offline-unit-page');

  // The tag's own address, as the phone's camera app would open it, lands on the same copy.
  await page.goto(`/T/${evaporator.code}`);
  await expect(page.getByRole('heading', { level: 1, name: evaporator.name })).toBeVisible();
  await expect(page.getByTestId('offline-unit-history')).toContainText('No history yet.');

  // A code of no kept site says so plainly.
  await page.goto('/offline/unit?code=K7QM3X9PA');
  await expect(page.getByTestId('offline-unit-missing')).toContainText('not on this phone');

  await context.setOffline(false);
  await page.goto('/scan');
  expect(await packCount(page)).toBe(1);
  expect(await packDatabases(page)).toHaveLength(1);
  await page.getByRole('button', { name: 'Sign out' }).click();
  await page.waitForURL(/\/sign-in/);
  expect(await packDatabases(page)).toEqual([]);
  expect(await page.evaluate(async () => (await caches.keys()).includes('rimeline-pages'))).toBe(false);
});

test('owners get no pack: no button on the site page and 403 from the API @phone', async ({ page }) => {
  await signIn(page, 'owner@client-one.test');
  const sites = await api<{ items: { id: string }[] }>(page.request, 'GET', '/api/sites?limit=1');
  const siteId = sites.items[0]!.id;
  await page.goto(`/sites/${siteId}`);
  await expect(page.getByRole('heading', { level: 1 })).toBeVisible();
  await expect(page.getByTestId('keep-site')).toHaveCount(0);
  expect((await page.request.get(`/api/sites/${siteId}/pack`)).status()).toBe(403);
});

test('another person signing in on the same phone wipes the first one’s kept sites and pages @phone', async ({ page, context }, info) => {
  test.setTimeout(180_000);
  const label = String(Date.now()).slice(-6);
  const { site } = await asOffice(info.project.use.baseURL, (office) => keptSite(office, label));

  await signIn(page, 'tech@rimeline.test');
  await keepSiteOnPhone(page, site.id);
  expect(await packDatabases(page)).toHaveLength(1);
  expect(await page.evaluate(async () => (await caches.keys()).includes('rimeline-pages'))).toBe(true);

  // The session ends without a sign-out (it expired, or the cookies were cleared); someone else signs in.
  await context.clearCookies();
  await signIn(page, 'office@rimeline.test');
  await page.goto('/scan');
  await expect(page.getByLabel('Tag code')).toBeVisible();
  await expect.poll(() => packDatabases(page), { timeout: 30_000 }).toEqual([]);
  // The technician's kept pages are gone (the office's own visit to /scan may be kept anew).
  const keptPaths = () =>
    page.evaluate(async () => {
      if (!(await caches.has('rimeline-pages'))) return [];
      return (await (await caches.open('rimeline-pages')).keys()).map((r) => new URL(r.url).pathname);
    });
  await expect.poll(keptPaths, { timeout: 30_000 }).not.toContain('/offline/unit');
  // Nothing of the technician's copy answers the office's lookups either.
  await page.goto(`/sites/${site.id}`);
  await expect(page.getByTestId('keep-site').getByRole('button', { name: 'Keep this site on the phone' })).toBeVisible();
});
