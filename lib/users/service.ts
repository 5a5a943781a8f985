import 'server-only';
import { createHash, randomBytes } from 'node:crypto';
import { sql, type Kysely, type UpdateObject } from 'kysely';
import { db as defaultDb } from '@/db';
import type { DB } from '@/db/schema.gen';
import type { Db, QueryRow } from '@/db/types';
import { assertCan } from '@/lib/auth/access';
import type { Actor } from '@/lib/auth/actor';
import { hashPassword } from '@/lib/auth/password';
import { roleLabels, type Role } from '@/lib/auth/permissions';
import { auditedChange } from '@/lib/audit/change';
import { recordAudit } from '@/lib/audit/service';
import { changedColumns } from '@/lib/changed-columns';
import { getClient } from '@/lib/clients/service';
import { env } from '@/lib/env';
import { AppError, foundOr404 } from '@/lib/errors';
import { enqueueMail, kickMailDelivery } from '@/lib/mail/outbox';
import { invitationMail } from '@/lib/mail/templates';
import type { InvitationDto, UserDto } from '@/lib/users/dto';
import type { AcceptInvitationInput, ChangeRoleInput, InviteUserInput, UpdateProfileInput } from '@/lib/users/schemas';

const INVITATION_DAYS = 7;

export function hashToken(token: string): string {
  return createHash('sha256').update(token).digest('hex');
}

function userQuery(db: Db, companyId: string) {
  return db
    .selectFrom('users')
    .leftJoin('clients', 'clients.id', 'users.client_id')
    .where('users.company_id', '=', companyId)
    .select([
      'users.id',
      'users.email',
      'users.name',
      'users.role',
      'users.client_id',
      'clients.name as client_name',
      'users.deactivated_at',
      'users.last_sign_in_at',
      'users.created_at',
    ]);
}

type UserRow = QueryRow<typeof userQuery>;

function toUserDto(row: UserRow): UserDto {
  return {
    id: row.id,
    email: row.email,
    name: row.name,
    role: row.role as Role,
    clientId: row.client_id,
    clientName: row.client_name,
    active: row.deactivated_at === null,
    lastSignInAt: row.last_sign_in_at?.toISOString() ?? null,
    createdAt: row.created_at.toISOString(),
  };
}

export async function listUsers(actor: Actor, db: Db = defaultDb): Promise<UserDto[]> {
  assertCan(actor, 'users.manage');
  const rows = await userQuery(db, actor.companyId).orderBy('users.deactivated_at', 'desc').orderBy('users.name').execute();
  return rows.map(toUserDto);
}

export async function getUser(actor: Actor, id: string, db: Db = defaultDb): Promise<UserDto> {
  assertCan(actor, 'users.manage');
  const row = foundOr404(await userQuery(db, actor.companyId).where('users.id', '=', id).executeTakeFirst(), 'User not found.');
  return toUserDto(row);
}

export async function listInvitations(actor: Actor, db: Db = defaultDb): Promise<InvitationDto[]> {
  assertCan(actor, 'users.manage');
  const rows = await db
    .selectFrom('invitations')
    .selectAll()
    .where('company_id', '=', actor.companyId)
    .where('accepted_at', 'is', null)
    .where('revoked_at', 'is', null)
    .orderBy('created_at', 'desc')
    .execute();
  return rows.map((r) => ({
    id: r.id,
    email: r.email,
    name: r.name,
    role: r.role as Role,
    clientId: r.client_id,
    expiresAt: r.expires_at.toISOString(),
    acceptedAt: r.accepted_at?.toISOString() ?? null,
    revokedAt: r.revoked_at?.toISOString() ?? null,
    createdAt: r.created_at.toISOString(),
  }));
}

