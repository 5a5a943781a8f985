// Refrigerant leak rate and leak-repair obligations (yearly totals: refrigerant-totals.ts).
// Leak-rate methods: 40 CFR 82.152 "leak rate" (parallel definition in 40 CFR 84.102).
import {
  DEFAULT_JURISDICTION,
  getComplianceRules,
  type ApplicationCategory,
  type JurisdictionId,
  type LeakRegime,
} from '@/lib/calc/compliance-rules';
import { toUtcDay, utcDayToIso, type DateInput } from '@/lib/calc/dates';
import { CalcInputError, fmt, requirePositive } from '@/lib/calc/errors';
import { getRefrigerant } from '@/lib/calc/refrigerants';
import { kgToLb, toKg, type MassUnit } from '@/lib/calc/units';

export interface AnnualizedLeakRate {
  ratePct: number;
  /** Days since the previous addition, or null when this is the first one. */
  daysSinceLastAddition: number | null;
  /** min(days since the last addition, 365); 365 for a first addition. */
  daysUsed: number;
  basis: string;
}

/**
 * Annualizing method, 40 CFR 82.152 (leak rate, steps 1–4):
 * rate % = (added ÷ full charge) × (365 ÷ min(days since the last addition, 365)) × 100.
 * With no earlier addition, 365 days are used (from memory for Part 84: not confirmed in the rule text).
 * `added` and `fullCharge` must be in the same mass unit.
 */
export function annualizedLeakRate(input: {
  added: number;
  fullCharge: number;
  additionDate: DateInput;
  previousAdditionDate?: DateInput | null | undefined;
}): AnnualizedLeakRate {
  requirePositive(input.added, 'refrigerant added');
  requirePositive(input.fullCharge, 'full charge');
  const day = toUtcDay(input.additionDate, 'additionDate');
  let daysSinceLastAddition: number | null = null;
  if (input.previousAdditionDate !== undefined && input.previousAdditionDate !== null) {
    const previous = toUtcDay(input.previousAdditionDate, 'previousAdditionDate');
    daysSinceLastAddition = day - previous;
    if (daysSinceLastAddition < 0) {
      throw new CalcInputError('the previous addition date is after this addition', 'previousAdditionDate');
    }
    if (daysSinceLastAddition === 0) {
      throw new CalcInputError(
        'two additions on the same day count as one: add the amounts together and use the earlier addition date',
        'previousAdditionDate',
      );
    }
  }
  const daysUsed = daysSinceLastAddition === null ? 365 : Math.min(daysSinceLastAddition, 365);
  return {
    ratePct: (input.added / input.fullCharge) * (365 / daysUsed) * 100,
    daysSinceLastAddition,
    daysUsed,
    basis: '40 CFR 82.152 / 84.102 annualizing method: (added ÷ full charge) × (365 ÷ days since the last addition, at most 365) × 100.',
  };
}

/**
 * Rolling-average method, 40 CFR 82.152 "leak rate": refrigerant added over the previous 365 days,
 * or over the period since the last successful follow-up verification test showing every identified
 * leak repaired, if that period is shorter; ÷ full charge × 100. A repair alone does not restart the
 * window: the passed follow-up verification test does (see lastPassedFollowUpTest).
 */
export function rollingAverageLeakRate(input: {
  additions: readonly { date: DateInput; amount: number }[];
  fullCharge: number;
  asOf: DateInput;
  /** Date of the last follow-up verification test that passed (all identified leaks repaired). */
  lastPassedFollowUpTestDate?: DateInput | null | undefined;
}): { ratePct: number; windowStart: string; windowStartReason: 'previous_365_days' | 'passed_follow_up_test'; addedInWindow: number; basis: string } {
  requirePositive(input.fullCharge, 'full charge');
  const asOf = toUtcDay(input.asOf, 'asOf');
  let start = asOf - 365;
  let windowStartReason: 'previous_365_days' | 'passed_follow_up_test' = 'previous_365_days';
  if (input.lastPassedFollowUpTestDate) {
    const test = toUtcDay(input.lastPassedFollowUpTestDate, 'lastPassedFollowUpTestDate');
    if (test > asOf) throw new CalcInputError('the follow-up verification test is after the as-of date', 'lastPassedFollowUpTestDate');
    if (test > start) {
      start = test;
      windowStartReason = 'passed_follow_up_test';
    }
  }
  let addedInWindow = 0;
  input.additions.forEach((a, i) => {
    requirePositive(a.amount, `addition ${i + 1} amount`);
    const d = toUtcDay(a.date, `addition ${i + 1} date`);
    if (d > start && d <= asOf) addedInWindow += a.amount;
  });
  return {
    ratePct: (addedInWindow / input.fullCharge) * 100,
    windowStart: utcDayToIso(start),
    windowStartReason,
    addedInWindow,
    basis:
      '40 CFR 82.152 rolling-average method: refrigerant added in the previous 365 days, or since the last passed follow-up verification test if shorter, ÷ full charge × 100.',
  };
}

