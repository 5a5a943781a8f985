// A Kysely instance for code that runs outside the app (the demo loader, tests, benchmarks), with
// the app's type parsers. The app itself uses the one instance in db/index.ts.
import { Kysely, PostgresDialect } from 'kysely';
import { pg } from '@/db/pg-types';
import type { DB } from '@/db/schema.gen';
import { databaseUrl } from '@/db/url';

export function connectDb(url: string = databaseUrl(), max = 2): Kysely<DB> {
  return new Kysely<DB>({ dialect: new PostgresDialect({ pool: new pg.Pool({ connectionString: url, max }) }) });
}
