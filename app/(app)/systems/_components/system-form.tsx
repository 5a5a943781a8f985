'use client';

import { zodResolver } from '@hookform/resolvers/zod';
import { useRouter } from 'next/navigation';
import { useMemo, useState } from 'react';
import { useForm, type FieldErrors, type Resolver, type ResolverResult } from 'react-hook-form';
import { BoundField } from '@/components/forms/bound-field';
import { FormFooter } from '@/components/forms/form-footer';
import { applyServerErrors } from '@/components/forms/server-errors';
import { Alert } from '@/components/ui/alert';
import { Field, Input, Select, describedBy } from '@/components/ui/field';
import { REFRIGERANT_IDS } from '@/lib/calc/refrigerants';
import type { SystemDto } from '@/lib/systems/dto';
import { useSaveSystem } from '@/lib/systems/hooks';
import { createSystemSchema, type CreateSystemInput } from '@/lib/systems/schemas';
import { APPLICATIONS, applicationLabels } from '@/lib/equipment/types';
import { conversionFor, formatQuantity, fromDisplayValue, toDisplayValue, type UnitPrefs } from '@/lib/units/quantities';

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
  const base = zodResolver(createSystemSchema);
  return async (values, context, options) => {
    const result = await base(toSchemaInput(values, siteId, prefs) as never, context, options as never);
    // The schema's limits are SI; say them in the user's units.
    const errors = result.errors as FieldErrors<SystemFormValues>;
    const outOfRange = (e?: { type?: unknown }) => e?.type === 'too_small' || e?.type === 'too_big';
    if (errors.designBoxTempC && outOfRange(errors.designBoxTempC)) {
      errors.designBoxTempC.message = `Design box temperature must be between ${formatQuantity(-60, 'temperature', prefs)} and ${formatQuantity(30, 'temperature', prefs)}.`;
    }
    if (errors.fullChargeKg?.type === 'too_big') errors.fullChargeKg.message = `Full charge must be at most ${formatQuantity(20_000, 'mass', prefs)}.`;
    if (errors.maintenanceIntervalDays && outOfRange(errors.maintenanceIntervalDays)) errors.maintenanceIntervalDays.message = 'Use a whole number of days from 7 to 1095.';
    return result as unknown as ResolverResult<SystemFormValues, CreateSystemInput>;
  };
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
  const errors = form.formState.errors;
  const mass = conversionFor('mass', prefs).label;
  const temp = conversionFor('temperature', prefs).label;

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
      <Field id="name" label="System name" error={errors.name?.message} hint="e.g. “Walk-in cooler system” or “Rack A”.">
        <Input id="name" autoComplete="off" {...describedBy('name', errors.name?.message)} {...form.register('name')} />
      </Field>
      <div className="grid gap-4 sm:grid-cols-2">
        <Field id="refrigerant" label="Refrigerant" error={errors.refrigerant?.message} hint="ASHRAE number, as on the condensing unit’s nameplate.">
          <Select id="refrigerant" {...describedBy('refrigerant', errors.refrigerant?.message)} {...form.register('refrigerant')}>
            <option value="">Choose…</option>
            {REFRIGERANT_IDS.map((r) => (
              <option key={r} value={r}>
                {r}
              </option>
            ))}
          </Select>
        </Field>
        <Field id="application" label="Application" error={errors.application?.message} hint="Sets the leak-rate thresholds that apply.">
          <Select id="application" {...describedBy('application', errors.application?.message)} {...form.register('application')}>
            {APPLICATIONS.map((a) => (
              <option key={a} value={a}>
                {applicationLabels[a]}
              </option>
            ))}
          </Select>
        </Field>
        <Field id="fullChargeKg" label={`Full charge (${mass})`} error={errors.fullChargeKg?.message} hint="Total refrigerant in the circuit, if known.">
          <Input id="fullChargeKg" inputMode="decimal" autoComplete="off" {...describedBy('fullChargeKg', errors.fullChargeKg?.message)} {...form.register('fullChargeKg')} />
        </Field>
        <Field id="designBoxTempC" label={`Design box temperature (${temp})`} error={errors.designBoxTempC?.message} hint="What the box is meant to hold.">
          <Input id="designBoxTempC" inputMode="text" autoComplete="off" {...describedBy('designBoxTempC', errors.designBoxTempC?.message)} {...form.register('designBoxTempC')} />
        </Field>
        <Field id="areaId" label="Area it serves" error={errors.areaId?.message}>
          <Select id="areaId" {...describedBy('areaId', errors.areaId?.message)} {...form.register('areaId')}>
            <option value="">No particular area</option>
            {areas.map((a) => (
              <option key={a.id} value={a.id}>
                {a.name}
              </option>
            ))}
          </Select>
        </Field>
        <Field id="maintenanceIntervalDays" label="Maintenance every (days)" error={errors.maintenanceIntervalDays?.message} hint="Leave empty if there is no plan.">
          <Input id="maintenanceIntervalDays" inputMode="numeric" autoComplete="off" {...describedBy('maintenanceIntervalDays', errors.maintenanceIntervalDays?.message)} {...form.register('maintenanceIntervalDays')} />
        </Field>
      </div>
      <BoundField form={form} name="notes" label="Notes" multiline />
      <FormFooter submitting={form.formState.isSubmitting} submitLabel={system ? 'Save changes' : 'Create system'} />
    </form>
  );
}
