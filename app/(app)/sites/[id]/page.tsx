import type { Metadata } from 'next';
import Link from 'next/link';
import { ButtonLink } from '@/components/ui/button';
import { Card, PageHeader } from '@/components/ui/card';
import { orNotFound } from '@/lib/api/page';
import { requirePageActor } from '@/lib/auth';
import { can } from '@/lib/auth/access';
import { formatElevation } from '@/lib/units/format';
import { siteAddress } from '@/lib/sites/dto';
import { listEquipment } from '@/lib/equipment/service';
import { getSite, listAreas } from '@/lib/sites/service';
import { listSystems } from '@/lib/systems/service';
import { AreaManager } from '@/app/(app)/sites/[id]/_components/area-manager';
import { ArchiveSiteButton } from '@/app/(app)/sites/[id]/_components/archive-site-button';
import { SiteEquipment } from '@/app/(app)/sites/[id]/_components/site-equipment';
import { SiteSystems } from '@/app/(app)/sites/[id]/_components/site-systems';

export const metadata: Metadata = { title: 'Site' };

export default async function SitePage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const actor = await requirePageActor(`/sites/${id}`);
  const site = await orNotFound(getSite(actor, id));
  const [areas, systems, equipment] = await Promise.all([
    listAreas(actor, id, can(actor, 'areas.write')),
    listSystems(actor, { siteId: id, limit: 200, archived: 'exclude' }),
    listEquipment(actor, { siteId: id, limit: 200, sort: 'name', dir: 'asc' }),
  ]);
  const canWrite = can(actor, 'sites.write');

  return (
    <div className="space-y-6">
      <PageHeader
        title={site.name}
        subtitle={
          actor.role === 'client' ? (
            siteAddress(site)
          ) : (
            <>
              <Link href={`/clients/${site.clientId}`} className="font-medium text-ice-800 underline">
                {site.clientName}
              </Link>
              {siteAddress(site) ? ` · ${siteAddress(site)}` : ''}
            </>
          )
        }
        actions={
          canWrite ? (
            <>
              <ButtonLink href={`/sites/${site.id}/edit`} variant="secondary">
                Edit site
              </ButtonLink>
              <ArchiveSiteButton siteId={site.id} archived={Boolean(site.archivedAt)} />
            </>
          ) : null
        }
      />
      {site.archivedAt ? <p className="rounded bg-slate-200 px-3 py-2 text-sm font-medium">Archived site: hidden from lists, kept with its history.</p> : null}
      <div className="grid gap-4 md:grid-cols-3">
        <Card className="md:col-span-1">
          <h2 className="text-base font-semibold">Site details</h2>
          <dl className="mt-3 space-y-2 text-sm">
            <div>
              <dt className="font-medium text-slate-600">Time zone</dt>
              <dd>{site.timeZone}</dd>
            </div>
            <div>
              <dt className="font-medium text-slate-600">Elevation</dt>
              <dd>{formatElevation(site.elevationM, actor.units)}</dd>
            </div>
            {site.accessNotes && actor.role !== 'client' ? (
              <div>
                <dt className="font-medium text-slate-600">Access notes</dt>
                <dd className="whitespace-pre-line">{site.accessNotes}</dd>
              </div>
            ) : null}
          </dl>
        </Card>
        <section aria-labelledby="areas-h" className="md:col-span-2">
          <h2 id="areas-h" className="mb-3 text-lg font-semibold">
            Areas
          </h2>
          <AreaManager siteId={site.id} areas={areas} canWrite={can(actor, 'areas.write')} />
        </section>
      </div>
      <SiteSystems siteId={site.id} systems={systems} canWrite={can(actor, 'systems.write') && !site.archivedAt} />
      <SiteEquipment
        siteId={site.id}
        items={equipment.items}
        more={equipment.nextCursor !== null}
        areas={areas}
        canRegister={can(actor, 'equipment.write') && !site.archivedAt}
        canImport={can(actor, 'equipment.import') && !site.archivedAt}
      />
    </div>
  );
}
