import { formatQuantity, type Quantity, type UnitPrefs } from '@/lib/units/quantities';
import { equipmentTypeLabels, type EquipmentType } from '@/lib/equipment/types';
import type { EntryDto, VisitDetailDto } from '@/lib/visits/dto';
import {
  leakActivityLabels,
  leakMethodLabels,
  leakResultLabels,
  severityLabels,
  visitReasonLabels,
  type LeakActivity,
  type LeakMethod,
  type LeakResult,
  type Severity,
} from '@/lib/visits/schemas';

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

const readingLabels: [string, string, Quantity | 'V' | 'A'][] = [
  ['suctionKpaG', 'Suction', 'pressureGauge'],
  ['dischargeKpaG', 'Discharge', 'pressureGauge'],
  ['suctionLineC', 'Suction line', 'temperature'],
  ['liquidLineC', 'Liquid line', 'temperature'],
  ['boxC', 'Box (return air)', 'temperature'],
  ['supplyAirC', 'Supply air', 'temperature'],
  ['ambientC', 'Ambient', 'temperature'],
  ['voltsL1L2', 'L1–L2', 'V'],
  ['voltsL2L3', 'L2–L3', 'V'],
  ['voltsL1L3', 'L1–L3', 'V'],
  ['controlVolts', 'Control circuit', 'V'],
  ['compressorAmps', 'Compressor', 'A'],
  ['fanAmps', 'Fan', 'A'],
];

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

function value(v: unknown, q: Quantity | 'V' | 'A', prefs: UnitPrefs): string {
  if (typeof v !== 'number') return '—';
  if (q === 'V' || q === 'A') return `${v} ${q}`;
  return formatQuantity(v, q, prefs);
}

/** Leak work in one line: what, how, the outcome and where; a repair says whether it met its deadline. */
export function describeLeakWork(d: Record<string, unknown>, c: Record<string, unknown> | null): string {
  const activity = leakActivityLabels[d.activity as LeakActivity] ?? String(d.activity);
  const method = d.method ? (leakMethodLabels[d.method as LeakMethod] ?? String(d.method)).toLowerCase() : null;
  const result = d.result ? (leakResultLabels[d.result as LeakResult] ?? String(d.result)).toLowerCase() : null;
  const where = typeof d.location === 'string' && d.location ? `at ${d.location}` : null;
  const deadline =
    c && typeof c.repairDueDate === 'string' ? (c.onTime ? `within the repair deadline of ${c.repairDueDate}` : `AFTER the repair deadline of ${c.repairDueDate}`) : null;
  const note = d.note ? `. ${d.note}` : '';
  if (d.activity === 'repair') return `${activity}${where ? ` ${where}` : ''}${deadline ? `, ${deadline}` : ''}${note}`;
  const outcome = [result, where].filter(Boolean).join(' ');
  return `${activity}${method ? ` (${method})` : ''}${outcome ? `: ${outcome}` : ''}${note}`;
}

export function describeEntry(e: EntryDto, prefs: UnitPrefs): string {
  const d = e.data;
  const c = (e.computed ?? {}) as Record<string, unknown>;
  switch (e.kind) {
    case 'reading': {
      const parts = readingLabels.filter(([k]) => typeof d[k] === 'number').map(([k, label, q]) => `${label} ${value(d[k], q, prefs)}`);
      const derived = [
        typeof c.superheatK === 'number' ? `superheat ${formatQuantity(c.superheatK, 'temperatureDiff', prefs)}` : null,
        typeof c.subcoolingK === 'number' ? `subcooling ${formatQuantity(c.subcoolingK, 'temperatureDiff', prefs)}` : null,
        typeof c.evaporatorTdK === 'number' ? `evaporator TD ${formatQuantity(c.evaporatorTdK, 'temperatureDiff', prefs)}` : null,
        typeof c.condenserSplitK === 'number' ? `condenser split ${formatQuantity(c.condenserSplitK, 'temperatureDiff', prefs)}` : null,
        typeof c.compressionRatio === 'number' ? `compression ratio ${c.compressionRatio.toFixed(2)}` : null,
        typeof c.unbalancePct === 'number' ? `voltage unbalance ${c.unbalancePct.toFixed(2)} %` : null,
      ].filter(Boolean);
      return `Readings: ${parts.join(', ')}${derived.length ? `. Computed: ${derived.join(', ')}` : ''}.`;
    }
    case 'finding':
      return `Finding (${severityLabels[d.severity as Severity] ?? d.severity}): ${d.text}`;
    case 'action':
      return `Action: ${d.text}${d.bypassedControl ? ` (temporary bypass: ${d.bypassDescription})` : ''}`;
    case 'setting_change': {
      const f = d.asFound as Record<string, number>;
      const l = d.asLeft as Record<string, number>;
      if (d.control === 'thermostat') {
        return `Thermostat: setpoint ${formatQuantity(f.setpointC, 'temperature', prefs)} → ${formatQuantity(l.setpointC, 'temperature', prefs)}, differential ${formatQuantity(f.differentialK, 'temperatureDiff', prefs)} → ${formatQuantity(l.differentialK, 'temperatureDiff', prefs)}`;
      }
      const key = d.control === 'low' ? 'cutInKpaG' : 'cutOutKpaG';
      const name = d.control === 'low' ? 'cut-in' : 'cut-out';
      const other = d.control === 'low' ? 'cut-out' : 'cut-in';
      const leftOther = typeof c.asLeftOtherKpaG === 'number' ? `, ${other} ${formatQuantity(c.asLeftOtherKpaG, 'pressureGauge', prefs)}` : '';
      return `${d.control === 'low' ? 'Low' : 'High'}-pressure control: ${name} ${formatQuantity(f[key], 'pressureGauge', prefs)} → ${formatQuantity(l[key], 'pressureGauge', prefs)}, differential ${formatQuantity(f.differentialKpa, 'pressureDiff', prefs)} → ${formatQuantity(l.differentialKpa, 'pressureDiff', prefs)}${leftOther}`;
    }
    case 'part':
      return `Part replaced: ${d.quantity} × ${d.part}${d.oldSerial ? `, old serial ${d.oldSerial}` : ''}${d.newSerial ? `, new serial ${d.newSerial}` : ''}`;
    case 'refrigerant': {
      const leak = c.leak as { ratePct?: number; thresholdPct?: number; exceedsThreshold?: boolean; repairDueDate?: string | null } | null | undefined;
      const rate = leak && typeof leak.ratePct === 'number' ? `; leak rate ${leak.ratePct.toFixed(1)} % per year (threshold ${leak.thresholdPct} %)` : '';
      const due = leak?.exceedsThreshold && leak.repairDueDate ? `; OVER THRESHOLD — repair due by ${leak.repairDueDate}` : '';
      return `Refrigerant ${d.direction}: ${formatQuantity(d.amountKg as number, 'mass', prefs)} of ${d.refrigerant}${d.cylinderId ? `, cylinder ${d.cylinderId}` : ''}${rate}${due}`;
    }
    case 'leak':
      return describeLeakWork(d, e.computed);
    case 'condition':
      return `Condition rated ${d.rating} of 5${d.note ? `: ${d.note}` : ''}`;
    case 'note':
      return `Note: ${d.text}`;
    case 'photo':
      return `Photo${d.caption ? `: ${d.caption}` : ''}`;
  }
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
