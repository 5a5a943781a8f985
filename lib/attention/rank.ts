// Which units need attention, and why. Pure: the service gathers the signals, this ranks them.
// The rule is ours and is shown on the page in plain words (rankingRule below).

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

export interface RankedUnit extends UnitSignals {
  score: number;
  reasons: { text: string; kind: Signal['kind']; href: string | null }[];
}

export const rankingRule = [
  'Each unit gets points for what is wrong with it, and the list is sorted by points, highest first:',
  'an open safety finding 100; a refrigerant addition over the legal leak-rate threshold in the last 12 months 80,',
  'or 40 once the repair is recorded, until its initial and follow-up verification tests have passed (then nothing);',
  'two or more no-cooling visits within 90 days 60, plus 10 for each further one;',
  'condition worse at the last rating than at the one before 20 per step down;',
  'past its expected service life 15, plus 2 per year past it (at most 40).',
  'Ties go to the unit whose problem has waited longest.',
].join(' ');

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
        text: `Leak rate ${s.ratePct.toFixed(1)} % per year on ${s.on}, over the ${s.thresholdPct} % threshold${leakProgress(s)}`,
        href: `/visits/${s.visitId}`,
      };
    case 'repeat_no_cooling':
      return { text: `${s.visitIds.length} no-cooling visits in the last 90 days`, href: `/visits/${s.visitIds[0]}` };
    case 'condition_worsening':
      return { text: `Condition fell from ${s.from} to ${s.to} (of 5)`, href: `/visits/${s.visitId}` };
    case 'past_expected_life':
      return { text: `${s.ageYears.toFixed(1)} years old; expected service life ${s.medianYears} years`, href: null };
  }
}

function leakProgress(s: Extract<Signal, { kind: 'leak_over_threshold' }>): string {
  if (s.repairedOn && s.verificationFailed) return `; repaired on ${s.repairedOn} but a verification test failed — repair again`;
  if (s.repairedOn) return `; repaired on ${s.repairedOn}, verification tests still to pass`;
  return s.repairDueDate ? `; repair due by ${s.repairDueDate}` : '';
}

function oldest(u: UnitSignals): string {
  const dates = u.signals.flatMap((s) => (s.kind === 'open_safety_finding' ? [s.since] : s.kind === 'leak_over_threshold' ? [s.on] : []));
  return dates.sort()[0] ?? '9999';
}

export function rankUnits(units: UnitSignals[]): RankedUnit[] {
  return units
    .filter((u) => u.signals.length > 0)
    .map((u) => ({
      ...u,
      score: u.signals.reduce((sum, s) => sum + scoreSignal(s), 0),
      reasons: [...u.signals].sort((a, b) => scoreSignal(b) - scoreSignal(a)).map((s) => ({ kind: s.kind, ...describeSignal(s) })),
    }))
    .sort((a, b) => b.score - a.score || oldest(a).localeCompare(oldest(b)) || a.equipmentName.localeCompare(b.equipmentName));
}
