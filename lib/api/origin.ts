// Cross-origin request refusal for state-changing requests, shared by withApi, server actions and
// the auth routes. SameSite=Lax cookies do not cover another port or a sibling subdomain, so the
// browser's own statement of where a request came from decides:
// - `Origin` present: it must be one of the allowed origins (APP_URL plus ALLOWED_ORIGINS).
//   `Origin: null` (sandboxed frames, opaque redirects) is refused.
// - no `Origin` but `Sec-Fetch-Site`: only `same-origin` or `none` (typed by the user) pass.
// - neither header: allowed. Browsers send at least one of them on every cross-origin POST, so
//   such a request comes from a non-browser client (curl, a server, a test) that holds its own
//   cookie and could not be used for cross-site forgery.

const SAFE_METHODS = new Set(['GET', 'HEAD', 'OPTIONS']);

export function normaliseOrigin(value: string): string | null {
  try {
    const url = new URL(value);
    if (url.protocol !== 'http:' && url.protocol !== 'https:') return null;
    return url.origin;
  } catch {
    return null;
  }
}

/** APP_URL's origin plus every origin in the comma- or space-separated extra list. */
export function allowedOrigins(appUrl: string, extra = ''): Set<string> {
  const out = new Set<string>();
  for (const value of [appUrl, ...extra.split(/[\s,]+/)]) {
    const origin = value ? normaliseOrigin(value) : null;
    if (origin) out.add(origin);
  }
  return out;
}

interface HeaderSource {
  get(name: string): string | null;
}

export function isSameOriginRequest(method: string, headers: HeaderSource, allowed: Set<string>): boolean {
  if (SAFE_METHODS.has(method.toUpperCase())) return true;
  const origin = headers.get('origin');
  if (origin !== null) {
    const normalised = origin === 'null' ? null : normaliseOrigin(origin);
    return normalised !== null && allowed.has(normalised);
  }
  const site = headers.get('sec-fetch-site');
  if (site !== null) return site === 'same-origin' || site === 'none';
  return true;
}

export const CROSS_ORIGIN_MESSAGE = 'This request came from another site and was refused.';
