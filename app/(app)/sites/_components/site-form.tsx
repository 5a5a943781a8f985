'use client';

import { zodResolver } from '@hookform/resolvers/zod';
import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';
import { BoundField } from '@/components/forms/bound-field';
import { BoundSelect } from '@/components/forms/bound-select';
import { optionsOf } from '@/components/forms/select-options';
import { FormFooter } from '@/components/forms/form-footer';
import { applyServerErrors } from '@/components/forms/server-errors';
import { Alert } from '@/components/ui/alert';
import { Field, Input, describedBy } from '@/components/ui/field';
import { useSaveSite } from '@/lib/sites/hooks';
import { createSiteSchema } from '@/lib/sites/schemas';
import type { SiteDto } from '@/lib/sites/dto';

type FormValues = z.input<typeof createSiteSchema>;
type FormOutput = z.output<typeof createSiteSchema>;
const fields = ['clientId', 'name', 'addressLine1', 'addressLine2', 'city', 'region', 'postalCode', 'country', 'timeZone', 'elevationM', 'accessNotes'] as const;
const FEET_PER_M = 1 / 0.3048;

export function SiteForm({
  site,
  clients,
  defaultClientId,
  units,
  timeZones,
}: {
  site?: SiteDto;
  clients: { id: string; name: string }[];
  defaultClientId?: string;
  units: 'imperial' | 'metric';
  timeZones: string[];
}) {
  const router = useRouter();
  const save = useSaveSite(site?.id);
  const [banner, setBanner] = useState<string>();
  const toDisplay = (m: number) => (units === 'imperial' ? String(Math.round(m * FEET_PER_M)) : String(Math.round(m)));
  const form = useForm<FormValues, unknown, FormOutput>({
    resolver: zodResolver(createSiteSchema),
    defaultValues: {
      clientId: site?.clientId ?? defaultClientId ?? '',
      name: site?.name ?? '',
      addressLine1: site?.addressLine1 ?? '',
      addressLine2: site?.addressLine2 ?? '',
      city: site?.city ?? '',
      region: site?.region ?? '',
      postalCode: site?.postalCode ?? '',
      country: site?.country ?? 'US',
      timeZone: site?.timeZone ?? 'America/Chicago',
      elevationM: site?.elevationM ?? 0,
      accessNotes: site?.accessNotes ?? '',
    },
  });
  const [elevation, setElevation] = useState(toDisplay(site?.elevationM ?? 0));
  const errors = form.formState.errors;

  const onSubmit = form.handleSubmit(async (values) => {
    setBanner(undefined);
    try {
      const { clientId, ...rest } = values;
      const saved = await save.mutateAsync(site ? rest : { clientId, ...rest });
      router.push(`/sites/${saved.id}`);
      router.refresh();
    } catch (error) {
      setBanner(applyServerErrors(error, form.setError, fields));
    }
  });

  function onElevation(value: string) {
    setElevation(value);
    const n = Number(value);
    // Stored in metres; a site's elevation sets the barometric pressure for gauge readings.
    form.setValue('elevationM', value.trim() === '' || Number.isNaN(n) ? Number.NaN : units === 'imperial' ? n * 0.3048 : n, { shouldValidate: form.formState.isSubmitted });
  }

  return (
    <form onSubmit={onSubmit} noValidate className="grid max-w-2xl gap-4">
      {banner ? <Alert tone="danger" title={banner} /> : null}
      {!site ? (
        <BoundSelect form={form} name="clientId" label="Client" placeholder="Choose a client…" options={clients.map((c) => ({ value: c.id, label: c.name }))} />
      ) : null}
      <BoundField form={form} name="name" label="Site name" hint="How technicians and the owner call it, e.g. “Harbor Street kitchen”." />
      <BoundField form={form} name="addressLine1" label="Street address" input={{ autoComplete: 'address-line1' }} />
      <BoundField form={form} name="addressLine2" label="Address line 2" input={{ autoComplete: 'address-line2' }} />
      <div className="grid gap-4 sm:grid-cols-3">
        <BoundField form={form} name="city" label="City" />
        <BoundField form={form} name="region" label="State / region" />
        <BoundField form={form} name="postalCode" label="Postal code" />
      </div>
      <div className="grid gap-4 sm:grid-cols-3">
        <BoundField form={form} name="country" label="Country code" input={{ maxLength: 2 }} />
        <BoundSelect form={form} name="timeZone" label="Time zone" hint="Visits at this site show in this zone." options={optionsOf(timeZones)} />
        <Field
          id="elevation"
          label={`Elevation (${units === 'imperial' ? 'ft' : 'm'})`}
          error={errors.elevationM?.message}
          hint="Sets the barometric pressure used to convert gauge readings."
        >
          <Input id="elevation" inputMode="numeric" value={elevation} onChange={(e) => onElevation(e.target.value)} {...describedBy('elevation', errors.elevationM?.message)} />
        </Field>
      </div>
      <BoundField form={form} name="accessNotes" label="Access notes" hint="Roof hatch, keys, hours, who to ask on arrival." multiline />
      <FormFooter submitting={form.formState.isSubmitting} submitLabel={site ? 'Save changes' : 'Create site'} />
    </form>
  );
}
