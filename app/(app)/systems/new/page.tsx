import type { Metadata } from 'next';
import { notFound } from 'next/navigation';
import { PageHeader } from '@/components/ui/card';
import { TextLink } from '@/components/ui/text-link';
import { orNotFound } from '@/lib/api/page';
import { requirePageActor } from '@/lib/auth';
import { getSite, listAreas } from '@/lib/sites/service';
import { SystemForm } from '@/app/(app)/systems/_components/system-form';

export const metadata: Metadata = { title: 'New system' };

export default async function NewSystemPage({ searchParams }: { searchParams: Promise<{ siteId?: string }> }) {
  const { siteId } = await searchParams;
  const actor = await requirePageActor(`/systems/new${siteId ? `?siteId=${encodeURIComponent(siteId)}` : ''}`, 'systems.write');
  // A system always belongs to a site; the site page links here with its id.
  if (!siteId) notFound();
  const site = await orNotFound(getSite(actor, siteId));
  const areas = await listAreas(actor, site.id);
  return (
    <>
      <PageHeader
        title="New system"
        subtitle={
          <>
            One refrigeration circuit at{' '}
            <TextLink href={`/sites/${site.id}`}>
              {site.name}
            </TextLink>
            : a condensing unit or rack and the evaporators and controls it serves.
          </>
        }
      />
      <SystemForm siteId={site.id} areas={areas.map((a) => ({ id: a.id, name: a.name }))} prefs={{ units: actor.units, metricPressure: actor.metricPressure }} />
    </>
  );
}
