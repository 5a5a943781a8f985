import { LogIn, QrCode } from 'lucide-react';
import type { Metadata } from 'next';
import { notFound, redirect } from 'next/navigation';
import { ButtonLink } from '@/components/ui/button';
import { SignedOutShell } from '@/components/ui/signed-out-shell';
import { getActor } from '@/lib/auth';
import { isAppError } from '@/lib/errors';
import { SCAN_VIA, type ScanVia } from '@/lib/tags/schemas';
import { isRegisteredCode, resolveTag } from '@/lib/tags/service';
import { TagCode } from '@/components/tags/tag-code';
import { tagCodeOrNotFound, type TagRouteProps } from '@/app/T/[code]/tag-route';

// The short route a tag's QR symbol holds: /T/<CODE> in upper case (QR alphanumeric mode; see
// lib/tags/qr.ts). The code itself is read case-insensitively; /tag/<code> is a lower-case alias.
// Signed in: the scan is logged and the viewer goes straight to what the tag opens. Signed out: only
// that the unit is registered, and a sign-in that comes back here.

export const dynamic = 'force-dynamic';
export const metadata: Metadata = { title: 'Equipment tag', robots: { index: false, follow: false } };

export default async function TagLinkPage({ params, searchParams }: TagRouteProps) {
  const code = await tagCodeOrNotFound(params);
  const actor = await getActor();
  if (!actor) {
    if (!(await isRegisteredCode(code))) notFound();
    return <SignedOutTag code={code} />;
  }
  const viaParam = (await searchParams).via;
  const via: ScanVia = typeof viaParam === 'string' && (SCAN_VIA as readonly string[]).includes(viaParam) ? (viaParam as ScanVia) : 'link';
  let target: string;
  try {
    target = (await resolveTag(actor, code, via)).target;
  } catch (error) {
    if (isAppError(error) && (error.code === 'not_found' || error.code === 'forbidden')) notFound();
    throw error;
  }
  redirect(target);
}

function SignedOutTag({ code }: { code: string }) {
  return (
    <SignedOutShell className="space-y-4">
      <h1 className="flex items-center gap-2 text-xl font-bold">
        <QrCode aria-hidden className="size-6 text-ice-800" />
        This unit is registered
      </h1>
      <p className="text-slate-700">
        Tag <TagCode code={code} className="text-lg font-bold" /> belongs to equipment serviced through Rimeline.
        Service staff and the owner can sign in to see it.
      </p>
      <ButtonLink href={`/sign-in?callbackUrl=${encodeURIComponent(`/T/${code}`)}`} size="lg" className="min-h-14 w-full text-lg">
        <LogIn aria-hidden className="size-6" /> Sign in to open it
      </ButtonLink>
    </SignedOutShell>
  );
}
