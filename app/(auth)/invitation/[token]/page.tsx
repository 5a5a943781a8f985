import type { Metadata } from 'next';
import { roleLabels, type Role } from '@/lib/auth/permissions';
import { findOpenInvitation } from '@/lib/users/service';
import { SignInNotice } from '@/app/(auth)/_components/sign-in-notice';
import { AcceptInvitationForm } from '@/app/(auth)/invitation/[token]/accept-form';

export const metadata: Metadata = { title: 'Accept invitation' };

export default async function InvitationPage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  const invitation = token.length <= 200 ? await findOpenInvitation(token) : null;
  if (!invitation) {
    return (
      <SignInNotice title="This invitation is no longer valid" backLabel="Go to sign-in">
        It may have expired, been replaced or already been used. Ask your admin to send a new one.
      </SignInNotice>
    );
  }
  return (
    <>
      <h1 className="mb-2 text-xl font-bold">Join {invitation.company_name}</h1>
      <p className="mb-4 text-slate-700">
        {invitation.name} ({invitation.email}), you are invited as {roleLabels[invitation.role as Role]}.
      </p>
      <AcceptInvitationForm token={token} email={invitation.email} />
    </>
  );
}
