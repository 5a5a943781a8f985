'use client';

import { zodResolver } from '@hookform/resolvers/zod';
import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';
import { applyServerErrors } from '@/components/forms/server-errors';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { Field, Input, Textarea, describedBy } from '@/components/ui/field';
import type { ClientDto } from '@/lib/clients/dto';
import { useSaveClient } from '@/lib/clients/hooks';
import { createClientSchema } from '@/lib/clients/schemas';

type Values = z.input<typeof createClientSchema>;

export function ClientForm({ client }: { client?: ClientDto }) {
  const router = useRouter();
  const save = useSaveClient(client?.id);
  const [banner, setBanner] = useState<string>();
  const form = useForm<Values>({ resolver: zodResolver(createClientSchema), defaultValues: { name: client?.name ?? '', notes: client?.notes ?? '' } });
  const errors = form.formState.errors;
  const onSubmit = form.handleSubmit(async (values) => {
    setBanner(undefined);
    try {
      const saved = await save.mutateAsync(createClientSchema.parse(values));
      router.push(`/clients/${saved.id}`);
      router.refresh();
    } catch (error) {
      setBanner(applyServerErrors(error, form.setError, ['name', 'notes']));
    }
  });
  return (
    <form onSubmit={onSubmit} noValidate className="grid max-w-xl gap-4">
      {banner ? <Alert tone="danger" title={banner} /> : null}
      <Field id="name" label="Client name" error={errors.name?.message} hint="The equipment owner: a restaurant group, a grocer, a clinic.">
        <Input id="name" {...describedBy('name', errors.name?.message)} {...form.register('name')} />
      </Field>
      <Field id="notes" label="Notes" error={errors.notes?.message}>
        <Textarea id="notes" {...describedBy('notes', errors.notes?.message)} {...form.register('notes')} />
      </Field>
      <div className="flex gap-2">
        <Button type="submit" size="lg" disabled={form.formState.isSubmitting}>
          {form.formState.isSubmitting ? 'Saving…' : client ? 'Save changes' : 'Create client'}
        </Button>
        <Button variant="secondary" size="lg" onClick={() => router.back()}>
          Cancel
        </Button>
      </div>
    </form>
  );
}
