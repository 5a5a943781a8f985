'use client';

import { useRouter } from 'next/navigation';
import { useMemo, useState, type ReactNode } from 'react';
import { useForm, type Resolver, type UseFormRegister, type UseFormReturn } from 'react-hook-form';
import { FormFooter } from '@/components/forms/form-footer';
import { schemaResolver, type PathErrors } from '@/components/forms/schema-resolver';
import { applyServerErrors } from '@/components/forms/server-errors';
import { EquipmentTypeIcon } from '@/components/equipment/equipment-type-icon';
import { conditionLook } from '@/components/equipment/condition-badge';
import { Alert } from '@/components/ui/alert';
import type { EquipmentDetailDto } from '@/lib/equipment/dto';
import { useSaveEquipment } from '@/lib/equipment/hooks';
import { nameplateFields, type NameplateField } from '@/lib/equipment/nameplate';
import { createEquipmentSchema, type CreateEquipmentInput } from '@/lib/equipment/schemas';
import { CONDITIONS, EQUIPMENT_STATUSES, EQUIPMENT_TYPES, equipmentTypeLabels, statusLabels, type EquipmentStatus, type EquipmentType } from '@/lib/equipment/types';
import type { UnitPrefs } from '@/lib/units/quantities';
import { cn } from '@/lib/utils';
import { fieldLabel, nameplateFromForm, nameplateToForm, rangeText, type NameplateFormValues } from '@/app/(app)/equipment/_components/nameplate-values';
import { BoundField } from '@/components/forms/bound-field';
import { BoundSelect } from '@/components/forms/bound-select';
import { optionsOf } from '@/components/forms/select-options';

/** Everything as the user typed it; numbers become SI only on their way to the schema. */
export interface EquipmentFormValues {
  type: EquipmentType | '';
  name: string;
  make: string;
  model: string;
  serial: string;
  areaId: string;
  systemId: string;
  manufacturedOn: string;
  installedOn: string;
  condition: string;
  conditionNote: string;
  status: EquipmentStatus;
  nameplate: NameplateFormValues;
}

const commonFields = ['type', 'name', 'make', 'model', 'serial', 'areaId', 'systemId', 'manufacturedOn', 'installedOn', 'condition', 'conditionNote', 'status'] as const;

function toSchemaInput(values: EquipmentFormValues, siteId: string, prefs: UnitPrefs) {
  return {
    siteId,
    type: values.type,
    name: values.name,
    make: values.make,
    model: values.model,
    serial: values.serial,
    areaId: values.areaId || null,
    systemId: values.systemId || null,
    manufacturedOn: values.manufacturedOn,
    installedOn: values.installedOn,
    condition: values.condition === '' ? null : Number(values.condition),
    conditionNote: values.conditionNote,
    status: values.status,
    nameplate: values.type ? nameplateFromForm(values.type, values.nameplate, prefs) : {},
  };
}

/** The schema's limits are in SI; say them in the user's units instead. */
function rangeMessagesInUserUnits(errors: PathErrors, type: EquipmentType, prefs: UnitPrefs) {
  for (const field of nameplateFields[type]) {
    const error = errors[`nameplate.${field.key}`];
    const range = rangeText(field, prefs);
    if (error && range && (error.type === 'too_small' || error.type === 'too_big')) error.message = `${field.label} must be ${range}.`;
  }
}

function equipmentResolver(siteId: string, prefs: UnitPrefs): Resolver<EquipmentFormValues, unknown, CreateEquipmentInput> {
  return schemaResolver(createEquipmentSchema, (values: EquipmentFormValues) => toSchemaInput(values, siteId, prefs), {
    adjust: (errors, values) => {
      if (values.type) rangeMessagesInUserUnits(errors, values.type, prefs);
    },
  });
}

function defaultsFrom(equipment: EquipmentDetailDto | undefined, preset: Partial<Pick<EquipmentFormValues, 'type' | 'areaId' | 'systemId'>>, prefs: UnitPrefs): EquipmentFormValues {
  return {
    type: equipment?.type ?? preset.type ?? '',
    name: equipment?.name ?? '',
    make: equipment?.make ?? '',
    model: equipment?.model ?? '',
    serial: equipment?.serial ?? '',
    areaId: equipment ? (equipment.areaId ?? '') : (preset.areaId ?? ''),
    systemId: equipment ? (equipment.systemId ?? '') : (preset.systemId ?? ''),
    manufacturedOn: equipment?.manufacturedOn ?? '',
    installedOn: equipment?.installedOn ?? '',
    condition: equipment?.condition != null ? String(equipment.condition) : '',
    conditionNote: equipment?.conditionNote ?? '',
    status: equipment?.status ?? 'in_service',
    nameplate: equipment ? nameplateToForm(equipment.type, equipment.nameplate, prefs) : {},
  };
}

