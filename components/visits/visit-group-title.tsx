import { formatDay } from '@/lib/format/dates';
import { visitReasonLabels, type VisitReason } from '@/lib/visits/terms';

// No 'use client': the server's first history page and the phone's kept copy both head a visit's entries with it.

/** What a history group's heading says about its visit. */
export interface VisitGroupVisit {
  reason: VisitReason;
  startedAt: string;
  technicianName: string;
  status: 'open' | 'closed';
  timeZone: string;
}

/** Consecutive entries of one visit form a group; lists are newest first, so a visit never splits out of order. */
export function groupByVisit<E extends { visitId: string }, V>(entries: readonly E[], visitOf: (entry: E) => V): { visitId: string; visit: V; entries: E[] }[] {
  const groups: { visitId: string; visit: V; entries: E[] }[] = [];
  for (const e of entries) {
    const last = groups.at(-1);
    if (last && last.visitId === e.visitId) last.entries.push(e);
    else groups.push({ visitId: e.visitId, visit: visitOf(e), entries: [e] });
  }
  return groups;
}

/** A visit's heading over its entries: reason · day · technician, and whether it is still open. */
export function VisitGroupTitle({ visit }: { visit: VisitGroupVisit }) {
  return (
    <>
      <span className="font-semibold text-slate-900">
        {visitReasonLabels[visit.reason]} · {formatDay(visit.startedAt, visit.timeZone)}
      </span>
      <span className="text-slate-700">
        {' · '}
        {visit.technicianName}
        {visit.status === 'open' ? ' · visit still open' : ''}
      </span>
    </>
  );
}
