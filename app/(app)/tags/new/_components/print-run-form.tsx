'use client';

import { useQuery } from '@tanstack/react-query';
import { FileDown, Printer } from 'lucide-react';
import { useRouter } from 'next/navigation';
import { useState, type FormEvent } from 'react';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { Field, Input, Select } from '@/components/ui/field';
import { ApiError, apiFetch } from '@/lib/api/client';
import { useSiteEquipment } from '@/lib/equipment/hooks';
import { equipmentTypeLabels } from '@/lib/equipment/types';
import { formatCode } from '@/lib/tags/code';
import type { LabelLayoutDto } from '@/lib/tags/dto';
import { tagKeys, useCreatePrintRun } from '@/lib/tags/hooks';
import { MAX_LABELS_PER_RUN } from '@/lib/tags/schemas';
import { SelectOptions } from '@/components/forms/select-options';

interface Initial {
  kind: 'equipment' | 'blank';
  siteId?: string;
  equipmentIds?: string[];
  alreadyTagged?: 'skip' | 'replace';
}

function useSiteTagCodes(siteId: string) {
  return useQuery({
    queryKey: [...tagKeys.all, 'site-codes', siteId],
    queryFn: ({ signal }) => apiFetch<{ codes: Record<string, string> }>(`/api/tags?siteId=${siteId}`, { signal }),
    enabled: Boolean(siteId),
  });
}

