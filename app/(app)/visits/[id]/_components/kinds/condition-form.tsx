'use client';

import { useState } from 'react';
import { conditionLook } from '@/components/equipment/condition-badge';
import { CONDITIONS } from '@/lib/equipment/types';
import { ChoiceCards, FormActions, useEntryForm, NotSaved, TextArea, type Submit } from '@/app/(app)/visits/[id]/_components/form-kit';

export function ConditionForm({ current, onSubmit, onCancel }: { current: number | null; onSubmit: Submit; onCancel: () => void }) {
  const [rating, setRating] = useState<string>(current ? String(current) : '');
  const [note, setNote] = useState('');
  const f = useEntryForm(onSubmit, () => setNote(''));
  return (
    <form noValidate className="space-y-4" aria-label="New condition rating" onSubmit={(e) => f.run(e, { rating: rating ? Number(rating) : undefined, note })}>
      <ChoiceCards<string>
        name="condition-rating"
        legend="Condition now"
        value={rating}
        onChange={setRating}
        error={f.errors.rating}
        columns="grid-cols-1 min-[400px]:grid-cols-2 md:grid-cols-5"
        choices={CONDITIONS.map((c) => {
          const look = conditionLook(c);
          return { value: String(c), label: `${c} · ${look.word}`, Icon: look.Icon };
        })}
      />
      <TextArea id="condition-note" label="Note (optional)" value={note} onChange={setNote} error={f.errors.note} rows={2} />
      <NotSaved message={f.message} />
      <FormActions busy={f.busy} onCancel={onCancel} label="Save condition" />
    </form>
  );
}
