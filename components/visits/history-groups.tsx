import { ChevronRight } from 'lucide-react';
import Link from 'next/link';
import { EntryKindLabel } from '@/components/visits/badges';
import { EntrySummary } from '@/components/visits/entry-summary';
import { groupByVisit, VisitGroupTitle, type VisitGroupVisit } from '@/components/visits/visit-group-title';
import { formatClockWithZone } from '@/lib/format/dates';
import type { UnitPrefs } from '@/lib/units/quantities';
import { cn } from '@/lib/utils';
import type { EntryDto } from '@/lib/visits/dto';
import { entryKindLabels } from '@/lib/visits/terms';

// No 'use client': the server renders a history's first page with it (so a slow phone paints the
// newest entries before any script runs), and the browser the pages loaded after it.

const timeIn = formatClockWithZone;

/** An entry that comes without its visit still gets a heading. */
function visitOf(e: EntryDto): VisitGroupVisit {
  return e.visit ?? { reason: 'maintenance', startedAt: e.recordedAt, technicianName: e.createdByName, status: 'closed', timeZone: 'UTC' };
}

/**
 * History entries, newest first, grouped by visit. `newestId` names the newest entry's element, for
 * the page's first history page only (one element per id).
 */
export function HistoryGroups({ items, prefs, showEquipment, newestId }: { items: EntryDto[]; prefs: UnitPrefs; showEquipment: boolean; newestId?: string }) {
  const groups = groupByVisit(items, visitOf);
  return (
    <ol aria-label="History, newest first" className="space-y-2">
      {groups.map((g, gi) => (
        <li key={`${g.visitId}-${gi}`} className="overflow-hidden rounded-lg border border-slate-200 bg-white" data-visit-group={g.visitId}>
          <Link href={`/visits/${g.visitId}`} className="flex min-h-11 items-center gap-2 border-b border-slate-200 bg-slate-50 px-3 py-1.5 hover:bg-ice-50">
            <span className="min-w-0 flex-1 text-sm leading-snug">
              <VisitGroupTitle visit={g.visit} />
            </span>
            <span className="sr-only">Open visit</span>
            <ChevronRight aria-hidden className="size-5 shrink-0 text-slate-500" />
          </Link>
          <ul className="divide-y divide-slate-100">
            {g.entries.map((e, ei) => (
              <li key={e.id}>
                <article id={gi === 0 && ei === 0 ? newestId : undefined} className={cn('px-3 py-2', e.voidedAt && 'bg-slate-50')} data-entry-kind={e.kind} aria-label={`${entryKindLabels[e.kind]}, ${timeIn(e.recordedAt, g.visit.timeZone)}`}>
                  <div className="mb-0.5 flex flex-wrap items-baseline gap-x-2 gap-y-0.5">
                    <EntryKindLabel kind={e.kind} />
                    {/* The newest entry's paint is what a scan waits for: npm run bench reads its time. */}
                    <time dateTime={e.recordedAt} className="text-xs text-slate-600" elementtiming={gi === 0 && ei === 0 ? 'first-history-entry' : undefined}>
                      {timeIn(e.recordedAt, g.visit.timeZone)}
                    </time>
                    {showEquipment ? (
                      <Link href={`/equipment/${e.equipmentId}`} className="inline-flex min-h-11 items-center text-sm font-medium text-ice-800 underline">
                        {e.equipmentName}
                      </Link>
                    ) : null}
                  </div>
                  <div className={cn('text-sm', e.voidedAt && 'text-slate-600 line-through')}>
                    <EntrySummary entry={e} prefs={prefs} />
                  </div>
                  {e.voidedAt ? <p className="mt-1 text-sm font-semibold text-slate-800">Struck out (kept on record): {e.voidReason}</p> : null}
                </article>
              </li>
            ))}
          </ul>
        </li>
      ))}
    </ol>
  );
}
