import { sql, type Kysely } from 'kysely';

// The equipment table sorts by make, model or serial: with these the database walks an index in
// order and stops after a page, instead of sorting every match of a broad search.
const columns = ['make', 'model', 'serial'] as const;

export async function up(db: Kysely<any>): Promise<void> {
  for (const c of columns) {
    await sql
      .raw(`create index equipment_company_${c}_idx on equipment (company_id, lower(coalesce(${c}, '')), id) where deleted_at is null`)
      .execute(db);
  }
}

export async function down(db: Kysely<any>): Promise<void> {
  for (const c of columns) await sql.raw(`drop index if exists equipment_company_${c}_idx`).execute(db);
}
