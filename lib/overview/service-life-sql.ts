import 'server-only';
import { sql } from 'kysely';
import { EQUIPMENT_TYPES, medianServiceLife } from '@/lib/calc/service-life';

// lib/calc/service-life.ts's expected service lives for queries that count or pick units in SQL
// (the owner home, the attention list) instead of loading every unit into JavaScript.

const YEAR_MS = 365.25 * 86_400_000;

/** The medians as a table to join on equipment.type as `life` (types without one are left out). */
export function serviceLifeTable() {
  const rows = EQUIPMENT_TYPES.flatMap((t) => {
    const life = medianServiceLife(t);
    return life ? [sql`(${t}::text, ${life.medianYears}::float8)`] : [];
  });
  return sql<{ type: string; median_years: number }>`(select * from (values ${sql.join(rows)}) as v(type, median_years))`;
}

/**
 * A unit's age in years on `today`: the same arithmetic as in JavaScript (UTC midnight of the
 * install day, 365.25-day years). The install day's milliseconds come from its day number (date
 * minus 1970-01-01, an integer) times 86,400,000: the same float8 as extract(epoch) × 1000 (whole
 * numbers far below 2^53), without extract's numeric arithmetic, which cost most of the owner
 * home's scans over every unit.
 */
export function ageYearsSql(today: Date) {
  return sql<number>`((${today.getTime()}::float8 - (equipment.installed_on - date '1970-01-01')::float8 * 86400000) / ${YEAR_MS}::float8)`;
}

/** Past its expected service life on `today`: needs `life` (serviceLifeTable) joined. */
export function pastExpectedLifeSql(today: Date) {
  return sql<boolean>`(equipment.installed_on is not null and life.median_years is not null and ${ageYearsSql(today)} > life.median_years)`;
}
