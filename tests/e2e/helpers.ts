import { expect, type Page } from '@playwright/test';
import path from 'node:path';

export const DEMO_PASSWORD = 'rimeline-demo';
export const screenshotDir = path.join(process.env.RIMELINE_DATA || path.resolve(import.meta.dirname, '../../.data/test'), 'screenshots');

export async function signIn(page: Page, email: string, password = DEMO_PASSWORD, returnTo = '/'): Promise<void> {
  await page.goto(`/sign-in?callbackUrl=${encodeURIComponent(returnTo)}`);
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.waitForURL((url) => url.pathname === returnTo.split('?')[0]);
}

export async function shot(page: Page, name: string): Promise<void> {
  await page.screenshot({ path: path.join(screenshotDir, `${name}.png`), fullPage: true });
}

export async function expectHome(page: Page, role: string): Promise<void> {
  await expect(page.locator(`[data-home="${role}"]`)).toBeVisible();
}
