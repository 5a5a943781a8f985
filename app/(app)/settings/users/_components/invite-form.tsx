'use client';

import { zodResolver } from '@hookform/resolvers/zod';
import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';
import { BoundField } from '@/components/forms/bound-field';
import { BoundSelect } from '@/components/forms/bound-select';
import { optionsOf } from '@/components/forms/select-options';
import { applyServerErrors } from '@/components/forms/server-errors';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
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
      <form onSubmit={onSubmit} noValidate className="grid grid-cols-1 gap-3 rounded-lg border border-slate-200 bg-white p-4 sm:grid-cols-2">
        {status ? <Alert tone={status.tone} title={status.text} className="sm:col-span-2" /> : null}
        <BoundField form={form} name="name" id="invite-name" label="Name" />
        <BoundField form={form} name="email" id="invite-email" label="E-mail" input={{ type: 'email' }} />
        <BoundSelect form={form} name="role" id="invite-role" label="Role" options={optionsOf(roles, roleLabels)} />
        {role === 'client' ? (
          <BoundSelect form={form} name="clientId" id="invite-client" label="Client" hint="An owner sees only this client's sites." placeholder="Choose a client…" options={clients.map((c) => ({ value: c.id, label: c.name }))} />
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
                <span className="min-w-0 flex-1 wrap-anywhere">
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
