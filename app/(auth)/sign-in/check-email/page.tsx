import type { Metadata } from 'next';
import Link from 'next/link';

export const metadata: Metadata = { title: 'Check your e-mail' };

export default async function CheckEmailPage({ searchParams }: { searchParams: Promise<{ email?: string }> }) {
  const { email } = await searchParams;
  return (
    <>
      <h1 className="mb-3 text-xl font-bold">Check your e-mail</h1>
      <p className="text-slate-700">
        If {email ? <strong>{email}</strong> : 'that address'} has a Rimeline account, a sign-in link is on its way. It works once and
        expires in 15 minutes.
      </p>
      <p className="mt-4">
        <Link href="/sign-in" className="font-semibold text-ice-800 underline">
          Back to sign-in
        </Link>
      </p>
    </>
  );
}
