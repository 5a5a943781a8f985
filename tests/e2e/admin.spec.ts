import { expect, test } from '@playwright/test';
import { clearMail } from '../helpers/mail';
import { expectHome, fillFields, signIn } from './helpers';

test('an admin invites a technician, who follows the link from the mail inbox and signs in', async ({ page }) => {
  await clearMail();
  await signIn(page, 'admin@rimeline.test');
  await page.goto('/settings/users');
  await page.getByLabel('Name', { exact: true }).fill('Rhea Calloway');
  await page.getByLabel('E-mail', { exact: true }).fill('rhea@example.test');
  await page.getByLabel('Role', { exact: true }).selectOption('technician');
  await page.getByRole('button', { name: 'Send invitation' }).click();
  await expect(page.getByText('Invitation sent to rhea@example.test.')).toBeVisible();

  // The outbox sends in the background; the inbox shows the mail once it has arrived.
  await expect(async () => {
    await page.goto('/settings/mail');
    await expect(page.getByRole('link', { name: /invited you to Brackenfield/ }).first()).toBeVisible({ timeout: 1_000 });
  }).toPass({ timeout: 30_000 });
  await page.getByText('Plain text').click();
  const text = await page.getByTestId('mail-text').innerText();
  const link = text.match(/https?:\/\/[^/\s]+\/invitation\/\S+/)![0];

  await page.getByRole('button', { name: 'Sign out' }).click();
  await page.waitForURL(/\/sign-in/);
  await page.goto(link);
  const createAccount = async (password: string) => {
    await fillFields(page, { 'Choose a password': password, 'Repeat the password': password });
    await page.getByRole('button', { name: 'Create my account' }).click();
  };
  await createAccount('short');
  await expect(page.getByText('Use at least 10 characters.')).toBeVisible();
  await createAccount('rooftop-coil-7');
  await page.waitForURL(/\/sign-in/);
  await signIn(page, 'rhea@example.test', 'rooftop-coil-7');
  await expectHome(page, 'technician');
});

test('the mail inbox is for admins only', async ({ page }) => {
  await signIn(page, 'office@rimeline.test');
  await page.goto('/settings/mail');
  await expect(page.getByText('That page is not available to your role.')).toBeVisible();
});
