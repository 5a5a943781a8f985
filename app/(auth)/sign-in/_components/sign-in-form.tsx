'use client';

import { zodResolver } from '@hookform/resolvers/zod';
import { signIn } from 'next-auth/react';
import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { Field, Input, describedBy } from '@/components/ui/field';
import { signInMessage } from '@/lib/auth/messages';
import { credentialsSchema, magicLinkSchema } from '@/lib/auth/schemas';
import type { z } from 'zod';

type Mode = 'password' | 'link';

export function SignInForm({ callbackUrl, initialError }: { callbackUrl: string; initialError?: string }) {
  const [mode, setMode] = useState<Mode>('password');
  const [error, setError] = useState<string | undefined>(initialError);
  const router = useRouter();
  const passwordForm = useForm<z.input<typeof credentialsSchema>>({ resolver: zodResolver(credentialsSchema) });
  const linkForm = useForm<z.input<typeof magicLinkSchema>>({ resolver: zodResolver(magicLinkSchema) });

  const onPassword = passwordForm.handleSubmit(async (values) => {
    setError(undefined);
    const result = await signIn('credentials', { ...values, redirect: false, callbackUrl });
    if (!result || result.error) {
      setError(signInMessage(result?.error ?? 'CredentialsSignin'));
      return;
    }
    router.replace(callbackUrl);
    router.refresh();
  });

  const onLink = linkForm.handleSubmit(async (values) => {
    setError(undefined);
    const result = await signIn('email', { email: values.email, redirect: false, callbackUrl });
    if (result?.error) {
      setError(signInMessage('EmailSignin'));
      return;
    }
    router.push(`/sign-in/check-email?email=${encodeURIComponent(values.email)}`);
  });

  const pwErrors = passwordForm.formState.errors;
  const linkErrors = linkForm.formState.errors;

  return (
    <div className="space-y-4">
      <div role="tablist" aria-label="How to sign in" className="grid grid-cols-2 gap-1 rounded-md bg-slate-100 p-1">
        {(['password', 'link'] as const).map((m) => (
          <button
            key={m}
            role="tab"
            type="button"
            aria-selected={mode === m}
            onClick={() => {
              setMode(m);
              setError(undefined);
            }}
            className={`min-h-11 rounded text-sm font-semibold ${mode === m ? 'bg-white text-ice-900 shadow' : 'text-slate-700'}`}
          >
            {m === 'password' ? 'Password' : 'E-mail me a link'}
          </button>
        ))}
      </div>

      {error ? <Alert tone="danger" title={error} /> : null}

      {mode === 'password' ? (
        <form onSubmit={onPassword} noValidate className="space-y-4">
          <Field id="email" label="E-mail" error={pwErrors.email?.message}>
            <Input id="email" type="email" autoComplete="username" inputMode="email" {...describedBy('email', pwErrors.email?.message)} {...passwordForm.register('email')} />
          </Field>
          <Field id="password" label="Password" error={pwErrors.password?.message}>
            <Input id="password" type="password" autoComplete="current-password" {...describedBy('password', pwErrors.password?.message)} {...passwordForm.register('password')} />
          </Field>
          <Button type="submit" size="lg" className="w-full" disabled={passwordForm.formState.isSubmitting}>
            {passwordForm.formState.isSubmitting ? 'Signing in…' : 'Sign in'}
          </Button>
        </form>
      ) : (
        <form onSubmit={onLink} noValidate className="space-y-4">
          <Field id="link-email" label="E-mail" error={linkErrors.email?.message} hint="We send a link that signs you in once; it expires in 15 minutes.">
            <Input id="link-email" type="email" autoComplete="username" inputMode="email" {...describedBy('link-email', linkErrors.email?.message)} {...linkForm.register('email')} />
          </Field>
          <Button type="submit" size="lg" className="w-full" disabled={linkForm.formState.isSubmitting}>
            {linkForm.formState.isSubmitting ? 'Sending…' : 'Send sign-in link'}
          </Button>
        </form>
      )}
    </div>
  );
}
