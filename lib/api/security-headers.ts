// The security headers of every page and route. Pure so proxy.ts, next.config.ts and the tests
// share one definition.
import { REQUEST_ID_HEADER } from './request-id';

/** Headers that never vary per request (also set by next.config.ts on static files). */
export const staticSecurityHeaders: Record<string, string> = {
  'X-Frame-Options': 'DENY',
  'X-Content-Type-Options': 'nosniff',
  'Referrer-Policy': 'strict-origin-when-cross-origin',
  // The scanner needs the camera on our own pages; nothing else is granted to anyone.
  'Permissions-Policy': 'camera=(self), microphone=(), geolocation=(), payment=(), usb=()',
};

export const HSTS = 'max-age=31536000; includeSubDomains';

/**
 * The page CSP: scripts only with this response's nonce (Next adds it to its own scripts) and
 * what they load ('strict-dynamic'); eval only for the development server's React tooling.
 * Styles allow inline attributes: React and the chart library render `style="…"` on the server,
 * which a nonce cannot cover, and styles cannot run code.
 */
export function pageCsp(nonce: string, dev: boolean): string {
  return [
    `default-src 'self'`,
    `script-src 'self' 'nonce-${nonce}' 'strict-dynamic'${dev ? ` 'unsafe-eval'` : ''}`,
    `style-src 'self' 'unsafe-inline'`,
    `img-src 'self' blob: data:`,
    `media-src 'self' blob:`,
    `font-src 'self'`,
    `connect-src 'self'`,
    `worker-src 'self' blob:`,
    `object-src 'none'`,
    `base-uri 'self'`,
    `form-action 'self'`,
    `frame-ancestors 'none'`,
  ].join('; ');
}

/** API answers are data or files, never documents that run code. */
export const API_CSP = `default-src 'none'; frame-ancestors 'none'`;

/**
 * Puts the request id and every security header on a response: the fixed ones, this CSP, and
 * HSTS when the request came over https (browsers ignore HSTS over plain HTTP, so trusting the
 * forwarded scheme cannot hurt). Shared by proxy.ts (pages) and withApi (API routes).
 */
export function setSecurityHeaders(headers: Headers, csp: string, https: boolean, requestId: string): void {
  headers.set(REQUEST_ID_HEADER, requestId);
  for (const name in staticSecurityHeaders) headers.set(name, staticSecurityHeaders[name]!);
  headers.set('Content-Security-Policy', csp);
  if (https) headers.set('Strict-Transport-Security', HSTS);
}

/** Whether the request came over https, directly or through a proxy that says so. */
export function cameOverHttps(url: { protocol: string }, headers: Pick<Headers, 'get'>): boolean {
  return url.protocol === 'https:' || headers.get('x-forwarded-proto') === 'https';
}
