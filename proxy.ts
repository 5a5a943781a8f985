import { NextResponse, type NextRequest } from 'next/server';
import { badQuery } from '@/lib/api/query-check';
import { API_CSP, cameOverHttps, pageCsp, setSecurityHeaders } from '@/lib/api/security-headers';
import { REQUEST_ID_HEADER, requestIdFrom } from '@/lib/api/request-id';

// Runs before every page and the API routes withApi does not wrap (the auth routes, health; see
// `config` below). Access is never decided here: every page, handler and action checks itself. It
// - refuses a query string with a NUL, broken Unicode or a malformed callbackUrl (400) before a
//   page parses it;
// - sets the security headers, with a fresh CSP nonce per page request (Next puts the nonce on
//   its own scripts when it finds it in the request's CSP header);
// - passes the requested path on to server layouts so a signed-out visitor returns to it;
// - gives every request an id (a well-formed incoming x-request-id is kept), passed on to the
//   handlers and pages and returned in the response's x-request-id header.
// The API routes withApi wraps do the same checks, id and headers in the wrapper itself
// (lib/api/handler.ts): a proxy pass costs every request a second round through the framework,
// and buffers every request body (photos included) before the route may read it.

function secure(res: NextResponse, req: NextRequest, csp: string, requestId: string): NextResponse {
  setSecurityHeaders(res.headers, csp, cameOverHttps(req.nextUrl, req.headers), requestId);
  return res;
}

export function proxy(req: NextRequest) {
  const isApi = req.nextUrl.pathname.startsWith('/api/');
  const requestId = requestIdFrom(req.headers);
  const problem = badQuery(req.nextUrl.search, req.nextUrl.pathname);
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

// Everything but the hashed static files and the API routes; the two API routes that are not
// wrapped by withApi (next-auth's own handler, the health check) still come through here, and an
// unknown API path is answered by app/api/[...path] through the same wrapper as the rest.
export const config = {
  matcher: ['/((?!_next/static|_next/image|favicon.ico|api/).*)', '/api/auth/:path*', '/api/health'],
};
