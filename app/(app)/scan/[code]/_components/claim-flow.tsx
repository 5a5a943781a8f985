'use client';

import { Link2, PlusCircle, Search } from 'lucide-react';
import { useRouter } from 'next/navigation';
import { useMemo, useState, type FormEvent } from 'react';
import { useForm } from 'react-hook-form';
import { BoundField } from '@/components/forms/bound-field';
import { BoundSelect } from '@/components/forms/bound-select';
import { optionsOf } from '@/components/forms/select-options';
import { applyServerErrors } from '@/components/forms/server-errors';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { Input } from '@/components/ui/field';
import { ApiError } from '@/lib/api/client';
import { EQUIPMENT_TYPES, equipmentTypeLabels, type EquipmentType } from '@/lib/equipment/types';
import { formatCode } from '@/lib/tags/code';
import { useAttachTag } from '@/lib/tags/hooks';

export interface ClaimEquipment {
  id: string;
  name: string;
  type: EquipmentType;
  areaName: string | null;
  /** The tag it carries now, if any: attaching replaces it. */
  tagCode: string | null;
}

/** Claiming a blank tag on site: pick the unit it goes on, or register the unit here and attach. */
interface NewUnitValues {
  newEquipment: { type: string; name: string; areaId: string; make: string; model: string; serial: string };
}
const newUnitFields = ['type', 'name', 'areaId', 'make', 'model', 'serial'].map((f) => `newEquipment.${f}`);

