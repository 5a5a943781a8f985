'use client';

import { zodResolver } from '@hookform/resolvers/zod';
import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';
import { applyServerErrors } from '@/components/forms/server-errors';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { Field, Input, Select, describedBy } from '@/components/ui/field';
import type { CompanyDto } from '@/lib/users/dto';
import { useUpdateCompany } from '@/lib/users/hooks';
import { updateCompanySchema } from '@/lib/users/schemas';

type Values = z.input<typeof updateCompanySchema>;

export function CompanyForm({ company }: { company: CompanyDto }) {
  const router = useRouter();
  const update = useUpdateCompany();
  const [status, setStatus] = useState<{ tone: 'success' | 'danger'; text: string }>();
  const form = useForm<Values>({
    resolver: zodResolver(updateCompanySchema),
    defaultValues: { name: company.name, servicePhone: company.servicePhone ?? '', labelLine: company.labelLine ?? '', defaultUnits: company.defaultUnits, keepPhotoLocation: company.keepPhotoLocation, mailVisitPlans: company.mailVisitPlans },
  });
  const errors = form.formState.errors;
  const onSubmit = form.handleSubmit(async (values) => {
    try {
      await update.mutateAsync(updateCompanySchema.parse(values));
      setStatus({ tone: 'success', text: 'Saved.' });
      router.refresh();
    } catch (error) {
      setStatus({ tone: 'danger', text: applyServerErrors(error, form.setError, ['name', 'servicePhone', 'labelLine', 'defaultUnits']) });
    }
  });
  return (
    <form onSubmit={onSubmit} noValidate className="grid max-w-xl gap-4">
      {status ? <Alert tone={status.tone} title={status.text} /> : null}
      <Field id="company-name" label="Company name" error={errors.name?.message}>
        <Input id="company-name" {...describedBy('company-name', errors.name?.message)} {...form.register('name')} />
      </Field>
      <Field id="service-phone" label="Service phone" error={errors.servicePhone?.message} hint="Printed on every tag.">
        <Input id="service-phone" type="tel" {...describedBy('service-phone', errors.servicePhone?.message)} {...form.register('servicePhone')} />
      </Field>
      <Field id="label-line" label="Label line" error={errors.labelLine?.message} hint="A short line under the code on tags, e.g. “Service: call before opening”.">
        <Input id="label-line" {...describedBy('label-line', errors.labelLine?.message)} {...form.register('labelLine')} />
      </Field>
      <Field id="default-units" label="Default units for new users" error={errors.defaultUnits?.message}>
        <Select id="default-units" {...describedBy('default-units', errors.defaultUnits?.message)} {...form.register('defaultUnits')}>
          <option value="imperial">Imperial (psig, °F, lb)</option>
          <option value="metric">Metric (kPa or bar, °C, kg)</option>
        </Select>
      </Field>
      <label className="flex min-h-11 items-center gap-2 text-sm font-medium">
        <input type="checkbox" className="size-5" {...form.register('keepPhotoLocation')} />
        Keep GPS location in stored photos (off by default: location is removed)
      </label>
      <label className="flex min-h-11 items-center gap-2 text-sm font-medium">
        <input type="checkbox" className="size-5" {...form.register('mailVisitPlans')} />
        E-mail the client&rsquo;s contacts when a visit is planned, moved or cancelled (contacts who receive visit reports)
      </label>
      <div>
        <Button type="submit" size="lg" disabled={form.formState.isSubmitting}>
          Save company settings
        </Button>
      </div>
    </form>
  );
}
