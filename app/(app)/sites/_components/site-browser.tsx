'use client';

import { useDeferredValue, useState } from 'react';
import { SiteList } from '@/components/sites/site-list';
import { Button } from '@/components/ui/button';
import { Input } from '@/components/ui/field';
import type { Page } from '@/lib/api/cursor';
import type { SiteDto } from '@/lib/sites/dto';
import { useSites } from '@/lib/sites/hooks';

export function SiteBrowser({ initial, showClient, canSeeArchived }: { initial: Page<SiteDto>; showClient: boolean; canSeeArchived: boolean }) {
  const [q, setQ] = useState('');
  const [archived, setArchived] = useState(false);
  const query = useDeferredValue(q.trim());
  const sites = useSites({ q: query || undefined, archived: archived ? 'only' : undefined }, initial);
  const items = sites.data?.pages.flatMap((p) => p.items) ?? [];

  return (
    <div className="space-y-4">
      <div className="flex flex-col gap-2 sm:flex-row sm:items-center">
        <label htmlFor="site-search" className="sr-only">
          Search sites
        </label>
        <Input id="site-search" type="search" placeholder="Search by site, city or client" value={q} onChange={(e) => setQ(e.target.value)} className="sm:max-w-sm" />
        {canSeeArchived ? (
          <label className="flex min-h-11 items-center gap-2 text-sm font-medium">
            <input type="checkbox" className="size-5" checked={archived} onChange={(e) => setArchived(e.target.checked)} />
            Show archived only
          </label>
        ) : null}
      </div>
      {sites.isError ? <p role="alert" className="text-red-700">{(sites.error as Error).message}</p> : null}
      <div aria-busy={sites.isFetching} aria-live="polite">
        <SiteList sites={items} showClient={showClient} empty={query ? `No sites match “${query}”.` : 'No sites yet.'} />
      </div>
      {sites.hasNextPage ? (
        <Button variant="secondary" onClick={() => sites.fetchNextPage()} disabled={sites.isFetchingNextPage}>
          {sites.isFetchingNextPage ? 'Loading…' : 'Load more'}
        </Button>
      ) : null}
    </div>
  );
}
