import type { Expression, ExpressionBuilder, SqlBool } from 'kysely';
import type { DB } from '@/db/schema.gen';
import type { Actor } from '@/lib/auth/actor';
import { clientScope } from '@/lib/auth/access';

/**
 * Row filter for anything reached through a site: same company, and for client users the
 * site's client must be theirs. Records outside the scope read as "not found".
 */
export function siteVisibleTo(actor: Actor) {
  const clientId = clientScope(actor);
  return <TB extends keyof DB>(eb: ExpressionBuilder<DB, TB | 'sites'>): Expression<SqlBool> => {
    const sameCompany = eb(eb.ref('sites.company_id' as never), '=', actor.companyId as never);
    return clientId === null
      ? sameCompany
      : eb.and([sameCompany, eb(eb.ref('sites.client_id' as never), '=', clientId as never)]);
  };
}

export function clientVisibleTo(actor: Actor) {
  const clientId = clientScope(actor);
  return <TB extends keyof DB>(eb: ExpressionBuilder<DB, TB | 'clients'>): Expression<SqlBool> => {
    const sameCompany = eb(eb.ref('clients.company_id' as never), '=', actor.companyId as never);
    return clientId === null
      ? sameCompany
      : eb.and([sameCompany, eb(eb.ref('clients.id' as never), '=', clientId as never)]);
  };
}

/** Escapes LIKE wildcards so user text matches literally. */
export function escapeLike(value: string): string {
  return value.replace(/[\\%_]/g, (c) => `\\${c}`);
}
