// Finding 6: sign-out ends the session on the server, "sign out everywhere" exists for a person
// and for an admin acting on a person, and a changed password or role ends other sessions.
import { sql } from 'kysely';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { authOptions } from '@/lib/auth/options';
import { actorForSession, endAllSessions, endSession, startSession } from '@/lib/auth/sessions';
import { changeRole } from '@/lib/users/service';
import { actorFor, createOtherCompany, createTestDb, demoEmails, resetToDemo } from '@/tests/helpers/db';

const db = createTestDb();
let techId: string;

beforeAll(async () => {
  await resetToDemo(db);
  techId = (await actorFor(db, demoEmails.technician)).id;
});
afterAll(async () => {
  await db.destroy();
});

const live = (sid: string) => actorForSession(techId, sid, db).then((a) => a !== null);

describe('server-side sessions', () => {
  it('sign-in starts a session the cookie names; sign-out ends exactly that one', async () => {
    const token = await authOptions.callbacks!.jwt!({ token: {}, user: { id: techId, email: demoEmails.technician }, account: null } as never);
    const sid = token.sid as string;
    expect(sid).toMatch(/^[0-9a-f-]{36}$/);
    const other = await startSession(techId, 3600, db);
    expect(await live(sid)).toBe(true);
    // A copied cookie of the signed-out session no longer works; the other browser stays in.
    await authOptions.events!.signOut!({ token, session: null as never });
    expect(await live(sid)).toBe(false);
    expect(await live(other)).toBe(true);
    await endSession(other, db);
  });

  it('a session expires on the server too, and a made-up session id is no sign-in', async () => {
    const sid = await startSession(techId, 3600, db);
    await db.updateTable('user_sessions').set({ expires_at: sql`now() - interval '1 second'` }).where('id', '=', sid).execute();
    expect(await live(sid)).toBe(false);
    await endSession(sid, db);
    expect(await live('00000000-0000-4000-8000-000000000000')).toBe(false);
    expect(await actorForSession(techId, 'not-a-uuid', db)).toBeNull();
  });

  it('sign out everywhere: a person for themselves, an admin for a person; nobody else', async () => {
    const tech = await actorFor(db, demoEmails.technician);
    const a = await startSession(techId, 3600, db);
    const b = await startSession(techId, 3600, db);
    expect(await endAllSessions(tech, techId, db)).toBe(2);
    expect(await live(a)).toBe(false);
    expect(await live(b)).toBe(false);

    const c = await startSession(techId, 3600, db);
    const office = await actorFor(db, demoEmails.office);
    const admin = await actorFor(db, demoEmails.admin);
    await expect(endAllSessions(office, techId, db)).rejects.toMatchObject({ code: 'forbidden' });
    expect(await live(c)).toBe(true);
    expect(await endAllSessions(admin, techId, db)).toBe(1);
    expect(await live(c)).toBe(false);
    const audit = await db.selectFrom('audit_events').select('action').where('entity_id', '=', techId).where('action', '=', 'sessions_end').execute();
    expect(audit).toHaveLength(2);

    const other = await createOtherCompany(db);
    const stranger = await actorFor(db, other.adminEmail);
    await expect(endAllSessions(stranger, techId, db)).rejects.toMatchObject({ code: 'not_found' });
  });

  it('a role change ends the person’s sessions at once', async () => {
    const sid = await startSession(techId, 3600, db);
    const admin = await actorFor(db, demoEmails.admin);
    await changeRole(admin, techId, { role: 'office' }, db);
    expect(await live(sid)).toBe(false);
  });

  it('a password change ends every other session, keeping the one it was made in', async () => {
    const here = await startSession(techId, 3600, db);
    const elsewhere = await startSession(techId, 3600, db);
    await db.transaction().execute(async (trx) => {
      await sql`select set_config('rimeline.keep_session', ${here}, true)`.execute(trx);
      await trx.updateTable('users').set({ password_hash: 'changed' }).where('id', '=', techId).execute();
    });
    expect(await live(here)).toBe(true);
    expect(await live(elsewhere)).toBe(false);
    // The setting was transaction-local: a later change ends the kept session too.
    await db.updateTable('users').set({ password_hash: 'changed again' }).where('id', '=', techId).execute();
    expect(await live(here)).toBe(false);
  });
});
