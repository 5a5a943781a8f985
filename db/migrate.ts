// Runs Kysely's Migrator: `tsx db/migrate.ts latest | down | up | reset`.
import { promises as fs } from 'node:fs';
import path from 'node:path';
import { FileMigrationProvider, Kysely, Migrator, PostgresDialect, type MigrationProvider, type MigrationResultSet } from 'kysely';
import pg from 'pg';
import { databaseUrl } from '@/db/url';

export function createMigrator(db: Kysely<unknown>, provider?: MigrationProvider): Migrator {
  return new Migrator({
    db,
    // Work lands from parallel branches: a migration dated before one already applied still runs.
    allowUnorderedMigrations: true,
    provider: provider ?? new FileMigrationProvider({ fs, path, migrationFolder: path.join(import.meta.dirname, 'migrations') }),
  });
}

function report({ error, results }: MigrationResultSet): void {
  for (const r of results ?? []) {
    console.log(`  ${r.direction === 'Up' ? 'up  ' : 'down'} ${r.migrationName}: ${r.status}`);
  }
  if (error) {
    console.error('Migration failed:', error instanceof Error ? error.message : error);
    process.exitCode = 1;
  }
}

async function main(): Promise<void> {
  const command = process.argv[2] ?? 'latest';
  const db = new Kysely<unknown>({ dialect: new PostgresDialect({ pool: new pg.Pool({ connectionString: databaseUrl(), max: 2 }) }) });
  const migrator = createMigrator(db);
  try {
    if (command === 'latest') report(await migrator.migrateToLatest());
    else if (command === 'down') report(await migrator.migrateDown());
    else if (command === 'up') report(await migrator.migrateUp());
    else if (command === 'reset') {
      let result: MigrationResultSet;
      do {
        result = await migrator.migrateDown();
        report(result);
      } while (!result.error && (result.results?.length ?? 0) > 0);
    } else {
      console.error(`Unknown command "${command}". Use latest, up, down or reset.`);
      process.exitCode = 2;
    }
  } finally {
    await db.destroy();
  }
}

if (process.argv[1] && path.resolve(process.argv[1]) === path.resolve(import.meta.filename)) {
  await main();
}
