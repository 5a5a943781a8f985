'use client';

import { ArrowDownWideNarrow, ArrowUpNarrowWide, Check, Download, Search, SlidersHorizontal, X } from 'lucide-react';
import { useSearchParams } from 'next/navigation';
import { useEffect, useMemo, useRef, useState } from 'react';
import { EquipmentList } from '@/components/equipment/equipment-list';
import { conditionLook } from '@/components/equipment/condition-badge';
import { Alert } from '@/components/ui/alert';
import { Button, buttonVariants } from '@/components/ui/button';
import { EmptyState } from '@/components/ui/card';
import { Input } from '@/components/ui/field';
import type { Page } from '@/lib/api/cursor';
import { REFRIGERANT_IDS } from '@/lib/calc/refrigerants';
import type { EquipmentDto } from '@/lib/equipment/dto';
import { equipmentSearchParams, useEquipmentList, useSiteAreas, type EquipmentListFilters } from '@/lib/equipment/hooks';
import { EQUIPMENT_SORTS, type EquipmentSort } from '@/lib/equipment/schemas';
import { CONDITIONS, EQUIPMENT_STATUSES, EQUIPMENT_TYPES, equipmentTypeLabels, statusLabels } from '@/lib/equipment/types';
import { cn } from '@/lib/utils';
import { CheckOption, DisclosureMenu } from '@/app/(app)/equipment/_components/disclosure-menu';
import { ColumnChooser, EquipmentTable, useColumnVisibility } from '@/app/(app)/equipment/_components/equipment-table';
import { hasActiveFilters, parseFilters } from '@/app/(app)/equipment/_components/table-filters';
import { LabelledSelect } from '@/components/forms/labelled-select';
import { optionsOf } from '@/components/forms/select-options';

const sortLabels: Record<EquipmentSort, string> = {
  name: 'Name',
  type: 'Type',
  make: 'Make',
  model: 'Model',
  serial: 'Serial',
  condition: 'Condition',
  installedOn: 'Install date',
  updatedAt: 'Last updated',
};

const EMPTY: EquipmentDto[] = [];

/** Filters, sort and search are the URL's query, so a filtered view can be bookmarked or shared. */
function useUrlFilters(): [EquipmentListFilters, (change: Partial<EquipmentListFilters>) => void] {
  const params = useSearchParams();
  const filters = useMemo(() => parseFilters(params), [params]);
  function update(change: Partial<EquipmentListFilters>) {
    const next = { ...filters, ...change };
    const query = equipmentSearchParams(next).toString();
    // Next keeps useSearchParams in step with history.replaceState, without a server round trip.
    window.history.replaceState(null, '', query ? `?${query}` : window.location.pathname);
  }
  return [filters, update];
}

function toggle<T>(list: T[], value: T, on: boolean): T[] {
  return on ? [...list.filter((v) => v !== value), value] : list.filter((v) => v !== value);
}

