// The signed-in person kept in memory per session (lib/auth/actor-cache.ts): a request after the
// first needs no database read, yet deactivation, a role change, sign-out from another app copy
// and a profile change reach the very next lookup, through the database's session notices. Every
// wait here is for a notice to be applied, never for time.
import { sql } from 'kysely';
import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { cachedSessionActor, closeActorCache, sessionNoticeHandled, sessionNoticesReady } from '@/lib/auth/actor-cache';
import { liveSession, startSession } from '@/lib/auth/sessions';
import { changeRole, setUserActive, updateProfile } from '@/lib/users/service';
import { actorFor, createTestDb, demoEmails, resetToDemo } from '@/tests/helpers/db';

const db = createTestDb();
let techId: string;
let reads = 0;
const load = (userId: string, sessionId: string) => {
  reads++;
  return liveSession(userId, sessionId, db);
};
const lookup = (sessionId: string) => cachedSessionActor(techId, sessionId, load);

beforeAll(async () => {
  await resetToDemo(db);
  techId = (await actorFor(db, demoEmails.technician)).id;
});
beforeEach(async () => {
  expect(await sessionNoticesReady()).toBe(true);
  reads = 0;
});
afterAll(async () => {
  await closeActorCache();
  await db.destroy();
});

describe('the actor cache', () => {
  it('reads a live session once, then answers from memory; an unknown session is read every time', async () => {
    const sid = await startSession(techId, 3600, db);
    expect(await lookup(sid)).toMatchObject({ id: techId, role: 'technician' });
    expect(await lookup(sid)).toMatchObject({ id: techId, role: 'technician' });
    expect(reads).toBe(1);
    // The token's person must be the session's: another person's id with this session is nobody.
    const office = await actorFor(db, demoEmails.office);
    expect(await cachedSessionActor(office.id, sid, load)).toBeNull();
    const made = '00000000-0000-4000-8000-000000000000';
    expect(await lookup(made)).toBeNull();
    expect(await lookup(made)).toBeNull();
    expect(reads).toBe(4);
  });

  it('a deactivated person loses access on the next lookup, and a role change is read afresh', async () => {
    const admin = await actorFor(db, demoEmails.admin);
    const sid = await startSession(techId, 3600, db);
    expect(await lookup(sid)).not.toBeNull();
    const heard = sessionNoticeHandled(`u:${techId}`);
    await setUserActive(admin, techId, false, db);
    await heard;
    expect(await lookup(sid)).toBeNull();
    let back = sessionNoticeHandled(`u:${techId}`);
    await setUserActive(admin, techId, true, db);
    await back;
    // Reactivation does not bring old sessions back (the credential trigger ended them).
    expect(await lookup(sid)).toBeNull();

    const next = await startSession(techId, 3600, db);
    expect(await lookup(next)).toMatchObject({ role: 'technician' });
    const roleHeard = sessionNoticeHandled(`u:${techId}`);
    await changeRole(admin, techId, { role: 'office' }, db);
    await roleHeard;
    expect(await lookup(next)).toBeNull();
    const after = await startSession(techId, 3600, db);
    expect(await lookup(after)).toMatchObject({ role: 'office' });
    back = sessionNoticeHandled(`u:${techId}`);
    await changeRole(admin, techId, { role: 'technician' }, db);
    await back;
  });

  it('a session ended by another app copy (no local call) is forgotten through its notice alone', async () => {
    const sid = await startSession(techId, 3600, db);
    expect(await lookup(sid)).not.toBeNull();
    const heard = sessionNoticeHandled(`s:${sid}`);
    await db.updateTable('user_sessions').set({ revoked_at: sql`now()` }).where('id', '=', sid).execute();
    await heard;
    expect(await lookup(sid)).toBeNull();
  });

  it('a name or unit change reaches the next lookup', async () => {
    const sid = await startSession(techId, 3600, db);
    const tech = await lookup(sid);
    expect(tech?.units).toBe('imperial');
    const heard = sessionNoticeHandled(`u:${techId}`);
    await updateProfile(tech!, { units: 'metric', name: 'Renamed Technician' }, db);
    await heard;
    expect(await lookup(sid)).toMatchObject({ units: 'metric', name: 'Renamed Technician' });
    const back = sessionNoticeHandled(`u:${techId}`);
    await updateProfile(tech!, { units: 'imperial', name: tech!.name }, db);
    await back;
  });

  it('an answer read while a notice arrives is used once but not kept', async () => {
    const sid = await startSession(techId, 3600, db);
    // The read sees the session live; before it returns, the session ends and its notice is applied.
    const racing = async (userId: string, sessionId: string) => {
      const found = await liveSession(userId, sessionId, db);
      const heard = sessionNoticeHandled(`s:${sid}`);
      await db.updateTable('user_sessions').set({ revoked_at: sql`now()` }).where('id', '=', sid).execute();
      await heard;
      return found;
    };
    expect(await cachedSessionActor(techId, sid, racing)).not.toBeNull();
    expect(await lookup(sid)).toBeNull();
  });

  it('when the listening connection is lost, everything is forgotten: a change made meanwhile is not missed', async () => {
    const sid = await startSession(techId, 3600, db);
    expect(await lookup(sid)).not.toBeNull();
    const lost = sessionNoticeHandled('down');
    await sql`select pg_terminate_backend(pid) from pg_stat_activity where query = 'listen rimeline_sessions' and datname = current_database()`.execute(db);
    await lost;
    // Nobody hears this one.
    await db.updateTable('user_sessions').set({ revoked_at: sql`now()` }).where('id', '=', sid).execute();
    expect(await lookup(sid)).toBeNull();
    // And it comes back.
    expect(await sessionNoticesReady()).toBe(true);
    const again = await startSession(techId, 3600, db);
    reads = 0;
    await lookup(again);
    await lookup(again);
    expect(reads).toBe(1);
  });
});
