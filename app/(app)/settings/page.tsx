import type { Metadata } from 'next';
import { PageHeader } from '@/components/ui/card';
import { requirePageActor } from '@/lib/auth';
import { roleLabels } from '@/lib/auth/permissions';
import { PreferencesForm } from '@/app/(app)/settings/_components/preferences-form';

export const metadata: Metadata = { title: 'My preferences' };

export default async function PreferencesPage() {
  const actor = await requirePageActor('/settings');
  return (
    <>
      <PageHeader title="My preferences" subtitle={`${actor.email} · ${roleLabels[actor.role]}`} />
      <PreferencesForm name={actor.name} units={actor.units} metricPressure={actor.metricPressure} />
    </>
  );
}
