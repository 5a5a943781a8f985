// Likely causes from a combination of reading levels: a short, ranked guide for the technician.
// Every rule here is common practice from refrigeration service training texts (the classic
// superheat/subcooling/TD/split patterns), not a standard; the result is a guide, never a verdict.
import { RULES, off, type DiagnosisInput, type Key, type LevelOf, type Rule, type SuggestionCode } from '@/lib/calc/diagnosis-rules';
import type { Level } from '@/lib/calc/reading-bands';

export type { DiagnosisInput, LevelOf, SuggestionCode } from '@/lib/calc/diagnosis-rules';

export interface Suggestion {
  code: SuggestionCode;
  /** 1 = most likely. */
  rank: number;
  title: string;
  /** Why these readings point there. */
  reasoning: string;
  /** What would confirm (or rule out) it. */
  checks: string[];
  /** The readings this rests on. */
  basedOn: (keyof Omit<DiagnosisInput, 'meteringDevice'>)[];
  /** Always a guide: common practice, not a verdict. */
  guide: true;
  basis: string;
}

export const DIAGNOSIS_BASIS =
  'A guide, not a verdict: common practice from refrigeration service training texts (superheat, subcooling, TD and split patterns). Confirm with the checks before acting.';

/**
 * A short ranked list of likely causes from the combination of levels. Score: the sum of how far
 * off each matched reading is (watch 1, abnormal 2); ties go to the more specific pattern. A rule
 * needs every one of its required readings off in its direction. At most `limit` suggestions.
 */
export function suggestCauses(input: DiagnosisInput, limit = 4): Suggestion[] {
  const scored: { rule: Rule; score: number; basedOn: Key[] }[] = [];
  for (const rule of RULES) {
    if (rule.metering && input.meteringDevice && rule.metering !== input.meteringDevice) continue;
    const required = rule.when.map((c) => off(input[c.key], c.direction));
    if (required.some((s) => s === 0)) continue;
    const extra = (rule.alsoWhen ?? []).map((c) => ({ c, s: off(input[c.key], c.direction) }));
    const penalty = (rule.against ?? []).reduce((a, c) => a + off(input[c.key], c.direction), 0);
    const score = required.reduce((a, b) => a + b, 0) + extra.reduce((a, e) => a + e.s, 0) - penalty;
    const basedOn = [...rule.when.map((c) => c.key), ...extra.filter((e) => e.s > 0).map((e) => e.c.key)];
    scored.push({ rule, score, basedOn });
  }
  scored.sort((a, b) => b.score - a.score || b.rule.priority - a.rule.priority || b.rule.when.length - a.rule.when.length);
  // A combined pattern explains its single-reading cousins: drop a single-reading rule whose one
  // reading is already explained by a higher-ranked two-reading rule in the same direction.
  const kept: typeof scored = [];
  for (const s of scored) {
    const explained =
      s.rule.when.length === 1 &&
      kept.some((k) => k.rule.when.length > 1 && k.rule.when.some((c) => c.key === s.rule.when[0]!.key && c.direction === s.rule.when[0]!.direction));
    if (!explained && !kept.some((k) => k.rule.code === s.rule.code)) kept.push(s);
  }
  return kept.slice(0, limit).map((s, i) => ({
    code: s.rule.code,
    rank: i + 1,
    title: s.rule.title,
    reasoning: s.rule.reasoning,
    checks: [...s.rule.checks],
    basedOn: s.basedOn,
    guide: true,
    basis: DIAGNOSIS_BASIS,
  }));
}

/** The diagnosis input from any result object that carries level and direction per reading. */
export function diagnosisInputFrom(r: {
  superheat?: LevelOf | null;
  subcooling?: LevelOf | null;
  evaporatorTd?: LevelOf | null;
  condenserSplit?: LevelOf | null;
  compressionRatio?: LevelOf | null;
  controlVoltage?: LevelOf | null;
  voltageUnbalance?: { level: Level } | null;
  supplyVoltage?: LevelOf | null;
  meteringDevice?: 'txv' | 'fixed' | null;
}): DiagnosisInput {
  return {
    superheat: r.superheat,
    subcooling: r.subcooling,
    evaporatorTd: r.evaporatorTd,
    condenserSplit: r.condenserSplit,
    compressionRatio: r.compressionRatio,
    controlVoltage: r.controlVoltage,
    // Unbalance is one-sided: any level above normal is "high".
    voltageUnbalance: r.voltageUnbalance ? { level: r.voltageUnbalance.level, direction: r.voltageUnbalance.level === 'normal' ? null : 'high' } : null,
    supplyVoltage: r.supplyVoltage,
    meteringDevice: r.meteringDevice,
  };
}
