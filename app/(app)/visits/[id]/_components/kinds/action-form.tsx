'use client';

import { useForm, useWatch } from 'react-hook-form';
import { BoundField } from '@/components/forms/bound-field';
import { FormFooter } from '@/components/forms/form-footer';
import { schemaResolver } from '@/components/forms/schema-resolver';
import { Alert } from '@/components/ui/alert';
import { SAFETY_CONTROL_CAUTION } from '@/lib/calc/cautions';
import { actionDataSchema, type ActionData } from '@/lib/visits/kinds/action';
import { BoundCheckCard, NotSaved, useEntrySubmit, type EntryFormProps } from '@/app/(app)/visits/[id]/_components/form-kit';

interface ActionValues {
  text: string;
  bypassedControl: boolean;
  bypassDescription: string;
}

const resolver = schemaResolver(actionDataSchema, (v: ActionValues) => ({ ...v, bypassDescription: v.bypassedControl ? v.bypassDescription : '' }));
const blank: ActionValues = { text: '', bypassedControl: false, bypassDescription: '' };

export function ActionForm({ onSubmit, onCancel }: EntryFormProps<ActionData>) {
  const form = useForm<ActionValues, unknown, ActionData>({ resolver, defaultValues: blank });
  const f = useEntrySubmit(form, onSubmit);
  const bypass = useWatch({ control: form.control, name: 'bypassedControl' });
  return (
    <form noValidate className="space-y-4" aria-label="New action" onSubmit={f.submit}>
      <BoundField form={form} name="text" id="action-text" label="What was done" multiline={3} />
      <BoundCheckCard form={form} name="bypassedControl" id="action-bypass" tone="warning">
        I bypassed a safety or operating control (jumper) to diagnose
        <span className="block text-sm font-normal text-slate-700">For example a jumper across a pressure control or a thermostat.</span>
      </BoundCheckCard>
      {bypass ? (
        <>
          <Alert tone="danger" title="Remove the jumper before you leave">
            <p>{SAFETY_CONTROL_CAUTION}</p>
            <p className="mt-1 font-semibold">This visit cannot be closed until you confirm the bypass was removed.</p>
          </Alert>
          <BoundField
            form={form}
            name="bypassDescription"
            id="action-bypass-description"
            label="Which control was bypassed, and how"
            input={{ placeholder: 'e.g. jumper across the low-pressure control', autoComplete: 'off', className: 'min-h-12' }}
          />
        </>
      ) : null}
      <NotSaved message={f.message} />
      <FormFooter submitting={f.busy} submitLabel="Save action" onCancel={onCancel} />
    </form>
  );
}
