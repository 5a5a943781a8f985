import type { Kysely, Transaction } from 'kysely';
import type { DB } from '@/db/schema.gen';

/** The database or an open transaction: every service and query builder takes either. */
export type Db = Kysely<DB> | Transaction<DB>;
