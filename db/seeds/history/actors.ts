// The demo's people as the services see them (the same Actor the sign-in builds from a user row).
import type { Kysely } from 'kysely';
import type { DB } from '@/db/schema.gen';
import type { Actor } from '@/lib/auth/actor';
import type { Role } from '@/lib/auth/permissions';

export async function loadActor(db: Kysely<DB>, email: string): Promise<Actor> {
  const row = await db.selectFrom('users').selectAll().where('email', '=', email).executeTakeFirstOrThrow();
  return {
    id: row.id,
    companyId: row.company_id,
    role: row.role as Role,
    clientId: row.client_id,
    name: row.name,
    email: row.email,
    units: row.units as Actor['units'],
    metricPressure: row.metric_pressure as Actor['metricPressure'],
  };
}