export function EquipmentForm({
  equipment,
  siteId,
  areas,
  systems,
  preset = {},
  prefs,
}: {
  equipment?: EquipmentDetailDto;
  siteId: string;
  areas: { id: string; name: string }[];
  systems: { id: string; name: string; refrigerant: string }[];
  preset?: Partial<Pick<EquipmentFormValues, 'type' | 'areaId' | 'systemId'>>;
  prefs: UnitPrefs;
}) {
  const router = useRouter();
  const save = useSaveEquipment(equipment?.id);
  const [banner, setBanner] = useState<string>();
  const resolver = useMemo(() => equipmentResolver(siteId, prefs), [siteId, prefs]);
  const form = useForm<EquipmentFormValues, unknown, CreateEquipmentInput>({ resolver, defaultValues: defaultsFrom(equipment, preset, prefs) });
  const errors = form.formState.errors;
  const type = form.watch('type');

  const onSubmit = form.handleSubmit(async (input) => {
    setBanner(undefined);
    try {
      // The type and site of existing equipment are fixed; an edit sends the rest.
      const { siteId: _site, type: _type, ...changes } = input;
      const saved = await save.mutateAsync(equipment ? changes : input);
      router.push(`/equipment/${saved.id}`);
      router.refresh();
    } catch (error) {
      const fields = [...commonFields, ...(type ? nameplateFields[type].map((f) => `nameplate.${f.key}`) : [])];
      setBanner(applyServerErrors(error, form.setError, fields));
    }
  });

  return (
    <form onSubmit={onSubmit} noValidate className="grid max-w-3xl gap-6">
      {banner ? <Alert tone="danger" title={banner}>Your entries are still here; fix the marked fields and save again.</Alert> : null}

      {equipment ? (
        <p className="flex items-center gap-2 text-base font-semibold">
          <EquipmentTypeIcon type={equipment.type} />
          {equipmentTypeLabels[equipment.type]}
          <span className="font-normal text-slate-600">(the type of registered equipment cannot change)</span>
        </p>
      ) : (
        <TypeChoice register={form.register} error={errors.type?.message} />
      )}

      {type ? (
        <>
          <Section title="Identity">
            <BoundField form={form} name="name" label="Name" hint="What technicians call it on site, e.g. “Walk-in cooler evaporator 1”." className="sm:col-span-2" input={{ autoComplete: 'off' }} />
            <BoundField form={form} name="make" label="Make" input={{ autoComplete: 'off' }} />
            <BoundField form={form} name="model" label="Model" input={{ autoComplete: 'off' }} />
            <BoundField form={form} name="serial" label="Serial number" hint="As printed on the nameplate." className="sm:col-span-2" input={{ autoComplete: 'off', autoCapitalize: 'characters', spellCheck: false, className: 'font-mono' }} />
          </Section>

          <Section title="Where it is">
            <BoundSelect
              form={form}
              name="areaId"
              label="Area"
              hint={areas.length === 0 ? 'This site has no areas yet; add them on the site page.' : undefined}
              placeholder="No area"
              options={areas.map((a) => ({ value: a.id, label: a.name }))}
            />
            <BoundSelect
              form={form}
              name="systemId"
              label="System"
              hint={systems.length === 0 ? 'This site has no systems yet.' : 'The refrigeration circuit it belongs to.'}
              placeholder="Not part of a system"
              options={systems.map((s) => ({ value: s.id, label: `${s.name} (${s.refrigerant})` }))}
            />
          </Section>

          <Section title="Condition and status">
            <ConditionChoice register={form.register} error={errors.condition?.message} />
            <BoundField form={form} name="conditionNote" label="Condition note" hint="What you saw, e.g. “coil fins corroded on the left side”." className="sm:col-span-2" multiline />
            <BoundSelect form={form} name="status" label="Status" options={optionsOf(EQUIPMENT_STATUSES, statusLabels)} />
          </Section>

          <Section title="Dates">
            <BoundField form={form} name="manufacturedOn" label="Manufactured" hint="Often coded in the serial; leave empty if unknown." input={{ type: 'date' }} />
            <BoundField form={form} name="installedOn" label="Installed" input={{ type: 'date' }} />
          </Section>

          <Section title={`Nameplate: ${equipmentTypeLabels[type].toLowerCase()}`} note="Every field is optional: record what the nameplate shows.">
            {nameplateFields[type].map((field) => (
              <NameplateInput key={`${type}.${field.key}`} field={field} prefs={prefs} form={form} />
            ))}
          </Section>

          <FormFooter submitting={form.formState.isSubmitting} submitLabel={equipment ? 'Save changes' : 'Register equipment'} />
        </>
      ) : null}
    </form>
  );
}

