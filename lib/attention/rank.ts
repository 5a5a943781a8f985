import { formatDay } from '@/lib/format/dates';
import { formatLeakRate, formatYears } from '@/lib/format/numbers';

// Which units need attention, and why. Pure: the service gathers the signals, this ranks them.
// The rule is ours and is shown on the page in plain words (priorityRule below): a priority word
// (urgent, soon, watch) per unit; the internal points only order units within one priority.

export type Signal =
  | { kind: 'open_safety_finding'; followUpId: string; title: string; since: string }
  | {
      kind: 'leak_over_threshold';
      visitId: string;
      ratePct: number;
      thresholdPct: number;
      repairDueDate: string | null;
      on: string;
      /** Set once a repair is recorded after the addition; a repaired and verified leak raises no signal. */
      repairedOn?: string | null;
      /** A verification test failed after the repair. */
      verificationFailed?: boolean;
    }
  | { kind: 'repeat_no_cooling'; visitIds: string[] }
  | { kind: 'condition_worsening'; from: number; to: number; visitId: string }
  | { kind: 'past_expected_life'; ageYears: number; medianYears: number };

export interface UnitSignals {
  equipmentId: string;
  equipmentName: string;
  equipmentType: string;
  siteId: string;
  siteName: string;
  signals: Signal[];
}

/** What an owner reads instead of a number: how soon the unit needs someone. */
export type Priority = 'urgent' | 'soon' | 'watch';
export const PRIORITIES: readonly Priority[] = ['urgent', 'soon', 'watch'];
export const priorityLabels: Record<Priority, string> = { urgent: 'Urgent', soon: 'Soon', watch: 'Watch' };

/** A unit placed on the list: its priority and score, before its reasons are put in words. */
export interface ScoredUnit extends UnitSignals {
  priority: Priority;
  /** Orders units within one priority (more, and more serious, problems first); never shown. */
  score: number;
}

export interface RankedUnit extends ScoredUnit {
  reasons: { text: string; kind: Signal['kind']; href: string | null }[];
}

/** The ordering rule in words, one line per priority and one for the order within a priority. */
export const priorityRule: readonly { priority: Priority | null; text: string }[] = [
  {
    priority: 'urgent',
    text: 'an open safety finding, or a refrigerant addition over the legal leak-rate threshold in the last 12 months with no repair recorded yet (or whose verification test failed).',
  },
  {
    priority: 'soon',
    text: 'two or more no-cooling visits within 90 days, or a leak repaired whose initial and follow-up verification tests have not both passed yet.',
  },
  { priority: 'watch', text: 'condition worse at the last rating than at the one before, or past its expected service life.' },
  {
    priority: null,
    text: 'A unit takes the highest priority among its reasons. Within a priority, a unit with more reasons, or a more serious one, comes first (a safety finding before a leak, a bigger drop in condition before a smaller one, longer past its expected life before newer); then the one whose problem has waited longest. A leak whose repair and verification tests are done drops off the list.',
  },
];

export const rankingRule = priorityRule.map((l) => (l.priority ? `${priorityLabels[l.priority]}: ${l.text}` : l.text)).join(' ');

export function signalPriority(s: Signal): Priority {
  switch (s.kind) {
    case 'open_safety_finding':
      return 'urgent';
    case 'leak_over_threshold':
      return s.repairedOn && !s.verificationFailed ? 'soon' : 'urgent';
    case 'repeat_no_cooling':
      return 'soon';
    case 'condition_worsening':
    case 'past_expected_life':
      return 'watch';
  }
}

function unitPriority(signals: Signal[]): Priority {
  return PRIORITIES.find((p) => signals.some((s) => signalPriority(s) === p)) ?? 'watch';
}

export function scoreSignal(s: Signal): number {
  switch (s.kind) {
    case 'open_safety_finding':
      return 100;
    case 'leak_over_threshold':
      return s.repairedOn && !s.verificationFailed ? 40 : 80;
    case 'repeat_no_cooling':
      return 60 + 10 * Math.max(0, s.visitIds.length - 2);
    case 'condition_worsening':
      return 20 * Math.max(1, s.from - s.to);
    case 'past_expected_life':
      return Math.min(40, 15 + 2 * Math.floor(Math.max(0, s.ageYears - s.medianYears)));
  }
}

