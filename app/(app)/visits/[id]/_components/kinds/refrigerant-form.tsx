'use client';

import { useEffect, useMemo } from 'react';
import { ArrowDownToLine, ArrowUpFromLine } from 'lucide-react';
import { useForm } from 'react-hook-form';
import { BoundField } from '@/components/forms/bound-field';
import { BoundSelect } from '@/components/forms/bound-select';
import { optionsOf } from '@/components/forms/select-options';
import { FormFooter } from '@/components/forms/form-footer';
import { schemaResolver } from '@/components/forms/schema-resolver';
import { UnitNumberField } from '@/components/forms/unit-number-field';
import { CERTIFIED_WORK_CAUTION } from '@/lib/calc/cautions';
import { REFRIGERANT_IDS } from '@/lib/calc/refrigerants';
import { fromDisplayValue } from '@/lib/units/quantities';
import { refrigerantDataSchema, type RefrigerantData } from '@/lib/visits/kinds/refrigerant';
import { BoundChoiceCards, Cautions, NotSaved, useEntrySubmit, type ComputingFormProps } from '@/app/(app)/visits/[id]/_components/form-kit';

const CERT_KEY = 'rimeline:technician-cert';

/** As typed: the amount in the reader's mass unit. */
interface RefrigerantValues {
  direction: 'added' | 'recovered' | '';
  amountKg: string;
  refrigerant: string;
  cylinderId: string;
  technicianCert: string;
}

export function RefrigerantForm({
  ctx,
  prefs,
  refrigerantCautions,
  onSubmit,
  onCancel,
}: ComputingFormProps<RefrigerantData> & { refrigerantCautions: string[] }) {
  const resolver = useMemo(
    () =>
      schemaResolver(
        refrigerantDataSchema,
        (v: RefrigerantValues) => ({ ...v, direction: v.direction || undefined, amountKg: fromDisplayValue(v.amountKg, 'mass', prefs) ?? undefined, refrigerant: v.refrigerant || undefined }),
        { prefs, unitFields: { amountKg: { label: 'Amount', quantity: 'mass' } } },
      ),
    [prefs],
  );
  const form = useForm<RefrigerantValues, unknown, RefrigerantData>({
    resolver,
    defaultValues: { direction: '', amountKg: '', refrigerant: ctx.refrigerant ?? '', cylinderId: '', technicianCert: '' },
  });
  // The certification number is the technician's own: remembered on this phone so it is typed once.
  useEffect(() => form.setValue('technicianCert', window.localStorage.getItem(CERT_KEY) ?? ''), [form]);
  const f = useEntrySubmit(
    form,
    async (data) => {
      const result = await onSubmit(data);
      if (result.ok && data.technicianCert) window.localStorage.setItem(CERT_KEY, data.technicianCert.trim());
      return result;
    },
    () => form.reset({ ...form.formState.defaultValues, refrigerant: form.getValues('refrigerant'), technicianCert: form.getValues('technicianCert') }),
  );
  const refrigerantError = form.formState.errors.refrigerant?.message;
  return (
    <form noValidate className="space-y-4" aria-label="New refrigerant entry" onSubmit={f.submit}>
      <Cautions items={[CERTIFIED_WORK_CAUTION, 'Never add a different refrigerant (“topping off” with another type); a retrofit is recorded on the system first.', ...refrigerantCautions]} title="Refrigerant handling" />
      <BoundChoiceCards
        form={form}
        name="direction"
        id="refrigerant-direction"
        legend="Added or recovered?"
        choices={[
          { value: 'added', label: 'Added', hint: 'Charged into the system', Icon: ArrowDownToLine },
          { value: 'recovered', label: 'Recovered', hint: 'Taken out into a recovery cylinder', Icon: ArrowUpFromLine },
        ]}
      />
      <UnitNumberField form={form} name="amountKg" id="refrigerant-amount" label="Amount" quantity="mass" prefs={prefs} large />
      {ctx.refrigerant ? (
        <p className="rounded-md border border-slate-300 bg-white px-3 py-2">
          Refrigerant: <strong>{ctx.refrigerant}</strong> <span className="text-sm text-slate-700">(the system’s refrigerant)</span>
        </p>
      ) : (
        <BoundSelect form={form} name="refrigerant" id="refrigerant-id" label="Refrigerant" hint="No refrigerant is on record for this system." placeholder="Choose…" options={optionsOf(REFRIGERANT_IDS)} />
      )}
      {refrigerantError && ctx.refrigerant ? (
        <p role="alert" className="text-sm font-medium text-red-700">
          {refrigerantError}
        </p>
      ) : null}
      <div className="grid grid-cols-1 gap-3 min-[400px]:grid-cols-2">
        <BoundField form={form} name="cylinderId" id="refrigerant-cylinder" label="Cylinder id" input={{ placeholder: 'e.g. CYL-0042', autoComplete: 'off', className: 'min-h-12' }} />
        <BoundField form={form} name="technicianCert" id="refrigerant-cert" label="Your certification number" hint="Remembered on this phone." input={{ autoComplete: 'off', className: 'min-h-12' }} />
      </div>
      <p className="text-sm text-slate-700">On an addition the leak rate is worked out from the system’s full charge and its last addition, and shown once the entry is saved.</p>
      <NotSaved message={f.message} />
      <FormFooter submitting={f.busy} submitLabel="Save refrigerant" onCancel={onCancel} />
    </form>
  );
}
