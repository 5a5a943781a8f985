import { expect, type BrowserContext, type Locator, type Page } from '@playwright/test';

// Steps the field specs share: keeping a site on the phone, and losing an answer on the way back.

/** Keeps a site on the phone from its page once the service worker is ready; returns the panel. */
export async function keepSiteOnPhone(page: Page, siteId: string): Promise<Locator> {
  await page.goto(`/sites/${siteId}`);
  await page.evaluate(async () => {
    await navigator.serviceWorker.ready;
  });
  const panel = page.getByTestId('keep-site');
  await panel.getByRole('button', { name: 'Keep this site on the phone' }).click();
  // Keeping also fetches the field pages for the worker's copy: slow on a loaded machine.
  await expect(panel.getByTestId('keep-site-status')).toContainText('Ready without signal', { timeout: 30_000 });
  return panel;
}

/**
 * The server gets and saves the first POST to `url`, but its answer never reaches the phone
 * (the connection resets). Returns how many answers were lost so far, for the spec to check.
 */
export async function loseFirstAnswer(target: Page | BrowserContext, url: string): Promise<() => number> {
  let lost = 0;
  await target.route(url, async (route) => {
    if (route.request().method() === 'POST' && lost === 0) {
      lost += 1;
      await route.fetch();
      await route.abort('connectionreset');
    } else {
      await route.continue();
    }
  });
  return () => lost;
}
