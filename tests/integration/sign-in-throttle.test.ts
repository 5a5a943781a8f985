// Failed sign-ins are slowed down in the database so every app copy agrees: per account and
// address pair (doubling waits), per address (20 free), and per account from everywhere (a fixed
// slow-down, never a long block). See lib/auth/throttle.ts.
import { describe, expect, it } from 'vitest';
import { beginAttempt, clearFailures, lockSecondsAfter, secondsLocked, throttleKeys } from '@/lib/auth/throttle';
import { createTestDb } from '@/tests/helpers/db';
import { resetDemoEach } from '@/tests/helpers/registry';

const db = createTestDb();
resetDemoEach(db);

describe('sign-in throttle', () => {
  it('a pair gets five attempts, then waits 30 s, doubling after each further failure', async () => {
    expect([1, 4, 5, 6, 7].map((n) => lockSecondsAfter(n))).toEqual([0, 0, 30, 60, 120]);
    expect(lockSecondsAfter(50)).toBe(900);
    const keys = throttleKeys('Tech@Rimeline.test', '10.1.2.3');
    expect(keys).toEqual(['pair:tech@rimeline.test|10.1.2.3', 'ip:10.1.2.3', 'email:tech@rimeline.test']);
    for (let i = 0; i < 5; i++) expect(await beginAttempt(keys, db)).toBe(0);
    const wait = await beginAttempt(keys, db);
    expect(wait).toBeGreaterThan(25);
    expect(wait).toBeLessThanOrEqual(30);
    await clearFailures(keys, db);
    expect(await secondsLocked(keys, db)).toBe(0);
  });

  it('one address gets twenty attempts across accounts before it is slowed down', async () => {
    for (let i = 0; i < 20; i++) expect(await beginAttempt(throttleKeys(`someone${i}@example.test`, '10.9.9.9'), db)).toBe(0);
    expect(await beginAttempt(throttleKeys('another@example.test', '10.9.9.9'), db)).toBeGreaterThan(25);
  });
});
