// Findings 3 and 5 at the sign-in: any address gets the same answer, no library or database
// message reaches a URL or the page, and NUL, broken Unicode or a malformed callbackUrl are
// refused before the auth library or the database sees them.
import { createHash, randomBytes } from 'node:crypto';
import { NextRequest } from 'next/server';
import { createRequire } from 'node:module';
import { resolve } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { authOptions } from '@/lib/auth/options';
import { GENERIC_SIGN_IN_MESSAGE, signInMessage, signInMessages } from '@/lib/auth/messages';
import { createTestDb, demoEmails, resetToDemo } from '@/tests/helpers/db';

// The library's request core, as its route handler calls it (the package does not export the path).
const { AuthHandler } = createRequire(import.meta.url)(resolve('node_modules/next-auth/core/index.js')) as {
  AuthHandler: (params: { req: Record<string, unknown>; options: unknown }) => Promise<{ status?: number; redirect?: string }>;
};
const db = createTestDb();
const appUrl = process.env.APP_URL ?? 'http://localhost:3000';
beforeAll(async () => {
  await resetToDemo(db);
});
afterAll(async () => {
  await db.destroy();
});

/** The library's own double-submit CSRF pair: cookie `token|sha256(token+secret)`, form `token`. */
function csrf() {
  const token = randomBytes(32).toString('hex');
  const hash = createHash('sha256').update(`${token}${authOptions.secret}`).digest('hex');
  return { token, cookie: `${token}|${hash}` };
}

async function askForLink(email: string) {
  const { token, cookie } = csrf();
  const res = await AuthHandler({
    req: {
      body: { email, csrfToken: token, callbackUrl: `${appUrl}/`, json: 'true' },
      query: {},
      cookies: { 'next-auth.csrf-token': cookie },
      headers: { host: new URL(appUrl).host },
      method: 'POST',
      action: 'signin',
      providerId: 'email',
      error: 'email',
    },
    options: authOptions,
  });
  return { status: res.status, redirect: String(res.redirect ?? '') };
}

describe('e-mail sign-in link', () => {
  it('answers a known and an unknown address with the same page and URL', async () => {
    const known = await askForLink(demoEmails.office);
    const unknown = await askForLink('nobody-here@example.test');
    expect(known.redirect).toContain('/api/auth/verify-request');
    expect(unknown).toEqual(known);
    expect(unknown.redirect).not.toMatch(/error|uuid|syntax/i);
    // Only the known address gets a message queued.
    const queued = await db.selectFrom('mail_outbox').select('to_addresses').where('kind', '=', 'magic_link').execute();
    expect(queued.map((q) => q.to_addresses)).toEqual([[demoEmails.office]]);
  });
});

describe('auth route guards', () => {
  async function post(path: string, form: Record<string, string>, headers: Record<string, string> = {}) {
    const { POST } = await import('@/app/api/auth/[...nextauth]/route');
    const req = new NextRequest(`http://localhost${path}`, {
      method: 'POST',
      body: new URLSearchParams(form).toString(),
      headers: { 'content-type': 'application/x-www-form-urlencoded', ...headers },
    });
    const res = await POST(req, { params: Promise.resolve({ nextauth: path.split('/').slice(3) }) });
    return { status: res.status, body: (await res.json()) as { error: { code: string; message: string } } };
  }

  // (A lone surrogate cannot travel in a form: URL encoding turns it into U+FFFD.)
  it('refuses a NUL in the sign-in forms with 422 and the usual shape', async () => {
    for (const email of ['office@rimeline.test\u0000', '\u0000']) {
      const res = await post('/api/auth/signin/email', { email, csrfToken: 'x' });
      expect(res.status).toBe(422);
      expect(res.body.error.code).toBe('validation_failed');
    }
    const creds = await post('/api/auth/callback/credentials', { email: demoEmails.office, password: 'a\u0000b', csrfToken: 'x' });
    expect(creds.status).toBe(422);
  });

  it('refuses a malformed callbackUrl with 400', async () => {
    for (const callbackUrl of ['http://[', 'javascript:alert(1)', '//evil.example.test/x']) {
      const res = await post('/api/auth/signin/email', { email: demoEmails.office, csrfToken: 'x', callbackUrl });
      expect(res.status).toBe(400);
    }
  });

  it('refuses a post from another origin with 403', async () => {
    const res = await post('/api/auth/signin/email', { email: demoEmails.office, csrfToken: 'x' }, { origin: 'http://localhost:8899' });
    expect(res.status).toBe(403);
  });

  it('the redirect callback never throws and never leaves the app', async () => {
    const redirect = authOptions.callbacks!.redirect!;
    const baseUrl = appUrl;
    expect(await redirect({ url: 'http://[', baseUrl })).toBe(baseUrl);
    expect(await redirect({ url: 'https://evil.example.test/', baseUrl })).toBe(baseUrl);
    expect(await redirect({ url: '/visits', baseUrl })).toBe(`${baseUrl}/visits`);
  });
});

describe('sign-in page messages', () => {
  it('shows only its own table; anything else reads as the generic message', () => {
    expect(signInMessage('CredentialsSignin')).toBe(signInMessages.CredentialsSignin);
    expect(signInMessage('invalid input syntax for type uuid: "a@b.test"')).toBe(GENERIC_SIGN_IN_MESSAGE);
    expect(signInMessage('Visit evil.example.test to unlock your account')).toBe(GENERIC_SIGN_IN_MESSAGE);
    expect(signInMessage('toString')).toBe(GENERIC_SIGN_IN_MESSAGE);
    expect(signInMessage(undefined)).toBeUndefined();
  });
});
