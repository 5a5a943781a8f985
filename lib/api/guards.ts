import 'server-only';
import { allowedOrigins, CROSS_ORIGIN_MESSAGE, isSameOriginRequest } from '@/lib/api/origin';
import { findInvalidText, INVALID_TEXT_MESSAGE, MAX_DEPTH, nestedDeeperThan } from '@/lib/api/text';
import { env } from '@/lib/env';
import { AppError } from '@/lib/errors';

// The request guards shared by withApi, server actions (lib/auth/action-guard.ts) and the auth routes.

export const APP_ORIGINS = allowedOrigins(env.APP_URL, env.ALLOWED_ORIGINS);

interface RequestLike {
  method: string;
  headers: { get(name: string): string | null };
}

/** 403 for a state-changing request sent by a page of another origin (see lib/api/origin.ts). */
export function assertSameOrigin(req: RequestLike): void {
  if (!isSameOriginRequest(req.method, req.headers, APP_ORIGINS)) throw new AppError('forbidden', CROSS_ORIGIN_MESSAGE);
}

/**
 * 400 for a body nested deeper than any record (it could only exhaust the server), then 422
 * naming the field when any string or key holds a NUL or a lone surrogate.
 */
export function assertValidText(value: unknown): void {
  if (nestedDeeperThan(value)) throw new AppError('bad_request', `The request body is nested more than ${MAX_DEPTH} levels deep.`);
  const path = findInvalidText(value);
  if (path !== null) throw new AppError('validation_failed', INVALID_TEXT_MESSAGE, [{ path, message: INVALID_TEXT_MESSAGE }]);
}
