// Invitations by e-mail (through the outbox to the real local mail catcher), role changes,
// deactivation, and the guard that keeps one admin.
import { afterAll, beforeEach, describe, expect, it } from 'vitest';
import { verifyPassword } from '@/lib/auth/password';
import { deliverDueMail } from '@/lib/mail/outbox';
import { acceptInvitation, changeRole, findOpenInvitation, inviteUser, setUserActive } from '@/lib/users/service';
import { actorFor, createTestDb, demoEmails, resetToDemo } from '@/tests/helpers/db';
import { clearMail, firstLink, waitForMail } from '@/tests/helpers/mail';

const db = createTestDb();

beforeEach(async () => {
  await resetToDemo(db);
  await clearMail();
});
afterAll(async () => {
  await db.destroy();
});

describe('invitations', () => {
  it('an invitation e-mail arrives with a working link, and accepting creates the user', async () => {
    const admin = await actorFor(db, demoEmails.admin);
    await inviteUser(admin, { email: 'new.tech@example.test', name: 'Rhea Calloway', role: 'technician' });
    await deliverDueMail();
    const mail = await waitForMail('new.tech@example.test');
    expect(mail.subject).toBe('Ada Kestrel invited you to Brackenfield Refrigeration Service on Rimeline');
    const link = firstLink(mail.text ?? '', '/invitation/');
    const token = link.split('/invitation/')[1]!;
    expect(await findOpenInvitation(token)).toMatchObject({ email: 'new.tech@example.test', role: 'technician' });

    await acceptInvitation({ token, password: 'cold-room-42!', confirm: 'cold-room-42!' });
    const user = await db.selectFrom('users').selectAll().where('email', '=', 'new.tech@example.test').executeTakeFirstOrThrow();
    expect(user.role).toBe('technician');
    expect(await verifyPassword('cold-room-42!', user.password_hash!)).toBe(true);
    // The link works once.
    await expect(acceptInvitation({ token, password: 'another-pass-1', confirm: 'another-pass-1' })).rejects.toMatchObject({ code: 'not_found' });
  });

  it('an owner invitation needs a client, and an address already in use is a conflict', async () => {
    const admin = await actorFor(db, demoEmails.admin);
    await expect(inviteUser(admin, { email: demoEmails.office, name: 'Dup', role: 'office' })).rejects.toMatchObject({ code: 'conflict' });
    const { inviteUserSchema } = await import('@/lib/users/schemas');
    expect(inviteUserSchema.safeParse({ email: 'o@example.test', name: 'O', role: 'client' }).success).toBe(false);
    expect(await db.selectFrom('invitations').select('id').execute()).toHaveLength(0);
  });

  it('mail queued while the server is down stays queued and is delivered once later', async () => {
    const admin = await actorFor(db, demoEmails.admin);
    await inviteUser(admin, { email: 'queued@example.test', name: 'Queued Person', role: 'office' });
    const row = await db.selectFrom('mail_outbox').selectAll().where('kind', '=', 'invitation').executeTakeFirstOrThrow();
    expect(row.status === 'pending' || row.status === 'sent').toBe(true);
    await deliverDueMail();
    await deliverDueMail();
    await waitForMail('queued@example.test');
    const { mailTo } = await import('@/tests/helpers/mail');
    expect(await mailTo('queued@example.test')).toHaveLength(1);
    const after = await db.selectFrom('mail_outbox').selectAll().where('id', '=', row.id).executeTakeFirstOrThrow();
    expect(after.status).toBe('sent');
  });
});

describe('roles and deactivation', () => {
  it('changing a role takes effect and is audited', async () => {
    const admin = await actorFor(db, demoEmails.admin);
    const tech = await actorFor(db, demoEmails.technician);
    await changeRole(admin, tech.id, { role: 'office', clientId: null });
    expect((await actorFor(db, demoEmails.technician)).role).toBe('office');
    const audit = await db.selectFrom('audit_events').selectAll().where('entity_id', '=', tech.id).where('action', '=', 'role_change').executeTakeFirstOrThrow();
    expect(audit.actor_id).toBe(admin.id);
  });

  it('the last active admin cannot be demoted or deactivated', async () => {
    const admin = await actorFor(db, demoEmails.admin);
    await expect(changeRole(admin, admin.id, { role: 'office', clientId: null })).rejects.toMatchObject({ code: 'conflict' });
    await expect(setUserActive(admin, admin.id, false)).rejects.toMatchObject({ code: 'conflict' });
  });

  it('a deactivated user can no longer be resolved as a signed-in actor', async () => {
    const admin = await actorFor(db, demoEmails.admin);
    const office = await actorFor(db, demoEmails.office);
    await setUserActive(admin, office.id, false);
    const row = await db.selectFrom('users').select('deactivated_at').where('id', '=', office.id).executeTakeFirstOrThrow();
    expect(row.deactivated_at).not.toBeNull();
  });
});
