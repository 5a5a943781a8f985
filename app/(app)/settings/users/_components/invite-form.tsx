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
import { roleLabels, roles } from '@/lib/auth/permissions';
import type { InvitationDto } from '@/lib/users/dto';
import { useInvite, useRevokeInvitation } from '@/lib/users/hooks';
import { inviteUserSchema } from '@/lib/users/schemas';
import { formatDay } from '@/lib/format/dates';

type Values = z.input<typeof inviteUserSchema>;

export function InviteForm({ clients, invitations }: { clients: { id: string; name: string }[]; invitations: InvitationDto[] }) {
  const router = useRouter();
  const invite = useInvite();
  const revoke = useRevokeInvitation();
  const [status, setStatus] = useState<{ tone: 'success' | 'danger'; text: string }>();
  const form = useForm<Values>({ resolver: zodResolver(inviteUserSchema), defaultValues: { email: '', name: '', role: 'technician', clientId: null } });
  const role = form.watch('role');
  const errors = form.formState.errors;
  const onSubmit = form.handleSubmit(async (values) => {
    setStatus(undefined);
    try {
      const sent = await invite.mutateAsync({ ...values, clientId: values.role === 'client' ? values.clientId || null : null });
      setStatus({ tone: 'success', text: `Invitation sent to ${sent.email}.` });
      form.reset();
      router.refresh();
    } catch (error) {
      setStatus({ tone: 'danger', text: applyServerErrors(error, form.setError, ['email', 'name', 'role', 'clientId']) });
    }
  });
  return (
    <div className="space-y-3">
      <form onSubmit={onSubmit} noValidate className="grid gap-3 rounded-lg border border-slate-200 bg-white p-4 sm:grid-cols-2">
        {status ? <Alert tone={status.tone} title={status.text} className="sm:col-span-2" /> : null}
        <Field id="invite-name" label="Name" error={errors.name?.message}>
          <Input id="invite-name" {...describedBy('invite-name', errors.name?.message)} {...form.register('name')} />
        </Field>
        <Field id="invite-email" label="E-mail" error={errors.email?.message}>
          <Input id="invite-email" type="email" {...describedBy('invite-email', errors.email?.message)} {...form.register('email')} />
        </Field>
        <Field id="invite-role" label="Role" error={errors.role?.message}>
          <Select id="invite-role" {...describedBy('invite-role', errors.role?.message)} {...form.register('role')}>
            {roles.map((r) => (
              <option key={r} value={r}>
                {roleLabels[r]}
              </option>
            ))}
          </Select>
        </Field>
        {role === 'client' ? (
          <Field id="invite-client" label="Client" error={errors.clientId?.message} hint="An owner sees only this client's sites.">
            <Select id="invite-client" {...describedBy('invite-client', errors.clientId?.message)} {...form.register('clientId')}>
              <option value="">Choose a client…</option>
              {clients.map((c) => (
                <option key={c.id} value={c.id}>
                  {c.name}
                </option>
              ))}
            </Select>
          </Field>
        ) : null}
        <div className="sm:col-span-2">
          <Button type="submit" disabled={form.formState.isSubmitting}>
            {form.formState.isSubmitting ? 'Sending…' : 'Send invitation'}
          </Button>
        </div>
      </form>
      {invitations.length > 0 ? (
        <div>
          <h3 className="mb-2 text-sm font-semibold">Open invitations</h3>
          <ul className="divide-y divide-slate-200 rounded-lg border border-slate-200 bg-white">
            {invitations.map((i) => (
              <li key={i.id} className="flex flex-wrap items-center gap-3 px-4 py-2 text-sm">
                <span className="flex-1">
                  <strong>{i.name}</strong> · {i.email} · {roleLabels[i.role]} · expires {formatDay(i.expiresAt)}
                </span>
                <Button
                  variant="ghost"
                  size="sm"
                  onClick={async () => {
                    await revoke.mutateAsync(i.id);
                    router.refresh();
                  }}
                >
                  Revoke
                </Button>
              </li>
            ))}
          </ul>
        </div>
      ) : null}
    </div>
  );
}
