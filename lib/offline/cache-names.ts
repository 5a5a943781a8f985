// Names shared by the service worker (app/sw.ts) and the pages: pure, no browser globals.

/** Field pages kept by the worker (network first); wiped on sign-out and on a change of user. */
export const PAGES_CACHE = 'rimeline-pages';

/** The page that shows a unit from a kept site pack. */
export const OFFLINE_UNIT_PATH = '/offline/unit';

/** Pages a phone keeps ready once a site is kept, so they open without signal. */
export const FIELD_PAGES = ['/scan', OFFLINE_UNIT_PATH, '/tools/pt-chart'] as const;

/** Pages the worker answers from its copy when the network fails (network first). */
export function isFieldPage(pathname: string): boolean {
  return (
    pathname === '/scan' ||
    pathname === OFFLINE_UNIT_PATH ||
    pathname === '/tools/pt-chart' ||
    pathname === '/visits/new' ||
    /^\/visits\/[0-9a-f-]{36}$/i.test(pathname)
  );
}

/**
 * Where a unit's own address sends a phone without signal: /T/<code> and /tag/<code> (a tag's
 * link) and /equipment/<id> open the unit from the kept pack.
 */
export function offlineUnitTarget(pathname: string): string | null {
  const tag = /^\/(?:T|tag)\/([^/]+)\/?$/.exec(pathname);
  if (tag) {
    let code: string;
    try {
      code = decodeURIComponent(tag[1]!);
    } catch {
      return null;
    }
    return `${OFFLINE_UNIT_PATH}?code=${encodeURIComponent(code)}`;
  }
  const unit = /^\/equipment\/([0-9a-f-]{36})\/?$/i.exec(pathname);
  if (unit) return `${OFFLINE_UNIT_PATH}?id=${unit[1]!.toLowerCase()}`;
  return null;
}
