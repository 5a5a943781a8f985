// Which link clicks leave the current screen for another page of this app: those are the ones a
// leave guard asks about. Pure, so it can be tested without a browser.

/**
 * The path a link leads to when following it replaces this page with another page of the app;
 * null for another site, a new tab or window, or a jump within the same page.
 */
export function inAppPath(href: string, target: string, current: string): string | null {
  if (target !== '' && target !== '_self') return null;
  let url: URL;
  try {
    url = new URL(href, current);
  } catch {
    return null;
  }
  const here = new URL(current);
  if (url.origin !== here.origin) return null;
  if (url.pathname === here.pathname && url.search === here.search && url.hash !== '') return null;
  return url.pathname + url.search + url.hash;
}
