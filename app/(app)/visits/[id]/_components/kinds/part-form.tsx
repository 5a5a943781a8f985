'use client';

import { useState } from 'react';
import { CheckCard, FormActions, Stepper, useEntryForm, NotSaved, TextInput, type Submit } from '@/app/(app)/visits/[id]/_components/form-kit';

export function PartForm({ onSubmit, onCancel, equipmentName }: { onSubmit: Submit; onCancel: () => void; equipmentName: string }) {
  const [part, setPart] = useState('');
  const [quantity, setQuantity] = useState(1);
  const [oldSerial, setOldSerial] = useState('');
  const [newSerial, setNewSerial] = useState('');
  const [whole, setWhole] = useState(false);
  const f = useEntryForm(onSubmit, () => {
    setPart('');
    setQuantity(1);
    setOldSerial('');
    setNewSerial('');
    setWhole(false);
  });
  return (
    <form noValidate className="space-y-4" aria-label="New part replaced" onSubmit={(e) => f.run(e, { part, quantity, oldSerial, newSerial, replacesEquipment: whole })}>
      <TextInput id="part-name" label="Part" placeholder="e.g. condenser fan motor" value={part} onChange={setPart} error={f.errors.part} />
      <Stepper id="part-quantity" label="Quantity" value={quantity} onChange={setQuantity} />
      <div className="grid grid-cols-1 gap-3 min-[400px]:grid-cols-2">
        <TextInput id="part-old-serial" label="Old serial (optional)" value={oldSerial} onChange={setOldSerial} error={f.errors.oldSerial} />
        <TextInput id="part-new-serial" label="New serial (optional)" value={newSerial} onChange={setNewSerial} error={f.errors.newSerial} />
      </div>
      <CheckCard id="part-whole" checked={whole} onChange={setWhole}>
        The whole component was replaced
        <span className="block text-sm font-normal text-slate-700">
          “{equipmentName}” is kept with its history and marked removed; a new record takes its place with the new serial.
        </span>
      </CheckCard>
      <NotSaved message={f.message} />
      <FormActions busy={f.busy} onCancel={onCancel} label="Save part" />
    </form>
  );
}
