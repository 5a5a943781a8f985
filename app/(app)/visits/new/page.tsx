import { ChevronRight, MapPin } from 'lucide-react';
import type { Metadata } from 'next';
import Link from 'next/link';
import { z } from 'zod';
import { Alert } from '@/components/ui/alert';
import { ButtonLink } from '@/components/ui/button';
import { Card, EmptyState, PageHeader } from '@/components/ui/card';
import { orNotFound } from '@/lib/api/page';
import { requirePageActor } from '@/lib/auth';
import { siteAddress } from '@/lib/sites/dto';
import { getSite, listSites } from '@/lib/sites/service';
import { formatTime } from '@/lib/visits/report-content';
import { visitReasonLabels } from '@/lib/visits/schemas';
import { listVisits } from '@/lib/visits/service';
import { StartVisitForm } from '@/app/(app)/visits/new/_components/start-visit-form';

export const metadata: Metadata = { title: 'Start a visit' };

const querySchema = z.object({ siteId: z.uuid().optional().catch(undefined), equipmentId: z.uuid().optional().catch(undefined) });

export default async function StartVisitPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const query = querySchema.parse(await searchParams);
  const actor = await requirePageActor(`/visits/new${query.siteId ? `?siteId=${query.siteId}` : ''}`, 'visits.start');

  if (!query.siteId) {
    const sites = await listSites(actor, { limit: 200, archived: 'exclude' });
    return (
      <div className="space-y-5">
        <PageHeader title="Start a visit" subtitle="Choose the site you are at. Scanning a unit’s tag also takes you to its site." />
        {sites.items.length === 0 ? (
          <EmptyState title="No sites yet." />
        ) : (
          <ul className="grid grid-cols-1 gap-2 sm:grid-cols-2">
            {sites.items.map((s) => (
              <li key={s.id}>
                <Link href={`/visits/new?siteId=${s.id}`} className="flex min-h-16 items-center gap-3 rounded-lg border-2 border-slate-300 bg-white px-4 py-2 hover:border-ice-700 hover:bg-ice-50">
                  <MapPin aria-hidden className="size-6 shrink-0 text-ice-700" />
                  <span className="min-w-0 flex-1">
                    <span className="block font-semibold">{s.name}</span>
                    <span className="block text-sm text-slate-700">
                      {s.clientName}
                      {siteAddress(s) ? ` · ${siteAddress(s)}` : ''}
                    </span>
                  </span>
                  <ChevronRight aria-hidden className="size-5 text-slate-500" />
                </Link>
              </li>
            ))}
          </ul>
        )}
      </div>
    );
  }

  const site = await orNotFound(getSite(actor, query.siteId));
  const open = await listVisits(actor, { siteId: site.id, status: 'open', technicianId: actor.id, limit: 1 });
  const current = open.items[0];

  return (
    <div className="space-y-5">
      <PageHeader
        title="Start a visit"
        subtitle={
          <>
            <Link href={`/sites/${site.id}`} className="inline-flex min-h-11 items-center font-semibold text-ice-800 underline">
              {site.name}
            </Link>{' '}
            · {site.clientName}
          </>
        }
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
