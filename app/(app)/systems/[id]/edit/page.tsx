import type { Metadata } from 'next';
import Link from 'next/link';
import { PageHeader } from '@/components/ui/card';
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
          <Link href={`/sites/${system.siteId}`} className="inline-flex min-h-11 items-center font-medium text-ice-800 underline">
            {system.siteName}
          </Link>
        }
      />
      <SystemForm system={system} siteId={system.siteId} areas={areas.map((a) => ({ id: a.id, name: a.name }))} prefs={{ units: actor.units, metricPressure: actor.metricPressure }} />
    </>
  );
}
