'use client';

import { useRouter } from 'next/navigation';
import { useMemo, useState } from 'react';
import { useForm, type Resolver } from 'react-hook-form';
import { BoundField } from '@/components/forms/bound-field';
import { BoundSelect } from '@/components/forms/bound-select';
import { optionsOf } from '@/components/forms/select-options';
import { FormFooter } from '@/components/forms/form-footer';
import { schemaResolver } from '@/components/forms/schema-resolver';
import { applyServerErrors } from '@/components/forms/server-errors';
import { UnitNumberField } from '@/components/forms/unit-number-field';
import { Alert } from '@/components/ui/alert';
import { REFRIGERANT_IDS } from '@/lib/calc/refrigerants';
import type { SystemDto } from '@/lib/systems/dto';
import { useSaveSystem } from '@/lib/systems/hooks';
import { createSystemSchema, type CreateSystemInput } from '@/lib/systems/schemas';
import { APPLICATIONS, applicationLabels } from '@/lib/equipment/types';
import { fromDisplayValue, toDisplayValue, type UnitPrefs } from '@/lib/units/quantities';

/** As typed: full charge and box temperature are in the user's units until they reach the schema. */
interface SystemFormValues {
  name: string;
  areaId: string;
  refrigerant: string;
  application: string;
  fullChargeKg: string;
  designBoxTempC: string;
  maintenanceIntervalDays: string;
  notes: string;
}

const fields = ['name', 'areaId', 'refrigerant', 'application', 'fullChargeKg', 'designBoxTempC', 'maintenanceIntervalDays', 'notes'] as const;

function toSchemaInput(v: SystemFormValues, siteId: string, prefs: UnitPrefs) {
  const days = v.maintenanceIntervalDays.trim();
  return {
    siteId,
    name: v.name,
    areaId: v.areaId || null,
    refrigerant: v.refrigerant,
    application: v.application,
    fullChargeKg: fromDisplayValue(v.fullChargeKg, 'mass', prefs),
    designBoxTempC: fromDisplayValue(v.designBoxTempC, 'temperature', prefs),
    maintenanceIntervalDays: days === '' ? null : Number(days),
    notes: v.notes,
  };
}

function systemResolver(siteId: string, prefs: UnitPrefs): Resolver<SystemFormValues, unknown, CreateSystemInput> {
  return schemaResolver(createSystemSchema, (values: SystemFormValues) => toSchemaInput(values, siteId, prefs), {
    prefs,
    unitFields: { fullChargeKg: { label: 'Full charge', quantity: 'mass' }, designBoxTempC: { label: 'Design box temperature', quantity: 'temperature' } },
    adjust: (errors) => {
      const days = errors.maintenanceIntervalDays;
      if (days && (days.type === 'too_small' || days.type === 'too_big')) days.message = 'Use a whole number of days from 7 to 1095.';
    },
  });
}

export function SystemForm({ system, siteId, areas, prefs }: { system?: SystemDto; siteId: string; areas: { id: string; name: string }[]; prefs: UnitPrefs }) {
  const router = useRouter();
  const save = useSaveSystem(system?.id);
  const [banner, setBanner] = useState<string>();
  const resolver = useMemo(() => systemResolver(siteId, prefs), [siteId, prefs]);
  const form = useForm<SystemFormValues, unknown, CreateSystemInput>({
    resolver,
    defaultValues: {
      name: system?.name ?? '',
      areaId: system?.areaId ?? '',
      refrigerant: system?.refrigerant ?? '',
      application: system?.application ?? 'commercial_refrigeration',
      fullChargeKg: toDisplayValue(system?.fullChargeKg, 'mass', prefs),
      designBoxTempC: toDisplayValue(system?.designBoxTempC, 'temperature', prefs),
      maintenanceIntervalDays: system?.maintenanceIntervalDays != null ? String(system.maintenanceIntervalDays) : '',
      notes: system?.notes ?? '',
    },
  });

  const onSubmit = form.handleSubmit(async (input) => {
    setBanner(undefined);
    try {
      const { siteId: _site, ...changes } = input;
      const saved = await save.mutateAsync(system ? changes : input);
      router.push(`/systems/${saved.id}`);
      router.refresh();
    } catch (error) {
      setBanner(applyServerErrors(error, form.setError, fields));
    }
  });

  return (
    <form onSubmit={onSubmit} noValidate className="grid max-w-2xl gap-4">
      {banner ? <Alert tone="danger" title={banner}>Your entries are still here; fix the marked fields and save again.</Alert> : null}
      <BoundField form={form} name="name" label="System name" hint="e.g. “Walk-in cooler system” or “Rack A”." input={{ autoComplete: 'off' }} />
      <div className="grid gap-4 sm:grid-cols-2">
        <BoundSelect form={form} name="refrigerant" label="Refrigerant" hint="ASHRAE number, as on the condensing unit’s nameplate." placeholder="Choose…" options={optionsOf(REFRIGERANT_IDS)} />
        <BoundSelect form={form} name="application" label="Application" hint="Sets the leak-rate thresholds that apply." options={optionsOf(APPLICATIONS, applicationLabels)} />
        <UnitNumberField form={form} name="fullChargeKg" label="Full charge" quantity="mass" prefs={prefs} hint="Total refrigerant in the circuit, if known." />
        <UnitNumberField form={form} name="designBoxTempC" label="Design box temperature" quantity="temperature" prefs={prefs} hint="What the box is meant to hold." negative />
        <BoundSelect form={form} name="areaId" label="Area it serves" placeholder="No particular area" options={areas.map((a) => ({ value: a.id, label: a.name }))} />
        <BoundField form={form} name="maintenanceIntervalDays" label="Maintenance every (days)" hint="Leave empty if there is no plan." input={{ inputMode: 'numeric', autoComplete: 'off' }} />
      </div>
      <BoundField form={form} name="notes" label="Notes" multiline />
      <FormFooter submitting={form.formState.isSubmitting} submitLabel={system ? 'Save changes' : 'Create system'} />
    </form>
  );
}
