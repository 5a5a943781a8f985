import { sql, type Kysely } from 'kysely';

// Closed visits by site and start: each site's last closed visit (the owner home's site cards) is
// one index entry, and an owner's visibility test on an entry (its visit closed, on their client's
// site) and the visits-per-month chart read only the closed visits of the sites asked for.

export async function up(db: Kysely<any>): Promise<void> {
  await sql`create index visits_closed_site_idx on visits (site_id, started_at) where status = 'closed'`.execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  await sql`drop index if exists visits_closed_site_idx`.execute(db);
}
