'use client';

import { ChevronRight, CircleCheck, ScanLine, Search } from 'lucide-react';
import { useId, useMemo, useState } from 'react';
import { EquipmentTypeIcon } from '@/components/equipment/equipment-type-icon';
import type { EquipmentDto } from '@/lib/equipment/dto';
import { equipmentTypeLabels } from '@/lib/equipment/types';
import { formatCode } from '@/lib/tags/code';
import { entryKindLabels, type EntryKind } from '@/lib/visits/terms';

// Choosing the unit to record on: by search (name, type or tag code), by scanning its tag, from
// the units already touched in this visit, or from the site's areas, folded so that a 30-unit
// site still fits a phone screen or two.

export interface Touched {
  count: number;
  kinds: Map<EntryKind, number>;
}

/** "Readings, Finding ×2" — what was recorded on a unit in this visit. */
export function touchedWords(t: Touched): string {
  return [...t.kinds].map(([k, n]) => (n > 1 ? `${entryKindLabels[k]} ×${n}` : entryKindLabels[k])).join(', ');
}

const plainCode = (s: string) => s.toUpperCase().replace(/[^0-9A-Z]/g, '');

export function UnitPicker({
  equipment,
  tagCodes,
  touched,
  onPick,
  onScan,
}: {
  equipment: EquipmentDto[];
  tagCodes: Record<string, string>;
  touched: Map<string, Touched>;
  onPick: (id: string) => void;
  onScan: () => void;
}) {
  const [query, setQuery] = useState('');
  const searchId = useId();
  const q = query.trim().toLowerCase();
  const results = useMemo(() => {
    if (!q) return [];
    const code = plainCode(q);
    return equipment.filter(
      (e) =>
        e.name.toLowerCase().includes(q) ||
        equipmentTypeLabels[e.type].toLowerCase().includes(q) ||
        (code.length >= 2 && tagCodes[e.id] !== undefined && plainCode(tagCodes[e.id]!).includes(code)),
    );
  }, [q, equipment, tagCodes]);
  const inVisit = equipment.filter((e) => touched.has(e.id));
  const areas = useMemo(() => {
    const m = new Map<string, EquipmentDto[]>();
    for (const e of equipment) if (!touched.has(e.id)) m.set(e.areaName ?? '', [...(m.get(e.areaName ?? '') ?? []), e]);
    return [...m.entries()].sort(([a], [b]) => (a === '' ? 1 : b === '' ? -1 : a.localeCompare(b)));
  }, [equipment, touched]);

  if (equipment.length === 0) {
    return <p className="rounded-lg border border-dashed border-slate-300 bg-white p-4">No equipment is registered at this site yet. Register it from the site page, then come back.</p>;
  }

  const row = (e: EquipmentDto) => (
    <li key={e.id}>
      <UnitButton unit={e} code={tagCodes[e.id] ?? null} touched={touched.get(e.id)} onPick={onPick} />
    </li>
  );

  return (
    <section aria-labelledby="pick-h" className="space-y-3">
      <h2 id="pick-h" className="text-lg font-semibold">
        Which unit?
      </h2>
      <div className="flex gap-2">
        <div className="relative min-w-0 flex-1">
          <label htmlFor={searchId} className="sr-only">
            Find a unit by name, type or tag code
          </label>
          <Search aria-hidden className="pointer-events-none absolute left-3 top-1/2 size-5 -translate-y-1/2 text-slate-500" />
          <input
            id={searchId}
            type="search"
            value={query}
            onChange={(e) => setQuery(e.target.value)}
            placeholder="Name, type or tag code"
            autoComplete="off"
            className="block min-h-12 w-full rounded-md border border-slate-400 bg-white pl-10 pr-3 text-base"
          />
        </div>
        <button type="button" onClick={onScan} className="inline-flex min-h-12 shrink-0 items-center gap-2 rounded-md border-2 border-ice-800 bg-white px-3 font-semibold text-ice-900 hover:bg-ice-50">
          <ScanLine aria-hidden className="size-5" /> Scan
        </button>
      </div>
      {q ? (
        <div aria-live="polite">
          {results.length === 0 ? (
            <p className="rounded-lg border border-dashed border-slate-300 bg-white p-3 text-slate-700">No unit here matches “{query.trim()}”.</p>
          ) : (
            <ul aria-label="Units found" className="space-y-2">
              {results.slice(0, 20).map(row)}
            </ul>
          )}
        </div>
      ) : (
        <>
          {inVisit.length > 0 ? (
            <div className="space-y-2">
              <h3 className="text-sm font-bold uppercase tracking-wide text-slate-700">In this visit</h3>
              <ul aria-label="Units in this visit" className="space-y-2">
                {inVisit.map(row)}
              </ul>
            </div>
          ) : null}
          <div className="space-y-2">
            <h3 className="text-sm font-bold uppercase tracking-wide text-slate-700">{inVisit.length > 0 ? 'Other units by area' : 'Units by area'}</h3>
            {areas.map(([area, items]) => (
              <details key={area || 'none'} className="group rounded-lg border border-slate-300 bg-white">
                <summary className="flex min-h-12 cursor-pointer list-none items-center gap-2 px-3 font-semibold text-slate-900 [&::-webkit-details-marker]:hidden">
                  <ChevronRight aria-hidden className="size-5 shrink-0 text-slate-600 transition-transform group-open:rotate-90" />
                  <span className="min-w-0 flex-1 break-words">{area || 'No area'}</span>
                  <span className="text-sm font-normal text-slate-700">
                    {items.length} {items.length === 1 ? 'unit' : 'units'}
                  </span>
                </summary>
                <ul className="space-y-2 p-2 pt-0">{items.map(row)}</ul>
              </details>
            ))}
          </div>
        </>
      )}
    </section>
  );
}

function UnitButton({ unit, code, touched, onPick }: { unit: EquipmentDto; code: string | null; touched: Touched | undefined; onPick: (id: string) => void }) {
  return (
    <button
      type="button"
      onClick={() => onPick(unit.id)}
      className="flex min-h-14 w-full items-center gap-3 rounded-lg border-2 border-slate-300 bg-white px-3 py-2 text-left hover:border-ice-700 hover:bg-ice-50"
    >
      <EquipmentTypeIcon type={unit.type} className="size-6" />
      <span className="min-w-0 flex-1">
        <span className="block break-words font-semibold text-slate-900">{unit.name}</span>
        <span className="block text-sm text-slate-700">
          {equipmentTypeLabels[unit.type]}
          {code ? (
            <>
              {' · '}
              <span className="whitespace-nowrap font-mono">{formatCode(code)}</span>
            </>
          ) : null}
        </span>
        {touched ? (
          <span className="mt-0.5 flex items-center gap-1 text-sm font-semibold text-emerald-900">
            <CircleCheck aria-hidden className="size-4 shrink-0" /> {touchedWords(touched)}
          </span>
        ) : null}
      </span>
      <ChevronRight aria-hidden className="size-5 shrink-0 text-slate-500" />
    </button>
  );
}
