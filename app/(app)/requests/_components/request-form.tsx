'use client';

import { zodResolver } from '@hookform/resolvers/zod';
import { useRouter } from 'next/navigation';
import { useEffect, useState } from 'react';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';
import { BoundField } from '@/components/forms/bound-field';
import { BoundSelect } from '@/components/forms/bound-select';
import { applyServerErrors } from '@/components/forms/server-errors';
import { ApiError } from '@/lib/api/client';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { useCreateRequest, useSiteEquipmentChoices } from '@/lib/requests/hooks';
import { photoFileProblem } from '@/lib/photos/schemas';
import { createRequestSchema, URGENCIES, urgencyLabels } from '@/lib/requests/schemas';
import { RequestPhotoField } from '@/app/(app)/requests/_components/request-photo';

type Values = z.input<typeof createRequestSchema>;
type Output = z.output<typeof createRequestSchema>;

export function RequestForm({ sites, siteId, equipmentId }: { sites: { id: string; name: string }[]; siteId?: string; equipmentId?: string }) {
  const router = useRouter();
  const create = useCreateRequest();
  const [banner, setBanner] = useState<string>();
  const [photo, setPhoto] = useState<File | null>(null);
  const [photoError, setPhotoError] = useState<string>();
  const form = useForm<Values, unknown, Output>({
    resolver: zodResolver(createRequestSchema),
    defaultValues: { siteId: siteId ?? (sites.length === 1 ? sites[0]!.id : ''), equipmentId: equipmentId ?? null, description: '', urgency: 'soon' },
  });
  const chosenSite = form.watch('siteId');
  const chosenUnit = form.watch('equipmentId');
  const equipment = useSiteEquipmentChoices(chosenSite);
  const errors = form.formState.errors;
  // The unit's option exists only once the site's units have loaded: select the unit then, so
  // the page opened from a unit (or a scanned tag) shows that unit rather than "Not sure".
  const loadedUnits = equipment.data;
  useEffect(() => {
    const current = form.getValues('equipmentId');
    if (loadedUnits && current) form.setValue('equipmentId', current);
  }, [loadedUnits, form]);
  const onSubmit = form.handleSubmit(async (values) => {
    setBanner(undefined);
    setPhotoError(undefined);
    const sendPhoto = values.equipmentId ? photo : null;
    try {
      const saved = await create.mutateAsync({ ...values, equipmentId: values.equipmentId || null, photo: sendPhoto });
      router.push(`/requests/${saved.id}?sent=1`);
      router.refresh();
    } catch (error) {
      // A refused image (type, size, unreadable) is the photo's problem, not the whole form's.
      const photoRefused = error instanceof ApiError && (['unsupported_media_type', 'payload_too_large'].includes(error.code) || error.issues.some((i) => i.path === 'file'));
      if (sendPhoto && photoRefused) {
        setPhotoError(`${error.issues.find((i) => i.path === 'file')?.message ?? error.message} Nothing was sent; choose another photo or remove it.`);
        setBanner('The photo could not be used. Nothing was sent.');
      } else {
        setBanner(applyServerErrors(error, form.setError, ['siteId', 'equipmentId', 'description', 'urgency']));
      }
    }
  });
  return (
    <form onSubmit={onSubmit} noValidate className="grid max-w-2xl gap-4">
      {banner ? <Alert tone="danger" title={banner} /> : null}
      <BoundSelect
        form={form}
        name="siteId"
        id="req-site"
        label="Site"
        placeholder="Choose a site…"
        options={sites.map((site) => ({ value: site.id, label: site.name }))}
        rules={{ onChange: () => form.setValue('equipmentId', null) }}
      />
      <BoundSelect
        form={form}
        name="equipmentId"
        id="req-unit"
        label="Which unit (if you know)"
        hint={equipment.isLoading ? 'Loading the units of this site…' : undefined}
        disabled={!chosenSite}
        placeholder="Not sure / the whole site"
        options={(equipment.data?.items ?? []).map((e) => ({ value: e.id, label: `${e.name}${e.areaName ? ` — ${e.areaName}` : ''}` }))}
        rules={{ setValueAs: (v: string) => v || null }}
      />
      <BoundField form={form} name="description" id="req-desc" label="What is wrong" hint="What you see or hear, the box temperature if you know it, since when." multiline={5} />
      <RequestPhotoField
        file={photo}
        error={photoError}
        disabledReason={chosenUnit ? undefined : 'Choose the unit above to add a photo of it.'}
        onChange={(file) => {
          setPhotoError(file ? photoFileProblem(file) : undefined);
          setPhoto(file && !photoFileProblem(file) ? file : null);
        }}
      />
      <fieldset className="space-y-2">
        <legend className="text-sm font-semibold">How urgent</legend>
        {URGENCIES.map((u) => (
          <label key={u} className="flex min-h-12 items-center gap-3 rounded-md border border-slate-300 bg-white px-3">
            <input type="radio" value={u} className="size-5" {...form.register('urgency')} />
            {urgencyLabels[u]}
          </label>
        ))}
        {errors.urgency?.message ? <p role="alert" className="text-sm font-medium text-red-700">{errors.urgency.message}</p> : null}
      </fieldset>
      <Alert tone="warning" title="If food safety is at risk right now">
        Move product to another cold box and call the service number as well; a request is read by the office during business hours.
      </Alert>
      <div>
        <Button type="submit" size="lg" disabled={form.formState.isSubmitting}>
          {form.formState.isSubmitting ? 'Sending…' : 'Send the request'}
        </Button>
      </div>
    </form>
  );
}
