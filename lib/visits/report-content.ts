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

export function formatTime(iso: string, timeZone: string): string {
  return new Intl.DateTimeFormat('en-US', {
    timeZone,
    year: 'numeric',
    month: 'short',
    day: 'numeric',
    hour: 'numeric',
    minute: '2-digit',
    timeZoneName: 'short',
  }).format(new Date(iso));
}

/** One entry in one sentence, in the reader's units; each kind's module says how. */
export function describeEntry(e: Pick<EntryDto, 'kind' | 'data' | 'computed'>, prefs: UnitPrefs): string {
  return kindDef(e.kind).describe(e.data, e.computed, prefs);
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
      ['Started', formatTime(visit.startedAt, visit.timeZone)],
      ['Ended', visit.endedAt ? formatTime(visit.endedAt, visit.timeZone) : 'Open'],
      ['Service company', companyName],
    ],
    summary: visit.summary ?? '',
    sections: [...byEquipment.values()].map((entries) => ({
      heading: `${entries[0]!.equipmentName} (${equipmentTypeLabels[entries[0]!.equipmentType as EquipmentType] ?? entries[0]!.equipmentType})`,
      lines: entries.map((e) => describeEntry(e, prefs)),
    })),
    caution: 'Computed values are for service reference and name their basis in Rimeline; local codes and licensed practice govern.',
  };
}
