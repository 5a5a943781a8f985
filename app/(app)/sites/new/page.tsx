import type { Metadata } from 'next';
import { PageHeader } from '@/components/ui/card';
import { requirePageActor } from '@/lib/auth';
import { listClients } from '@/lib/clients/service';
import { timeZoneChoices } from '@/lib/sites/time-zones';
import { SiteForm } from '@/app/(app)/sites/_components/site-form';

export const metadata: Metadata = { title: 'New site' };

export default async function NewSitePage({ searchParams }: { searchParams: Promise<{ clientId?: string }> }) {
  const actor = await requirePageActor('/sites/new', 'sites.write');
  const { clientId } = await searchParams;
  const clients = await listClients(actor, { limit: 200, archived: 'exclude' });
  return (
    <>
      <PageHeader title="New site" subtitle="An address where a client has refrigeration equipment." />
      <SiteForm clients={clients.items} defaultClientId={clientId} units={actor.units} timeZones={timeZoneChoices()} />
    </>
  );
}