/** Office: a print run for chosen equipment (tags bound now) or N blank tags for a site (bound on site). */
export function PrintRunForm({ sites, layouts, initial }: { sites: { id: string; name: string; clientName: string }[]; layouts: LabelLayoutDto[]; initial: Initial }) {
  const router = useRouter();
  const create = useCreatePrintRun();
  const [kind, setKind] = useState<'equipment' | 'blank'>(initial.kind);
  const [siteId, setSiteId] = useState(initial.siteId ?? '');
  const [chosen, setChosen] = useState<Set<string>>(new Set(initial.equipmentIds ?? []));
  const [alreadyTagged, setAlreadyTagged] = useState<'skip' | 'replace'>(initial.alreadyTagged ?? 'skip');
  const [count, setCount] = useState('30');
  const [layoutId, setLayoutId] = useState(layouts[0]?.id ?? '');
  const [start, setStart] = useState('1');
  const [error, setError] = useState<string>();
  const [issues, setIssues] = useState<Record<string, string>>({});
  const equipment = useSiteEquipment(siteId);
  const codes = useSiteTagCodes(siteId);
  const layout = layouts.find((l) => l.id === layoutId);
  const perPage = layout ? layout.columns * layout.rows : 1;
  const items = siteId ? (equipment.data?.items ?? []) : [];
  const tagCodes = codes.data?.codes ?? {};

  function toggle(id: string) {
    setChosen((prev) => {
      const next = new Set(prev);
      if (next.has(id)) next.delete(id);
      else next.add(id);
      return next;
    });
  }

  async function submit(e: FormEvent) {
    e.preventDefault();
    setError(undefined);
    setIssues({});
    const startPosition = Number.parseInt(start, 10) || 1;
    try {
      const run = await create.mutateAsync(
        kind === 'equipment'
          ? { kind, equipmentIds: [...chosen].filter((id) => items.some((i) => i.id === id)), alreadyTagged, layoutId, startPosition }
          : { kind, siteId, count: Number.parseInt(count, 10), layoutId, startPosition },
      );
      router.push(`/tags/runs/${run.id}`);
    } catch (err) {
      if (err instanceof ApiError) {
        setError(err.message);
        setIssues(Object.fromEntries(err.issues.map((i) => [i.path.split('.')[0] ?? i.path, i.message])));
      } else setError('Something went wrong. Nothing was printed.');
    }
  }

  return (
    <form onSubmit={submit} noValidate className="max-w-3xl space-y-6">
      {error ? <Alert tone="danger" title={error} /> : null}
      <fieldset className="space-y-2">
        <legend className="mb-1 font-semibold">What to print</legend>
        {(
          [
            ['equipment', 'Tags for registered equipment', 'Each label shows the unit’s type, name, site and area; the tag is attached now.'],
            ['blank', 'Blank tags for a site', 'Technicians attach each tag on site by scanning it and choosing the unit.'],
          ] as const
        ).map(([value, title, hint]) => (
          <label key={value} className="flex min-h-14 cursor-pointer items-start gap-3 rounded-md border border-slate-300 bg-white p-3 has-[:checked]:border-ice-700 has-[:checked]:bg-ice-50">
            <input type="radio" name="kind" value={value} checked={kind === value} onChange={() => setKind(value)} className="mt-1 size-5" />
            <span>
              <span className="block font-semibold">{title}</span>
              <span className="block text-sm text-slate-600">{hint}</span>
            </span>
          </label>
        ))}
      </fieldset>

      <Field id="run-site" label="Site" error={issues.siteId}>
        <Select id="run-site" value={siteId} onChange={(e) => setSiteId(e.target.value)}>
          <option value="">Choose a site</option>
          {sites.map((s) => (
            <option key={s.id} value={s.id}>
              {s.name} ({s.clientName})
            </option>
          ))}
        </Select>
      </Field>

      {kind === 'equipment' ? (
        <fieldset className="space-y-2">
          <legend className="font-semibold">Equipment</legend>
          {!siteId ? (
            <p className="text-sm text-slate-600">Choose a site to list its equipment.</p>
          ) : equipment.isLoading ? (
            <p className="text-sm text-slate-600">Loading equipment…</p>
          ) : items.length === 0 ? (
            <p className="text-sm text-slate-600">No equipment registered on this site. Print blank tags instead, or register equipment first.</p>
          ) : (
            <>
              <div className="flex flex-wrap gap-2">
                <Button variant="secondary" onClick={() => setChosen(new Set(items.filter((i) => !tagCodes[i.id]).map((i) => i.id)))}>
                  Choose all untagged
                </Button>
                <Button variant="ghost" onClick={() => setChosen(new Set())}>
                  Clear
                </Button>
              </div>
              <ul className="max-h-96 divide-y divide-slate-200 overflow-y-auto rounded-md border border-slate-200 bg-white">
                {items.map((i) => (
                  <li key={i.id}>
                    <label className="flex min-h-12 cursor-pointer items-center gap-3 px-3 py-2 has-[:checked]:bg-ice-50">
                      <input type="checkbox" checked={chosen.has(i.id)} onChange={() => toggle(i.id)} className="size-5" />
                      <span className="flex-1">
                        <span className="block font-semibold">{i.name}</span>
                        <span className="block text-sm text-slate-600">
                          {equipmentTypeLabels[i.type]}
                          {i.areaName ? ` · ${i.areaName}` : ''}
                          {tagCodes[i.id] ? ` · tagged ${formatCode(tagCodes[i.id]!)}` : ' · no tag'}
                        </span>
                      </span>
                    </label>
                  </li>
                ))}
              </ul>
              {issues.equipmentIds ? <p className="text-sm font-medium text-red-700">{issues.equipmentIds}</p> : null}
              <div className="space-y-1">
                <p className="text-sm font-semibold">Equipment that already carries a tag</p>
                <label className="flex min-h-11 items-center gap-2">
                  <input type="radio" name="alreadyTagged" checked={alreadyTagged === 'skip'} onChange={() => setAlreadyTagged('skip')} className="size-5" /> Skip it
                </label>
                <label className="flex min-h-11 items-center gap-2">
                  <input type="radio" name="alreadyTagged" checked={alreadyTagged === 'replace'} onChange={() => setAlreadyTagged('replace')} className="size-5" />
                  Print a replacement (the old tag is retired; its scans still lead to the unit)
                </label>
              </div>
            </>
          )}
        </fieldset>
      ) : (
        <Field id="run-count" label="How many blank tags" error={issues.count} hint={`Up to ${MAX_LABELS_PER_RUN} per run.`}>
          <Input id="run-count" type="number" inputMode="numeric" min={1} max={MAX_LABELS_PER_RUN} value={count} onChange={(e) => setCount(e.target.value)} className="max-w-40" />
        </Field>
      )}

      <div className="grid gap-4 sm:grid-cols-2">
        <Field id="run-layout" label="Label layout" error={issues.layoutId}>
          <Select id="run-layout" value={layoutId} onChange={(e) => setLayoutId(e.target.value)}>
            <SelectOptions options={layouts.map((l) => ({ value: l.id, label: l.name }))} />
          </Select>
        </Field>
        <Field
          id="run-start"
          label="Start at label"
          error={issues.startPosition}
          hint={perPage > 1 ? `1 is the top-left label; count left to right, then down (1–${perPage}). Lets a partly used sheet go through again.` : 'One label per page.'}
        >
          <Input id="run-start" type="number" inputMode="numeric" min={1} max={perPage} value={start} onChange={(e) => setStart(e.target.value)} disabled={perPage === 1} className="max-w-40" />
        </Field>
      </div>
      {layout ? (
        <p className="text-sm text-slate-700">
          <a href={`/api/print-runs/calibration?layoutId=${layout.id}`} className="inline-flex min-h-11 items-center gap-1 font-semibold text-ice-800 underline">
            <FileDown aria-hidden className="size-4" /> Calibration page for this layout
          </a>{' '}
          — print it first at actual size to check scaling.
        </p>
      ) : null}

      <Button type="submit" size="lg" disabled={create.isPending || !siteId || (kind === 'equipment' && chosen.size === 0)}>
        <Printer aria-hidden className="size-5" />
        {create.isPending ? 'Making labels…' : kind === 'equipment' ? `Print ${chosen.size} ${chosen.size === 1 ? 'tag' : 'tags'}` : 'Print blank tags'}
      </Button>
    </form>
  );
}
