// Finding 7: a stranger cannot keep an account locked, X-Forwarded-For is only believed behind a
// configured number of proxies, and a parallel burst cannot pass the limit.
import { describe, expect, it } from 'vitest';
import { beginAttempt, clientAddress, secondsLocked, throttleKeys } from '@/lib/auth/throttle';
import { createTestDb } from '@/tests/helpers/db';
import { resetDemoEach } from '@/tests/helpers/registry';

const db = createTestDb();
resetDemoEach(db);

describe('fair throttling', () => {
  it('a stranger guessing from one address leaves the owner at another address a way in', async () => {
    const stranger = throttleKeys('office@rimeline.test', '203.0.113.7');
    for (let i = 0; i < 5; i++) expect(await beginAttempt(stranger, db)).toBe(0);
    expect(await beginAttempt(stranger, db)).toBeGreaterThan(25);
    // The account as a whole is only slowed down after ten attempts; the owner's pair is fresh.
    expect(await beginAttempt(throttleKeys('office@rimeline.test', '198.51.100.2'), db)).toBe(0);
  });

  it('many addresses together only slow the account to one check per 30 s, never a long block', async () => {
    for (let i = 0; i < 10; i++) await beginAttempt(throttleKeys('tech@rimeline.test', `203.0.113.${i + 1}`), db);
    const wait = await beginAttempt(throttleKeys('tech@rimeline.test', '198.51.100.9'), db);
    expect(wait).toBeGreaterThan(0);
    expect(wait).toBeLessThanOrEqual(30);
    for (let i = 0; i < 30; i++) await beginAttempt(throttleKeys('tech@rimeline.test', `203.0.113.${i + 50}`), db);
    expect(await secondsLocked(['email:tech@rimeline.test'], db)).toBeLessThanOrEqual(30);
  });

  it('counts a burst of 60 parallel attempts atomically: exactly five pass for one pair', async () => {
    const keys = throttleKeys('admin@rimeline.test', '203.0.113.99');
    const waits = await Promise.all(Array.from({ length: 60 }, () => beginAttempt(keys, db)));
    expect(waits.filter((w) => w === 0)).toHaveLength(5);
    const rows = await db.selectFrom('sign_in_throttles').select(['key', 'failures']).where('key', 'in', keys).orderBy('key').execute();
    expect(rows).toEqual([
      { key: 'email:admin@rimeline.test', failures: 5 },
      { key: 'ip:203.0.113.99', failures: 5 },
      { key: 'pair:admin@rimeline.test|203.0.113.99', failures: 5 },
    ]);
  });

  it('without a trusted address, the burst limit holds on the account alone', async () => {
    const keys = throttleKeys('owner@client-one.test', null);
    const waits = await Promise.all(Array.from({ length: 60 }, () => beginAttempt(keys, db)));
    expect(waits.filter((w) => w === 0)).toHaveLength(10);
  });
});

describe('clientAddress', () => {
  it('ignores X-Forwarded-For unless proxies are configured, then takes the hop they appended', () => {
    expect(clientAddress('203.0.113.5', 0)).toBeNull();
    expect(clientAddress('1.1.1.1, 203.0.113.5', 1)).toBe('203.0.113.5');
    expect(clientAddress('1.1.1.1, 203.0.113.5, 10.0.0.2', 2)).toBe('203.0.113.5');
    expect(clientAddress('10.0.0.2', 2)).toBeNull();
    expect(clientAddress('not an address', 1)).toBeNull();
  });
});