export function EquipmentBrowser({
  sites,
  initial,
  systemName,
  showSite,
}: {
  sites: { id: string; name: string }[];
  initial: { filters: EquipmentListFilters; page: Page<EquipmentDto> };
  systemName: string | null;
  showSite: boolean;
}) {
  const [filters, update] = useUrlFilters();
  const list = useEquipmentList(filters, initial);
  const rows = useMemo(() => list.data?.pages.flatMap((p) => p.items) ?? EMPTY, [list.data]);
  const areas = useSiteAreas(filters.siteId);
  const [visibility, setVisibility] = useColumnVisibility();
  const exportHref = `/api/equipment/export?${equipmentSearchParams(filters)}`;
  const active = hasActiveFilters(filters);
  const activeCount =
    [filters.siteId, filters.areaId, filters.systemId].filter(Boolean).length + filters.type.length + filters.condition.length + filters.refrigerant.length + filters.status.length;
  const [filtersOpen, setFiltersOpen] = useState(false);

  return (
    <div className="space-y-4">
      <div className="flex flex-col gap-2 sm:flex-row sm:items-center">
        <SearchBox value={filters.q ?? ''} onSearch={(q) => update({ q: q || undefined })} />
        <div className="flex gap-2">
          {/* On a phone the filters fold away behind one button, so results start on the first screen. */}
          <Button variant="secondary" className="flex-1 md:hidden" aria-expanded={filtersOpen} aria-controls="equipment-filters" onClick={() => setFiltersOpen((o) => !o)}>
            <SlidersHorizontal aria-hidden className="size-4" />
            {filtersOpen ? 'Hide filters' : 'Filters'}
            {activeCount ? ` (${activeCount} on)` : ''}
          </Button>
          <div className="hidden md:block">
            <ColumnChooser visibility={visibility} onChange={setVisibility} />
          </div>
          <a href={exportHref} download className={buttonVariants({ variant: 'secondary' })}>
            <Download aria-hidden className="size-4" /> Export CSV
          </a>
        </div>
      </div>

      <div id="equipment-filters" className={cn('flex-wrap items-start gap-2 md:flex', filtersOpen ? 'flex' : 'hidden')} role="group" aria-label="Filters">
        <LabelledSelect
          id="filter-site"
          label="Site"
          hideLabel
          value={filters.siteId ?? ''}
          onChange={(e) => update({ siteId: e.target.value || undefined, areaId: undefined })}
          empty="All sites"
          options={sites.map((s) => ({ value: s.id, label: s.name }))}
          className="w-full sm:w-56"
          selectClassName="text-sm font-semibold"
        />
        <LabelledSelect
          id="filter-area"
          label="Area"
          hideLabel
          value={filters.areaId ?? ''}
          disabled={!filters.siteId}
          onChange={(e) => update({ areaId: e.target.value || undefined })}
          empty={filters.siteId ? 'All areas' : 'Area (site first)'}
          options={(areas.data?.items ?? []).map((a) => ({ value: a.id, label: a.name }))}
          className="w-full sm:w-48"
          selectClassName="text-sm font-semibold"
        />
        <DisclosureMenu label="Type" count={filters.type.length}>
          {EQUIPMENT_TYPES.map((t) => (
            <CheckOption key={t} checked={filters.type.includes(t)} onChange={(on) => update({ type: toggle(filters.type, t, on) })}>
              {equipmentTypeLabels[t]}
            </CheckOption>
          ))}
        </DisclosureMenu>
        <DisclosureMenu label="Condition" count={filters.condition.length}>
          {CONDITIONS.map((c) => {
            const { Icon, word } = conditionLook(c);
            return (
              <CheckOption key={c} checked={filters.condition.includes(c)} onChange={(on) => update({ condition: toggle(filters.condition, c, on) })}>
                <Icon aria-hidden className="size-4" /> {c} · {word}
              </CheckOption>
            );
          })}
        </DisclosureMenu>
        <DisclosureMenu label="Refrigerant" count={filters.refrigerant.length}>
          {REFRIGERANT_IDS.map((r) => (
            <CheckOption key={r} checked={filters.refrigerant.includes(r)} onChange={(on) => update({ refrigerant: toggle(filters.refrigerant, r, on) })}>
              {r}
            </CheckOption>
          ))}
        </DisclosureMenu>
        {filters.removed ? null : (
          <DisclosureMenu label="Status" count={filters.status.length}>
            {EQUIPMENT_STATUSES.filter((s) => s !== 'removed').map((s) => (
              <CheckOption key={s} checked={filters.status.includes(s)} onChange={(on) => update({ status: toggle(filters.status, s, on) })}>
                {statusLabels[s]}
              </CheckOption>
            ))}
          </DisclosureMenu>
        )}
        {filters.systemId ? (
          <Button variant="secondary" onClick={() => update({ systemId: undefined })} aria-label={`Remove the system filter: ${systemName ?? 'one system'}`}>
            System: {systemName ?? 'one system'} <X aria-hidden className="size-4" />
          </Button>
        ) : null}
        {active ? (
          <Button variant="ghost" onClick={() => update({ siteId: undefined, areaId: undefined, systemId: undefined, type: [], condition: [], refrigerant: [], status: [], q: undefined })}>
            Clear filters
          </Button>
        ) : null}
      </div>

      <RemovedToggle removed={Boolean(filters.removed)} onChange={(only) => update({ removed: only ? 'only' : undefined, status: [] })} />

      <PhoneSort sort={filters.sort} dir={filters.dir} onChange={(sort, dir) => update({ sort, dir })} />

      {list.isError ? (
        <Alert tone="danger" title="The equipment list could not be loaded.">
          {(list.error as Error).message}{' '}
          <button type="button" className="font-semibold underline" onClick={() => list.refetch()}>
            Try again
          </button>
        </Alert>
      ) : null}

      <div aria-busy={list.isFetching} className={list.isPlaceholderData ? 'opacity-60 transition-opacity' : undefined}>
        <p className="mb-2 text-sm text-slate-700" aria-live="polite">
          {list.isPending ? 'Loading equipment…' : `${rows.length} shown${list.hasNextPage ? ', more to load' : ''}${filters.q ? ` for “${filters.q}”` : ''}.`}
        </p>
        {!list.isPending && rows.length === 0 ? (
          <EmptyState title={filters.removed ? (active ? 'No removed equipment matches these filters.' : 'No equipment has been removed.') : active ? 'No equipment matches these filters.' : 'No equipment registered yet.'}>
            {active ? 'Search matches part of a name, make, model or serial.' : 'Register equipment from a site page, or import a CSV there.'}
          </EmptyState>
        ) : (
          <>
            <div className="hidden md:block">
              <EquipmentTable rows={rows} sort={filters.sort} dir={filters.dir} onSort={(sort, dir) => update({ sort, dir })} visibility={visibility} onVisibilityChange={setVisibility} />
            </div>
            <div className="md:hidden">
              <EquipmentList items={rows} empty="" showSite={showSite} showArea />
            </div>
          </>
        )}
      </div>

      {list.hasNextPage ? (
        <Button variant="secondary" size="lg" className="w-full sm:w-auto" onClick={() => list.fetchNextPage()} disabled={list.isFetchingNextPage}>
          {list.isFetchingNextPage ? 'Loading…' : 'Load more'}
        </Button>
      ) : null}
    </div>
  );
}

