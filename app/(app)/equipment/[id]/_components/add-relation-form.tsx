'use client';

import { useState } from 'react';
import { useForm, type Resolver } from 'react-hook-form';
import { BoundSelect } from '@/components/forms/bound-select';
import { schemaResolver } from '@/components/forms/schema-resolver';
import { applyServerErrors } from '@/components/forms/server-errors';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { ApiError } from '@/lib/api/client';
import type { RelationDto } from '@/lib/equipment/dto';
import { useAddRelation, useSiteEquipment } from '@/lib/equipment/hooks';
import { createRelationSchema, type CreateRelationInput } from '@/lib/equipment/schemas';
import { equipmentTypeLabels, type RelationKind } from '@/lib/equipment/types';

// The form of relation-manager.tsx, in its own module: the form library and the schemas load
// only when someone opens "Change connections", not with the unit page a scan lands on.

// One choice covers both the kind and which end this equipment is, read as a sentence:
// "This equipment is wired to …" / "This equipment is switched by …".
const ways: { value: string; kind: RelationKind; direction: 'from' | 'to'; label: string }[] = [
  { value: 'controls:from', kind: 'controls', direction: 'from', label: 'is wired to (switches)' },
  { value: 'controls:to', kind: 'controls', direction: 'to', label: 'is switched by' },
  { value: 'serves:from', kind: 'serves', direction: 'from', label: 'feeds' },
  { value: 'serves:to', kind: 'serves', direction: 'to', label: 'is fed by' },
];

interface RelationFormValues {
  way: string;
  otherId: string;
}

const relationResolver: Resolver<RelationFormValues, unknown, CreateRelationInput> = schemaResolver(
  createRelationSchema,
  (values: RelationFormValues) => {
    const way = ways.find((w) => w.value === values.way);
    return { kind: way?.kind ?? '', direction: way?.direction ?? 'from', otherId: values.otherId };
  },
  {
    // The kind and its direction are one choice on the form.
    adjust: (errors) => {
      const kind = errors.kind ?? errors.direction;
      if (kind) errors.way = kind;
    },
  },
);

export function AddRelationForm({ equipmentId, siteId, onAdded }: { equipmentId: string; siteId: string; onAdded: (relations: RelationDto[]) => void }) {
  const add = useAddRelation(equipmentId);
  const candidates = useSiteEquipment(siteId);
  const [banner, setBanner] = useState<string>();
  const form = useForm<RelationFormValues, unknown, CreateRelationInput>({ resolver: relationResolver, defaultValues: { way: 'controls:from', otherId: '' } });
  // The list API leaves removed units out; the check here keeps a stale cache from offering one.
  const others = (candidates.data?.items ?? []).filter((e) => e.id !== equipmentId && e.status !== 'removed');

  const onSubmit = form.handleSubmit(async (input) => {
    setBanner(undefined);
    try {
      const result = await add.mutateAsync(input);
      onAdded(result.items);
      form.reset({ way: form.getValues('way'), otherId: '' });
    } catch (error) {
      setBanner(
        error instanceof ApiError && error.code === 'conflict'
          ? 'These two are already connected that way.'
          : applyServerErrors(error, form.setError, ['otherId']),
      );
    }
  });

  return (
    <form onSubmit={onSubmit} noValidate className="grid gap-3 p-4 sm:grid-cols-[minmax(0,14rem)_minmax(0,1fr)_auto] sm:items-end lg:grid-cols-1 xl:grid-cols-[minmax(0,12rem)_minmax(0,1fr)] xl:[&>button]:col-span-2">
      <h3 className="text-base font-semibold sm:col-span-3 lg:col-span-1 xl:col-span-2">Add a connection</h3>
      {banner ? <Alert tone="danger" title={banner} className="sm:col-span-3 lg:col-span-1 xl:col-span-2" /> : null}
      <BoundSelect form={form} name="way" id="relation-way" label="This equipment" options={ways} />
      <BoundSelect
        form={form}
        name="otherId"
        id="relation-other"
        label="Other equipment on this site"
        hint={candidates.isPending ? 'Loading the site’s equipment…' : others.length === 0 ? 'No other equipment on this site yet.' : undefined}
        options={others.map((e) => ({ value: e.id, label: `${e.name} (${equipmentTypeLabels[e.type]}${e.areaName ? `, ${e.areaName}` : ''})` }))}
        placeholder="Choose…"
        disabled={candidates.isPending}
      />
      <Button type="submit" disabled={form.formState.isSubmitting}>
        {form.formState.isSubmitting ? 'Adding…' : 'Add connection'}
      </Button>
      {candidates.isError ? <p className="text-sm text-red-700 sm:col-span-3 lg:col-span-1 xl:col-span-2">The site’s equipment could not be loaded: {(candidates.error as Error).message}</p> : null}
    </form>
  );
}
