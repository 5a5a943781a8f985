'use client';

import { ChevronRight, SlidersHorizontal } from 'lucide-react';
import Link from 'next/link';
import { useEffect, useRef, useState, type ReactNode } from 'react';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { EmptyState } from '@/components/ui/card';
import { EntryKindLabel, entryKindIcons } from '@/components/visits/badges';
import { EntrySummary } from '@/components/visits/entry-summary';
import type { Page } from '@/lib/api/cursor';
import type { UnitPrefs } from '@/lib/units/quantities';
import { cn } from '@/lib/utils';
import type { EntryDto } from '@/lib/visits/dto';
import { useHistory, type HistoryScope } from '@/lib/visits/hooks';
import { ENTRY_KINDS, entryKindLabels, visitReasonLabels, type EntryKind } from '@/lib/visits/schemas';
import { formatClockWithZone, formatDay } from '@/lib/format/dates';
import { FilterChip } from '@/components/ui/filter-chip';


const timeIn = formatClockWithZone;

interface VisitGroup {
  visitId: string;
  visit: NonNullable<EntryDto['visit']>;
  entries: EntryDto[];
}

/** Consecutive entries of one visit form a group; pages are newest first, so a visit never splits out of order. */
function groupByVisit(items: EntryDto[]): VisitGroup[] {
  const groups: VisitGroup[] = [];
  for (const e of items) {
    const last = groups.at(-1);
    if (last && last.visitId === e.visitId) last.entries.push(e);
    else groups.push({ visitId: e.visitId, visit: e.visit ?? { reason: 'maintenance', startedAt: e.recordedAt, technicianName: e.createdByName, status: 'closed', timeZone: 'UTC' }, entries: [e] });
  }
  return groups;
}

/**
 * An equipment item's (or a system's) history, newest first, grouped by visit, filterable by entry
 * kind. Older pages load when the end of the list scrolls into view, or with the button (keyboard).
 */

