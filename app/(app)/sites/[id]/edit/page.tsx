import type { Metadata } from 'next';
import { PageHeader } from '@/components/ui/card';
import { requirePageActor } from '@/lib/auth';
import { orNotFound } from '@/lib/api/page';
import { getSite } from '@/lib/sites/service';
import { timeZoneChoices } from '@/lib/sites/time-zones';
import { SiteForm } from '@/app/(app)/sites/_components/site-form';

export const metadata: Metadata = { title: 'Edit site' };

export default async function EditSitePage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const actor = await requirePageActor(`/sites/${id}/edit`, 'sites.write');
  const site = await orNotFound(getSite(actor, id));
  return (
    <>
      <PageHeader title={`Edit ${site.name}`} subtitle={site.clientName} />
      <SiteForm site={site} clients={[]} units={actor.units} timeZones={timeZoneChoices(site.timeZone)} />
    </>
  );
}
