import 'server-only';
import { getServerSession } from 'next-auth';
import { redirect } from 'next/navigation';
import { cache } from 'react';
import { AppError } from '@/lib/errors';
import type { Actor } from '@/lib/auth/actor';
import { authOptions } from '@/lib/auth/options';
import { roleCan, type Permission } from '@/lib/auth/permissions';
import { actorForSession } from '@/lib/auth/sessions';

export { authOptions };
export type { Actor };

/** The signed-in, active user, or null. Read fresh from the database once per request. */
export const getActor = cache(async (): Promise<Actor | null> => {
  const session = await getServerSession(authOptions);
  const user = session?.user as { id?: string; sid?: string } | undefined;
  // A cookie without a live server-side session (signed out, ended everywhere, credentials
  // changed, or older than sessions) is no sign-in.
  if (!user?.id || !user.sid) return null;
  return actorForSession(user.id, user.sid);
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
