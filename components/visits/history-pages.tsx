'use client';

import { useEffect, useRef } from 'react';
import { Alert } from '@/components/ui/alert';
import { EmptyState } from '@/components/ui/card';
import { HistoryGroups } from '@/components/visits/history-groups';
import { OlderEntries } from '@/components/visits/older-entries';
import type { Page } from '@/lib/api/cursor';
import type { UnitPrefs } from '@/lib/units/quantities';
import type { EntryDto } from '@/lib/visits/dto';
import { useHistory, type HistoryScope } from '@/lib/visits/hooks';
import type { EntryKind } from '@/lib/visits/terms';

/** Pages loaded by scrolling alone before the button takes over. */
const AUTO_PAGES = 3;

/**
 * The history once the browser takes it over (a filter, or older pages): loaded by
 * components/visits/history-shell.tsx only then, so the query code and the entry sentences are
 * not in the page's first scripts. `olderNow` fetches the next page at once (the reader asked).
 */
export function HistoryPages({
  scope,
  id,
  prefs,
  kinds,
  initialPage,
  showEquipment,
  olderNow,
}: {
  scope: HistoryScope;
  id: string;
  prefs: UnitPrefs;
  kinds: EntryKind[];
  initialPage?: Page<EntryDto>;
  showEquipment: boolean;
  olderNow: boolean;
}) {
  const history = useHistory(scope, id, kinds, initialPage);
  const items = history.data?.pages.flatMap((p) => p.items) ?? [];
  const { hasNextPage, isFetchingNextPage, fetchNextPage } = history;
  const pageCount = history.data?.pages.length ?? 0;
  const askedOnce = useRef(false);

  useEffect(() => {
    if (!olderNow || askedOnce.current || !hasNextPage || pageCount !== 1) return;
    askedOnce.current = true;
    void fetchNextPage();
  }, [olderNow, hasNextPage, pageCount, fetchNextPage]);

  return (
    <>
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
        <HistoryGroups items={items} prefs={prefs} showEquipment={showEquipment} />
      )}
      <OlderEntries
        hasMore={Boolean(hasNextPage)}
        hasItems={items.length > 0}
        loading={isFetchingNextPage}
        auto={pageCount < AUTO_PAGES}
        onMore={() => void fetchNextPage()}
      />
    </>
  );
}
