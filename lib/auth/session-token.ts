import 'server-only';
import { decode } from 'next-auth/jwt';
import { cookies } from 'next/headers';
import { env } from '@/lib/env';

// Reading the session cookie on each request. next-auth's getServerSession runs its whole
// request handler for this (configuration checks, the callbacks, and a fresh encryption of the
// token that a server component cannot even send back), which made it most of the cost of a
// signed-in request that does no work. The cookie is the same encrypted token (next-auth's
// `decode`, same secret); it only names the person and their server-side session, and every
// request still checks that session row (lib/auth/sessions.ts), so a revoked session ends at once.

export interface SessionClaims {
  userId: string;
  sessionId: string;
}

// next-auth's names: the __Secure- prefix when the site is served over https (its
// `useSecureCookies` default), and `.0`, `.1`, … when a large token is split over several cookies.
const BASE = 'next-auth.session-token';
const cookieName = () => ((process.env.NEXTAUTH_URL ?? '').startsWith('https://') ? `__Secure-${BASE}` : BASE);

function tokenFrom(all: { name: string; value: string }[], name: string): string | null {
  const whole = all.find((c) => c.name === name);
  if (whole) return whole.value;
  const chunks = all
    .filter((c) => c.name.startsWith(`${name}.`) && /^\d+$/.test(c.name.slice(name.length + 1)))
    .sort((a, b) => Number(a.name.slice(name.length + 1)) - Number(b.name.slice(name.length + 1)));
  return chunks.length > 0 ? chunks.map((c) => c.value).join('') : null;
}

// A decrypted token, kept by its exact text: the encryption is authenticated, so the same text
// always decrypts to the same claims; only the expiry is checked again on each use. Bounded, the
// oldest entry goes first.
const MAX_KEPT = 5_000;
const kept = new Map<string, { claims: SessionClaims; expiresAtMs: number }>();

function remember(token: string, claims: SessionClaims, expiresAtMs: number): void {
  if (kept.size >= MAX_KEPT) kept.delete(kept.keys().next().value!);
  kept.set(token, { claims, expiresAtMs });
}

/** The claims of a session token, or null for a missing, expired, tampered or foreign one. */
export async function claimsFromToken(token: string | null, secret: string = env.AUTH_SECRET, now = Date.now()): Promise<SessionClaims | null> {
  if (!token) return null;
  const hit = kept.get(token);
  if (hit) {
    if (hit.expiresAtMs > now) return hit.claims;
    kept.delete(token);
    return null;
  }
  let payload: Awaited<ReturnType<typeof decode>>;
  try {
    payload = await decode({ token, secret });
  } catch {
    return null;
  }
  const userId = payload?.sub;
  const sessionId = payload?.sid;
  const exp = payload?.exp;
  if (typeof userId !== 'string' || typeof sessionId !== 'string' || typeof exp !== 'number') return null;
  const claims = { userId, sessionId };
  remember(token, claims, exp * 1000);
  return exp * 1000 > now ? claims : null;
}

/** The claims of this request's session cookie. */
export async function requestSessionClaims(): Promise<SessionClaims | null> {
  return claimsFromToken(tokenFrom((await cookies()).getAll(), cookieName()));
}

/** For tests: forget every decrypted token. */
export function forgetSessionTokens(): void {
  kept.clear();
}
