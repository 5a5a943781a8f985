import 'server-only';
import { sql } from 'kysely';
import { db as defaultDb } from '@/db';
import { siteVisibleTo } from '@/lib/auth/scope';
import type { Actor } from '@/lib/auth/actor';

export interface HomeCounts {
  clients: number;
  sites: number;
  areas: number;
  activeUsers: number;
  openInvitations: number;
}

/** Real counts only; each home shows what exists now and says plainly what does not yet. */
export async function getHomeCounts(actor: Actor, db = defaultDb): Promise<HomeCounts> {
  const [sites, areas, clients, users] = await Promise.all([
    db.selectFrom('sites').where(siteVisibleTo(actor)).where('sites.archived_at', 'is', null).select((eb) => eb.fn.countAll<number>().as('n')).executeTakeFirstOrThrow(),
    db
      .selectFrom('areas')
      .innerJoin('sites', 'sites.id', 'areas.site_id')
      .where(siteVisibleTo(actor))
      .where('areas.archived_at', 'is', null)
      .where('sites.archived_at', 'is', null)
      .select((eb) => eb.fn.countAll<number>().as('n'))
      .executeTakeFirstOrThrow(),
    actor.role === 'client'
      ? Promise.resolve({ n: 1 })
      : db.selectFrom('clients').where('company_id', '=', actor.companyId).where('archived_at', 'is', null).select((eb) => eb.fn.countAll<number>().as('n')).executeTakeFirstOrThrow(),
    actor.role === 'admin'
      ? db
          .selectFrom('users')
          .where('company_id', '=', actor.companyId)
          .select([
            sql<number>`count(*) filter (where deactivated_at is null)`.as('active'),
            (eb) =>
              eb
                .selectFrom('invitations')
                .where('company_id', '=', actor.companyId)
                .where('accepted_at', 'is', null)
                .where('revoked_at', 'is', null)
                .where('expires_at', '>', sql<Date>`now()`)
                .select(eb.fn.countAll<number>().as('n'))
                .as('invites'),
          ])
          .executeTakeFirstOrThrow()
      : Promise.resolve({ active: 0, invites: 0 }),
  ]);
  return {
    clients: Number(clients.n),
    sites: Number(sites.n),
    areas: Number(areas.n),
    activeUsers: Number(users.active),
    openInvitations: Number(users.invites ?? 0),
  };
}
