import { expect, request as playwrightRequest, type APIRequestContext, type APIResponse, type Page } from '@playwright/test';
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

/** Fills labelled fields in order: label → text (a label matches as getByLabel's text does). */
export async function fillFields(scope: Pick<Page, 'getByLabel'>, values: Record<string, string>): Promise<void> {
  for (const [label, text] of Object.entries(values)) await scope.getByLabel(label).fill(text);
}

export async function shot(page: Page, name: string): Promise<void> {
  await page.screenshot({ path: path.join(screenshotDir, `${name}.png`), fullPage: true });
}

export async function expectHome(page: Page, role: string): Promise<void> {
  await expect(page.locator(`[data-home="${role}"]`)).toBeVisible();
}

/** An API client signed in as a demo user, for setting up records the way the app would. */
export async function apiAs(baseURL: string, email: string): Promise<APIRequestContext> {
  const api = await playwrightRequest.newContext({ baseURL });
  const { csrfToken } = (await (await api.get('/api/auth/csrf')).json()) as { csrfToken: string };
  await api.post('/api/auth/callback/credentials', { form: { csrfToken, email, password: DEMO_PASSWORD, json: 'true' } });
  expect((await api.get('/api/me')).ok()).toBe(true);
  return api;
}

/** The JSON body of a response that must be a success; a failure names the address, status and body. */
export async function ok<T>(res: Promise<APIResponse>): Promise<T> {
  const r = await res;
  expect(r.ok(), `${r.url()} → ${r.status()} ${await r.text()}`).toBe(true);
  return (await r.json()) as T;
}

/** Runs set-up as the office through the API, then ends the office's session. */
export async function asOffice<T>(baseURL: string | undefined, make: (office: APIRequestContext) => Promise<T>): Promise<T> {
  const office = await apiAs(baseURL ?? 'http://localhost:3100', 'office@rimeline.test');
  try {
    return await make(office);
  } finally {
    await office.dispose();
  }
}
