import { expect, test } from '@playwright/test';
import { clearMail, firstLink, waitForMail } from '../helpers/mail';
import { expectHome, shot, signIn } from './helpers';

const homes = [
  ['admin@rimeline.test', 'admin', 'People and settings'],
  ['office@rimeline.test', 'office', 'Customers'],
  ['tech@rimeline.test', 'technician', 'Your work'],
  ['owner@client-one.test', 'client', 'Your sites'],
] as const;

test.describe('sign-in', () => {
  for (const [email, role, heading] of homes) {
    test(`${role} signs in with a password and lands on their home @phone`, async ({ page }, info) => {
      await signIn(page, email);
      await expectHome(page, role);
      await expect(page.getByRole('heading', { name: heading })).toBeVisible();
      await shot(page, `home-${role}-${info.project.name}`);
    });
  }

  test('a wrong password says so and leaves the visitor signed out', async ({ page }) => {
    await page.goto('/sign-in');
    await page.getByLabel('E-mail').fill('office@rimeline.test');
    await page.getByLabel('Password').fill('not-the-password');
    await page.getByRole('button', { name: 'Sign in' }).click();
    await expect(page.getByRole('alert').filter({ hasText: 'The e-mail or password is not right.' })).toBeVisible();
    await page.goto('/');
    await expect(page).toHaveURL(/\/sign-in\?callbackUrl=%2F/);
  });

  // Without a trusted client address (TRUSTED_PROXY_COUNT=0) only the account's own slow-down
  // applies: ten tries, then one per 30 s (lib/auth/throttle.ts).
  test('repeated failures for one account are slowed down, and the page says so', async ({ page }) => {
    await page.goto('/sign-in');
    for (let i = 0; i < 10; i++) {
      await page.getByLabel('E-mail').fill('nobody-here@rimeline.test');
      await page.getByLabel('Password').fill(`wrong-${i}`);
      await page.getByRole('button', { name: 'Sign in' }).click();
      await expect(page.getByRole('alert').filter({ hasText: /not right|Too many/ })).toBeVisible();
    }
    await page.getByLabel('Password').fill('wrong-again');
    await page.getByRole('button', { name: 'Sign in' }).click();
    await expect(page.getByRole('alert').filter({ hasText: 'Too many failed sign-ins' })).toContainText('E-mail me a link');
  });

  test('a magic link from the mail catcher signs the technician in', async ({ page, browser }, info) => {
    await clearMail();
    await page.goto('/sign-in');
    await page.getByRole('tab', { name: 'E-mail me a link' }).click();
    await page.getByLabel('E-mail').fill('tech@rimeline.test');
    await page.getByRole('button', { name: 'Send sign-in link' }).click();
    await expect(page.getByRole('heading', { name: 'Check your e-mail' })).toBeVisible();
    const mail = await waitForMail('tech@rimeline.test');
    expect(mail.subject).toBe('Your Rimeline sign-in link');
    await page.goto(firstLink(mail.text ?? '', '/api/auth/callback/email'));
    await expectHome(page, 'technician');
    // The link works only once. A fresh context rather than clearCookies(): a session refresh
    // still in flight in the first page could put the cookie back after clearing.
    const fresh = await browser.newContext({ baseURL: info.project.use.baseURL, viewport: page.viewportSize() });
    try {
      const again = await fresh.newPage();
      await again.goto(firstLink(mail.text ?? '', '/api/auth/callback/email'));
      await expect(again.getByRole('alert').filter({ hasText: 'expired or was already used' })).toBeVisible();
    } finally {
      await fresh.close();
    }
  });

  test('signing out ends the session', async ({ page }) => {
    await signIn(page, 'office@rimeline.test');
    await page.getByRole('button', { name: 'Sign out' }).click();
    await page.waitForURL(/\/sign-in/);
    const res = await page.request.get('/api/me');
    expect(res.status()).toBe(401);
  });

  test('a signed-out visitor returns to the page they asked for after signing in', async ({ page }) => {
    await page.goto('/clients');
    await expect(page).toHaveURL(/callbackUrl=%2Fclients/);
    await page.getByLabel('E-mail').fill('office@rimeline.test');
    await page.getByLabel('Password').fill('rimeline-demo');
    await page.getByRole('button', { name: 'Sign in' }).click();
    await expect(page.getByRole('heading', { name: 'Clients', level: 1 })).toBeVisible();
  });
});
