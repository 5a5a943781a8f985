'use client';

import { useQuery } from '@tanstack/react-query';
import { FileDown, Printer } from 'lucide-react';
import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { useForm, useWatch } from 'react-hook-form';
import { BoundField } from '@/components/forms/bound-field';
import { BoundSelect } from '@/components/forms/bound-select';
import { schemaResolver } from '@/components/forms/schema-resolver';
import { applyServerErrors } from '@/components/forms/server-errors';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { ApiError, apiFetch } from '@/lib/api/client';
import { useSiteEquipment } from '@/lib/equipment/hooks';
import { equipmentTypeLabels } from '@/lib/equipment/types';
import { formatCode } from '@/lib/tags/code';
import type { LabelLayoutDto } from '@/lib/tags/dto';
import { useCreatePrintRun } from '@/lib/tags/hooks';
import { tagKeys } from '@/lib/tags/keys';
import { createPrintRunSchema, MAX_LABELS_PER_RUN, type CreatePrintRunInput } from '@/lib/tags/schemas';

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

interface RunValues {
  kind: 'equipment' | 'blank';
  siteId: string;
  equipmentIds: string[];
  alreadyTagged: 'skip' | 'replace';
  /** As typed. */
  count: string;
  layoutId: string;
  /** As typed; an empty or unreadable one is the first label. */
  startPosition: string;
}

const runFields = ['siteId', 'equipmentIds', 'count', 'layoutId', 'startPosition'];

// The form's fields are the API's, so the schema's and the server's issues land on them as they are.
const runResolver = schemaResolver(createPrintRunSchema, (v: RunValues) => {
  const startPosition = Number.parseInt(v.startPosition, 10) || 1;
  return v.kind === 'equipment'
    ? { kind: v.kind, equipmentIds: v.equipmentIds, alreadyTagged: v.alreadyTagged, layoutId: v.layoutId, startPosition }
    : { kind: v.kind, siteId: v.siteId, count: v.count.trim() === '' ? undefined : Number(v.count), layoutId: v.layoutId, startPosition };
});