export interface LeakWorkEvent {
  date: DateInput;
  /** The 40 CFR 82.157 terms. */
  kind: 'inspection' | 'repair' | 'initial_verification' | 'follow_up_verification';
  /** For verification tests: whether it showed the repair holding. */
  passed?: boolean | null | undefined;
}

/**
 * The window start for rollingAverageLeakRate: the latest follow-up verification test that passed
 * (40 CFR 82.152 "leak rate"); null when there is none. Repairs and initial tests do not count.
 */
export function lastPassedFollowUpTest(events: readonly LeakWorkEvent[]): string | null {
  let latest: number | null = null;
  events.forEach((e, i) => {
    const day = toUtcDay(e.date, `leak work ${i + 1} date`);
    if (e.kind === 'follow_up_verification' && e.passed === true && (latest === null || day > latest)) latest = day;
  });
  return latest === null ? null : utcDayToIso(latest);
}

export interface RegimeApplicability {
  regimeId: string;
  name: string;
  citation: string;
  applies: boolean;
  reason: string;
}

/** Which leak-repair regimes cover an appliance on a date. Basis: the jurisdiction's rules data. */
export function leakRuleApplicability(input: {
  refrigerant: string;
  fullCharge: number;
  massUnit: MassUnit;
  onDate: DateInput;
  jurisdiction?: JurisdictionId | undefined;
}): RegimeApplicability[] {
  const r = getRefrigerant(input.refrigerant);
  requirePositive(input.fullCharge, 'full charge');
  const chargeLb = kgToLb(toKg(input.fullCharge, input.massUnit));
  const day = toUtcDay(input.onDate, 'onDate');
  return getComplianceRules(input.jurisdiction).regimes.map((regime) => {
    const base = { regimeId: regime.id, name: regime.name, citation: regime.citation };
    if (day < toUtcDay(regime.appliesFrom)) {
      return { ...base, applies: false, reason: `applies from ${regime.appliesFrom}` };
    }
    if (regime.appliesUntil && day > toUtcDay(regime.appliesUntil)) {
      return { ...base, applies: false, reason: `applied until ${regime.appliesUntil}${regime.endedBy ? `: ${regime.endedBy}` : ''}` };
    }
    const covered = coversRefrigerant(regime, r);
    if (!covered.covered) return { ...base, applies: false, reason: covered.reason };
    if (chargeLb < regime.minFullChargeLb) {
      return { ...base, applies: false, reason: `full charge ${fmt(chargeLb, 1)} lb is below ${regime.minFullChargeLb} lb` };
    }
    return {
      ...base,
      applies: true,
      reason: `${covered.reason}; full charge ${fmt(chargeLb, 1)} lb ≥ ${regime.minFullChargeLb} lb`,
    };
  });
}

function coversRefrigerant(
  regime: LeakRegime,
  r: { id: string; containsOds: boolean; containsHfc: boolean; gwpAr4: number | null; gwpEu517: number },
): { covered: boolean; reason: string } {
  if (regime.covers === 'ods') {
    return r.containsOds
      ? { covered: true, reason: `${r.id} is an ozone-depleting (class I/II) refrigerant` }
      : { covered: false, reason: `${r.id} contains no ozone-depleting substance` };
  }
  if (regime.covers === 'substitute_hfc') {
    if (r.containsOds) return { covered: false, reason: `${r.id} is ozone-depleting, covered by the class I/II rule instead` };
    return r.containsHfc
      ? { covered: true, reason: `${r.id} is a substitute refrigerant containing an HFC` }
      : { covered: false, reason: `${r.id} contains no HFC` };
  }
  if (r.containsHfc) return { covered: true, reason: `${r.id} contains an HFC` };
  const limit = regime.gwpAbove ?? Infinity;
  // GWP on the AR4 basis of the AIM Act exchange values (from memory); where AR4 lists no value,
  // the commonly used regulatory figure stands in (all such refrigerants here are far below 53).
  const gwp = r.gwpAr4 ?? r.gwpEu517;
  const basis = r.gwpAr4 === null ? 'not in AR4; regulatory figure' : 'AR4';
  if (!r.containsOds && gwp > limit) return { covered: true, reason: `${r.id} is a substitute with GWP ${gwp} (${basis}) > ${limit}` };
  return { covered: false, reason: `${r.id} contains no HFC and its GWP (${gwp}, ${basis}) is not above ${limit}` };
}

