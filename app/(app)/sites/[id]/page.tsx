import type { Metadata } from 'next';
import Link from 'next/link';
import { ButtonLink } from '@/components/ui/button';
import { KeepSitePanel } from '@/components/offline/keep-site-panel';
import { Card, PageHeader } from '@/components/ui/card';
import { FollowUpList } from '@/components/visits/follow-up-list';
import { SitePlans } from '@/components/plans/site-plans';
import { TextLink } from '@/components/ui/text-link';
import { upcomingPlansForSite } from '@/lib/plans/service';
import { orNotFound } from '@/lib/api/page';
import { requirePageActor } from '@/lib/auth';
import { formatElevation } from '@/lib/units/format';
import { siteAddress } from '@/lib/sites/dto';
import { listEquipment } from '@/lib/equipment/service';
import { listFollowUps } from '@/lib/follow-ups/service';
import { recentSitePhotos } from '@/lib/photos/service';
import { getSite, listAreas } from '@/lib/sites/service';
import { listSystems } from '@/lib/systems/service';
import { listVisits } from '@/lib/visits/service';
import { AreaManager } from '@/app/(app)/sites/[id]/_components/area-manager';
import { ArchiveSiteButton } from '@/app/(app)/sites/[id]/_components/archive-site-button';
import { SiteEquipment } from '@/app/(app)/sites/[id]/_components/site-equipment';
import { SiteSystems } from '@/app/(app)/sites/[id]/_components/site-systems';
import { SiteAttention } from '@/app/(app)/sites/[id]/_components/site-attention';
import { SiteRecentPhotos, SiteRecentVisits } from '@/app/(app)/sites/[id]/_components/site-recent';

export const metadata: Metadata = { title: 'Site' };

export default async function SitePage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const actor = await requirePageActor(`/sites/${id}`);
  const site = await orNotFound(getSite(actor, id));
  const [areas, systems, equipment, removedEquipment] = await Promise.all([
    listAreas(actor, id, site.canManageAreas),
    listSystems(actor, { siteId: id, limit: 200, archived: 'exclude' }),
    listEquipment(actor, { siteId: id, limit: 200, sort: 'name', dir: 'asc' }),
    listEquipment(actor, { siteId: id, removed: 'only', limit: 100, sort: 'updatedAt', dir: 'desc' }),
  ]);
  // What the viewer may do here comes with the site (lib/sites/permissions.ts), as GET /api/sites/:id sends it.
  const { canEdit: canWrite, canStartVisit: canVisit, canAskForService: canRequest } = site;
  const [followUps, myOpenVisit, recentVisits, recentPhotos, plans] = await Promise.all([
    listFollowUps(actor, { siteId: id, status: ['open', 'scheduled'], limit: 50 }),
    canVisit ? listVisits(actor, { siteId: id, status: 'open', technicianId: actor.id, limit: 1 }).then((p) => p.items[0]) : undefined,
    listVisits(actor, { siteId: id, status: 'closed', limit: 5 }),
    recentSitePhotos(actor, id, 8),
    upcomingPlansForSite(actor, id),
  ]);

  return (
    <div className="space-y-6">
      <PageHeader
        title={site.name}
        subtitle={
          actor.role === 'client' ? (
            siteAddress(site)
          ) : (
            <>
              <TextLink href={`/clients/${site.clientId}`}>{site.clientName}</TextLink>
              {siteAddress(site) ? ` · ${siteAddress(site)}` : ''}
            </>
          )
        }
        actions={
          canWrite || canVisit || canRequest ? (
            <>
              {canRequest ? (
                <ButtonLink href={`/requests/new?siteId=${site.id}`} size="lg">
                  Ask for service
                </ButtonLink>
              ) : null}
              {canVisit ? (
                <ButtonLink href={myOpenVisit ? `/visits/${myOpenVisit.id}` : `/visits/new?siteId=${site.id}`} size="lg">
                  {myOpenVisit ? 'Continue your visit' : 'Start visit'}
                </ButtonLink>
              ) : null}
              {canWrite ? (
                <>
                  <ButtonLink href={`/sites/${site.id}/edit`} variant="secondary">
                    Edit site
                  </ButtonLink>
                  <ArchiveSiteButton siteId={site.id} archived={Boolean(site.archivedAt)} />
                </>
              ) : null}
            </>
          ) : null
        }
      />
      {site.archivedAt ? <p className="rounded bg-slate-200 px-3 py-2 text-sm font-medium">Archived site: hidden from lists, kept with its history.</p> : null}
      {site.canKeepOffline ? <KeepSitePanel siteId={site.id} timeZone={site.timeZone} /> : null}
      <SiteAttention actor={actor} siteId={site.id} />
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
            {site.accessNotes ? (
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
          <AreaManager siteId={site.id} areas={areas} canWrite={site.canManageAreas} />
        </section>
      </div>
      <section aria-labelledby="follow-ups-h" className="space-y-3">
        <div className="flex flex-wrap items-center justify-between gap-2">
          <h2 id="follow-ups-h" className="text-lg font-semibold">
            Open follow-ups ({followUps.items.length}
            {followUps.nextCursor ? '+' : ''})
          </h2>
          <Link href={`/follow-ups?siteId=${site.id}`} className="inline-flex min-h-11 items-center font-semibold text-ice-800 underline">
            All follow-ups at this site
          </Link>
        </div>
        <FollowUpList items={followUps.items} showSite={false} openVisitBySite={myOpenVisit ? { [site.id]: myOpenVisit.id } : {}} empty="Nothing open at this site." />
      </section>
      <SitePlans plans={plans} siteId={site.id} canPlan={site.canPlan} />
      <SiteRecentVisits visits={recentVisits.items} siteId={site.id} />
      <SiteRecentPhotos photos={recentPhotos} timeZone={site.timeZone} />
      <SiteSystems siteId={site.id} systems={systems} canWrite={site.canManageSystems} />
      <SiteEquipment
        siteId={site.id}
        items={equipment.items}
        removed={removedEquipment.items}
        more={equipment.nextCursor !== null}
        areas={areas}
        canRegister={site.canRegisterEquipment}
        canImport={site.canImportEquipment}
      />
    </div>
  );
}
