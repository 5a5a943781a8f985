import NextAuth from 'next-auth';
import type { NextRequest } from 'next/server';
import { errorResponse } from '@/lib/api/handler';
import { assertSameOrigin, assertValidText } from '@/lib/api/guards';
import { authOptions } from '@/lib/auth';
import { isWellFormedCallbackUrl } from '@/lib/auth/redirect';
import { AppError } from '@/lib/errors';

const handler = NextAuth(authOptions);

type Ctx = { params: Promise<{ nextauth: string[] }> };

/**
 * The auth library's routes behind the same guards as withApi: a post from another origin is a
 * 403, NUL or broken Unicode in the query or form is a 422, a malformed callbackUrl is a 400,
 * each before the library (or the database) sees the request.
 */
async function guarded(req: NextRequest, ctx: Ctx): Promise<Response> {
  try {
    assertSameOrigin(req);
    const fields: Record<string, string> = Object.fromEntries(req.nextUrl.searchParams);
    if (req.method === 'POST' && (req.headers.get('content-type') ?? '').includes('application/x-www-form-urlencoded')) {
      Object.assign(fields, Object.fromEntries(new URLSearchParams(await req.clone().text())));
    }
    assertValidText(fields);
    if (fields.callbackUrl !== undefined && !isWellFormedCallbackUrl(fields.callbackUrl)) throw new AppError('bad_request', 'The callbackUrl is not a valid address.');
  } catch (error) {
    return errorResponse(error);
  }
  return handler(req, ctx);
}

export { guarded as GET, guarded as POST };
