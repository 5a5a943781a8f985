import 'server-only';
import type { NextAuthOptions } from 'next-auth';
import CredentialsProvider from 'next-auth/providers/credentials';
import EmailProvider from 'next-auth/providers/email';
import { db } from '@/db';
import { env } from '@/lib/env';
import { rimelineAdapter } from '@/lib/auth/adapter';
import { verifyPassword } from '@/lib/auth/password';
import { credentialsSchema } from '@/lib/auth/schemas';
import { endSession, startSession } from '@/lib/auth/sessions';
import { beginAttempt, clearFailures, clientAddress, throttleKeys } from '@/lib/auth/throttle';
import { enqueueMail, kickMailDelivery } from '@/lib/mail/outbox';
import { magicLinkMail } from '@/lib/mail/templates';

const isUuid = (value: string) => /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i.test(value);

export const SESSION_MAX_AGE_SECONDS = 12 * 60 * 60;

/** The code the sign-in page turns into its own message (lib/auth/messages.ts). */
const PAUSED = 'SignInPaused';

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
        const forwarded = req?.headers?.['x-forwarded-for'];
        const keys = throttleKeys(email, clientAddress(typeof forwarded === 'string' ? forwarded : null, env.TRUSTED_PROXY_COUNT));
        // Counted before the password is read, so parallel attempts cannot pass the limit.
        if ((await beginAttempt(keys)) > 0) throw new Error(PAUSED);

        const user = await db
          .selectFrom('users')
          .select(['id', 'email', 'name', 'password_hash'])
          .where('email', '=', email)
          .where('deactivated_at', 'is', null)
          .executeTakeFirst();
        const ok = user?.password_hash ? await verifyPassword(password, user.password_hash) : false;
        if (!user || !ok) return null;
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
  events: {
    async signOut({ token }) {
      if (typeof token?.sid === 'string') await endSession(token.sid);
    },
  },
  callbacks: {
    async jwt({ token, user }) {
      // At sign-in only: the cookie names a server-side session row that sign-out can end.
      if (user) {
        token.sub = user.id;
        token.sid = await startSession(user.id, SESSION_MAX_AGE_SECONDS);
      }
      return token;
    },
    async session({ session, token }) {
      if (session.user && token.sub) Object.assign(session.user, { id: token.sub, sid: typeof token.sid === 'string' ? token.sid : undefined });
      return session;
    },
    async signIn({ user, email }) {
      // Asking for a link: every address gets the same answer (sendVerificationRequest only mails
      // existing accounts). For an unknown address the library passes the address as the id, so
      // nothing may be looked up by it here.
      if (email?.verificationRequest) return true;
      if (!user?.id || !isUuid(user.id)) return false;
      await db.updateTable('users').set({ last_sign_in_at: new Date() }).where('id', '=', user.id).execute();
      return true;
    },
    // Only our own origin, and never a thrown error for a malformed address (cookie or query).
    async redirect({ url, baseUrl }) {
      if (url.startsWith('/') && !url.startsWith('//')) return `${baseUrl}${url}`;
      try {
        return new URL(url).origin === new URL(baseUrl).origin ? url : baseUrl;
      } catch {
        return baseUrl;
      }
    },
  },
};
