import { sql, type Expression, type SqlBool } from 'kysely';
import type { Actor } from '@/lib/auth/actor';
import { clientScope } from '@/lib/auth/access';

/**
 * Row filter for anything reached through a site: same company, and for client users the
 * site's client must be theirs. Records outside the scope read as "not found". Written as SQL
 * so it fits any query that joins `sites`, whatever else (and whichever aliases) it joins.
 */
export function siteVisibleTo(actor: Actor) {
  const clientId = clientScope(actor);
  return (): Expression<SqlBool> =>
    clientId === null
      ? sql<SqlBool>`sites.company_id = ${actor.companyId}`
      : sql<SqlBool>`(sites.company_id = ${actor.companyId} and sites.client_id = ${clientId})`;
}

export function clientVisibleTo(actor: Actor) {
  const clientId = clientScope(actor);
  return (): Expression<SqlBool> =>
    clientId === null
      ? sql<SqlBool>`clients.company_id = ${actor.companyId}`
      : sql<SqlBool>`(clients.company_id = ${actor.companyId} and clients.id = ${clientId})`;
}

/** Escapes LIKE wildcards so user text matches literally. */
export function escapeLike(value: string): string {
  return value.replace(/[\\%_]/g, (c) => `\\${c}`);
}
