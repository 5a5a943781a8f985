// Repeated failed sign-ins for one account are slowed down, in the database so every app copy agrees.
import { afterAll, beforeEach, describe, expect, it } from 'vitest';
import { clearFailures, lockSecondsAfter, recordFailure, secondsLocked, throttleKeys } from '@/lib/auth/throttle';
import { createTestDb, resetToDemo } from '@/tests/helpers/db';

const db = createTestDb();
beforeEach(async () => {
  await resetToDemo(db);
});
afterAll(async () => {
  await db.destroy();
});

describe('sign-in throttle', () => {
  it('allows four failures, then locks for 30 s, doubling after each further failure', async () => {
    expect([1, 4, 5, 6, 7].map((n) => lockSecondsAfter(n))).toEqual([0, 0, 30, 60, 120]);
    expect(lockSecondsAfter(50)).toBe(900);
    const keys = throttleKeys('Tech@Rimeline.test', '10.1.2.3');
    expect(keys).toEqual(['email:tech@rimeline.test', 'ip:10.1.2.3']);
    for (let i = 0; i < 4; i++) expect(await recordFailure(keys, db)).toBe(0);
    expect(await secondsLocked(keys, db)).toBe(0);
    expect(await recordFailure(keys, db)).toBe(30);
    const wait = await secondsLocked(keys, db);
    expect(wait).toBeGreaterThan(25);
    expect(wait).toBeLessThanOrEqual(30);
    await clearFailures(keys, db);
    expect(await secondsLocked(keys, db)).toBe(0);
  });

  it('one address gets twenty free failures across accounts before it is slowed down', async () => {
    for (let i = 0; i < 19; i++) expect(await recordFailure([`ip:10.9.9.9`], db)).toBe(0);
    expect(await recordFailure([`ip:10.9.9.9`], db)).toBe(30);
    expect(await secondsLocked(['email:someone@example.test', 'ip:10.9.9.9'], db)).toBeGreaterThan(25);
  });
});
