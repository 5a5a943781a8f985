// Names shared by the service worker (app/sw.ts) and the pages: pure, no browser globals.

/** Field pages kept by the worker (network first); wiped on sign-out and on a change of user. */
export const PAGES_CACHE = 'rimeline-pages';

/** The page that shows a unit from a kept site pack. */
export const OFFLINE_UNIT_PATH = '/offline/unit';

/** The page that shows a visit from the phone's copy: one started without signal, or an open one never loaded here. */
export const OFFLINE_VISIT_PATH = '/offline/visit';

/** Pages a phone keeps ready once a site is kept, so they open without signal. */
export const FIELD_PAGES = ['/scan', OFFLINE_UNIT_PATH, OFFLINE_VISIT_PATH, '/tools/pt-chart'] as const;

/** A visit page's own address (/visits/<id>), whose query only the browser reads. */
export const VISIT_PAGE = /^\/visits\/([0-9a-f-]{36})\/?$/i;

/** Pages the worker answers from its copy when the network fails (network first). */
export function isFieldPage(pathname: string): boolean {
  return (
    pathname === '/scan' ||
    pathname === OFFLINE_UNIT_PATH ||
    pathname === OFFLINE_VISIT_PATH ||
    pathname === '/tools/pt-chart' ||
    pathname === '/visits/new' ||
    VISIT_PAGE.test(pathname)
  );
}

/** One kept copy per page whose server render ignores the query (the browser reads it). */
export function pageCacheKey(url: URL): string | null {
  return url.pathname === OFFLINE_UNIT_PATH || url.pathname === OFFLINE_VISIT_PATH || VISIT_PAGE.test(url.pathname) ? `${url.origin}${url.pathname}` : null;
}

/** Where a visit page that has no kept copy sends a phone without signal: the phone's copy of it. */
export function offlineVisitTarget(url: URL): string | null {
  const m = VISIT_PAGE.exec(url.pathname);
  if (!m) return null;
  const params = new URLSearchParams(url.search);
  params.delete('id');
  const rest = params.toString();
  return `${OFFLINE_VISIT_PATH}?id=${m[1]!.toLowerCase()}${rest ? `&${rest}` : ''}`;
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
