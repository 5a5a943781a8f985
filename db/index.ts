import 'server-only';
import { Kysely, PostgresDialect } from 'kysely';
import { pg } from '@/db/pg-types';
import { env } from '@/lib/env';
import type { DB } from '@/db/schema.gen';

export type Database = DB;

const globalForDb = globalThis as unknown as { rimelineDb?: Kysely<DB> };

function createDb(): Kysely<DB> {
  const pool = new pg.Pool({ connectionString: env.DATABASE_URL, max: env.DATABASE_POOL_MAX });
  return new Kysely<DB>({ dialect: new PostgresDialect({ pool }) });
}

// Cached on globalThis so dev hot reload reuses one pool.
export const db: Kysely<DB> = globalForDb.rimelineDb ?? createDb();
if (env.NODE_ENV !== 'production') globalForDb.rimelineDb = db;
