// Calendar-day helpers of planned visits and the wall-clock formatting they are shown with.
// Expected weekdays and Mondays were read from Python's datetime (date.weekday()), not from this code.
import { describe, expect, it } from 'vitest';
import { formatLocalTime, formatTimeWindow, formatWeekday } from '@/lib/format/local-times';
import { addDays, isOverdue, weekDays, weekStart } from '@/lib/plans/days';
import { createPlanSchema, movePlanSchema } from '@/lib/plans/schemas';

describe('plan days', () => {
  // The Monday of a week, across a month, a year and a leap day.
  it.each([
    ['2026-12-04', '2026-11-30'],
    ['2026-12-07', '2026-12-07'],
    ['2026-12-13', '2026-12-07'],
    ['2027-01-01', '2026-12-28'],
    ['2028-02-29', '2028-02-28'],
  ])('the week of %s starts on %s', (day, monday) => {
    expect(weekStart(day)).toBe(monday);
  });

  it('lists a week across a year end and steps onto a leap day', () => {
    expect(weekDays('2026-12-28')).toEqual(['2026-12-28', '2026-12-29', '2026-12-30', '2026-12-31', '2027-01-01', '2027-01-02', '2027-01-03']);
    expect(addDays('2028-02-28', 1)).toBe('2028-02-29');
  });

  // Overdue only when still planned and its day has passed on the site calendar (today 2026-12-04).
  it.each([
    ['planned', '2026-12-03', true],
    ['planned', '2026-12-04', false],
    ['started', '2026-12-01', false],
    ['cancelled', '2026-12-01', false],
  ] as const)('a %s plan for %s is overdue: %s', (status, day, overdue) => {
    expect(isOverdue({ status, day }, '2026-12-04')).toBe(overdue);
  });

  it('shows wall-clock times as written, whatever the reader’s zone', () => {
    expect(formatLocalTime('08:00')).toBe('8:00 AM');
    expect(formatLocalTime('13:30:00')).toBe('1:30 PM');
    expect(formatLocalTime('00:05')).toBe('12:05 AM');
    expect(formatTimeWindow('07:30', '09:00')).toBe('7:30 AM – 9:00 AM');
    expect(formatWeekday('2026-12-04')).toBe('Fri, Dec 4, 2026');
  });

  it('refuses a window that ends before it starts, bad clocks and bad days', () => {
    const ok = { siteId: crypto.randomUUID(), reason: 'maintenance', technicianId: crypto.randomUUID(), day: '2026-12-08', windowStart: '08:00', windowEnd: '10:00' };
    expect(createPlanSchema.safeParse(ok).success).toBe(true);
    const reversed = createPlanSchema.safeParse({ ...ok, windowEnd: '07:59' });
    expect(reversed.success).toBe(false);
    expect(reversed.error?.issues[0]).toMatchObject({ path: ['windowEnd'], message: 'The window must end after it starts.' });
    expect(createPlanSchema.safeParse({ ...ok, windowStart: '24:00' }).success).toBe(false);
    expect(createPlanSchema.safeParse({ ...ok, reason: 'lunch' }).success).toBe(false);
    expect(movePlanSchema.safeParse({ technicianId: ok.technicianId, day: '2026-02-30', windowStart: '08:00', windowEnd: '09:00' }).success).toBe(false);
  });
});
