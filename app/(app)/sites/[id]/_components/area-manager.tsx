'use client';

import { zodResolver } from '@hookform/resolvers/zod';
import { Archive, Pencil, RotateCcw } from 'lucide-react';
import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';
import { BoundField } from '@/components/forms/bound-field';
import { BoundSelect } from '@/components/forms/bound-select';
import { optionsOf } from '@/components/forms/select-options';
import { applyServerErrors } from '@/components/forms/server-errors';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { EmptyState } from '@/components/ui/card';
import type { AreaDto } from '@/lib/sites/dto';
import { useArchiveArea, useSaveArea } from '@/lib/sites/hooks';
import { areaKindLabels, areaKinds, createAreaSchema, type AreaKind } from '@/lib/sites/schemas';

type Values = z.input<typeof createAreaSchema>;

function AreaForm({ siteId, area, onDone }: { siteId: string; area?: AreaDto; onDone: () => void }) {
  const save = useSaveArea(siteId, area?.id);
  const router = useRouter();
  const [banner, setBanner] = useState<string>();
  const form = useForm<Values>({
    resolver: zodResolver(createAreaSchema),
    defaultValues: { name: area?.name ?? '', kind: (area?.kind as AreaKind) ?? 'walk_in_cooler', notes: area?.notes ?? '' },
  });
  const prefix = area ? `area-${area.id}` : 'new-area';
  const onSubmit = form.handleSubmit(async (values) => {
    try {
      await save.mutateAsync(createAreaSchema.parse(values));
      form.reset();
      onDone();
      router.refresh();
    } catch (error) {
      setBanner(applyServerErrors(error, form.setError, ['name', 'kind', 'notes']));
    }
  });
  return (
    <form onSubmit={onSubmit} noValidate className="grid gap-3 rounded-lg border border-slate-200 bg-white p-4 sm:grid-cols-[1fr_1fr_auto] sm:items-end">
      {banner ? <Alert tone="danger" title={banner} className="sm:col-span-3" /> : null}
      <BoundField form={form} name="name" id={`${prefix}-name`} label="Area name" input={{ placeholder: 'Walk-in freezer 1' }} />
      <BoundSelect form={form} name="kind" id={`${prefix}-kind`} label="Kind" options={optionsOf(areaKinds, areaKindLabels)} />
      <div className="flex gap-2">
        <Button type="submit" disabled={form.formState.isSubmitting}>
          {area ? 'Save' : 'Add area'}
        </Button>
        {area ? (
          <Button variant="secondary" onClick={onDone}>
            Cancel
          </Button>
        ) : null}
      </div>
    </form>
  );
}

export function AreaManager({ siteId, areas, canWrite }: { siteId: string; areas: AreaDto[]; canWrite: boolean }) {
  const [editing, setEditing] = useState<string | null>(null);
  const archive = useArchiveArea(siteId);
  const router = useRouter();
  return (
    <div className="space-y-3">
      {areas.length === 0 ? <EmptyState title="No areas yet.">Areas are places on the site: a walk-in freezer, the roof, a mechanical room.</EmptyState> : null}
      {areas.length > 0 ? (
        <ul className="divide-y divide-slate-200 rounded-lg border border-slate-200 bg-white">
          {areas.map((a) =>
            editing === a.id ? (
              <li key={a.id} className="p-2">
                <AreaForm siteId={siteId} area={a} onDone={() => setEditing(null)} />
              </li>
            ) : (
              <li key={a.id} className="flex min-h-14 items-center gap-3 px-4 py-2">
                <span className="min-w-0 flex-1">
                  <span className="block font-semibold">
                    {a.name}
                    {a.archivedAt ? <span className="ml-2 rounded bg-slate-200 px-1.5 text-xs font-medium">Archived</span> : null}
                  </span>
                  <span className="text-sm text-slate-600">{areaKindLabels[a.kind as AreaKind] ?? a.kind}</span>
                </span>
                {canWrite ? (
                  <>
                    <Button variant="ghost" size="sm" onClick={() => setEditing(a.id)} aria-label={`Edit ${a.name}`}>
                      <Pencil aria-hidden className="size-4" /> Edit
                    </Button>
                    <Button
                      variant="ghost"
                      size="sm"
                      aria-label={`${a.archivedAt ? 'Restore' : 'Archive'} ${a.name}`}
                      onClick={async () => {
                        await archive.mutateAsync({ areaId: a.id, archived: !a.archivedAt });
                        router.refresh();
                      }}
                    >
                      {a.archivedAt ? <RotateCcw aria-hidden className="size-4" /> : <Archive aria-hidden className="size-4" />}
                      {a.archivedAt ? 'Restore' : 'Archive'}
                    </Button>
                  </>
                ) : null}
              </li>
            ),
          )}
        </ul>
      ) : null}
      {canWrite ? <AreaForm siteId={siteId} onDone={() => undefined} /> : null}
    </div>
  );
}
