'use client';

import { SlidersHorizontal } from 'lucide-react';
import { useState, type ComponentType, type ReactNode } from 'react';
import { loadWithQuery } from '@/components/query/lazy-with-query';
import { Button } from '@/components/ui/button';
import { FilterChip } from '@/components/ui/filter-chip';
import { OlderEntries } from '@/components/visits/older-entries';
import type { Page } from '@/lib/api/cursor';
import type { UnitPrefs } from '@/lib/units/quantities';
import { cn } from '@/lib/utils';
import type { EntryDto } from '@/lib/visits/dto';
import type { HistoryScope } from '@/lib/visits/keys';
import { ENTRY_KINDS, entryKindLabels, type EntryKind } from '@/lib/visits/terms';

type Pages = ComponentType<Parameters<typeof import('@/components/visits/history-pages').HistoryPages>[0]>;

/**
 * The interactive part of a history (components/visits/equipment-history.tsx): the kind filter,
 * and the first page as the server rendered it. Only a filter or a wish for older entries loads
 * the client's own list (history-pages.tsx: the query and the entry sentences), so the first
 * entries paint without waiting for that code or for a request.
 */
export function HistoryShell({
  scope,
  id,
  prefs,
  initialPage,
  firstPage,
  kindIcons,
  showEquipment,
  title,
}: {
  scope: HistoryScope;
  id: string;
  prefs: UnitPrefs;
  initialPage?: Page<EntryDto>;
  /** The first page as the server rendered it. */
  firstPage: ReactNode;
  kindIcons: Record<EntryKind, ReactNode>;
  showEquipment: boolean;
  title?: ReactNode;
}) {
  const [kinds, setKinds] = useState<EntryKind[]>([]);
  const [filtersOpen, setFiltersOpen] = useState(false);
  const [live, setLive] = useState(false);
  const [olderNow, setOlderNow] = useState(false);
  const [HistoryPages, setHistoryPages] = useState<Pages | null>(null);
  const [loadFailed, setLoadFailed] = useState(false);

  function goLive(older: boolean) {
    if (older) setOlderNow(true);
    setLive(true);
    setLoadFailed(false);
    if (HistoryPages) return;
    // With its query provider: a unit's page has none until the list goes live (DEVELOPERS.md, "Phone pages").
    loadWithQuery(async () => (await import('@/components/visits/history-pages')).HistoryPages)
      .then((Loaded) => setHistoryPages(() => Loaded))
      .catch(() => setLoadFailed(true));
  }

  function toggle(kind: EntryKind) {
    setKinds((current) => (current.includes(kind) ? current.filter((k) => k !== kind) : ENTRY_KINDS.filter((k) => k === kind || current.includes(k))));
    goLive(false);
  }

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
      <div id={`history-kinds-${id}`} role="group" aria-label="Show entries of kind" className={cn('flex-wrap gap-2 lg:flex', filtersOpen ? 'flex' : 'hidden')}>
        <FilterChip pressed={kinds.length === 0} onClick={() => setKinds([])}>
          All
        </FilterChip>
        {ENTRY_KINDS.map((k) => (
          <FilterChip key={k} pressed={kinds.includes(k)} onClick={() => toggle(k)}>
            {kindIcons[k]}
            {entryKindLabels[k]}
          </FilterChip>
        ))}
      </div>

      {HistoryPages && live ? (
        <HistoryPages scope={scope} id={id} prefs={prefs} kinds={kinds} initialPage={initialPage} showEquipment={showEquipment} olderNow={olderNow} />
      ) : loadFailed ? (
        <p className="text-slate-800" role="alert">
          The history list could not be loaded.{' '}
          <button type="button" className="font-semibold underline" onClick={() => goLive(olderNow)}>
            Try again
          </button>
        </p>
      ) : kinds.length > 0 ? (
        <p className="text-slate-600" role="status">
          Loading history…
        </p>
      ) : (
        <>
          {firstPage}
          <OlderEntries
            hasMore={Boolean(initialPage?.nextCursor)}
            hasItems={(initialPage?.items.length ?? 0) > 0}
            loading={live}
            auto
            onMore={() => goLive(true)}
          />
        </>
      )}
    </div>
  );
}
