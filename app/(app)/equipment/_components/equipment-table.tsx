'use client';

import { columnVisibilityFeature, createColumnHelper, rowSortingFeature, tableFeatures, useTable, type ColumnVisibilityState, type SortingState, type Updater } from '@tanstack/react-table';
import { ArrowDown, ArrowUp, ArrowUpDown } from 'lucide-react';
import Link from 'next/link';
import { useEffect, useMemo, useState } from 'react';
import { ConditionBadge } from '@/components/equipment/condition-badge';
import { EquipmentTypeIcon } from '@/components/equipment/equipment-type-icon';
import { RemovalLine } from '@/components/equipment/removal-line';
import { EquipmentStatusBadge } from '@/components/equipment/status-badge';
import type { EquipmentDto } from '@/lib/equipment/dto';
import type { EquipmentSort } from '@/lib/equipment/schemas';
import { equipmentTypeLabels } from '@/lib/equipment/types';
import { CheckOption, DisclosureMenu } from '@/app/(app)/equipment/_components/disclosure-menu';
import { formatDay } from '@/lib/format/dates';

// The server sorts and pages (a site list can hold 100,000 rows), so the table only renders what
// the query returned: sorting is manual and its state comes from the URL.
const features = tableFeatures({ rowSortingFeature, columnVisibilityFeature });
const helper = createColumnHelper<typeof features, EquipmentDto>();

function formatDayOrDash(iso: string | null): string {
  return iso ? formatDay(iso.slice(0, 10)) : '—';
}

const dash = <span className="text-slate-600">—</span>;

export const equipmentColumns = helper.columns([
  helper.accessor('name', {
    header: 'Name',
    enableHiding: false,
    cell: (info) => (
      <Link href={`/equipment/${info.row.original.id}`} className="inline-flex min-h-11 items-center font-semibold text-ice-800 underline decoration-ice-300 underline-offset-2 hover:decoration-ice-800">
        {info.getValue()}
      </Link>
    ),
  }),
  helper.accessor('type', {
    header: 'Type',
    cell: (info) => (
      <span className="flex items-center gap-2">
        <EquipmentTypeIcon type={info.getValue()} className="size-4" />
        {equipmentTypeLabels[info.getValue()]}
      </span>
    ),
  }),
  helper.accessor('siteName', { id: 'site', header: 'Site', enableSorting: false }),
  helper.accessor('areaName', { id: 'area', header: 'Area', enableSorting: false, cell: (info) => info.getValue() ?? dash }),
  helper.accessor('systemName', { id: 'system', header: 'System', enableSorting: false, cell: (info) => info.getValue() ?? dash }),
  helper.accessor('make', { header: 'Make', cell: (info) => info.getValue() ?? dash }),
  helper.accessor('model', { header: 'Model', cell: (info) => info.getValue() ?? dash }),
  helper.accessor('serial', { header: 'Serial', cell: (info) => (info.getValue() ? <span className="whitespace-nowrap font-mono">{info.getValue()}</span> : dash) }),
  helper.accessor('refrigerant', { header: 'Refrigerant', enableSorting: false, cell: (info) => info.getValue() ?? dash }),
  helper.accessor('condition', { header: 'Condition', cell: (info) => <ConditionBadge condition={info.getValue()} /> }),
  helper.accessor('status', {
    header: 'Status',
    enableSorting: false,
    cell: (info) => (
      <span className="flex flex-col items-start gap-1">
        <EquipmentStatusBadge status={info.getValue()} />
        {info.getValue() === 'removed' ? <RemovalLine equipment={info.row.original} /> : null}
      </span>
    ),
  }),
  helper.accessor('installedOn', { header: 'Installed', cell: (info) => formatDayOrDash(info.getValue()) }),
  helper.accessor('updatedAt', { header: 'Updated', cell: (info) => formatDayOrDash(info.getValue()) }),
]);

const defaultVisibility: ColumnVisibilityState = { system: false, refrigerant: false, installedOn: false, updatedAt: false };
const STORAGE_KEY = 'rimeline:equipment-table:columns';

/** The column choice is the viewer's own, kept in this browser. */
export function useColumnVisibility() {
  const [visibility, setVisibility] = useState<ColumnVisibilityState>(defaultVisibility);
  // Read after hydration: the server cannot know this browser's choice.
  useEffect(() => {
    try {
      const saved: unknown = JSON.parse(window.localStorage.getItem(STORAGE_KEY) ?? 'null');
      if (saved && typeof saved === 'object') setVisibility({ ...defaultVisibility, ...(saved as ColumnVisibilityState) });
    } catch {
      // A corrupt entry just means the default columns.
    }
  }, []);
  function update(updater: Updater<ColumnVisibilityState>) {
    setVisibility((current) => {
      const next = typeof updater === 'function' ? updater(current) : updater;
      window.localStorage.setItem(STORAGE_KEY, JSON.stringify(next));
      return next;
    });
  }
  return [visibility, update] as const;
}

