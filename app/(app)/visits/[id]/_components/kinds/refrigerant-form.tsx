'use client';

import { useEffect, useState } from 'react';
import { ArrowDownToLine, ArrowUpFromLine } from 'lucide-react';
import { describedBy, Field, Select } from '@/components/ui/field';
import { CERTIFIED_WORK_CAUTION } from '@/lib/calc/cautions';
import { REFRIGERANT_IDS } from '@/lib/calc/refrigerants';
import { conversionFor, fromDisplayValue, type UnitPrefs } from '@/lib/units/quantities';
import type { EntryContext } from '@/lib/visits/kinds/types';
import { ChoiceCards, Cautions, FormActions, NumberInput, useEntryForm, NotSaved, TextInput, type Submit } from '@/app/(app)/visits/[id]/_components/form-kit';

const CERT_KEY = 'rimeline:technician-cert';

export function RefrigerantForm({
  ctx,
  prefs,
  refrigerantCautions,
  onSubmit,
  onCancel,
}: {
  ctx: EntryContext;
  prefs: UnitPrefs;
  refrigerantCautions: string[];
  onSubmit: Submit;
  onCancel: () => void;
}) {
  const [direction, setDirection] = useState<'added' | 'recovered' | ''>('');
  const [amount, setAmount] = useState('');
  const [refrigerant, setRefrigerant] = useState(ctx.refrigerant ?? '');
  const [cylinderId, setCylinderId] = useState('');
  const [cert, setCert] = useState('');
  // The certification number is the technician's own: remembered on this phone so it is typed once.
  useEffect(() => setCert(window.localStorage.getItem(CERT_KEY) ?? ''), []);
  const f = useEntryForm(
    async (data) => {
      const result = await onSubmit(data);
      if (result.ok && cert.trim()) window.localStorage.setItem(CERT_KEY, cert.trim());
      return result;
    },
    () => {
      setDirection('');
      setAmount('');
      setCylinderId('');
    },
  );
  const mass = conversionFor('mass', prefs);
  return (
    <form
      noValidate
      className="space-y-4"
      aria-label="New refrigerant entry"
      onSubmit={(e) =>
        f.run(e, { direction: direction || undefined, amountKg: fromDisplayValue(amount, 'mass', prefs) ?? undefined, refrigerant: refrigerant || undefined, cylinderId, technicianCert: cert })
      }
    >
      <Cautions items={[CERTIFIED_WORK_CAUTION, 'Never add a different refrigerant (“topping off” with another type); a retrofit is recorded on the system first.', ...refrigerantCautions]} title="Refrigerant handling" />
      <ChoiceCards<'added' | 'recovered'>
        name="refrigerant-direction"
        legend="Added or recovered?"
        value={direction}
        onChange={setDirection}
        error={f.errors.direction}
        choices={[
          { value: 'added', label: 'Added', hint: 'Charged into the system', Icon: ArrowDownToLine },
          { value: 'recovered', label: 'Recovered', hint: 'Taken out into a recovery cylinder', Icon: ArrowUpFromLine },
        ]}
      />
      <NumberInput id="refrigerant-amount" label="Amount" unit={mass.label} value={amount} onChange={setAmount} error={f.errors.amountKg} />
      {ctx.refrigerant ? (
        <p className="rounded-md border border-slate-300 bg-white px-3 py-2">
          Refrigerant: <strong>{ctx.refrigerant}</strong> <span className="text-sm text-slate-700">(the system’s refrigerant)</span>
        </p>
      ) : (
        <Field id="refrigerant-id" label="Refrigerant" error={f.errors.refrigerant} hint="No refrigerant is on record for this system.">
          <Select id="refrigerant-id" value={refrigerant} onChange={(e) => setRefrigerant(e.target.value)} {...describedBy('refrigerant-id', f.errors.refrigerant)}>
            <option value="">Choose…</option>
            {REFRIGERANT_IDS.map((r) => (
              <option key={r} value={r}>
                {r}
              </option>
            ))}
          </Select>
        </Field>
      )}
      {f.errors.refrigerant && ctx.refrigerant ? (
        <p role="alert" className="text-sm font-medium text-red-700">
          {f.errors.refrigerant}
        </p>
      ) : null}
      <div className="grid grid-cols-1 gap-3 min-[400px]:grid-cols-2">
        <TextInput id="refrigerant-cylinder" label="Cylinder id" placeholder="e.g. CYL-0042" value={cylinderId} onChange={setCylinderId} error={f.errors.cylinderId} />
        <TextInput id="refrigerant-cert" label="Your certification number" value={cert} onChange={setCert} error={f.errors.technicianCert} hint="Remembered on this phone." />
      </div>
      <p className="text-sm text-slate-700">On an addition the leak rate is worked out from the system’s full charge and its last addition, and shown once the entry is saved.</p>
      <NotSaved message={f.message} />
      <FormActions busy={f.busy} onCancel={onCancel} label="Save refrigerant" />
    </form>
  );
}
