// Wall-clock times and calendar days at a site ("8:00 AM", "Tue, Dec 8, 2026"). A planned visit's
// window is stored as the site's own local times, so it is shown as written, never shifted by the
// reader's time zone.

const HHMM = /^(\d{2}):(\d{2})/;
const CALENDAR_DATE = /^\d{4}-\d{2}-\d{2}$/;

/** '08:00' or '08:00:00' → '8:00 AM'. */
export function formatLocalTime(value: string): string {
  const m = HHMM.exec(value);
  if (!m) return value;
  const at = new Date(Date.UTC(2000, 0, 1, Number(m[1]), Number(m[2])));
  return new Intl.DateTimeFormat('en-US', { hour: 'numeric', minute: '2-digit', timeZone: 'UTC' }).format(at);
}

/** '8:00 AM – 10:00 AM'. */
export function formatTimeWindow(start: string, end: string): string {
  return `${formatLocalTime(start)} – ${formatLocalTime(end)}`;
}

/** 'YYYY-MM-DD' → 'Tue, Dec 8, 2026' (the calendar day as written). */
export function formatWeekday(day: string): string {
  if (!CALENDAR_DATE.test(day)) return day;
  return new Date(`${day}T00:00:00Z`).toLocaleDateString('en-US', { weekday: 'short', month: 'short', day: 'numeric', year: 'numeric', timeZone: 'UTC' });
}