/** Pages loaded by scrolling alone before the button takes over. */
const AUTO_PAGES = 3;
export function EquipmentHistory({
  scope,
  id,
  prefs,
  initialPage,
  showEquipment = false,
  title,
}: {
  scope: HistoryScope;
  id: string;
  prefs: UnitPrefs;
  initialPage?: Page<EntryDto>;
  showEquipment?: boolean;
  /** The section's heading, set on one row with the phone's filter button to save a line. */
  title?: ReactNode;
}) {
  const [kinds, setKinds] = useState<EntryKind[]>([]);
  const history = useHistory(scope, id, kinds, initialPage);
  const items = history.data?.pages.flatMap((p) => p.items) ?? [];
  const groups = groupByVisit(items);
  const sentinel = useRef<HTMLDivElement>(null);
  const { hasNextPage, isFetchingNextPage, fetchNextPage } = history;
  const pageCount = history.data?.pages.length ?? 0;

  // Older pages load by themselves while scrolling, up to a few; after that a button does it, so
  // what sits below the history (details, photos) stays within reach of a thumb.
  useEffect(() => {
    const el = sentinel.current;
    if (!el || !hasNextPage || pageCount >= AUTO_PAGES || typeof IntersectionObserver === 'undefined') return;
    const observer = new IntersectionObserver(
      (seen) => {
        if (seen.some((s) => s.isIntersecting) && !isFetchingNextPage) void fetchNextPage();
      },
      { rootMargin: '200px 0px' },
    );
    observer.observe(el);
    return () => observer.disconnect();
  }, [hasNextPage, isFetchingNextPage, fetchNextPage, pageCount]);

  function toggle(kind: EntryKind) {
    setKinds((current) => (current.includes(kind) ? current.filter((k) => k !== kind) : ENTRY_KINDS.filter((k) => k === kind || current.includes(k))));
  }

  const [filtersOpen, setFiltersOpen] = useState(false);

  return (
    <div className="space-y-2">
      {/* On a phone the kind filter folds behind one button, so the newest entries start on the first screen. */}
      <div className="flex items-center justify-between gap-2">
        {title}
        <Button
          variant="secondary"
          className={cn('lg:hidden', !title && 'w-full justify-between')}
          aria-expanded={filtersOpen}
          aria-controls={`history-kinds-${id}`}
          onClick={() => setFiltersOpen((o) => !o)}
        >
          <SlidersHorizontal aria-hidden className="size-4" />
          Filter by kind
          <span className="font-normal">{kinds.length === 0 ? '' : `(${kinds.length} chosen)`}</span>
        </Button>
      </div>
      <div
        id={`history-kinds-${id}`}
        role="group"
        aria-label="Show entries of kind"
        className={cn('flex-wrap gap-2 lg:flex', filtersOpen ? 'flex' : 'hidden')}
      >
        <FilterChip pressed={kinds.length === 0} onClick={() => setKinds([])}>
          All
        </FilterChip>
        {ENTRY_KINDS.map((k) => {
          const Icon = entryKindIcons[k];
          return (
            <FilterChip key={k} pressed={kinds.includes(k)} onClick={() => toggle(k)}>
              <Icon aria-hidden className="size-4" />
              {entryKindLabels[k]}
            </FilterChip>
          );
        })}
      </div>

      {history.isError && items.length === 0 ? (
        <Alert tone="warning" title="The history could not be loaded.">
          {history.error instanceof Error ? history.error.message : null}{' '}
          <button type="button" className="font-semibold underline" onClick={() => void history.refetch()}>
            Try again
          </button>
        </Alert>
      ) : history.isPending ? (
        <p className="text-slate-600" role="status">
          Loading history…
        </p>
      ) : items.length === 0 ? (
        <EmptyState title={kinds.length ? 'No entries of that kind yet.' : 'No history yet.'}>Entries appear here as visits are recorded.</EmptyState>
      ) : (
        <ol aria-label="History, newest first" className="space-y-2">
          {groups.map((g, gi) => (
            <li key={`${g.visitId}-${gi}`} className="overflow-hidden rounded-lg border border-slate-200 bg-white" data-visit-group={g.visitId}>
              <Link href={`/visits/${g.visitId}`} className="flex min-h-11 items-center gap-2 border-b border-slate-200 bg-slate-50 px-3 py-1.5 hover:bg-ice-50">
                <span className="min-w-0 flex-1 text-sm leading-snug">
                  <span className="font-semibold text-slate-900">
                    {visitReasonLabels[g.visit.reason]} · {formatDay(g.visit.startedAt, g.visit.timeZone)}
                  </span>
                  <span className="text-slate-700">
                    {' · '}
                    {g.visit.technicianName}
                    {g.visit.status === 'open' ? ' · visit still open' : ''}
                  </span>
                </span>
                <span className="sr-only">Open visit</span>
                <ChevronRight aria-hidden className="size-5 shrink-0 text-slate-500" />
              </Link>
              <ul className="divide-y divide-slate-100">
                {g.entries.map((e) => (
                  <li key={e.id}>
                    <article className={cn('px-3 py-2', e.voidedAt && 'bg-slate-50')} data-entry-kind={e.kind} aria-label={`${entryKindLabels[e.kind]}, ${timeIn(e.recordedAt, g.visit.timeZone)}`}>
                      <div className="mb-0.5 flex flex-wrap items-baseline gap-x-2 gap-y-0.5">
                        <EntryKindLabel kind={e.kind} />
                        <time dateTime={e.recordedAt} className="text-xs text-slate-600">
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
      )}

      <div ref={sentinel}>
        {hasNextPage ? (
          <Button variant="secondary" size="lg" className="w-full" onClick={() => void fetchNextPage()} disabled={isFetchingNextPage}>
            {isFetchingNextPage ? 'Loading older entries…' : 'Load older entries'}
          </Button>
        ) : items.length > 0 ? (
          <p className="py-2 text-center text-sm text-slate-600">Start of the history.</p>
        ) : null}
      </div>
    </div>
  );
}
