import { expect, test } from '@playwright/test';
import { signIn } from './helpers';

test('an owner gets the not-found page and a 404 for another client’s site', async ({ page }) => {
  // The office finds a site of the second client.
  await signIn(page, 'office@rimeline.test');
  const sites = (await (await page.request.get('/api/sites?q=Linden')).json()) as { items: { id: string }[] };
  const otherSiteId = sites.items[0]!.id;
  await page.getByRole('button', { name: 'Sign out' }).click();
  await page.waitForURL(/\/sign-in/);

  await signIn(page, 'owner@client-one.test');
  await page.goto(`/sites/${otherSiteId}`);
  await expect(page.getByRole('heading', { name: 'Not found' })).toBeVisible();
  const api = await page.request.get(`/api/sites/${otherSiteId}`);
  expect(api.status()).toBe(404);
  expect(await api.json()).toEqual({ error: { code: 'not_found', message: 'Site not found.' } });
  // Their own list holds only their client's sites.
  await page.goto('/sites');
  await expect(page.getByText('Pell Street Kitchen')).toBeVisible();
  await expect(page.getByText('Linden Avenue Market')).toHaveCount(0);
});

test('owners and technicians cannot open office pages', async ({ page }) => {
  await signIn(page, 'tech@rimeline.test');
  await page.goto('/clients/new');
  await expect(page.getByText('That page is not available to your role.')).toBeVisible();
  const res = await page.request.post('/api/clients', { data: { name: 'Not allowed' } });
  expect(res.status()).toBe(403);
});
