import 'server-only';
import type { NextRequest } from 'next/server';
import { z, type ZodType } from 'zod';
import { requireActor, type Actor } from '@/lib/auth';
import { assertCan } from '@/lib/auth/access';
import type { Permission } from '@/lib/auth/permissions';
import { isCalcError } from '@/lib/calc/errors';
import { zodIssues } from '@/lib/api/issues';
import { formFields, isMultipart, readMultipart } from '@/lib/api/multipart';
import { assertSameOrigin, assertValidText } from '@/lib/api/guards';
import { AppError } from '@/lib/errors';
import { logger } from '@/lib/logger';
import { requestIdFrom } from '@/lib/api/request-id';
import { badQuery } from '@/lib/api/query-check';
import { API_CSP, cameOverHttps, setSecurityHeaders } from '@/lib/api/security-headers';
import { runWithRequestId } from '@/lib/request-context';
import { BODY_BYTES_HEADER } from '@/lib/http/small-answers';

type RouteContext = { params: Promise<Record<string, string | string[] | undefined>> };

interface Options<P, Q, B> {
  /** Checked before the body is read, so a refused role gets 403 rather than a validation error. */
  permission?: Permission;
  params?: ZodType<P>;
  query?: ZodType<Q>;
  body?: ZodType<B>;
  /** Status on success when the handler returns a value (201 for creates). */
  status?: 200 | 201 | 202;
  maxBodyBytes?: number;
  /**
   * Also take the body as multipart/form-data (for a record sent with a file): its text fields
   * are validated by `body` as JSON would be, and the form reaches the handler for its files.
   */
  multipart?: { maxBytes: number; tooLarge: () => AppError };
}

interface HandlerInput<P, Q, B> {
  actor: Actor;
  params: P;
  query: Q;
  body: B;
  /** The multipart form when the body came as one (see `multipart`), else null. */
  form: FormData | null;
  req: NextRequest;
}

const DEFAULT_MAX_BODY = 1_000_000;

function validationError(error: z.ZodError): AppError {
  return new AppError('validation_failed', 'Some fields need attention.', zodIssues(error));
}

function queryObject(url: URL): Record<string, string | string[]> {
  const out: Record<string, string | string[]> = {};
  for (const key of new Set(url.searchParams.keys())) {
    const all = url.searchParams.getAll(key);
    out[key] = all.length > 1 ? all : (all[0] ?? '');
  }
  return out;
}

async function readJson(req: NextRequest, maxBytes: number): Promise<unknown> {
  const length = Number(req.headers.get('content-length') ?? '0');
  if (length > maxBytes) throw new AppError('payload_too_large', `The request body is larger than ${maxBytes} bytes.`);
  const type = req.headers.get('content-type') ?? '';
  if (!type.toLowerCase().startsWith('application/json')) {
    throw new AppError('unsupported_media_type', 'Send the request body as application/json.');
  }
  const text = await req.text();
  if (Buffer.byteLength(text) > maxBytes) throw new AppError('payload_too_large', `The request body is larger than ${maxBytes} bytes.`);
  try {
    return JSON.parse(text);
  } catch {
    throw new AppError('bad_request', 'The request body is not valid JSON.');
  }
}

/** Sets the id and security headers on a response; a response with fixed headers (a fetched one) is copied. */
function withApiHeaders(res: Response, https: boolean, requestId: string): Response {
  try {
    setSecurityHeaders(res.headers, API_CSP, https, requestId);
    return res;
  } catch {
    const copy = new Response(res.body, res);
    setSecurityHeaders(copy.headers, API_CSP, https, requestId);
    return copy;
  }
}

/**
 * What proxy.ts does for a page, done here for the API routes (they skip the proxy, see its
 * `config`): the address check (400; with `textChecked` a NUL in the query is left to the
 * handler's own 422), the request id (kept when well-formed, else new; on the log
 * lines written meanwhile and on the response) and the security headers, on every answer.
 */
export function apiRoute<C>(handle: (req: NextRequest, ctx: C) => Promise<Response>, textChecked = false) {
  return async (req: NextRequest, ctx: C): Promise<Response> => {
    const requestId = requestIdFrom(req.headers);
    const problem = badQuery(req.nextUrl.search, req.nextUrl.pathname, textChecked);
    const res = problem ? errorResponse(new AppError('bad_request', problem)) : await runWithRequestId(requestId, () => handle(req, ctx));
    return withApiHeaders(res, cameOverHttps(req.nextUrl, req.headers), requestId);
  };
}

/**
 * A JSON answer that states its length, so server.ts sends one under 1 kB uncompressed: starting a
 * compressor for a few hundred bytes cost about half a millisecond a request.
 */
export function jsonResponse(body: unknown, status: number, headers?: Record<string, string>): Response {
  const text = JSON.stringify(body);
  return new Response(text, {
    status,
    // Not Content-Length, which Next drops; server.ts turns this into it (lib/http/small-answers.ts).
    headers: { ...headers, 'Content-Type': 'application/json', [BODY_BYTES_HEADER]: String(Buffer.byteLength(text)) },
  });
}

