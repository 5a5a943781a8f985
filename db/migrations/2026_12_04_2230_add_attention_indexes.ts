import { sql, type Kysely } from 'kysely';

// The attention list and the owner home look for a few kinds of rows among many: refrigerant
// additions of the last year, condition ratings per unit (latest two), recent no-cooling visits.
// Partial indexes hold only those rows, so the lookups stay small as the history grows.

export async function up(db: Kysely<any>): Promise<void> {
  await sql`create index entries_refrigerant_time_idx on entries (company_id, recorded_at) where kind = 'refrigerant' and voided_at is null`.execute(db);
  await sql`create index entries_condition_unit_idx on entries (equipment_id, recorded_at desc, id desc) include (visit_id, company_id) where kind = 'condition' and voided_at is null`.execute(db);
  await sql`create index visits_no_cooling_idx on visits (company_id, started_at) where reason = 'no_cooling'`.execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  await sql`drop index if exists visits_no_cooling_idx`.execute(db);
  await sql`drop index if exists entries_condition_unit_idx`.execute(db);
  await sql`drop index if exists entries_refrigerant_time_idx`.execute(db);
}
