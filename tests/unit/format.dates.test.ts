// Days as pages show them: a calendar date is never shifted; an instant is the day in the site's zone.
import { describe, expect, it } from 'vitest';
import { formatDay } from '@/lib/format/dates';

describe('formatDay', () => {
  it('shows a calendar date as written, whatever the zone', () => {
    expect(formatDay('2026-12-01')).toBe('Dec 1, 2026');
    expect(formatDay('2026-12-01', 'Pacific/Auckland')).toBe('Dec 1, 2026');
  });

  it('shows an instant as the day it was where the site is (02:00 UTC on Dec 2 is still Dec 1 in Denver)', () => {
    expect(formatDay('2026-12-02T02:00:00.000Z', 'America/Denver')).toBe('Dec 1, 2026');
    expect(formatDay('2026-12-02T02:00:00.000Z')).toBe('Dec 2, 2026');
  });
});
