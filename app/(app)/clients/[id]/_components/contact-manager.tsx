'use client';

import { zodResolver } from '@hookform/resolvers/zod';
import { Mail, Phone, Trash2 } from 'lucide-react';
import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';
import { BoundField } from '@/components/forms/bound-field';
import { applyServerErrors } from '@/components/forms/server-errors';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { EmptyState } from '@/components/ui/card';
import type { ContactDto } from '@/lib/clients/dto';
import { useDeleteContact, useSaveContact } from '@/lib/clients/hooks';
import { createContactSchema } from '@/lib/clients/schemas';

type Values = z.input<typeof createContactSchema>;

export function ContactManager({ clientId, contacts, canWrite }: { clientId: string; contacts: ContactDto[]; canWrite: boolean }) {
  const router = useRouter();
  const save = useSaveContact(clientId);
  const remove = useDeleteContact(clientId);
  const [banner, setBanner] = useState<string>();
  const form = useForm<Values>({ resolver: zodResolver(createContactSchema), defaultValues: { name: '', email: '', phone: '', title: '', receivesReports: true } });
  const onSubmit = form.handleSubmit(async (values) => {
    setBanner(undefined);
    try {
      await save.mutateAsync(createContactSchema.parse(values));
      form.reset();
      router.refresh();
    } catch (error) {
      setBanner(applyServerErrors(error, form.setError, ['name', 'email', 'phone', 'title']));
    }
  });
  return (
    <div className="space-y-3">
      {contacts.length === 0 ? <EmptyState title="No contacts yet." /> : null}
      {contacts.length > 0 ? (
        <ul className="divide-y divide-slate-200 rounded-lg border border-slate-200 bg-white">
          {contacts.map((c) => (
            <li key={c.id} className="flex flex-wrap items-center gap-3 px-4 py-3">
              <span className="min-w-0 flex-1">
                <span className="block font-semibold">
                  {c.name}
                  {c.title ? <span className="font-normal text-slate-600"> · {c.title}</span> : null}
                </span>
                <span className="flex flex-wrap gap-x-4 text-sm text-slate-700">
                  {c.email ? (
                    <a className="inline-flex min-h-11 items-center gap-1 underline" href={`mailto:${c.email}`}>
                      <Mail aria-hidden className="size-4" /> {c.email}
                    </a>
                  ) : null}
                  {c.phone ? (
                    <a className="inline-flex min-h-11 min-w-11 items-center gap-1 underline" href={`tel:${c.phone}`}>
                      <Phone aria-hidden className="size-4" /> {c.phone}
                    </a>
                  ) : null}
                  <span>{c.receivesReports ? 'Receives visit reports' : 'No visit reports'}</span>
                </span>
              </span>
              {canWrite ? (
                <Button
                  variant="ghost"
                  size="sm"
                  aria-label={`Remove ${c.name}`}
                  onClick={async () => {
                    if (!window.confirm(`Remove ${c.name} from this client's contacts?`)) return;
                    await remove.mutateAsync(c.id);
                    router.refresh();
                  }}
                >
                  <Trash2 aria-hidden className="size-4" /> Remove
                </Button>
              ) : null}
            </li>
          ))}
        </ul>
      ) : null}
      {canWrite ? (
        <form onSubmit={onSubmit} noValidate className="grid gap-3 rounded-lg border border-slate-200 bg-white p-4 sm:grid-cols-2">
          {banner ? <Alert tone="danger" title={banner} className="sm:col-span-2" /> : null}
          <BoundField form={form} name="name" id="contact-name" label="Name" />
          <BoundField form={form} name="title" id="contact-title" label="Title" input={{ placeholder: 'Facilities lead' }} />
          <BoundField form={form} name="email" id="contact-email" label="E-mail" input={{ type: 'email' }} />
          <BoundField form={form} name="phone" id="contact-phone" label="Phone" input={{ type: 'tel' }} />
          <label className="flex min-h-11 items-center gap-2 text-sm font-medium sm:col-span-2">
            <input type="checkbox" className="size-5" {...form.register('receivesReports')} />
            Send this contact a report after each visit
          </label>
          <div className="sm:col-span-2">
            <Button type="submit" disabled={form.formState.isSubmitting}>
              Add contact
            </Button>
          </div>
        </form>
      ) : null}
    </div>
  );
}