/** Office: a print run for chosen equipment (tags bound now) or N blank tags for a site (bound on site). */
export function PrintRunForm({ sites, layouts, initial }: { sites: { id: string; name: string; clientName: string }[]; layouts: LabelLayoutDto[]; initial: Initial }) {
  const router = useRouter();
  const create = useCreatePrintRun();
  const form = useForm<RunValues, unknown, CreatePrintRunInput>({
    resolver: runResolver,
    defaultValues: {
      kind: initial.kind,
      siteId: initial.siteId ?? '',
      equipmentIds: initial.equipmentIds ?? [],
      alreadyTagged: initial.alreadyTagged ?? 'skip',
      count: '30',
      layoutId: layouts[0]?.id ?? '',
      startPosition: '1',
    },
  });
  const [kind, siteId, chosen, layoutId] = useWatch({ control: form.control, name: ['kind', 'siteId', 'equipmentIds', 'layoutId'] });
  const [error, setError] = useState<string>();
  const equipment = useSiteEquipment(siteId);
  const codes = useSiteTagCodes(siteId);
  const layout = layouts.find((l) => l.id === layoutId);
  const perPage = layout ? layout.columns * layout.rows : 1;
  const items = siteId ? (equipment.data?.items ?? []) : [];
  const tagCodes = codes.data?.codes ?? {};

  const submit = form.handleSubmit(async (input) => {
    setError(undefined);
    try {
      // Units chosen at another site before the site was changed are not printed.
      const run = await create.mutateAsync(input.kind === 'equipment' ? { ...input, equipmentIds: input.equipmentIds.filter((id) => items.some((i) => i.id === id)) } : input);
      router.push(`/tags/runs/${run.id}`);
    } catch (err) {
      setError(err instanceof ApiError ? applyServerErrors(err, form.setError, runFields) : 'Something went wrong. Nothing was printed.');
    }
  });

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
            <input type="radio" value={value} {...form.register('kind')} className="mt-1 size-5" />
            <span>
              <span className="block font-semibold">{title}</span>
              <span className="block text-sm text-slate-600">{hint}</span>
            </span>
          </label>
        ))}
      </fieldset>

      <BoundSelect form={form} name="siteId" id="run-site" label="Site" placeholder="Choose a site" options={sites.map((s) => ({ value: s.id, label: `${s.name} (${s.clientName})` }))} />

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
                <Button variant="secondary" onClick={() => form.setValue('equipmentIds', items.filter((i) => !tagCodes[i.id]).map((i) => i.id))}>
                  Choose all untagged
                </Button>
                <Button variant="ghost" onClick={() => form.setValue('equipmentIds', [])}>
                  Clear
                </Button>
              </div>
              <ul className="max-h-96 divide-y divide-slate-200 overflow-y-auto rounded-md border border-slate-200 bg-white">
                {items.map((i) => (
                  <li key={i.id}>
                    <label className="flex min-h-12 cursor-pointer items-center gap-3 px-3 py-2 has-[:checked]:bg-ice-50">
                      <input type="checkbox" value={i.id} {...form.register('equipmentIds')} className="size-5" />
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
              {form.formState.errors.equipmentIds ? (
                <p role="alert" className="text-sm font-medium text-red-700">
                  {form.formState.errors.equipmentIds.message}
                </p>
              ) : null}
              <div className="space-y-1">
                <p className="text-sm font-semibold">Equipment that already carries a tag</p>
                <label className="flex min-h-11 items-center gap-2">
                  <input type="radio" value="skip" {...form.register('alreadyTagged')} className="size-5" /> Skip it
                </label>
                <label className="flex min-h-11 items-center gap-2">
                  <input type="radio" value="replace" {...form.register('alreadyTagged')} className="size-5" />
                  Print a replacement (the old tag is retired; its scans still lead to the unit)
                </label>
              </div>
            </>
          )}
        </fieldset>
      ) : (
        <BoundField
          form={form}
          name="count"
          id="run-count"
          label="How many blank tags"
          hint={`Up to ${MAX_LABELS_PER_RUN} per run.`}
          input={{ type: 'number', inputMode: 'numeric', min: 1, max: MAX_LABELS_PER_RUN, className: 'max-w-40' }}
        />
      )}

      <div className="grid gap-4 sm:grid-cols-2">
        <BoundSelect form={form} name="layoutId" id="run-layout" label="Label layout" options={layouts.map((l) => ({ value: l.id, label: l.name }))} />
        <BoundField
          form={form}
          name="startPosition"
          id="run-start"
          label="Start at label"
          hint={perPage > 1 ? `1 is the top-left label; count left to right, then down (1–${perPage}). Lets a partly used sheet go through again.` : 'One label per page.'}
          input={{ type: 'number', inputMode: 'numeric', min: 1, max: perPage, disabled: perPage === 1, className: 'max-w-40' }}
        />
      </div>
      {layout ? (
        <p className="text-sm text-slate-700">
          <a href={`/api/print-runs/calibration?layoutId=${layout.id}`} className="inline-flex min-h-11 items-center gap-1 font-semibold text-ice-800 underline">
            <FileDown aria-hidden className="size-4" /> Calibration page for this layout
          </a>{' '}
          — print it first at actual size to check scaling.
        </p>
      ) : null}

      <Button type="submit" size="lg" disabled={create.isPending || !siteId || (kind === 'equipment' && chosen.length === 0)}>
        <Printer aria-hidden className="size-5" />
        {create.isPending ? 'Making labels…' : kind === 'equipment' ? `Print ${chosen.length} ${chosen.length === 1 ? 'tag' : 'tags'}` : 'Print blank tags'}
      </Button>
    </form>
  );
}
