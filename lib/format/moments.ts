// An instant with its time of day ("Dec 4, 2026, 4:06 PM"), for when something was saved or taken.
export function formatMoment(value: string, timeZone?: string): string {
  return new Intl.DateTimeFormat('en-US', { year: 'numeric', month: 'short', day: 'numeric', hour: 'numeric', minute: '2-digit', ...(timeZone ? { timeZone } : {}) }).format(new Date(value));
}
