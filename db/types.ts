import type { Kysely, Transaction } from 'kysely';
import type { DB } from '@/db/schema.gen';

/** The database or an open transaction: every service and query builder takes either. */
export type Db = Kysely<DB> | Transaction<DB>;

/**
 * The row a query builder function yields, inferred by Kysely from its select list (one name for
 * what each service would otherwise spell out with nested ReturnTypes).
 */
export type QueryRow<F extends (...args: never[]) => { executeTakeFirstOrThrow(): Promise<unknown> }> = Awaited<
  ReturnType<ReturnType<F>['executeTakeFirstOrThrow']>
>;
