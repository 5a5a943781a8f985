// The demo's people as the services see them (the same Actor the sign-in builds from a user row).
import type { Kysely } from 'kysely';
import type { DB } from '@/db/schema.gen';
import { actorFromRow, type Actor } from '@/lib/auth/actor';

export async function loadActor(db: Kysely<DB>, email: string): Promise<Actor> {
  const row = await db.selectFrom('users').selectAll().where('email', '=', email).executeTakeFirstOrThrow();
  return actorFromRow(row);
}
