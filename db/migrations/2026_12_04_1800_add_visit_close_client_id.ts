import type { Kysely } from 'kysely';

// A close made without signal is sent again until the server answers; it carries an id made on the
// phone, so a repeat of a close that already went through returns the closed visit instead of a
// conflict. (Entries and photo uploads have theirs already: client_entry_id, upload_key.)

export async function up(db: Kysely<any>): Promise<void> {
  await db.schema.alterTable('visits').addColumn('close_client_id', 'uuid').execute();
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.alterTable('visits').dropColumn('close_client_id').execute();
}