export interface LeakEventInput {
  jurisdiction?: JurisdictionId | undefined;
  refrigerant: string;
  application: ApplicationCategory;
  fullCharge: number;
  added: number;
  massUnit: MassUnit;
  additionDate: DateInput;
  previousAdditionDate?: DateInput | null | undefined;
  /** Industrial process refrigeration needing a process shutdown for the repair. */
  iprShutdown?: boolean | undefined;
}

export interface LeakEventResult {
  jurisdiction: JurisdictionId;
  ratePct: number;
  daysUsed: number;
  thresholdPct: number;
  exceedsThreshold: boolean;
  /** True when at least one regime legally covers this appliance on the addition date. */
  regulated: boolean;
  applicability: RegimeApplicability[];
  /** Set when the threshold is exceeded on a regulated appliance. */
  repairDueDate: string | null;
  verification: { initial: string; followUp: string; followUpDays: number; followUpDaysFromMemory: true } | null;
  cautions: string[];
  basis: string;
}

/**
 * Evaluates one refrigerant addition: annualized leak rate (40 CFR 82.152), threshold for the
 * application (§82.157(c) / §84.106), repair deadline and verification tests.
 */
export function evaluateLeakEvent(input: LeakEventInput): LeakEventResult {
  const jurisdiction = input.jurisdiction ?? DEFAULT_JURISDICTION;
  const rules = getComplianceRules(jurisdiction);
  const rate = annualizedLeakRate(input);
  const applicability = leakRuleApplicability({
    refrigerant: input.refrigerant,
    fullCharge: input.fullCharge,
    massUnit: input.massUnit,
    onDate: input.additionDate,
    jurisdiction,
  });
  const regulated = applicability.some((a) => a.applies);
  const applying = rules.regimes.find((r) => applicability.some((a) => a.applies && a.regimeId === r.id));
  // Not covered: show the threshold of the rules in force on that date, for guidance.
  const day = toUtcDay(input.additionDate, 'additionDate');
  const inForce = rules.regimes.filter((r) => day >= toUtcDay(r.appliesFrom) && (!r.appliesUntil || day <= toUtcDay(r.appliesUntil)));
  const thresholdPct = (applying ?? inForce[0] ?? rules.regimes[rules.regimes.length - 1])?.thresholdPct[input.application] ?? 10;
  const exceedsThreshold = rate.ratePct > thresholdPct;
  const cautions = [rules.caution];
  if (!regulated) cautions.push('No regime covers this appliance on that date; the threshold is shown for guidance only.');
  if (input.previousAdditionDate === undefined || input.previousAdditionDate === null) {
    cautions.push('No earlier addition given, so 365 days were used (first addition).');
  }
  if (input.application === 'comfort_cooling') {
    const excl = rules.regimes.find((r) => r.exclusions)?.exclusions;
    if (excl) cautions.push(excl);
  }
  let repairDueDate: string | null = null;
  let verification: LeakEventResult['verification'] = null;
  if (exceedsThreshold && regulated) {
    const days =
      input.iprShutdown && input.application === 'industrial_process_refrigeration' ? rules.repairDaysIprShutdown : rules.repairDays;
    repairDueDate = utcDayToIso(toUtcDay(input.additionDate, 'additionDate') + days);
    verification = { ...rules.verification, followUpDaysFromMemory: true };
  }
  return {
    jurisdiction,
    ratePct: rate.ratePct,
    daysUsed: rate.daysUsed,
    thresholdPct,
    exceedsThreshold,
    regulated,
    applicability,
    repairDueDate,
    verification,
    cautions,
    basis: `${rate.basis} Threshold by application (${(applying ?? inForce[0])?.citation ?? rules.regimes[0]?.citation ?? ''}); repair within ${rules.repairDays} days of the addition (${rules.repairDaysIprShutdown} with an industrial process shutdown).`,
  };
}