function Section({ title, note, children }: { title: string; note?: string; children: ReactNode }) {
  return (
    <fieldset className="grid gap-4 rounded-lg border border-slate-200 bg-white p-4 sm:grid-cols-2 sm:p-5">
      <legend className="px-1 text-lg font-semibold text-slate-900">{title}</legend>
      {note ? <p className="-mt-2 text-sm text-slate-600 sm:col-span-2">{note}</p> : null}
      {children}
    </fieldset>
  );
}

// Large radio cards: a whole card is the target, and the native radio keeps keyboard and screen
// reader behaviour intact.
const choiceCard =
  'flex min-h-14 cursor-pointer items-center gap-3 rounded-lg border-2 border-slate-300 bg-white px-3 py-2 font-semibold text-slate-900 has-[:checked]:border-ice-700 has-[:checked]:bg-ice-50 has-[:focus-visible]:outline has-[:focus-visible]:outline-3 has-[:focus-visible]:outline-offset-2 has-[:focus-visible]:outline-ice-500';

function TypeChoice({ register, error }: { register: UseFormRegister<EquipmentFormValues>; error?: string }) {
  // Two columns even at 360 px, so the whole choice fits about one phone screen.
  return (
    <fieldset aria-describedby={error ? 'type-error' : undefined}>
      <legend className="mb-2 text-lg font-semibold text-slate-900">What are you registering?</legend>
      <div className="grid grid-cols-2 gap-2 md:grid-cols-3">
        {EQUIPMENT_TYPES.map((t) => (
          <label key={t} className={cn(choiceCard, 'gap-2 px-2 text-sm sm:gap-3 sm:px-3 sm:text-base')}>
            <input type="radio" value={t} className="size-5 shrink-0 accent-ice-800" {...register('type')} />
            <EquipmentTypeIcon type={t} className="hidden min-[400px]:block" />
            <span className="min-w-0 break-words">{equipmentTypeLabels[t]}</span>
          </label>
        ))}
      </div>
      {error ? (
        <p id="type-error" role="alert" className="mt-2 text-sm font-medium text-red-700">
          {error}
        </p>
      ) : null}
    </fieldset>
  );
}

function ConditionChoice({ register, error }: { register: UseFormRegister<EquipmentFormValues>; error?: string }) {
  const options: { value: string; rating: number | null }[] = [...CONDITIONS.map((c) => ({ value: String(c), rating: c as number | null })), { value: '', rating: null }];
  return (
    <fieldset className="sm:col-span-2" aria-describedby={error ? 'condition-error' : 'condition-hint'}>
      <legend className="mb-1 block text-sm font-semibold text-slate-800">Condition</legend>
      <p id="condition-hint" className="mb-2 text-sm text-slate-600">
        5 is like new, 1 is failing.
      </p>
      <div className="grid grid-cols-2 gap-2 sm:grid-cols-3 lg:grid-cols-6">
        {options.map(({ value, rating }) => {
          const { Icon, word } = conditionLook(rating);
          return (
            <label key={value || 'none'} className={cn(choiceCard, 'flex-col items-start gap-1 sm:min-h-20')}>
              <span className="flex items-center gap-2">
                <input type="radio" value={value} className="size-5 accent-ice-800" {...register('condition')} />
                <Icon aria-hidden className="size-5" />
                {rating !== null ? <span className="text-lg">{rating}</span> : null}
              </span>
              <span className="text-sm">{word}</span>
            </label>
          );
        })}
      </div>
      {error ? (
        <p id="condition-error" role="alert" className="mt-2 text-sm font-medium text-red-700">
          {error}
        </p>
      ) : null}
    </fieldset>
  );
}

function NameplateInput({ field, prefs, form }: { field: NameplateField; prefs: UnitPrefs; form: Pick<UseFormReturn<EquipmentFormValues>, 'register' | 'formState'> }) {
  const bound = { form, name: `nameplate.${field.key}` as const, id: `np-${field.key}`, label: fieldLabel(field, prefs), hint: field.hint };
  switch (field.kind) {
    case 'number':
      // Text with a numeric keypad: iOS's decimal pad has no minus sign, and vacuum and freezer values are negative.
      return <BoundField {...bound} input={{ inputMode: field.min < 0 ? 'text' : 'decimal', autoComplete: 'off' }} />;
    case 'enum':
      return <BoundSelect {...bound} placeholder="Not recorded" options={field.options.map(([value, label]) => ({ value, label }))} />;
    case 'bool':
      return <BoundSelect {...bound} placeholder="Not recorded" options={yesNo} />;
    case 'text':
      return <BoundField {...bound} className={field.max > 100 ? 'sm:col-span-2' : undefined} multiline={field.max > 100} input={{ autoComplete: 'off' }} />;
  }
}

const yesNo = [
  { value: 'true', label: 'Yes' },
  { value: 'false', label: 'No' },
];
