// The start-visit form's check (app/(app)/visits/new/_components/start-visit-values.ts): the reason
// is required with the API's own message; "earlier today" takes a time in the site's zone, and a
// time still to come or unreadable is said on the time field; what passes is the API's input.
import type { ResolverOptions } from 'react-hook-form';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { startResolver, todayAt, type StartValues } from '@/app/(app)/visits/new/_components/start-visit-values';

const siteId = '7b0f5a52-2d8e-4c1f-9a3b-0d6e1f2a3b4c';
// 15 June 2026, 15:00 UTC = 10:00 in Chicago (CDT, UTC−5 in summer, per the IANA tz database).
const now = new Date('2026-06-15T15:00:00Z');
const options = { fields: {}, shouldUseNativeValidation: false } as ResolverOptions<StartValues>;
const resolve = (v: StartValues) => startResolver(siteId, 'America/Chicago')(v, undefined, options);

beforeEach(() => {
  vi.useFakeTimers();
  vi.setSystemTime(now);
});
afterEach(() => {
  vi.useRealTimers();
});

describe('todayAt', () => {
  it('reads a time earlier today in the site’s zone as an instant', () => {
    expect(todayAt('07:30', 'America/Chicago')).toBe('2026-06-15T12:30:00.000Z');
    expect(todayAt('7:05', 'Europe/London')).toBe('2026-06-15T06:05:00.000Z');
  });

  it('refuses a time still to come, an empty or an unreadable one', () => {
    expect(todayAt('11:00', 'America/Chicago')).toBeNull();
    expect(todayAt('', 'America/Chicago')).toBeNull();
    expect(todayAt('7.30', 'America/Chicago')).toBeNull();
  });
});

describe('startResolver', () => {
  it('passes the API’s input: the site, the reason, and the arrival only when it was earlier', async () => {
    expect((await resolve({ reason: 'maintenance', when: 'now', time: '' })).values).toEqual({ siteId, reason: 'maintenance' });
    expect((await resolve({ reason: 'no_cooling', when: 'earlier', time: '08:15' })).values).toEqual({ siteId, reason: 'no_cooling', startedAt: '2026-06-15T13:15:00.000Z' });
  });

  it('asks for the reason with the API’s message', async () => {
    const { errors } = await resolve({ reason: '', when: 'now', time: '' });
    expect(errors.reason?.message).toBe('Choose the reason for the visit.');
    expect(errors.time).toBeUndefined();
  });

  it('says a missing or later arrival on the time field, not on startedAt', async () => {
    for (const time of ['', '23:00']) {
      const { errors } = await resolve({ reason: 'maintenance', when: 'earlier', time });
      expect(errors.time?.message).toBe('Give a time earlier today, like 07:30.');
      expect((errors as Record<string, unknown>).startedAt).toBeUndefined();
    }
  });
});