/** Maps any thrown value to the one error shape; unknown errors are logged and hidden. */
export function errorResponse(error: unknown): Response {
  const appError = toAppError(error);
  if (appError.code === 'internal') logger.error({ err: error }, 'unhandled error in route handler');
  return jsonResponse(appError.toBody(), appError.status);
}

// A lost or refused connection (a database restart, a failover) is temporary: 503 tells the
// caller to try again, where 500 would say something is broken. SQLSTATE class 08 is "connection
// exception", 57P01–57P03 the server shutting down or starting (PostgreSQL docs, Appendix A).
const CONNECTION_LOST_CODES = new Set(['ECONNREFUSED', 'ECONNRESET', 'EPIPE', 'ETIMEDOUT']);
function isConnectionLost(error: unknown): boolean {
  const e = error as { code?: unknown; message?: unknown };
  if (typeof e?.code === 'string' && (CONNECTION_LOST_CODES.has(e.code) || e.code.startsWith('08') || /^57P0[123]$/.test(e.code))) return true;
  // node-postgres reports a dropped connection without a code: during a query, or on the next
  // query (a rollback, say) of a client whose connection broke while checked out.
  return typeof e?.message === 'string' && /^(Connection terminated|Client has encountered a connection error|Client was closed)/.test(e.message);
}

export function toAppError(error: unknown): AppError {
  if (error instanceof AppError) return error;
  if (error instanceof z.ZodError) return validationError(error);
  // Calculation input and range errors (unknown refrigerant, above the critical point, …) are the caller's to fix.
  if (isCalcError(error)) return new AppError('validation_failed', error.message, [{ path: error.field ?? '', message: error.message }]);
  if (isConnectionLost(error)) return new AppError('unavailable', 'A service Rimeline needs cannot be reached right now. Try again in a moment.');
  const pg = error as { code?: unknown; constraint?: unknown };
  if (typeof pg?.code === 'string') {
    if (pg.code === '23505') return new AppError('conflict', 'A record with these details already exists.');
    if (pg.code === '23503') return new AppError('validation_failed', 'A linked record does not exist or is still in use.');
    if (pg.code === '23514') return new AppError('validation_failed', 'A value is outside what this record allows.');
    if (pg.code === '22P02' || pg.code === '22003' || pg.code === '22007') return new AppError('bad_request', 'A value has the wrong format.');
  }
  return new AppError('internal');
}

/**
 * Wraps every route handler export: session (401), params (404 when malformed), query and body
 * (400/413/415/422) parsing, one service call, and error mapping. Services do the authorization.
 */
export function withApi<P = Record<string, never>, Q = Record<string, never>, B = undefined, R = unknown>(
  options: Options<P, Q, B>,
  handler: (input: HandlerInput<P, Q, B>) => Promise<R>,
) {
  // NUL in the query is refused below (assertValidText), with the field named.
  const route = apiRoute<RouteContext>((req, ctx) => handle(req, ctx), true);
  const handle = async (req: NextRequest, ctx: RouteContext): Promise<Response> => {
    try {
      // Before any lookup: a forged cross-origin request learns nothing, not even 401 or 404.
      assertSameOrigin(req);
      const actor = await requireActor();
      if (options.permission) assertCan(actor, options.permission);
      const rawParams = (await ctx?.params) ?? {};
      let params = rawParams as unknown as P;
      if (options.params) {
        const parsed = options.params.safeParse(rawParams);
        // A malformed id cannot name anything the caller may see.
        if (!parsed.success) throw new AppError('not_found');
        params = parsed.data;
      }
      let query = {} as Q;
      const rawQuery = queryObject(req.nextUrl);
      assertValidText(rawQuery);
      if (options.query) {
        const parsed = options.query.safeParse(rawQuery);
        if (!parsed.success) throw validationError(parsed.error);
        query = parsed.data;
      }
      let body = undefined as B;
      let form: FormData | null = null;
      if (options.body) {
        if (options.multipart && isMultipart(req)) form = await readMultipart(req, options.multipart.maxBytes, options.multipart.tooLarge);
        const raw = form ? formFields(form) : await readJson(req, options.maxBodyBytes ?? DEFAULT_MAX_BODY);
        assertValidText(raw);
        const parsed = options.body.safeParse(raw);
        if (!parsed.success) throw validationError(parsed.error);
        body = parsed.data;
      }
      const result = await handler({ actor, params, query, body, form, req });
      if (result instanceof Response) return result;
      if (result === undefined || result === null) return new Response(null, { status: 204 });
      return jsonResponse(result, options.status ?? 200);
    } catch (error) {
      return errorResponse(error);
    }
  };
  // The schemas stay readable on the export so tests (the route fuzzer) can mutate each route's own.
  return Object.assign(route, { apiOptions: options as Options<unknown, unknown, unknown> });
}
