import type { Metadata } from 'next';
import { redirect } from 'next/navigation';
import { getActor } from '@/lib/auth';
import { signInMessage } from '@/lib/auth/messages';
import { safeReturnPath } from '@/lib/auth/redirect';
import { SignInForm } from '@/app/(auth)/sign-in/_components/sign-in-form';

export const metadata: Metadata = { title: 'Sign in' };

export default async function SignInPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const params = await searchParams;
  const callbackUrl = safeReturnPath(params.callbackUrl);
  if (await getActor()) redirect(callbackUrl);
  const code = typeof params.error === 'string' ? params.error : undefined;
  // Only texts of our own table, whatever the address says.
  const error = signInMessage(code);
  return (
    <>
      <h1 className="mb-4 text-xl font-bold">Sign in</h1>
      <SignInForm callbackUrl={callbackUrl} initialError={error} />
    </>
  );
}
