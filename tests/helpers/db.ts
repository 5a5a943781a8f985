import { Kysely, PostgresDialect, sql } from 'kysely';
import { pg } from '@/db/pg-types';
import type { DB } from '@/db/schema.gen';
import { seedDemo } from '@/docker-free-scripts/demo/scenario';
import { actorFromRow, type Actor } from '@/lib/auth/actor';

export const testDatabaseUrl = process.env.DATABASE_URL ?? 'postgres://postgres@127.0.0.1:54339/rimeline_test';

export function createTestDb(url = testDatabaseUrl): Kysely<DB> {
  return new Kysely<DB>({ dialect: new PostgresDialect({ pool: new pg.Pool({ connectionString: url, max: 3 }) }) });
}

const migrationDataTables = ['label_layouts'];

/** Empties every app table (TRUNCATE skips the audit table's no-delete row trigger) and loads the demo. */
export async function resetToDemo(db: Kysely<DB>): Promise<void> {
  const existing = await sql<{ tablename: string }>`select tablename from pg_tables where schemaname = 'public'`.execute(db);
  const present = new Set(existing.rows.map((r) => r.tablename));
  // Reference rows that the migrations themselves insert (label layouts) stay: they are not test data.
  // One TRUNCATE of every table at once, so their order does not matter.
  const list = [...present].filter((t) => !t.startsWith('kysely_') && !migrationDataTables.includes(t));
  if (list.length === 0) throw new Error('The test database has no tables: run the migrations first (npm test does).');
  await sql.raw(`truncate ${list.map((t) => `"${t}"`).join(', ')} restart identity cascade`).execute(db);
  await seedDemo(db);
}

export async function actorFor(db: Kysely<DB>, email: string): Promise<Actor> {
  const row = await db.selectFrom('users').selectAll().where('email', '=', email).executeTakeFirstOrThrow();
  return actorFromRow(row);
}

export const demoEmails = {
  admin: 'admin@rimeline.test',
  office: 'office@rimeline.test',
  technician: 'tech@rimeline.test',
  client: 'owner@client-one.test',
  clientTwo: 'owner@client-two.test',
} as const;

export type DemoActors = Record<keyof typeof demoEmails, Actor>;

/** The demo's five people as actors; read again after every resetToDemo (ids change with a reset). */
export async function demoActors(db: Kysely<DB>): Promise<DemoActors> {
  const entries = await Promise.all(Object.entries(demoEmails).map(async ([role, email]) => [role, await actorFor(db, email)] as const));
  return Object.fromEntries(entries) as DemoActors;
}

/** A second, unrelated company for cross-tenant checks. */
export async function createOtherCompany(db: Kysely<DB>): Promise<{ companyId: string; clientId: string; siteId: string; adminEmail: string }> {
  const company = await db.insertInto('companies').values({ name: 'Other Service Co' }).returning('id').executeTakeFirstOrThrow();
  const client = await db.insertInto('clients').values({ company_id: company.id, name: 'Other Client' }).returning('id').executeTakeFirstOrThrow();
  const site = await db.insertInto('sites').values({ company_id: company.id, client_id: client.id, name: 'Other Site' }).returning('id').executeTakeFirstOrThrow();
  const adminEmail = 'admin@other.test';
  await db.insertInto('users').values({ company_id: company.id, email: adminEmail, name: 'Other Admin', role: 'admin' }).execute();
  return { companyId: company.id, clientId: client.id, siteId: site.id, adminEmail };
}
