// axe-core over the main pages of every role, at 360 px (phone project) and on desktop: any
// serious or critical violation fails the test, listed by page, rule and element.
import AxeBuilder from '@axe-core/playwright';
import { expect, test, type Page } from '@playwright/test';
import { apiAs, signIn } from './helpers';

type Found = { page: string; rule: string; impact: string; help: string; targets: string[] };

async function audit(page: Page, path: string, found: Found[]): Promise<void> {
  const res = await page.goto(path);
  expect(res?.status(), `${path} answered ${res?.status()}`).toBeLessThan(400);
  await expect(page.locator('main').first()).toBeVisible();
  // Client-side lists fill in after the first paint; axe looks once they have settled.
  await page.waitForLoadState('networkidle');
  // A caught e-mail's body is shown in a sandboxed frame without scripts: axe cannot run inside it
  // (and would wait for it for ever); the frame's own title is still checked on the page.
  const result = await new AxeBuilder({ page }).exclude('iframe[sandbox]').analyze();
  for (const v of result.violations) {
    if (v.impact !== 'serious' && v.impact !== 'critical') continue;
    found.push({ page: path, rule: v.id, impact: v.impact, help: v.help, targets: v.nodes.slice(0, 5).map((n) => n.target.join(' ')) });
  }
}

async function created(res: Promise<import('@playwright/test').APIResponse>): Promise<string> {
  const r = await res;
  expect(r.status(), await r.text()).toBe(201);
  return ((await r.json()) as { id: string }).id;
}

// The demo has clients and sites but no units or visits: one of each on a site of client one
// (so its owner sees them too), made through the API the way the app would.
const ids = { client: '', site: '', unit: '', visit: '' };

async function auditAll(page: Page, paths: string[]): Promise<void> {
  const found: Found[] = [];
  for (const path of paths) await audit(page, path, found);
  expect(found, JSON.stringify(found, null, 2)).toEqual([]);
}

test.describe('accessibility (axe: no serious or critical violations) @phone', () => {
  // Several pages per test, each analysed in full: generous on a busy 2-core machine.
  test.describe.configure({ timeout: 600_000 });

  test.beforeAll(async ({}, info) => {
    const baseURL = info.project.use.baseURL!;
    const office = await apiAs(baseURL, 'office@rimeline.test');
    const tech = await apiAs(baseURL, 'tech@rimeline.test');
    // A site of its own for client one (so its owner sees it): an open visit left here never stands
    // in the way of another spec's visit at a demo site.
    const demoSite = ((await (await office.get('/api/sites?q=Orchard')).json()) as { items: { id: string; clientId: string }[] }).items[0]!;
    ids.client = demoSite.clientId;
    ids.site = await created(office.post('/api/sites', { data: { clientId: ids.client, name: `Axe corner store ${info.project.name} ${Date.now()}`, timeZone: 'America/Chicago', elevationM: 200 } }));
    const site = { id: ids.site };
    const system = await created(office.post('/api/systems', { data: { siteId: site.id, name: `Axe circuit ${info.project.name} ${Date.now()}`, refrigerant: 'R-134a', fullChargeKg: 2.5, application: 'commercial_refrigeration', designBoxTempC: 3 } }));
    ids.unit = await created(office.post('/api/equipment', { data: { siteId: site.id, systemId: system, type: 'condensing_unit', name: `Axe condensing unit ${info.project.name} ${Date.now()}`, installedOn: '2012-06-01', condition: 3 } }));
    // A technician has one open visit per site: the one an earlier project made is reused.
    const open = (await (await tech.get(`/api/visits?siteId=${site.id}&status=open`)).json()) as { items: { id: string }[] };
    ids.visit = open.items[0]?.id ?? (await created(tech.post('/api/visits', { data: { siteId: site.id, reason: 'no_cooling' } })));
    await office.dispose();
    await tech.dispose();
  });

  test('the check itself: a page with known faults fails it', async ({ page }) => {
    await page.setContent('<!doctype html><html lang="en"><title>t</title><main><img src="data:image/gif;base64,R0lGODlhAQABAAAAACw="><button></button></main></html>');
    const rules = (await new AxeBuilder({ page }).analyze()).violations.filter((v) => v.impact === 'serious' || v.impact === 'critical').map((v) => v.id);
    expect(rules).toEqual(expect.arrayContaining(['image-alt', 'button-name']));
  });

  test('signed-out pages', async ({ page }) => {
    await auditAll(page, ['/sign-in']);
  });

  test('admin', async ({ page }) => {
    await signIn(page, 'admin@rimeline.test');
    await auditAll(page, ['/', '/settings', '/settings/users', '/settings/company', '/settings/mail', '/settings/storage', '/tags', '/reports']);
  });

  test('office', async ({ page }) => {
    await signIn(page, 'office@rimeline.test');
    await auditAll(page, [
      '/',
      '/attention',
      '/clients',
      `/clients/${ids.client}`,
      '/clients/new',
      '/sites',
      `/sites/${ids.site}`,
      '/equipment',
      `/equipment/${ids.unit}`,
      '/visits',
      `/visits/${ids.visit}`,
      '/requests',
      '/follow-ups',
      '/tools/pt-chart',
    ]);
  });

  test('technician', async ({ page }) => {
    await signIn(page, 'tech@rimeline.test');
    await auditAll(page, ['/', '/visits', '/visits/new', `/visits/${ids.visit}`, `/equipment/${ids.unit}`, '/scan', '/tools/pt-chart']);
  });

  test('owner', async ({ page }) => {
    await signIn(page, 'owner@client-one.test');
    await auditAll(page, ['/', `/sites/${ids.site}`, `/equipment/${ids.unit}`, '/requests', '/requests/new']);
  });
});
