import 'server-only';
import type { NextAuthOptions } from 'next-auth';
import CredentialsProvider from 'next-auth/providers/credentials';
import EmailProvider from 'next-auth/providers/email';
import { db } from '@/db';
import { env } from '@/lib/env';
import { rimelineAdapter } from '@/lib/auth/adapter';
import { verifyPassword } from '@/lib/auth/password';
import { credentialsSchema } from '@/lib/auth/schemas';
import { clearFailures, recordFailure, secondsLocked, throttleKeys } from '@/lib/auth/throttle';
import { enqueueMail, kickMailDelivery } from '@/lib/mail/outbox';
import { magicLinkMail } from '@/lib/mail/templates';

export const SESSION_MAX_AGE_SECONDS = 12 * 60 * 60;

function waitMessage(seconds: number): string {
  const human = seconds >= 90 ? `${Math.ceil(seconds / 60)} minutes` : `${seconds} seconds`;
  return `Too many failed sign-ins. For your security, sign-in is paused for ${human}.`;
}

function clientAddress(headers: Record<string, unknown> | undefined): string | null {
  const forwarded = headers?.['x-forwarded-for'];
  if (typeof forwarded === 'string' && forwarded) return forwarded.split(',')[0]!.trim();
  const real = headers?.['x-real-ip'];
  return typeof real === 'string' && real ? real : null;
}

export const authOptions: NextAuthOptions = {
  secret: env.AUTH_SECRET,
  adapter: rimelineAdapter,
  session: { strategy: 'jwt', maxAge: SESSION_MAX_AGE_SECONDS },
  pages: { signIn: '/sign-in', verifyRequest: '/sign-in/check-email', error: '/sign-in' },
  providers: [
    CredentialsProvider({
      id: 'credentials',
      name: 'E-mail and password',
      credentials: { email: { label: 'E-mail', type: 'email' }, password: { label: 'Password', type: 'password' } },
      async authorize(raw, req) {
        const parsed = credentialsSchema.safeParse(raw ?? {});
        if (!parsed.success) return null;
        const { email, password } = parsed.data;
        const keys = throttleKeys(email, clientAddress(req?.headers));
        const wait = await secondsLocked(keys);
        if (wait > 0) throw new Error(waitMessage(wait));

        const user = await db
          .selectFrom('users')
          .select(['id', 'email', 'name', 'password_hash'])
          .where('email', '=', email)
          .where('deactivated_at', 'is', null)
          .executeTakeFirst();
        const ok = user?.password_hash ? await verifyPassword(password, user.password_hash) : false;
        if (!user || !ok) {
          const locked = await recordFailure(keys);
          if (locked > 0) throw new Error(waitMessage(locked));
          return null;
        }
        await clearFailures(keys);
        await db.updateTable('users').set({ last_sign_in_at: new Date() }).where('id', '=', user.id).execute();
        return { id: user.id, email: user.email, name: user.name };
      },
    }),
    EmailProvider({
      server: env.SMTP_URL,
      from: env.MAIL_FROM,
      maxAge: 15 * 60,
      async sendVerificationRequest({ identifier, url }) {
        // Only people who already have an account get a link; the page says the same either way,
        // so the form does not reveal which addresses exist.
        const user = await db
          .selectFrom('users')
          .select(['id', 'name', 'company_id'])
          .where('email', '=', identifier.toLowerCase())
          .where('deactivated_at', 'is', null)
          .executeTakeFirst();
        if (!user) return;
        await enqueueMail({ companyId: user.company_id, kind: 'magic_link', to: [identifier], ...magicLinkMail(user.name, url) });
        kickMailDelivery();
      },
    }),
  ],
  callbacks: {
    async jwt({ token, user }) {
      if (user) token.sub = user.id;
      return token;
    },
    async session({ session, token }) {
      if (session.user && token.sub) (session.user as { id?: string }).id = token.sub;
      return session;
    },
    async signIn({ user }) {
      if (!user?.id) return false;
      await db.updateTable('users').set({ last_sign_in_at: new Date() }).where('id', '=', user.id).execute();
      return true;
    },
  },
};
