import type { Metadata } from 'next';
import { z } from 'zod';
import { Alert } from '@/components/ui/alert';
import { ButtonLink } from '@/components/ui/button';
import { Card, PageHeader } from '@/components/ui/card';
import { SiteLine } from '@/components/sites/site-line';
import { formatTime } from '@/lib/visits/report-content';
import { visitReasonLabels } from '@/lib/visits/schemas';
import { listVisits } from '@/lib/visits/service';
import { siteFirst } from '@/app/(app)/site-first';
import { StartVisitForm } from '@/app/(app)/visits/new/_components/start-visit-form';

export const metadata: Metadata = { title: 'Start a visit' };

const querySchema = z.object({ siteId: z.uuid().optional().catch(undefined), equipmentId: z.uuid().optional().catch(undefined) });

export default async function StartVisitPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const query = querySchema.parse(await searchParams);
  const at = await siteFirst('/visits/new', 'visits.start', query.siteId, {
    title: 'Start a visit',
    subtitle: 'Choose the site you are at. Scanning a unit’s tag also takes you to its site.',
  });
  if (!at.site) return at.picker;
  const { actor, site } = at;
  const open = await listVisits(actor, { siteId: site.id, status: 'open', technicianId: actor.id, limit: 1 });
  const current = open.items[0];

  return (
    <div className="space-y-5">
      <PageHeader
        title="Start a visit"
        subtitle={<SiteLine site={site} />}
      />
      {site.archivedAt ? (
        <Alert tone="warning" title="This site is archived">
          Visits cannot be started at an archived site.
        </Alert>
      ) : current ? (
        <Card className="space-y-3">
          <p className="text-lg font-semibold">You already have an open visit here.</p>
          <p className="text-slate-700">
            {visitReasonLabels[current.reason]} · started {formatTime(current.startedAt, current.timeZone)} · {current.entryCount}{' '}
            {current.entryCount === 1 ? 'entry' : 'entries'}
          </p>
          <ButtonLink href={`/visits/${current.id}${query.equipmentId ? `?equipment=${query.equipmentId}` : ''}`} size="lg">
            Continue that visit
          </ButtonLink>
        </Card>
      ) : (
        <Card>
          <StartVisitForm siteId={site.id} timeZone={site.timeZone} equipmentId={query.equipmentId} />
        </Card>
      )}
    </div>
  );
}