const getRowId = (row: EquipmentDto) => row.id;

function ariaSort(sorted: false | 'asc' | 'desc'): 'ascending' | 'descending' | 'none' {
  return sorted === 'asc' ? 'ascending' : sorted === 'desc' ? 'descending' : 'none';
}

export function EquipmentTable({
  rows,
  sort,
  dir,
  onSort,
  visibility,
  onVisibilityChange,
}: {
  rows: EquipmentDto[];
  sort: EquipmentSort;
  dir: 'asc' | 'desc';
  onSort: (sort: EquipmentSort, dir: 'asc' | 'desc') => void;
  visibility: ColumnVisibilityState;
  onVisibilityChange: (updater: Updater<ColumnVisibilityState>) => void;
}) {
  // Stable between renders: a fresh state object each render would make the table recompute.
  const sorting = useMemo<SortingState>(() => [{ id: sort, desc: dir === 'desc' }], [sort, dir]);
  const table = useTable({
    features,
    columns: equipmentColumns,
    data: rows,
    getRowId,
    state: { sorting, columnVisibility: visibility },
    manualSorting: true,
    enableSortingRemoval: false,
    enableMultiSort: false,
    onSortingChange: (updater) => {
      const next = typeof updater === 'function' ? updater(sorting) : updater;
      const first = next[0];
      if (first) onSort(first.id as EquipmentSort, first.desc ? 'desc' : 'asc');
    },
    onColumnVisibilityChange: onVisibilityChange,
  });

  return (
    <div className="overflow-x-auto rounded-lg border border-slate-200 bg-white">
      <table className="w-full text-left text-sm">
        <thead className="border-b border-slate-200 bg-slate-50 text-slate-800">
          {table.getHeaderGroups().map((group) => (
            <tr key={group.id}>
              {group.headers.map((header) => {
                const canSort = header.column.getCanSort();
                const sorted = header.column.getIsSorted();
                const Icon = sorted === 'asc' ? ArrowUp : sorted === 'desc' ? ArrowDown : ArrowUpDown;
                return (
                  <th key={header.id} scope="col" aria-sort={canSort ? ariaSort(sorted) : undefined} className="whitespace-nowrap px-3 py-1 font-semibold">
                    {canSort ? (
                      <button
                        type="button"
                        onClick={header.column.getToggleSortingHandler()}
                        className="-mx-2 flex min-h-11 items-center gap-1.5 rounded px-2 hover:bg-slate-200"
                      >
                        <table.FlexRender header={header} />
                        <Icon aria-hidden className={sorted ? 'size-4 text-ice-800' : 'size-4 text-slate-500'} />
                      </button>
                    ) : (
                      <span className="flex min-h-11 items-center">
                        <table.FlexRender header={header} />
                      </span>
                    )}
                  </th>
                );
              })}
            </tr>
          ))}
        </thead>
        <tbody className="divide-y divide-slate-200">
          {table.getRowModel().rows.map((row) => (
            <tr key={row.id} className="hover:bg-ice-50">
              {row.getVisibleCells().map((cell) => (
                <td key={cell.id} className="px-3 py-2.5 align-middle">
                  <table.FlexRender cell={cell} />
                </td>
              ))}
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}

export function ColumnChooser({ visibility, onChange }: { visibility: ColumnVisibilityState; onChange: (updater: Updater<ColumnVisibilityState>) => void }) {
  const choosable = equipmentColumns.filter((c) => c.enableHiding !== false);
  const hidden = choosable.filter((c) => visibility[columnId(c)] === false).length;
  return (
    <DisclosureMenu label="Columns" count={choosable.length - hidden} align="right">
      <p className="px-2 pb-1 text-xs font-medium text-slate-600">Shown in the table (kept in this browser)</p>
      {choosable.map((c) => {
        const id = columnId(c);
        return (
          <CheckOption key={id} checked={visibility[id] !== false} onChange={(checked) => onChange((v) => ({ ...v, [id]: checked }))}>
            {String(c.header)}
          </CheckOption>
        );
      })}
    </DisclosureMenu>
  );
}

function columnId(c: object): string {
  const { id, accessorKey } = c as { id?: string; accessorKey?: string };
  return id ?? String(accessorKey);
}
