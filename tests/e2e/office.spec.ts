import { expect, test } from '@playwright/test';
import { shot, signIn } from './helpers';

test('the office creates a client, a site with areas, edits and archives them @phone', async ({ page }, info) => {
  const suffix = `${info.project.name}-${Date.now() % 100000}`;
  await signIn(page, 'office@rimeline.test');
  await page.getByRole('link', { name: 'New client' }).click();
  await page.getByRole('button', { name: 'Create client' }).click();
  await expect(page.getByText('Name is required.')).toBeVisible();
  await page.getByLabel('Client name').fill(`Juniper Hollow Deli ${suffix}`);
  await page.getByRole('button', { name: 'Create client' }).click();
  await expect(page.getByRole('heading', { name: `Juniper Hollow Deli ${suffix}` })).toBeVisible();

  await page.getByRole('link', { name: 'Add a site' }).click();
  await page.getByLabel('Site name').fill('Mill Lane Deli');
  await page.getByLabel('Street address').fill('12 Mill Lane');
  await page.getByLabel('Elevation (ft)').fill('99999');
  await page.getByRole('button', { name: 'Create site' }).click();
  // The server-side limit shows on the field and keeps what was typed.
  await expect(page.getByText('Elevation must be at most 6000 m.')).toBeVisible();
  await expect(page.getByLabel('Street address')).toHaveValue('12 Mill Lane');
  await page.getByLabel('Elevation (ft)').fill('5280');
  await page.getByRole('button', { name: 'Create site' }).click();
  await expect(page.getByRole('heading', { name: 'Mill Lane Deli' })).toBeVisible();
  await expect(page.getByText('5,280 ft')).toBeVisible();

  await page.getByLabel('Area name').fill('Walk-in freezer');
  await page.getByLabel('Kind').selectOption('walk_in_freezer');
  await page.getByRole('button', { name: 'Add area' }).click();
  await expect(page.getByRole('listitem').filter({ hasText: 'Walk-in freezer' })).toBeVisible();
  await shot(page, `site-page-${info.project.name}`);

  await page.getByRole('link', { name: 'Edit site' }).click();
  await page.getByLabel('Site name').fill('Mill Lane Deli (rear)');
  await page.getByRole('button', { name: 'Save changes' }).click();
  await expect(page.getByRole('heading', { name: 'Mill Lane Deli (rear)' })).toBeVisible();

  page.once('dialog', (d) => d.accept());
  await page.getByRole('button', { name: 'Archive site' }).click();
  await expect(page.getByText('Archived site')).toBeVisible();
});

test('keyboard users can skip to content and see where focus is', async ({ page }) => {
  await signIn(page, 'office@rimeline.test');
  await page.keyboard.press('Tab');
  const skip = page.getByRole('link', { name: 'Skip to content' });
  await expect(skip).toBeFocused();
  await expect(skip).toBeVisible();
  const outline = await skip.evaluate((el) => getComputedStyle(el).outlineStyle);
  expect(outline).toBe('solid');
});
