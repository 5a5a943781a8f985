import 'server-only';
import { Kysely, PostgresDialect } from 'kysely';
import { pg } from '@/db/pg-types';
import { env } from '@/lib/env';
import { logger } from '@/lib/logger';
import type { DB } from '@/db/schema.gen';

export type Database = DB;

const globalForDb = globalThis as unknown as { rimelineDb?: Kysely<DB> };

/**
 * An idle pooled connection that the server drops (a restart, a failover) is reported as an
 * 'error' event on the pool; without a listener Node treats it as uncaught. The pool discards
 * such clients itself, so the event is only logged: once per outage, not once per connection,
 * with a note when a new connection succeeds again.
 */
export function watchPool(pool: InstanceType<typeof pg.Pool>, log: Pick<typeof logger, 'error' | 'info'> = logger): void {
  let failing = false;
  const lost = (err: Error) => {
    if (failing) return;
    failing = true;
    log.error({ err: err.message }, 'database connection lost; the pool reconnects on the next query');
  };
  pool.on('error', lost);
  pool.on('connect', (client?: InstanceType<typeof pg.Client>) => {
    // The pool listens only while a client is idle: one lost while checked out (between the
    // queries of a transaction) would otherwise be an uncaught error. Its query fails by itself.
    client?.on('error', lost);
    if (!failing) return;
    failing = false;
    log.info('database connection restored');
  });
}

function createDb(): Kysely<DB> {
  const pool = new pg.Pool({ connectionString: env.DATABASE_URL, max: env.DATABASE_POOL_MAX });
  watchPool(pool);
  return new Kysely<DB>({ dialect: new PostgresDialect({ pool }) });
}

// Cached on globalThis so dev hot reload reuses one pool.
export const db: Kysely<DB> = globalForDb.rimelineDb ?? createDb();
if (env.NODE_ENV !== 'production') globalForDb.rimelineDb = db;