/** Creates the invitation and queues its e-mail in one transaction. */
export async function inviteUser(actor: Actor, input: InviteUserInput, db: Kysely<DB> = defaultDb): Promise<InvitationDto> {
  assertCan(actor, 'users.manage');
  const token = randomBytes(32).toString('base64url');
  const result = await db.transaction().execute(async (trx) => {
    if (input.clientId) await getClient(actor, input.clientId, trx);
    const existing = await trx.selectFrom('users').select('id').where('email', '=', input.email).executeTakeFirst();
    if (existing) throw new AppError('conflict', 'Someone already has an account with this e-mail address.');
    // A new invitation replaces any earlier open one for the same address.
    await trx
      .updateTable('invitations')
      .set({ revoked_at: sql`now()` })
      .where('company_id', '=', actor.companyId)
      .where('email', '=', input.email)
      .where('accepted_at', 'is', null)
      .where('revoked_at', 'is', null)
      .execute();
    const row = await trx
      .insertInto('invitations')
      .values({
        company_id: actor.companyId,
        email: input.email,
        name: input.name,
        role: input.role,
        client_id: input.role === 'client' ? (input.clientId ?? null) : null,
        token_hash: hashToken(token),
        invited_by: actor.id,
        expires_at: sql`now() + interval '${sql.raw(String(INVITATION_DAYS))} days'`,
      })
      .returningAll()
      .executeTakeFirstOrThrow();
    const company = await trx.selectFrom('companies').select('name').where('id', '=', actor.companyId).executeTakeFirstOrThrow();
    const url = `${env.APP_URL}/invitation/${token}`;
    await enqueueMail(
      {
        companyId: actor.companyId,
        kind: 'invitation',
        to: [input.email],
        ...invitationMail({ name: input.name, companyName: company.name, inviterName: actor.name, roleLabel: roleLabels[input.role], url }),
      },
      trx,
    );
    const dto: InvitationDto = {
      id: row.id,
      email: row.email,
      name: row.name,
      role: row.role as Role,
      clientId: row.client_id,
      expiresAt: row.expires_at.toISOString(),
      acceptedAt: null,
      revokedAt: null,
      createdAt: row.created_at.toISOString(),
    };
    await recordAudit(trx, actor, { action: 'invite', entityType: 'invitation', entityId: row.id, after: dto });
    return dto;
  });
  kickMailDelivery();
  return result;
}

export async function revokeInvitation(actor: Actor, id: string, db: Kysely<DB> = defaultDb): Promise<void> {
  assertCan(actor, 'users.manage');
  await db.transaction().execute(async (trx) => {
    const row = await trx
      .updateTable('invitations')
      .set({ revoked_at: sql`now()` })
      .where('id', '=', id)
      .where('company_id', '=', actor.companyId)
      .where('accepted_at', 'is', null)
      .where('revoked_at', 'is', null)
      .returning(['id', 'email'])
      .executeTakeFirst();
    if (!row) throw new AppError('not_found', 'Open invitation not found.');
    await recordAudit(trx, actor, { action: 'revoke', entityType: 'invitation', entityId: id, before: row });
  });
}

/** Public: looked up by the secret token in the e-mailed link. */
export async function findOpenInvitation(token: string, db: Db = defaultDb) {
  const row = await db
    .selectFrom('invitations')
    .innerJoin('companies', 'companies.id', 'invitations.company_id')
    .select(['invitations.id', 'invitations.email', 'invitations.name', 'invitations.role', 'companies.name as company_name'])
    .where('invitations.token_hash', '=', hashToken(token))
    .where('invitations.accepted_at', 'is', null)
    .where('invitations.revoked_at', 'is', null)
    .where('invitations.expires_at', '>', sql<Date>`now()`)
    .executeTakeFirst();
  return row ?? null;
}