/** Typing waits 300 ms before it searches, so each keystroke does not cost a request. */
function SearchBox({ value, onSearch }: { value: string; onSearch: (q: string) => void }) {
  const [text, setText] = useState(value);
  // "Clear filters" empties the search from outside; follow it.
  const [shown, setShown] = useState(value);
  if (value !== shown) {
    setShown(value);
    if (value !== text.trim()) setText(value);
  }
  const latest = useRef(onSearch);
  useEffect(() => {
    latest.current = onSearch;
  });
  useEffect(() => {
    if (text.trim() === value) return;
    const timer = window.setTimeout(() => latest.current(text.trim()), 300);
    return () => window.clearTimeout(timer);
  }, [text, value]);
  return (
    <div className="relative flex-1">
      <label htmlFor="equipment-search" className="sr-only">
        Search equipment
      </label>
      <Search aria-hidden className="pointer-events-none absolute left-3 top-1/2 size-5 -translate-y-1/2 text-slate-500" />
      <Input
        id="equipment-search"
        type="search"
        placeholder="Search name, make, model or serial"
        value={text}
        onChange={(e) => setText(e.target.value)}
        autoComplete="off"
        spellCheck={false}
        className="pl-10"
      />
    </div>
  );
}

/** Removed units are listed apart, so a replaced unit never sits beside its namesake in the current list. */
function RemovedToggle({ removed, onChange }: { removed: boolean; onChange: (only: boolean) => void }) {
  const option = (on: boolean, label: string) => (
    <button
      type="button"
      aria-pressed={removed === on}
      onClick={() => onChange(on)}
      className={cn(
        'inline-flex min-h-11 flex-1 items-center justify-center gap-1.5 px-4 text-sm font-semibold sm:flex-none',
        removed === on ? 'bg-ice-900 text-white' : 'bg-white text-slate-900 hover:bg-slate-100',
      )}
    >
      {removed === on ? <Check aria-hidden className="size-4" /> : null}
      {label}
    </button>
  );
  return (
    <div role="group" aria-label="Which equipment" className="flex divide-x divide-slate-300 overflow-hidden rounded-md border border-slate-300 sm:inline-flex">
      {option(false, 'Current equipment')}
      {option(true, 'Removed')}
    </div>
  );
}

/** Phones show cards, which have no headers to click; sorting gets its own control. */
function PhoneSort({ sort, dir, onChange }: { sort: EquipmentSort; dir: 'asc' | 'desc'; onChange: (sort: EquipmentSort, dir: 'asc' | 'desc') => void }) {
  return (
    <div className="flex items-end gap-2 md:hidden">
      <LabelledSelect id="phone-sort" label="Sort by" className="flex-1" value={sort} onChange={(e) => onChange(e.target.value as EquipmentSort, dir)} options={optionsOf(EQUIPMENT_SORTS, sortLabels)} />
      <Button variant="secondary" onClick={() => onChange(sort, dir === 'asc' ? 'desc' : 'asc')} aria-label={`Order: ${dir === 'asc' ? 'ascending' : 'descending'}. Switch.`}>
        {dir === 'asc' ? <ArrowUpNarrowWide aria-hidden className="size-5" /> : <ArrowDownWideNarrow aria-hidden className="size-5" />}
        {dir === 'asc' ? 'Ascending' : 'Descending'}
      </Button>
    </div>
  );
}
