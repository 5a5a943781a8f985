// Calendar-year refrigerant totals per system and per refrigerant, with the chronic-leaker flag
// (40 CFR 82.157).
import { DEFAULT_JURISDICTION, getComplianceRules, type JurisdictionId } from '@/lib/calc/compliance-rules';
import { toUtcDay, utcYear, type DateInput } from '@/lib/calc/dates';
import { CalcInputError, requirePositive } from '@/lib/calc/errors';
import { findRefrigerant } from '@/lib/calc/refrigerants';
import { kgToLb, toKg, type MassUnit } from '@/lib/calc/units';

export interface RefrigerantTransaction {
  systemId: string;
  refrigerant: string;
  date: DateInput;
  kind: 'added' | 'recovered';
  amount: number;
  unit: MassUnit;
}

export interface SystemYearTotal {
  systemId: string;
  year: number;
  refrigerants: string[];
  addedKg: number;
  addedLb: number;
  recoveredKg: number;
  recoveredLb: number;
  fullChargeKg: number | null;
  /** Added ÷ full charge × 100; null without a full charge. */
  addedPctOfCharge: number | null;
  /** ≥ 125 % of the full charge added in the calendar year (40 CFR 82.157 chronic leaker). */
  chronicLeaker: boolean | null;
}

export interface RefrigerantYearTotal {
  year: number;
  refrigerant: string;
  addedKg: number;
  addedLb: number;
  recoveredKg: number;
  recoveredLb: number;
}

/**
 * Calendar-year totals per system and per refrigerant from a list of transactions.
 * Chronic leaker: ≥125 % of the full charge added in a calendar year (40 CFR 82.157; report by 1 March).
 * Unknown refrigerant names are kept as written, so old records still total.
 */
export function yearlyTotals(
  transactions: readonly RefrigerantTransaction[],
  fullChargeKgBySystem: Readonly<Record<string, number>> = {},
  jurisdiction: JurisdictionId = DEFAULT_JURISDICTION,
): { bySystem: SystemYearTotal[]; byRefrigerant: RefrigerantYearTotal[] } {
  const chronicPct = getComplianceRules(jurisdiction).chronicLeakerPctOfCharge;
  const systems = new Map<string, { systemId: string; year: number; refrigerants: Set<string>; added: number; recovered: number }>();
  const refrigerants = new Map<string, { year: number; refrigerant: string; added: number; recovered: number }>();
  transactions.forEach((t, i) => {
    requirePositive(t.amount, `transaction ${i + 1} amount`);
    if (typeof t.systemId !== 'string' || t.systemId === '') {
      throw new CalcInputError(`transaction ${i + 1} has no system id`, 'systemId');
    }
    const year = utcYear(toUtcDay(t.date, `transaction ${i + 1} date`));
    const refrigerant = findRefrigerant(t.refrigerant)?.id ?? t.refrigerant.trim();
    const kg = toKg(t.amount, t.unit);
    const sKey = `${t.systemId}\u0000${year}`;
    const s = systems.get(sKey) ?? { systemId: t.systemId, year, refrigerants: new Set<string>(), added: 0, recovered: 0 };
    s.refrigerants.add(refrigerant);
    const rKey = `${refrigerant}\u0000${year}`;
    const r = refrigerants.get(rKey) ?? { year, refrigerant, added: 0, recovered: 0 };
    if (t.kind === 'added') {
      s.added += kg;
      r.added += kg;
    } else {
      s.recovered += kg;
      r.recovered += kg;
    }
    systems.set(sKey, s);
    refrigerants.set(rKey, r);
  });
  const bySystem = [...systems.values()]
    .map((s): SystemYearTotal => {
      const fullChargeKg = fullChargeKgBySystem[s.systemId] ?? null;
      if (fullChargeKg !== null) requirePositive(fullChargeKg, `full charge of ${s.systemId}`);
      const pct = fullChargeKg === null ? null : (s.added / fullChargeKg) * 100;
      return {
        systemId: s.systemId,
        year: s.year,
        refrigerants: [...s.refrigerants].sort(),
        addedKg: s.added,
        addedLb: kgToLb(s.added),
        recoveredKg: s.recovered,
        recoveredLb: kgToLb(s.recovered),
        fullChargeKg,
        addedPctOfCharge: pct,
        chronicLeaker: pct === null ? null : pct >= chronicPct,
      };
    })
    .sort((a, b) => a.year - b.year || a.systemId.localeCompare(b.systemId));
  const byRefrigerant = [...refrigerants.values()]
    .map((r) => ({
      year: r.year,
      refrigerant: r.refrigerant,
      addedKg: r.added,
      addedLb: kgToLb(r.added),
      recoveredKg: r.recovered,
      recoveredLb: kgToLb(r.recovered),
    }))
    .sort((a, b) => a.year - b.year || a.refrigerant.localeCompare(b.refrigerant));
  return { bySystem, byRefrigerant };
}
