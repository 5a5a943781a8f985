import { encode } from 'next-auth/jwt';
import { beforeEach, describe, expect, it } from 'vitest';
import { claimsFromToken, forgetSessionTokens } from '@/lib/auth/session-token';

// The session cookie is read without getServerSession: these check that only a token next-auth
// itself made with our secret, still unexpired and naming a session, gives claims.
const secret = 'a-test-secret-of-enough-length';
const userId = '7b0c3c55-2f0e-4b55-9d5b-0f2a4c1e9a11';
const sessionId = '1f7d2a90-5b1c-4e3f-8a2d-6c9b0e4f7a22';

beforeEach(() => forgetSessionTokens());

describe('claimsFromToken', () => {
  it('reads the person and the server-side session from a token next-auth made', async () => {
    const token = await encode({ token: { sub: userId, sid: sessionId, name: 'Test' }, secret, maxAge: 3600 });
    expect(await claimsFromToken(token, secret)).toEqual({ userId, sessionId });
    // The second read comes from the kept copy and says the same.
    expect(await claimsFromToken(token, secret)).toEqual({ userId, sessionId });
  });

  it('refuses a missing cookie, a token made with another secret and a tampered token', async () => {
    expect(await claimsFromToken(null, secret)).toBeNull();
    const foreign = await encode({ token: { sub: userId, sid: sessionId }, secret: 'another-secret-of-enough-length', maxAge: 3600 });
    expect(await claimsFromToken(foreign, secret)).toBeNull();
    const token = await encode({ token: { sub: userId, sid: sessionId }, secret, maxAge: 3600 });
    const parts = token.split('.');
    parts[3] = `${parts[3]!.slice(0, -2)}${parts[3]!.endsWith('AA') ? 'BB' : 'AA'}`;
    expect(await claimsFromToken(parts.join('.'), secret)).toBeNull();
    expect(await claimsFromToken('not-a-token', secret)).toBeNull();
  });

  it('refuses a token without a session id (made before server-side sessions)', async () => {
    const token = await encode({ token: { sub: userId }, secret, maxAge: 3600 });
    expect(await claimsFromToken(token, secret)).toBeNull();
  });

  it('refuses an expired token, also when it was read while it was still valid', async () => {
    const expired = await encode({ token: { sub: userId, sid: sessionId }, secret, maxAge: -60 });
    expect(await claimsFromToken(expired, secret)).toBeNull();
    const token = await encode({ token: { sub: userId, sid: sessionId }, secret, maxAge: 60 });
    expect(await claimsFromToken(token, secret)).toEqual({ userId, sessionId });
    expect(await claimsFromToken(token, secret, Date.now() + 61_000)).toBeNull();
  });
});
