import { sql, type Kysely } from 'kysely';

// Every app copy keeps the signed-in person per session in memory (lib/auth/actor-cache.ts) and
// must forget it the moment it stops being true. These triggers announce each such change on
// the `rimeline_sessions` channel; PostgreSQL delivers a NOTIFY when its transaction commits.
// - 's:<session id>': a session ended (sign-out, sign out everywhere, and the credential
//   trigger's revocations on a password, role, client or active-state change), its expiry moved,
//   or it was deleted;
// - 'u:<user id>': a person's row changed in a column the app's Actor carries, or was deleted.

export async function up(db: Kysely<any>): Promise<void> {
  await sql`
    create function notify_session_change() returns trigger language plpgsql as $$
    begin
      if tg_op = 'UPDATE' and old.revoked_at is not distinct from new.revoked_at
         and old.expires_at is not distinct from new.expires_at and old.user_id = new.user_id then
        return null;
      end if;
      perform pg_notify('rimeline_sessions', 's:' || old.id::text);
      return null;
    end $$`.execute(db);
  await sql`create trigger user_sessions_notify after update or delete on user_sessions for each row execute function notify_session_change()`.execute(db);
  await sql`
    create function notify_session_user_change() returns trigger language plpgsql as $$
    begin
      if tg_op = 'UPDATE' and (old.company_id, old.role, old.client_id, old.name, old.email, old.units, old.metric_pressure, old.deactivated_at)
         is not distinct from (new.company_id, new.role, new.client_id, new.name, new.email, new.units, new.metric_pressure, new.deactivated_at) then
        return null;
      end if;
      perform pg_notify('rimeline_sessions', 'u:' || old.id::text);
      return null;
    end $$`.execute(db);
  await sql`create trigger users_notify_sessions after update or delete on users for each row execute function notify_session_user_change()`.execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  await sql`drop trigger if exists users_notify_sessions on users`.execute(db);
  await sql`drop function if exists notify_session_user_change()`.execute(db);
  await sql`drop trigger if exists user_sessions_notify on user_sessions`.execute(db);
  await sql`drop function if exists notify_session_change()`.execute(db);
}
