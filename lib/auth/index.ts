import 'server-only';
import { redirect } from 'next/navigation';
import { cache } from 'react';
import { AppError } from '@/lib/errors';
import type { Actor } from '@/lib/auth/actor';
import { authOptions } from '@/lib/auth/options';
import { roleCan, type Permission } from '@/lib/auth/permissions';
import { requestSessionClaims } from '@/lib/auth/session-token';
import { cachedSessionActor } from '@/lib/auth/actor-cache';
import { liveSession } from '@/lib/auth/sessions';

export { authOptions };
export type { Actor };

/**
 * The signed-in, active user, or null; once per request. From memory while the database's session
 * notices are heard (lib/auth/actor-cache.ts), else read from the database.
 */
export const getActor = cache(async (): Promise<Actor | null> => {
  // The session cookie read directly (lib/auth/session-token.ts), not through getServerSession.
  const claims = await requestSessionClaims();
  // A cookie without a live server-side session (signed out, ended everywhere, credentials
  // changed, or older than sessions) is no sign-in.
  if (!claims) return null;
  return cachedSessionActor(claims.userId, claims.sessionId, liveSession);
});

/** For route handlers and actions: 401 when signed out. */
export async function requireActor(): Promise<Actor> {
  const actor = await getActor();
  if (!actor) throw new AppError('unauthorized');
  return actor;
}

/** For pages and layouts: signed-out visitors go to sign-in and come back afterwards. */
export async function requirePageActor(returnTo = '/', permission?: Permission): Promise<Actor> {
  const actor = await getActor();
  if (!actor) redirect(`/sign-in?callbackUrl=${encodeURIComponent(returnTo)}`);
  if (permission && !roleCan(actor.role, permission)) redirect('/?denied=1');
  return actor;
}
