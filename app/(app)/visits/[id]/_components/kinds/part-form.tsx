'use client';

import { useForm } from 'react-hook-form';
import { BoundField } from '@/components/forms/bound-field';
import { FormFooter } from '@/components/forms/form-footer';
import { schemaResolver } from '@/components/forms/schema-resolver';
import { partDataSchema, type PartData } from '@/lib/visits/kinds/part';
import { BoundCheckCard, BoundStepper, NotSaved, useEntrySubmit, type EntryFormProps } from '@/app/(app)/visits/[id]/_components/form-kit';

interface PartValues {
  part: string;
  quantity: number;
  oldSerial: string;
  newSerial: string;
  replacesEquipment: boolean;
}

const resolver = schemaResolver(partDataSchema, (v: PartValues) => v);
const blank: PartValues = { part: '', quantity: 1, oldSerial: '', newSerial: '', replacesEquipment: false };

export function PartForm({ onSubmit, onCancel, equipmentName }: { equipmentName: string } & EntryFormProps<PartData>) {
  const form = useForm<PartValues, unknown, PartData>({ resolver, defaultValues: blank });
  const f = useEntrySubmit(form, onSubmit);
  return (
    <form noValidate className="space-y-4" aria-label="New part replaced" onSubmit={f.submit}>
      <BoundField form={form} name="part" id="part-name" label="Part" input={{ placeholder: 'e.g. condenser fan motor', autoComplete: 'off', className: 'min-h-12' }} />
      <BoundStepper form={form} name="quantity" id="part-quantity" label="Quantity" />
      <div className="grid grid-cols-1 gap-3 min-[400px]:grid-cols-2">
        <BoundField form={form} name="oldSerial" id="part-old-serial" label="Old serial (optional)" input={{ autoComplete: 'off', className: 'min-h-12' }} />
        <BoundField form={form} name="newSerial" id="part-new-serial" label="New serial (optional)" input={{ autoComplete: 'off', className: 'min-h-12' }} />
      </div>
      <BoundCheckCard form={form} name="replacesEquipment" id="part-whole">
        The whole component was replaced
        <span className="block text-sm font-normal text-slate-700">
          “{equipmentName}” is kept with its history and marked removed; a new record takes its place with the new serial.
        </span>
      </BoundCheckCard>
      <NotSaved message={f.message} />
      <FormFooter submitting={f.busy} submitLabel="Save part" onCancel={onCancel} />
    </form>
  );
}
