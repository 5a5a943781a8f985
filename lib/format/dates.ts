// Dates as pages show them ("Dec 1, 2026"). A calendar date (YYYY-MM-DD: installed on, due on)
// is shown as written, never shifted by a time zone; an instant is shown as the day it was in
// the given time zone (the site's, for visits), UTC when none is given.

const DAY = { year: 'numeric', month: 'short', day: 'numeric' } as const;
const CALENDAR_DATE = /^\d{4}-\d{2}-\d{2}$/;

// Making a formatter costs far more than formatting with one (a page of fifty sites spent a few
// milliseconds per request making them), so each style and zone gets one, kept for the process.
const formatters = new Map<string, Intl.DateTimeFormat>();
function formatter(style: string, locale: string, options: Intl.DateTimeFormatOptions): Intl.DateTimeFormat {
  const key = `${style}|${options.timeZone ?? ''}`;
  let f = formatters.get(key);
  if (!f) {
    f = new Intl.DateTimeFormat(locale, options);
    formatters.set(key, f);
  }
  return f;
}

export function formatDay(value: string, timeZone = 'UTC'): string {
  if (CALENDAR_DATE.test(value)) return formatter('day', 'en-US', { ...DAY, timeZone: 'UTC' }).format(new Date(`${value}T00:00:00Z`));
  return formatter('day', 'en-US', { ...DAY, timeZone }).format(new Date(value));
}

/** 'YYYY-MM-DD' of an instant on a time zone's calendar (a site's day, for deadlines and counts). */
export function localDate(at: Date, timeZone: string): string {
  return formatter('iso-day', 'en-CA', { timeZone, year: 'numeric', month: '2-digit', day: '2-digit' }).format(at);
}

/** The time of day an instant was in a time zone ("2:05 PM"), for entries within one visit. */
export function formatClock(value: string, timeZone = 'UTC'): string {
  return formatter('clock', 'en-US', { timeZone, hour: 'numeric', minute: '2-digit' }).format(new Date(value));
}

/** A short day for chart axes ("Dec 4, 26"), on a time zone's calendar. */
export function formatShortDay(value: string, timeZone = 'UTC'): string {
  return formatter('short-day', 'en-US', { timeZone, month: 'short', day: 'numeric', year: '2-digit' }).format(new Date(value));
}

/** The time of day with its zone ("2:05 PM CST"), for history read away from the site. */
export function formatClockWithZone(value: string, timeZone = 'UTC'): string {
  return formatter('clock-zone', 'en-US', { timeZone, hour: 'numeric', minute: '2-digit', timeZoneName: 'short' }).format(new Date(value));
}

/**
 * An instant with its time of day and zone ("Dec 4, 2026, 4:06 PM MST"), for documents and lists
 * read away from the site (reports, e-mails, print runs): the site's time zone, UTC when none.
 */
export function formatStamp(value: string, timeZone = 'UTC'): string {
  return formatter('stamp', 'en-US', { timeZone, year: 'numeric', month: 'short', day: 'numeric', hour: 'numeric', minute: '2-digit', timeZoneName: 'short' }).format(new Date(value));
}