export function describeSignal(s: Signal): { text: string; href: string | null } {
  switch (s.kind) {
    case 'open_safety_finding':
      return { text: `Open safety finding: ${s.title}`, href: `/follow-ups?focus=${s.followUpId}` };
    case 'leak_over_threshold':
      return {
        text: `Leak rate ${formatLeakRate(s.ratePct)} on ${formatDay(s.on)}, over the ${s.thresholdPct} % threshold${leakProgress(s)}`,
        href: `/visits/${s.visitId}`,
      };
    case 'repeat_no_cooling':
      return { text: `${s.visitIds.length} no-cooling visits in the last 90 days`, href: `/visits/${s.visitIds[0]}` };
    case 'condition_worsening':
      return { text: `Condition fell from ${s.from} to ${s.to} (of 5)`, href: `/visits/${s.visitId}` };
    case 'past_expected_life':
      return { text: `${formatYears(s.ageYears)} old; expected service life ${formatYears(s.medianYears)}`, href: null };
  }
}

function leakProgress(s: Extract<Signal, { kind: 'leak_over_threshold' }>): string {
  if (s.repairedOn && s.verificationFailed) return `; repaired on ${formatDay(s.repairedOn)} but a verification test failed — repair again`;
  if (s.repairedOn) return `; repaired on ${formatDay(s.repairedOn)}, verification tests still to pass`;
  return s.repairDueDate ? `; repair due by ${formatDay(s.repairDueDate)}` : '';
}

function oldest(u: UnitSignals): string {
  const dates = u.signals.flatMap((s) => (s.kind === 'open_safety_finding' ? [s.since] : s.kind === 'leak_over_threshold' ? [s.on] : []));
  return dates.sort()[0] ?? '9999';
}

/**
 * A unit's place in the list: priority, score (higher first), oldest problem, then name and id in
 * code-point order. The last two are what SQL's `COLLATE "C"` and uuid order give, so units paged
 * in SQL (past their expected life and nothing else) merge into this order exactly.
 */
export interface RankKey {
  priority: number;
  score: number;
  oldest: string;
  name: string;
  id: string;
}

export function rankKey(u: ScoredUnit): RankKey {
  return { priority: PRIORITIES.indexOf(u.priority), score: u.score, oldest: oldest(u), name: u.equipmentName, id: u.equipmentId };
}

/** Code-point order (UTF-8 byte order), unlike `<` on UTF-16 code units for characters past U+FFFF. */
export function compareCodePoints(a: string, b: string): number {
  const x = [...a];
  const y = [...b];
  for (let i = 0; i < Math.min(x.length, y.length); i++) {
    const d = x[i]!.codePointAt(0)! - y[i]!.codePointAt(0)!;
    if (d !== 0) return d;
  }
  return x.length - y.length;
}

export function compareRankKeys(a: RankKey, b: RankKey): number {
  return a.priority - b.priority || b.score - a.score || compareCodePoints(a.oldest, b.oldest) || compareCodePoints(a.name, b.name) || compareCodePoints(a.id, b.id);
}

/**
 * The units with a signal, in list order, not yet described: putting reasons in words formats
 * numbers and dates, which costs more than the ranking, so a page describes only what it shows.
 */
export function scoreUnits(units: UnitSignals[]): ScoredUnit[] {
  return units
    .filter((u) => u.signals.length > 0)
    .map((u) => ({ ...u, priority: unitPriority(u.signals), score: u.signals.reduce((sum, s) => sum + scoreSignal(s), 0) }))
    .map((u) => ({ u, key: rankKey(u) }))
    .sort((a, b) => compareRankKeys(a.key, b.key))
    .map(({ u }) => u);
}

/** A scored unit's reasons in words, the most serious first. */
export function describeUnit(u: ScoredUnit): RankedUnit {
  return { ...u, reasons: [...u.signals].sort((a, b) => scoreSignal(b) - scoreSignal(a)).map((s) => ({ kind: s.kind, ...describeSignal(s) })) };
}

export function rankUnits(units: UnitSignals[]): RankedUnit[] {
  return scoreUnits(units).map(describeUnit);
}
