'use client';

import { useForm } from 'react-hook-form';
import { BoundField } from '@/components/forms/bound-field';
import { FormFooter } from '@/components/forms/form-footer';
import { schemaResolver } from '@/components/forms/schema-resolver';
import { noteDataSchema, type NoteData } from '@/lib/visits/kinds/note';
import { NotSaved, useEntrySubmit, type EntryFormProps } from '@/app/(app)/visits/[id]/_components/form-kit';

interface NoteValues {
  text: string;
}

const resolver = schemaResolver(noteDataSchema, (v: NoteValues) => v);

export function NoteForm({ onSubmit, onCancel }: EntryFormProps<NoteData>) {
  const form = useForm<NoteValues, unknown, NoteData>({ resolver, defaultValues: { text: '' } });
  const f = useEntrySubmit(form, onSubmit);
  return (
    <form noValidate className="space-y-4" aria-label="New note" onSubmit={f.submit}>
      <BoundField form={form} name="text" id="note-text" label="Note" multiline={4} />
      <NotSaved message={f.message} />
      <FormFooter submitting={f.busy} submitLabel="Save note" onCancel={onCancel} />
    </form>
  );
}
