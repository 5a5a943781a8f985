// Calendar-day arithmetic on 'YYYY-MM-DD' strings (a site's local day), free of time zones.

const DAY_MS = 86_400_000;

function toUtc(day: string): number {
  return Date.parse(`${day}T00:00:00Z`);
}

export function addDays(day: string, n: number): string {
  return new Date(toUtc(day) + n * DAY_MS).toISOString().slice(0, 10);
}

/** The Monday on or before the day: weeks in the planned-visits view start on Monday. */
export function weekStart(day: string): string {
  const weekday = new Date(toUtc(day)).getUTCDay(); // 0 = Sunday
  return addDays(day, -((weekday + 6) % 7));
}

/** The seven days of the week that starts on `monday`. */
export function weekDays(monday: string): string[] {
  return Array.from({ length: 7 }, (_, i) => addDays(monday, i));
}

/** A plan is overdue when its day has passed on the site's calendar and it was not started. */
export function isOverdue(plan: { status: string; day: string }, siteToday: string): boolean {
  return plan.status === 'planned' && plan.day < siteToday;
}
