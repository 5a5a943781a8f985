'use client';

import { useForm } from 'react-hook-form';
import { BoundField } from '@/components/forms/bound-field';
import { FormFooter } from '@/components/forms/form-footer';
import { schemaResolver } from '@/components/forms/schema-resolver';
import { conditionLook } from '@/components/equipment/condition-badge';
import { CONDITIONS } from '@/lib/equipment/types';
import { conditionDataSchema, type ConditionData } from '@/lib/visits/kinds/condition';
import { BoundChoiceCards, NotSaved, useEntrySubmit, type EntryFormProps } from '@/app/(app)/visits/[id]/_components/form-kit';

interface ConditionValues {
  rating: string;
  note: string;
}

const resolver = schemaResolver(conditionDataSchema, (v: ConditionValues) => ({ rating: v.rating ? Number(v.rating) : undefined, note: v.note }));

export function ConditionForm({ current, onSubmit, onCancel }: { current: number | null } & EntryFormProps<ConditionData>) {
  const form = useForm<ConditionValues, unknown, ConditionData>({ resolver, defaultValues: { rating: current ? String(current) : '', note: '' } });
  const f = useEntrySubmit(form, onSubmit);
  return (
    <form noValidate className="space-y-4" aria-label="New condition rating" onSubmit={f.submit}>
      <BoundChoiceCards
        form={form}
        name="rating"
        id="condition-rating"
        legend="Condition now"
        columns="grid-cols-1 min-[400px]:grid-cols-2 md:grid-cols-5"
        choices={CONDITIONS.map((c) => {
          const look = conditionLook(c);
          return { value: String(c), label: `${c} · ${look.word}`, Icon: look.Icon };
        })}
      />
      <BoundField form={form} name="note" id="condition-note" label="Note (optional)" multiline={2} />
      <NotSaved message={f.message} />
      <FormFooter submitting={f.busy} submitLabel="Save condition" onCancel={onCancel} />
    </form>
  );
}
