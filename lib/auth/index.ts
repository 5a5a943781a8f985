import 'server-only';
import { getServerSession } from 'next-auth';
import { redirect } from 'next/navigation';
import { cache } from 'react';
import { db } from '@/db';
import { AppError } from '@/lib/errors';
import { actorFromRow, type Actor } from '@/lib/auth/actor';
import { authOptions } from '@/lib/auth/options';
import { roleCan, type Permission } from '@/lib/auth/permissions';

export { authOptions };
export type { Actor };

/** The signed-in, active user, or null. Read fresh from the database once per request. */
export const getActor = cache(async (): Promise<Actor | null> => {
  const session = await getServerSession(authOptions);
  const id = (session?.user as { id?: string } | undefined)?.id;
  if (!id) return null;
  const row = await db
    .selectFrom('users')
    .select(['id', 'company_id', 'role', 'client_id', 'name', 'email', 'units', 'metric_pressure'])
    .where('id', '=', id)
    .where('deactivated_at', 'is', null)
    .executeTakeFirst();
  if (!row) return null;
  return actorFromRow(row);
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
