import { sql, type CreateTableBuilder } from 'kysely';

// Columns that most tables of db/migrations begin or end with. Migrations are frozen in time, so
// what these add must never change: a database migrated long ago and one migrated today would
// differ. A table that needs another shape writes its columns out or gets a new helper.
// (Not in db/migrations/: the migrator takes every file there for a migration.)

/** The first two columns of a company's record: `id uuid primary key default gen_random_uuid()` and the owning company. */
export function idAndCompany<TB extends string, C extends string>(table: CreateTableBuilder<TB, C>) {
  return table
    .addColumn('id', 'uuid', (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn('company_id', 'uuid', (c) => c.notNull().references('companies.id').onDelete('restrict'));
}

/** `created_at` and `updated_at`, both set to now() when the row is made. */
export function timestamps<TB extends string, C extends string>(table: CreateTableBuilder<TB, C>) {
  return table
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addColumn('updated_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`));
}
