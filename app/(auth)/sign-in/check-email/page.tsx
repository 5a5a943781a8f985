import type { Metadata } from 'next';
import { SignInNotice } from '@/app/(auth)/_components/sign-in-notice';

export const metadata: Metadata = { title: 'Check your e-mail' };

export default async function CheckEmailPage({ searchParams }: { searchParams: Promise<{ email?: string }> }) {
  const { email } = await searchParams;
  return (
    <SignInNotice title="Check your e-mail" backLabel="Back to sign-in">
      If {email ? <strong>{email}</strong> : 'that address'} has a Rimeline account, a sign-in link is on its way. It works once and
      expires in 15 minutes.
    </SignInNotice>
  );
}
