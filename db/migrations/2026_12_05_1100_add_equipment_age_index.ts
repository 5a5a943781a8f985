import { sql, type Kysely } from 'kysely';

// The owner home's oldest-units chart: within one equipment type, oldest for its expected life is
// earliest installed, so each type's oldest units are the first entries of this index and the
// chart merges a few per type instead of sorting every unit of the company.

export async function up(db: Kysely<any>): Promise<void> {
  await sql`create index equipment_type_age_idx on equipment (company_id, type, installed_on, name) where deleted_at is null and installed_on is not null`.execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  await sql`drop index if exists equipment_type_age_idx`.execute(db);
}
