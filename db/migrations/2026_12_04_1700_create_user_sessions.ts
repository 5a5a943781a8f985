import { sql, type Kysely } from 'kysely';

// One row per signed-in browser. The session cookie (a signed JWT) carries the row's id and every
// request's actor lookup requires the row unrevoked and unexpired, so sign-out, "sign out
// everywhere" and a changed password or role end sessions on the server, not only in the browser.
// A per-session row (rather than one version number per person) lets sign-out end just the one
// browser. The trigger ends every session of a person whose password, role, client or active state
// changes, except the session named in the transaction-local setting `rimeline.keep_session` (a
// person changing their own password stays signed in where they did it).

export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .createTable('user_sessions')
    .addColumn('id', 'uuid', (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn('user_id', 'uuid', (c) => c.notNull().references('users.id').onDelete('cascade'))
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addColumn('expires_at', 'timestamptz', (c) => c.notNull())
    .addColumn('revoked_at', 'timestamptz')
    .execute();
  await db.schema.createIndex('user_sessions_user_live_idx').on('user_sessions').column('user_id').where(sql.ref('revoked_at'), 'is', null).execute();
  await sql`
    create function end_sessions_on_credential_change() returns trigger language plpgsql as $$
    begin
      update user_sessions set revoked_at = now()
       where user_id = new.id and revoked_at is null
         and id::text is distinct from nullif(current_setting('rimeline.keep_session', true), '');
      return new;
    end $$`.execute(db);
  await sql`
    create trigger users_end_sessions after update on users for each row
    when (old.password_hash is distinct from new.password_hash or old.role is distinct from new.role
       or old.client_id is distinct from new.client_id or old.deactivated_at is distinct from new.deactivated_at)
    execute function end_sessions_on_credential_change()`.execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  await sql`drop trigger if exists users_end_sessions on users`.execute(db);
  await sql`drop function if exists end_sessions_on_credential_change()`.execute(db);
  await db.schema.dropTable('user_sessions').ifExists().execute();
}
