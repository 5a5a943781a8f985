import type { Metadata } from 'next';
import { PageHeader } from '@/components/ui/card';
import { TextLink } from '@/components/ui/text-link';
import { orNotFound } from '@/lib/api/page';
import { requirePageActor } from '@/lib/auth';
import { listAreas } from '@/lib/sites/service';
import { getSystem } from '@/lib/systems/service';
import { SystemForm } from '@/app/(app)/systems/_components/system-form';

export const metadata: Metadata = { title: 'Edit system' };

export default async function EditSystemPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const actor = await requirePageActor(`/systems/${id}/edit`, 'systems.write');
  const system = await orNotFound(getSystem(actor, id));
  const areas = await listAreas(actor, system.siteId);
  return (
    <>
      <PageHeader
        title={`Edit ${system.name}`}
        subtitle={
          <TextLink href={`/sites/${system.siteId}`}>{system.siteName}</TextLink>
        }
      />
      <SystemForm system={system} siteId={system.siteId} areas={areas.map((a) => ({ id: a.id, name: a.name }))} prefs={{ units: actor.units, metricPressure: actor.metricPressure }} />
    </>
  );
}