export function ClaimFlow({
  code,
  siteName,
  equipment,
  areas,
  canCreate,
}: {
  code: string;
  siteName: string;
  equipment: ClaimEquipment[];
  areas: { id: string; name: string }[];
  canCreate: boolean;
}) {
  const router = useRouter();
  const attach = useAttachTag();
  const [q, setQ] = useState('');
  const [chosen, setChosen] = useState<string>('');
  const [error, setError] = useState<string>();
  const form = useForm<NewUnitValues>({ defaultValues: { newEquipment: { type: '', name: '', areaId: '', make: '', model: '', serial: '' } } });

  const shown = useMemo(() => {
    const needle = q.trim().toLowerCase();
    const list = needle ? equipment.filter((e) => `${e.name} ${e.areaName ?? ''} ${equipmentTypeLabels[e.type]}`.toLowerCase().includes(needle)) : equipment;
    // Untagged units first: they are the ones waiting for this tag.
    return [...list].sort((a, b) => Number(a.tagCode !== null) - Number(b.tagCode !== null) || a.name.localeCompare(b.name));
  }, [equipment, q]);
  const chosenUnit = equipment.find((e) => e.id === chosen);

  function fail(e: unknown) {
    setError(e instanceof ApiError ? e.message : 'Something went wrong. Nothing was saved.');
  }

  async function attachExisting(e: FormEvent) {
    e.preventDefault();
    if (!chosen) {
      setError('Choose the equipment this tag goes on.');
      return;
    }
    setError(undefined);
    try {
      const result = await attach.mutateAsync({ code, input: { equipmentId: chosen } });
      router.push(`/equipment/${result.equipmentId}?tag=attached`);
      router.refresh();
    } catch (err) {
      fail(err);
    }
  }

  // The server checks the new unit (its issues name `newEquipment.<field>`, the form's own names).
  const createAndAttach = form.handleSubmit(async ({ newEquipment: n }) => {
    setError(undefined);
    try {
      const result = await attach.mutateAsync({
        code,
        input: { newEquipment: { type: n.type, name: n.name, areaId: n.areaId || null, make: n.make || null, model: n.model || null, serial: n.serial || null } },
      });
      router.push(`/equipment/${result.equipmentId}?tag=attached`);
      router.refresh();
    } catch (err) {
      setError(applyServerErrors(err, form.setError, newUnitFields));
    }
  });

  return (
    <div className="space-y-6">
      {error ? <Alert tone="danger" title={error} /> : null}
      <section aria-labelledby="existing-h" className="space-y-3 rounded-lg border border-slate-200 bg-white p-4">
        <h2 id="existing-h" className="flex items-center gap-2 text-lg font-semibold">
          <Link2 aria-hidden className="size-5" /> Put it on equipment at {siteName}
        </h2>
        {equipment.length === 0 ? (
          <p className="text-slate-700">No equipment is registered on this site yet. Register the unit below.</p>
        ) : (
          <form onSubmit={attachExisting} className="space-y-3">
            <div className="relative">
              <label htmlFor="claim-q" className="sr-only">
                Find equipment
              </label>
              <Search aria-hidden className="pointer-events-none absolute left-3 top-1/2 size-5 -translate-y-1/2 text-slate-500" />
              <Input id="claim-q" type="search" value={q} onChange={(e) => setQ(e.target.value)} placeholder="Find by name, type or area" className="min-h-12 pl-10" />
            </div>
            <fieldset>
              <legend className="sr-only">Equipment on this site</legend>
              <ul className="max-h-[28rem] divide-y divide-slate-200 overflow-y-auto rounded-md border border-slate-200">
                {shown.map((e) => (
                  <li key={e.id}>
                    <label className="flex min-h-14 cursor-pointer items-center gap-3 px-3 py-2 has-[:checked]:bg-ice-50">
                      <input type="radio" name="equipmentId" value={e.id} checked={chosen === e.id} onChange={() => setChosen(e.id)} className="size-6 shrink-0" />
                      <span className="min-w-0 flex-1">
                        <span className="block font-semibold">{e.name}</span>
                        <span className="block text-sm text-slate-600">
                          {equipmentTypeLabels[e.type]}
                          {e.areaName ? ` · ${e.areaName}` : ''}
                          {e.tagCode ? ` · tagged ${formatCode(e.tagCode)}` : ' · no tag'}
                        </span>
                      </span>
                    </label>
                  </li>
                ))}
              </ul>
            </fieldset>
            {chosenUnit?.tagCode ? (
              <Alert tone="warning" title={`${chosenUnit.name} already carries tag ${formatCode(chosenUnit.tagCode)}.`}>
                Attaching this tag replaces it: the old tag is retired, and scanning it still leads to this unit.
              </Alert>
            ) : null}
            <Button type="submit" size="lg" className="min-h-14 w-full text-lg sm:w-auto" disabled={attach.isPending || !chosen}>
              {attach.isPending ? 'Attaching…' : chosenUnit ? `Attach tag to ${chosenUnit.name}` : 'Attach tag'}
            </Button>
          </form>
        )}
      </section>

      {canCreate ? (
        <section aria-labelledby="new-h" className="space-y-3 rounded-lg border border-slate-200 bg-white p-4">
          <h2 id="new-h" className="flex items-center gap-2 text-lg font-semibold">
            <PlusCircle aria-hidden className="size-5" /> Or register the unit and attach the tag
          </h2>
          <form onSubmit={createAndAttach} noValidate className="grid gap-3 sm:grid-cols-2">
            <BoundSelect form={form} name="newEquipment.type" id="new-type" label="Type" placeholder="Choose a type" options={optionsOf(EQUIPMENT_TYPES, equipmentTypeLabels)} className="[&_select]:min-h-12" />
            <BoundField form={form} name="newEquipment.name" id="new-name" label="Name" hint="As people on site call it, e.g. Walk-in cooler condensing unit." input={{ className: 'min-h-12' }} />
            <BoundSelect form={form} name="newEquipment.areaId" id="new-area" label="Area" placeholder="No area" options={areas.map((a) => ({ value: a.id, label: a.name }))} className="[&_select]:min-h-12" />
            <BoundField form={form} name="newEquipment.make" id="new-make" label="Make" input={{ className: 'min-h-12' }} />
            <BoundField form={form} name="newEquipment.model" id="new-model" label="Model" input={{ className: 'min-h-12' }} />
            <BoundField form={form} name="newEquipment.serial" id="new-serial" label="Serial" input={{ className: 'min-h-12' }} />
            <div className="sm:col-span-2">
              <Button type="submit" size="lg" className="min-h-14 w-full text-lg sm:w-auto" disabled={attach.isPending}>
                {attach.isPending ? 'Saving…' : 'Register and attach tag'}
              </Button>
            </div>
          </form>
        </section>
      ) : null}
    </div>
  );
}
