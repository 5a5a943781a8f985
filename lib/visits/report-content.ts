import { formatStamp } from '@/lib/format/dates';
import type { UnitPrefs } from '@/lib/units/quantities';
import { equipmentTypeLabels, type EquipmentType } from '@/lib/equipment/types';
import type { EntryDto, VisitDetailDto } from '@/lib/visits/dto';
import { kindDef } from '@/lib/visits/kinds';
import { visitReasonLabels } from '@/lib/visits/terms';

// The visit report as plain sections of text, shared by the e-mail and the PDF so both say the same.

export interface ReportSection {
  heading: string;
  lines: string[];
}

export interface VisitReport {
  title: string;
  facts: [string, string][];
  summary: string;
  sections: ReportSection[];
  caution: string;
}

/** The visit pages' name for the document date style (lib/format/dates formatStamp). */
export const formatTime = formatStamp;

/** One entry in one sentence, in the reader's units; each kind's module says how. */
export function describeEntry(e: Pick<EntryDto, 'kind' | 'data' | 'computed'>, prefs: UnitPrefs): string {
  return kindDef(e.kind).describe(e.data, e.computed, prefs);
}

/** A reading's likely causes, said as a guide from common practice (never a verdict), as on the readings form. */
export function suggestionLines(e: Pick<EntryDto, 'kind' | 'computed'>): string[] {
  const list = e.kind === 'reading' ? (e.computed as { suggestions?: { title: string; reasoning: string; checks: string[] }[] } | null)?.suggestions : undefined;
  if (!list?.length) return [];
  return [
    'What these readings suggest (a guide from common practice, not a verdict; confirm before acting):',
    ...list.map((x, i) => `${i + 1}. ${x.title}. ${x.reasoning} Check: ${x.checks.join('; ')}.`),
  ];
}

export function buildVisitReport(visit: VisitDetailDto, prefs: UnitPrefs, companyName: string): VisitReport {
  const byEquipment = new Map<string, EntryDto[]>();
  for (const e of visit.entries) {
    if (e.voidedAt) continue;
    byEquipment.set(e.equipmentId, [...(byEquipment.get(e.equipmentId) ?? []), e]);
  }
  return {
    title: `Service visit report — ${visit.siteName}`,
    facts: [
      ['Client', visit.clientName],
      ['Site', visit.siteName],
      ['Reason', visitReasonLabels[visit.reason]],
      ['Technician', visit.technicianName],
      ['Started', formatStamp(visit.startedAt, visit.timeZone)],
      ['Ended', visit.endedAt ? formatStamp(visit.endedAt, visit.timeZone) : 'Open'],
      ['Service company', companyName],
    ],
    summary: visit.summary ?? '',
    sections: [...byEquipment.values()].map((entries) => ({
      heading: `${entries[0]!.equipmentName} (${equipmentTypeLabels[entries[0]!.equipmentType as EquipmentType] ?? entries[0]!.equipmentType})`,
      lines: entries.flatMap((e) => [describeEntry(e, prefs), ...suggestionLines(e)]),
    })),
    caution: 'Computed values are for service reference and name their basis in Rimeline; local codes and licensed practice govern.',
  };
}
