// Every migration runs up, down and up again on a real, separate PostgreSQL database.
import { Kysely, PostgresDialect, sql, type Migration } from 'kysely';
import pg from 'pg';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createMigrator } from '@/db/migrate';
import { testDatabaseUrl } from '@/tests/helpers/db';

const scratchName = 'rimeline_migration_check';
const adminUrl = testDatabaseUrl.replace(/\/[^/]+$/, '/postgres');
const scratchUrl = testDatabaseUrl.replace(/\/[^/]+$/, `/${scratchName}`);
const admin = new Kysely<unknown>({ dialect: new PostgresDialect({ pool: new pg.Pool({ connectionString: adminUrl, max: 1 }) }) });
let db: Kysely<unknown>;

async function tables(): Promise<string[]> {
  const r = await sql<{ t: string }>`select tablename as t from pg_tables where schemaname = 'public' and tablename not like 'kysely_%' order by 1`.execute(db);
  return r.rows.map((x) => x.t);
}

beforeAll(async () => {
  await sql.raw(`drop database if exists ${scratchName}`).execute(admin);
  await sql.raw(`create database ${scratchName}`).execute(admin);
  db = new Kysely<unknown>({ dialect: new PostgresDialect({ pool: new pg.Pool({ connectionString: scratchUrl, max: 2 }) }) });
});

afterAll(async () => {
  await db.destroy();
  await sql.raw(`drop database if exists ${scratchName}`).execute(admin);
  await admin.destroy();
});

describe('migrations', () => {
  it('go up, all the way down, and up again', async () => {
    // The same files the CLI runner loads, imported through vitest's transformer.
    const modules = import.meta.glob<Migration>('../../db/migrations/*.ts');
    const provider = {
      getMigrations: async () =>
        Object.fromEntries(await Promise.all(Object.entries(modules).map(async ([file, load]) => [file.split('/').pop()!.replace(/\.ts$/, ''), await load()]))),
    };
    const migrator = createMigrator(db, provider);
    const up = await migrator.migrateToLatest();
    expect(up.error).toBeUndefined();
    const all = await tables();
    expect(all).toEqual(expect.arrayContaining(['companies', 'users', 'clients', 'client_contacts', 'sites', 'areas', 'invitations', 'audit_events', 'mail_outbox']));

    let step = await migrator.migrateDown();
    while (!step.error && (step.results?.length ?? 0) > 0) step = await migrator.migrateDown();
    expect(step.error).toBeUndefined();
    expect(await tables()).toEqual([]);

    const again = await migrator.migrateToLatest();
    expect(again.error).toBeUndefined();
    expect(await tables()).toEqual(all);
  });
});
