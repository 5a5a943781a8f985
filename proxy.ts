import { NextResponse, type NextRequest } from 'next/server';

// Only passes the requested path on to server layouts so a signed-out visitor returns to it
// after sign-in. Access is never decided here: every page, handler and action checks itself.
export function proxy(req: NextRequest) {
  const headers = new Headers(req.headers);
  headers.set('x-rimeline-path', `${req.nextUrl.pathname}${req.nextUrl.search}`);
  return NextResponse.next({ request: { headers } });
}

export const config = { matcher: ['/((?!api|_next|favicon.ico).*)'] };
