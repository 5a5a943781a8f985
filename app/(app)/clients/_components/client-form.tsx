'use client';

import { zodResolver } from '@hookform/resolvers/zod';
import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';
import { BoundField } from '@/components/forms/bound-field';
import { FormFooter } from '@/components/forms/form-footer';
import { applyServerErrors } from '@/components/forms/server-errors';
import { Alert } from '@/components/ui/alert';
import type { ClientDto } from '@/lib/clients/dto';
import { useSaveClient } from '@/lib/clients/hooks';
import { createClientSchema } from '@/lib/clients/schemas';

type Values = z.input<typeof createClientSchema>;

export function ClientForm({ client }: { client?: ClientDto }) {
  const router = useRouter();
  const save = useSaveClient(client?.id);
  const [banner, setBanner] = useState<string>();
  const form = useForm<Values>({ resolver: zodResolver(createClientSchema), defaultValues: { name: client?.name ?? '', notes: client?.notes ?? '' } });
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
      <BoundField form={form} name="name" label="Client name" hint="The equipment owner: a restaurant group, a grocer, a clinic." />
      <BoundField form={form} name="notes" label="Notes" multiline />
      <FormFooter submitting={form.formState.isSubmitting} submitLabel={client ? 'Save changes' : 'Create client'} />
    </form>
  );
}