export async function acceptInvitation(input: AcceptInvitationInput, db: Kysely<DB> = defaultDb): Promise<{ email: string }> {
  const passwordHash = await hashPassword(input.password);
  return db.transaction().execute(async (trx) => {
    const inv = await trx
      .selectFrom('invitations')
      .selectAll()
      .where('token_hash', '=', hashToken(input.token))
      .where('accepted_at', 'is', null)
      .where('revoked_at', 'is', null)
      .where('expires_at', '>', sql<Date>`now()`)
      .forUpdate()
      .executeTakeFirst();
    if (!inv) throw new AppError('not_found', 'This invitation is no longer valid. Ask your admin for a new one.');
    const user = await trx
      .insertInto('users')
      .values({
        company_id: inv.company_id,
        email: inv.email,
        name: inv.name,
        role: inv.role,
        client_id: inv.client_id,
        password_hash: passwordHash,
        email_verified_at: sql`now()`,
      })
      .returning(['id', 'email', 'role'])
      .executeTakeFirstOrThrow();
    await trx.updateTable('invitations').set({ accepted_at: sql`now()` }).where('id', '=', inv.id).execute();
    await recordAudit(trx, { id: user.id, companyId: inv.company_id }, { action: 'create', entityType: 'user', entityId: user.id, after: user });
    return { email: user.email };
  });
}

async function assertNotLastAdmin(trx: Db, actor: Actor, userId: string): Promise<void> {
  const admins = await trx
    .selectFrom('users')
    .select('id')
    .where('company_id', '=', actor.companyId)
    .where('role', '=', 'admin')
    .where('deactivated_at', 'is', null)
    .execute();
  if (admins.length === 1 && admins[0]?.id === userId) {
    throw new AppError('conflict', 'This is the only active admin. Make someone else an admin first.');
  }
}

export async function changeRole(actor: Actor, userId: string, input: ChangeRoleInput, db: Kysely<DB> = defaultDb): Promise<UserDto> {
  assertCan(actor, 'users.manage');
  return auditedChange(db, actor, { entityType: 'user', id: userId, action: 'role_change' }, (trx) => getUser(actor, userId, trx), async (trx, before) => {
    if (input.clientId) await getClient(actor, input.clientId, trx);
    if (before.role === 'admin' && input.role !== 'admin') await assertNotLastAdmin(trx, actor, userId);
    await setUserColumns(trx, actor, userId, { role: input.role, client_id: input.role === 'client' ? (input.clientId ?? null) : null });
  });
}

export async function setUserActive(actor: Actor, userId: string, active: boolean, db: Kysely<DB> = defaultDb): Promise<UserDto> {
  assertCan(actor, 'users.manage');
  const action = active ? 'reactivate' : 'deactivate';
  return auditedChange(db, actor, { entityType: 'user', id: userId, action }, (trx) => getUser(actor, userId, trx), async (trx, before) => {
    if (!active) {
      if (userId === actor.id) throw new AppError('conflict', 'You cannot deactivate your own account.');
      if (before.role === 'admin') await assertNotLastAdmin(trx, actor, userId);
    }
    await setUserColumns(trx, actor, userId, { deactivated_at: active ? null : sql`coalesce(deactivated_at, now())` });
  });
}

/** Writes a person's own columns (role, client, deactivation), stamping the change. */
function setUserColumns(trx: Db, actor: Actor, userId: string, set: UpdateObject<DB, 'users'>) {
  return trx.updateTable('users').set({ ...set, updated_at: sql`now()` }).where('id', '=', userId).where('company_id', '=', actor.companyId).execute();
}

export async function updateProfile(actor: Actor, input: UpdateProfileInput, db: Kysely<DB> = defaultDb) {
  assertCan(actor, 'profile.update');
  return db.transaction().execute(async (trx) => {
    const before = await trx.selectFrom('users').select(['name', 'units', 'metric_pressure']).where('id', '=', actor.id).executeTakeFirstOrThrow();
    const after = await trx
      .updateTable('users')
      .set({ ...changedColumns({ name: input.name, units: input.units, metric_pressure: input.metricPressure }), updated_at: sql`now()` })
      .where('id', '=', actor.id)
      .returning(['name', 'units', 'metric_pressure'])
      .executeTakeFirstOrThrow();
    await recordAudit(trx, actor, { action: 'update', entityType: 'user', entityId: actor.id, before, after });
    return { name: after.name, units: after.units as 'imperial' | 'metric', metricPressure: after.metric_pressure as 'kPa' | 'bar' };
  });
}
