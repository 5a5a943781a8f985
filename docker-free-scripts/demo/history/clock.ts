// Times of the demo history, counted back from "now" in each site's own time zone, so the demo
// stays fresh whenever it is loaded and visits fall in working hours on the site's clock.
import { TZDate } from '@date-fns/tz';

const DAY_MS = 86_400_000;

/** The instant that is `hour:minute` on the site's calendar day `daysAgo` days before `now`. */
export function siteTime(now: Date, timeZone: string, daysAgo: number, hour: number, minute = 0): Date {
  const local = new TZDate(now.getTime(), timeZone);
  const at = new Date(new TZDate(local.getFullYear(), local.getMonth(), local.getDate() - daysAgo, hour, minute, 0, timeZone).getTime());
  // A visit "today" that the clock has not reached yet starts an hour and a half ago instead.
  return at.getTime() > now.getTime() ? new Date(now.getTime() - 90 * 60_000) : at;
}

/** 'YYYY-MM-DD' on the site's calendar. */
export function siteDate(at: Date, timeZone: string): string {
  return new Intl.DateTimeFormat('en-CA', { timeZone, year: 'numeric', month: '2-digit', day: '2-digit' }).format(at);
}

/** EXIF's 'YYYY:MM:DD HH:MM:SS' in the site's local time (cameras write local time without a zone). */
export function exifTime(at: Date, timeZone: string): string {
  const t = new TZDate(at.getTime(), timeZone);
  const p = (n: number) => String(n).padStart(2, '0');
  return `${t.getFullYear()}:${p(t.getMonth() + 1)}:${p(t.getDate())} ${p(t.getHours())}:${p(t.getMinutes())}:${p(t.getSeconds())}`;
}

export function addMinutes(at: Date, minutes: number): Date {
  return new Date(at.getTime() + minutes * 60_000);
}

export function daysBefore(now: Date, days: number): Date {
  return new Date(now.getTime() - days * DAY_MS);
}

/** Day of the year (1–366) on the site's calendar, for the season of outdoor readings. */
export function dayOfYear(at: Date, timeZone: string): number {
  const t = new TZDate(at.getTime(), timeZone);
  const start = new TZDate(t.getFullYear(), 0, 1, timeZone);
  return Math.floor((t.getTime() - start.getTime()) / DAY_MS) + 1;
}
