'use client';

import { CircleCheck, CircleSlash } from 'lucide-react';
import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { Button } from '@/components/ui/button';
import { Select } from '@/components/ui/field';
import { ApiError } from '@/lib/api/client';
import { roleLabels, roles, type Role } from '@/lib/auth/permissions';
import type { UserDto } from '@/lib/users/dto';
import { useChangeRole, useSetActive } from '@/lib/users/hooks';
import { SignOutEverywhere } from '@/app/(app)/settings/_components/sign-out-everywhere';
import { optionsOf, SelectOptions } from '@/components/forms/select-options';

function UserRow({ user, clients, isSelf }: { user: UserDto; clients: { id: string; name: string }[]; isSelf: boolean }) {
  const router = useRouter();
  const changeRole = useChangeRole(user.id);
  const setActive = useSetActive(user.id);
  const [role, setRole] = useState<Role>(user.role);
  const [clientId, setClientId] = useState(user.clientId ?? '');
  const [message, setMessage] = useState<string>();
  const dirty = role !== user.role || (role === 'client' && clientId !== (user.clientId ?? ''));

  async function run(fn: () => Promise<unknown>) {
    setMessage(undefined);
    try {
      await fn();
      router.refresh();
    } catch (error) {
      setMessage(error instanceof ApiError ? error.message : 'Could not save.');
    }
  }

  return (
    <li className="grid grid-cols-1 gap-2 px-4 py-3 sm:grid-cols-[minmax(0,1fr)_auto] sm:items-center">
      <div className="min-w-0">
        <p className="font-semibold">
          {user.name} {isSelf ? <span className="text-sm font-normal text-slate-600">(you)</span> : null}
        </p>
        <p className="text-sm text-slate-600 wrap-anywhere">{user.email}</p>
        <p className="flex items-center gap-1 text-sm">
          {user.active ? <CircleCheck aria-hidden className="size-4 text-emerald-700" /> : <CircleSlash aria-hidden className="size-4 text-red-700" />}
          {user.active ? 'Active' : 'Deactivated'}
          {user.clientName ? ` · ${user.clientName}` : ''}
        </p>
        {message ? (
          <p role="alert" className="text-sm font-medium text-red-700">
            {message}
          </p>
        ) : null}
      </div>
      <div className="flex flex-wrap items-center gap-2">
        <label className="sr-only" htmlFor={`role-${user.id}`}>
          Role for {user.name}
        </label>
        <Select id={`role-${user.id}`} value={role} onChange={(e) => setRole(e.target.value as Role)} className="w-auto">
          <SelectOptions options={optionsOf(roles, roleLabels)} />
        </Select>
        {role === 'client' ? (
          <>
            <label className="sr-only" htmlFor={`client-${user.id}`}>
              Client for {user.name}
            </label>
            <Select id={`client-${user.id}`} value={clientId} onChange={(e) => setClientId(e.target.value)} className="w-auto">
              <option value="">Choose a client…</option>
              <SelectOptions options={clients.map((c) => ({ value: c.id, label: c.name }))} />
            </Select>
          </>
        ) : null}
        {dirty ? (
          <Button size="sm" onClick={() => run(() => changeRole.mutateAsync({ role, clientId: role === 'client' ? clientId || null : null }))}>
            Save role
          </Button>
        ) : null}
        {!isSelf ? (
          <Button size="sm" variant={user.active ? 'secondary' : 'primary'} onClick={() => run(() => setActive.mutateAsync(!user.active))}>
            {user.active ? 'Deactivate' : 'Reactivate'}
          </Button>
        ) : null}
        {!isSelf && user.active ? <SignOutEverywhere userId={user.id} self={false} name={user.name} /> : null}
      </div>
    </li>
  );
}

export function UserTable({ users, clients, selfId }: { users: UserDto[]; clients: { id: string; name: string }[]; selfId: string }) {
  return (
    <ul className="divide-y divide-slate-200 rounded-lg border border-slate-200 bg-white">
      {users.map((u) => (
        <UserRow key={u.id} user={u} clients={clients} isSelf={u.id === selfId} />
      ))}
    </ul>
  );
}
