'use client';

import { useActionState } from 'react';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { Field, Input, describedBy } from '@/components/ui/field';
import { acceptInvitationAction, type AcceptState } from '@/app/(auth)/invitation/[token]/actions';

export function AcceptInvitationForm({ token, email }: { token: string; email: string }) {
  const [state, action, pending] = useActionState<AcceptState, FormData>(acceptInvitationAction, {});
  const err = state.fieldErrors ?? {};
  return (
    <form action={action} className="space-y-4" noValidate>
      <input type="hidden" name="token" value={token} />
      <input type="hidden" name="username" autoComplete="username" value={email} readOnly />
      {state.message ? <Alert tone="danger" title={state.message} /> : null}
      <Field id="password" label="Choose a password" error={err.password} hint="At least 10 characters.">
        <Input id="password" name="password" type="password" autoComplete="new-password" {...describedBy('password', err.password)} />
      </Field>
      <Field id="confirm" label="Repeat the password" error={err.confirm}>
        <Input id="confirm" name="confirm" type="password" autoComplete="new-password" {...describedBy('confirm', err.confirm)} />
      </Field>
      <Button type="submit" size="lg" className="w-full" disabled={pending}>
        {pending ? 'Creating your account…' : 'Create my account'}
      </Button>
    </form>
  );
}
