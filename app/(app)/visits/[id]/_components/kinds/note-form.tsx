'use client';

import { useState } from 'react';
import { FormActions, useEntryForm, NotSaved, TextArea, type Submit } from '@/app/(app)/visits/[id]/_components/form-kit';

export function NoteForm({ onSubmit, onCancel }: { onSubmit: Submit; onCancel: () => void }) {
  const [text, setText] = useState('');
  const f = useEntryForm(onSubmit, () => setText(''));
  return (
    <form noValidate className="space-y-4" aria-label="New note" onSubmit={(e) => f.run(e, { text })}>
      <TextArea id="note-text" label="Note" value={text} onChange={setText} error={f.errors.text} rows={4} />
      <NotSaved message={f.message} />
      <FormActions busy={f.busy} onCancel={onCancel} label="Save note" />
    </form>
  );
}
