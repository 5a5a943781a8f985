'use client';

import { useState } from 'react';
import { Alert } from '@/components/ui/alert';
import { SAFETY_CONTROL_CAUTION } from '@/lib/calc/cautions';
import { CheckCard, FormActions, useEntryForm, NotSaved, TextArea, TextInput, type Submit } from '@/app/(app)/visits/[id]/_components/form-kit';

export function ActionForm({ onSubmit, onCancel }: { onSubmit: Submit; onCancel: () => void }) {
  const [text, setText] = useState('');
  const [bypass, setBypass] = useState(false);
  const [description, setDescription] = useState('');
  const f = useEntryForm(onSubmit, () => {
    setText('');
    setBypass(false);
    setDescription('');
  });
  return (
    <form noValidate className="space-y-4" aria-label="New action" onSubmit={(e) => f.run(e, { text, bypassedControl: bypass, bypassDescription: bypass ? description : '' })}>
      <TextArea id="action-text" label="What was done" value={text} onChange={setText} error={f.errors.text} />
      <CheckCard id="action-bypass" checked={bypass} onChange={setBypass} tone="warning">
        I bypassed a safety or operating control (jumper) to diagnose
        <span className="block text-sm font-normal text-slate-700">For example a jumper across a pressure control or a thermostat.</span>
      </CheckCard>
      {bypass ? (
        <>
          <Alert tone="danger" title="Remove the jumper before you leave">
            <p>{SAFETY_CONTROL_CAUTION}</p>
            <p className="mt-1 font-semibold">This visit cannot be closed until you confirm the bypass was removed.</p>
          </Alert>
          <TextInput
            id="action-bypass-description"
            label="Which control was bypassed, and how"
            placeholder="e.g. jumper across the low-pressure control"
            value={description}
            onChange={setDescription}
            error={f.errors.bypassDescription}
          />
        </>
      ) : null}
      <NotSaved message={f.message} />
      <FormActions busy={f.busy} onCancel={onCancel} label="Save action" />
    </form>
  );
}
