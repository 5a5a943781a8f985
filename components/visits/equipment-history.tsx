import type { ReactNode } from 'react';
import { EmptyState } from '@/components/ui/card';
import { entryKindIcons } from '@/components/visits/badges';
import { HistoryGroups } from '@/components/visits/history-groups';
import { HistoryShell } from '@/components/visits/history-shell';
import type { Page } from '@/lib/api/cursor';
import type { UnitPrefs } from '@/lib/units/quantities';
import type { EntryDto } from '@/lib/visits/dto';
import type { HistoryScope } from '@/lib/visits/keys';
import { ENTRY_KINDS, type EntryKind } from '@/lib/visits/terms';

const NEWEST_ENTRY_ID = 'newest-entry';

/**
 * An equipment item's (or a system's) history, newest first, grouped by visit, filterable by entry
 * kind. A server component: the first page is rendered here, into the page's HTML, so a scanned
 * unit's newest entries paint before any script has loaded; the filter and older pages are the
 * client's (history-shell.tsx), which fetches its list code only when they are used.
 */
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
  initialPage: Page<EntryDto>;
  showEquipment?: boolean;
  /** The section's heading, set on one row with the phone's filter button to save a line. */
  title?: ReactNode;
}) {
  const kindIcons = Object.fromEntries(
    ENTRY_KINDS.map((k) => {
      const Icon = entryKindIcons[k];
      return [k, <Icon key={k} aria-hidden className="size-4" />];
    }),
  ) as Record<EntryKind, ReactNode>;
  const firstPage =
    initialPage.items.length === 0 ? (
      <EmptyState title="No history yet.">Entries appear here as visits are recorded.</EmptyState>
    ) : (
      <>
        {/* The browser holds its first frame until the newest entry has arrived (React puts the link
            in the head). On a slow link it would otherwise paint the header alone, and the frame
            with the entry would queue behind the scripts' start-up, hundreds of ms on a slow phone.
            Browsers without render-blocking links ignore it. */}
        <link rel="expect" href={`#${NEWEST_ENTRY_ID}`} blocking="render" />
        <HistoryGroups items={initialPage.items} prefs={prefs} showEquipment={showEquipment} newestId={NEWEST_ENTRY_ID} />
      </>
    );
  return <HistoryShell scope={scope} id={id} prefs={prefs} initialPage={initialPage} firstPage={firstPage} kindIcons={kindIcons} showEquipment={showEquipment} title={title} />;
}
