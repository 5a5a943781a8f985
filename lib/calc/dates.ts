// Calendar-day arithmetic for the compliance and service-life calculations. Days are UTC calendar
// days: pass 'YYYY-MM-DD' strings to avoid time-zone surprises.
import { CalcInputError } from '@/lib/calc/errors';

export type DateInput = string | Date;

const MS_PER_DAY = 86_400_000;
const ISO_DATE = /^(\d{4})-(\d{2})-(\d{2})(?:[T ][\d:.]+(?:Z|[+-]\d{2}:?\d{2})?)?$/;

/** Whole UTC days since 1970-01-01 for an ISO date or date-time string, or a Date. */
export function toUtcDay(date: DateInput, field = 'date'): number {
  let ms = Number.NaN;
  if (date instanceof Date) {
    ms = date.getTime();
  } else if (typeof date === 'string') {
    const text = date.trim();
    const m = ISO_DATE.exec(text);
    if (m) {
      ms = Date.parse(text);
      // Date.parse rolls 2026-02-30 over to March; reject dates that do not exist.
      const [, y, mo, d] = m;
      const check = new Date(Date.UTC(Number(y), Number(mo) - 1, Number(d)));
      if (check.getUTCMonth() !== Number(mo) - 1 || check.getUTCDate() !== Number(d)) ms = Number.NaN;
    }
  }
  if (!Number.isFinite(ms)) {
    throw new CalcInputError(`${field} is not a valid date (got ${String(date)}); use YYYY-MM-DD`, field);
  }
  return Math.floor(ms / MS_PER_DAY);
}

export function utcDayToIso(day: number): string {
  return new Date(day * MS_PER_DAY).toISOString().slice(0, 10);
}

export function utcYear(day: number): number {
  return new Date(day * MS_PER_DAY).getUTCFullYear();
}
