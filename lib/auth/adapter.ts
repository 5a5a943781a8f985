import 'server-only';
import type { Adapter, AdapterUser } from 'next-auth/adapters';
import { db } from '@/db';
import { AppError } from '@/lib/errors';

// A small adapter over our own users table: the magic link only ever signs in a person the
// company already created or invited, so createUser refuses and no parallel user table exists.
type UserRow = { id: string; email: string; name: string; email_verified_at: Date | null };

function toAdapterUser(row: UserRow): AdapterUser {
  return { id: row.id, email: row.email, name: row.name, emailVerified: row.email_verified_at };
}

const activeUser = () =>
  db.selectFrom('users').select(['id', 'email', 'name', 'email_verified_at']).where('deactivated_at', 'is', null);

export const rimelineAdapter: Adapter = {
  async createUser() {
    throw new AppError('forbidden', 'No account exists for this address.');
  },
  async getUser(id) {
    const row = await activeUser().where('id', '=', id).executeTakeFirst();
    return row ? toAdapterUser(row) : null;
  },
  async getUserByEmail(email) {
    const row = await activeUser().where('email', '=', email.toLowerCase()).executeTakeFirst();
    return row ? toAdapterUser(row) : null;
  },
  async getUserByAccount() {
    return null;
  },
  async updateUser(user) {
    const row = await db
      .updateTable('users')
      .set({ email_verified_at: user.emailVerified ?? new Date(), updated_at: new Date() })
      .where('id', '=', user.id)
      .returning(['id', 'email', 'name', 'email_verified_at'])
      .executeTakeFirstOrThrow();
    return toAdapterUser(row);
  },
  async linkAccount() {
    return undefined;
  },
  async createVerificationToken(token) {
    await db.insertInto('auth_verification_tokens').values(token).execute();
    return token;
  },
  async useVerificationToken({ identifier, token }) {
    const row = await db
      .deleteFrom('auth_verification_tokens')
      .where('identifier', '=', identifier)
      .where('token', '=', token)
      .returning(['identifier', 'token', 'expires'])
      .executeTakeFirst();
    return row ?? null;
  },
};
