import type { Metadata } from 'next';
import { redirect } from 'next/navigation';
import { getActor } from '@/lib/auth';
import { safeReturnPath } from '@/lib/auth/redirect';
import { SignInForm } from '@/app/(auth)/sign-in/_components/sign-in-form';

export const metadata: Metadata = { title: 'Sign in' };

const errorMessages: Record<string, string> = {
  CredentialsSignin: 'The e-mail or password is not right.',
  Verification: 'That sign-in link has expired or was already used. Ask for a new one.',
  AccessDenied: 'This account cannot sign in. Ask your admin.',
  EmailSignin: 'The sign-in link could not be sent. Try again in a minute.',
  SessionRequired: 'Sign in to continue.',
};

export default async function SignInPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const params = await searchParams;
  const callbackUrl = safeReturnPath(params.callbackUrl);
  if (await getActor()) redirect(callbackUrl);
  const code = typeof params.error === 'string' ? params.error : undefined;
  const error = code ? (errorMessages[code] ?? (code.length < 200 ? code : 'Sign-in failed.')) : undefined;
  return (
    <>
      <h1 className="mb-4 text-xl font-bold">Sign in</h1>
      <SignInForm callbackUrl={callbackUrl} initialError={error} />
    </>
  );
}
