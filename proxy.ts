import { NextResponse, type NextRequest } from 'next/server';
import { API_CSP, HSTS, pageCsp, staticSecurityHeaders } from '@/lib/api/security-headers';
import { REQUEST_ID_HEADER, requestIdFrom } from '@/lib/api/request-id';
import { isValidText } from '@/lib/api/text';
import { isWellFormedCallbackUrl } from '@/lib/auth/redirect';

// Runs before every page and route (not the hashed static files). Access is never decided here:
// every page, handler and action checks itself. It
// - refuses a query string with a NUL, broken Unicode or a malformed callbackUrl (400) before a
//   page parses it;
// - sets the security headers, with a fresh CSP nonce per page request (Next puts the nonce on
//   its own scripts when it finds it in the request's CSP header);
// - passes the requested path on to server layouts so a signed-out visitor returns to it;
// - gives every request an id (a well-formed incoming x-request-id is kept), passed on to the
//   handlers and pages and returned in the response's x-request-id header.

function badQuery(req: NextRequest): string | null {
  let pairs: [string, string][];
  try {
    // searchParams replaces bad percent-escapes silently; decode by hand to notice them.
    pairs = req.nextUrl.search
      .slice(1)
      .split('&')
      .filter(Boolean)
      .map((part) => {
        const [k, ...v] = part.split('=');
        return [decodeURIComponent(k!.replace(/\+/g, ' ')), decodeURIComponent(v.join('=').replace(/\+/g, ' '))];
      });
  } catch {
    return 'The address has a malformed percent-escape.';
  }
  for (const [key, value] of pairs) {
    if (!isValidText(key) || !isValidText(value)) return 'The address contains a NUL character or broken Unicode.';
    if (key === 'callbackUrl' && !isWellFormedCallbackUrl(value)) return 'The callbackUrl is not a valid address.';
  }
  if (!isValidText(safeDecode(req.nextUrl.pathname))) return 'The address contains a NUL character or broken Unicode.';
  return null;
}

function safeDecode(value: string): string {
  try {
    return decodeURIComponent(value);
  } catch {
    return '\u0000';
  }
}

function secure(res: NextResponse, req: NextRequest, csp: string, requestId: string): NextResponse {
  res.headers.set(REQUEST_ID_HEADER, requestId);
  for (const [name, value] of Object.entries(staticSecurityHeaders)) res.headers.set(name, value);
  res.headers.set('Content-Security-Policy', csp);
  // Browsers ignore HSTS over plain HTTP, so trusting the forwarded scheme here cannot hurt.
  if (req.nextUrl.protocol === 'https:' || req.headers.get('x-forwarded-proto') === 'https') res.headers.set('Strict-Transport-Security', HSTS);
  return res;
}

export function proxy(req: NextRequest) {
  const isApi = req.nextUrl.pathname.startsWith('/api/');
  const requestId = requestIdFrom(req.headers);
  const problem = badQuery(req);
  if (problem) {
    const res = isApi
      ? NextResponse.json({ error: { code: 'bad_request', message: problem } }, { status: 400 })
      : new NextResponse(problem, { status: 400, headers: { 'content-type': 'text/plain; charset=utf-8' } });
    return secure(res, req, API_CSP, requestId);
  }
  const headers = new Headers(req.headers);
  headers.set(REQUEST_ID_HEADER, requestId);
  if (isApi) return secure(NextResponse.next({ request: { headers } }), req, API_CSP, requestId);

  const nonce = Buffer.from(crypto.randomUUID()).toString('base64');
  const csp = pageCsp(nonce, process.env.NODE_ENV === 'development');
  headers.set('x-rimeline-path', `${req.nextUrl.pathname}${req.nextUrl.search}`);
  headers.set('x-nonce', nonce);
  headers.set('Content-Security-Policy', csp);
  return secure(NextResponse.next({ request: { headers } }), req, csp, requestId);
}

export const config = { matcher: ['/((?!_next/static|_next/image|favicon.ico).*)'] };
