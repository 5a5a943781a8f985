import type { Metadata } from 'next';
import { PageHeader } from '@/components/ui/card';
import { requirePageActor } from '@/lib/auth';
import { roleLabels } from '@/lib/auth/permissions';
import { PreferencesForm } from '@/app/(app)/settings/_components/preferences-form';
import { SignOutEverywhere } from '@/app/(app)/settings/_components/sign-out-everywhere';

export const metadata: Metadata = { title: 'My preferences' };

export default async function PreferencesPage() {
  const actor = await requirePageActor('/settings');
  return (
    <>
      <PageHeader title="My preferences" subtitle={`${actor.email} · ${roleLabels[actor.role]}`} />
      <PreferencesForm name={actor.name} units={actor.units} metricPressure={actor.metricPressure} />
      <section aria-labelledby="sessions-h" className="mt-8 space-y-2">
        <h2 id="sessions-h" className="text-lg font-semibold">
          Sessions
        </h2>
        <p className="text-sm text-slate-700">Signed in on a phone or computer you no longer have? End every session, this one included.</p>
        <SignOutEverywhere userId={actor.id} self />
      </section>
    </>
  );
}
