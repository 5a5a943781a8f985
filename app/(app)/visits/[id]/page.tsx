import { Download } from 'lucide-react';
import type { Metadata } from 'next';
import Link from 'next/link';
import { Suspense } from 'react';
import { EquipmentTypeIcon } from '@/components/equipment/equipment-type-icon';
import { Alert } from '@/components/ui/alert';
import { Card, EmptyState } from '@/components/ui/card';
import { EntryKindLabel, NeedsReviewBadge, VisitStatusBadge } from '@/components/visits/badges';
import { EntrySummary } from '@/components/visits/entry-summary';
import { orNotFound } from '@/lib/api/page';
import { requirePageActor } from '@/lib/auth';
import { listEquipment } from '@/lib/equipment/service';
import { equipmentTypeLabels, type EquipmentType } from '@/lib/equipment/types';
import { cn } from '@/lib/utils';
import type { EntryDto } from '@/lib/visits/dto';
import { formatTime } from '@/lib/visits/report-content';
import { visitReasonLabels } from '@/lib/visits/schemas';
import { siteEntryContexts } from '@/lib/visits/context';
import { getVisit } from '@/lib/visits/service';
import { siteTagCodes } from '@/lib/tags/service';
import { ReviewActions } from '@/app/(app)/visits/[id]/_components/review-actions';
import { VisitWorkspace } from '@/app/(app)/visits/[id]/_components/visit-workspace';

export const metadata: Metadata = { title: 'Visit' };

/** The visit's title: the name of its site, which it links to. */
function SiteHeading({ visit, className }: { visit: { siteId: string; siteName: string }; className: string }) {
  return (
    <h1 className={cn('break-words font-bold tracking-tight text-slate-900', className)}>
      <Link href={`/sites/${visit.siteId}`} className="inline-flex min-h-11 items-center hover:underline">
        {visit.siteName}
      </Link>
    </h1>
  );
}

export default async function VisitPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const actor = await requirePageActor(`/visits/${id}`);
  const visit = await orNotFound(getVisit(actor, id));
  const prefs = { units: actor.units, metricPressure: actor.metricPressure };

  const header = (
    <header className="space-y-2">
      <p className="text-sm font-semibold uppercase tracking-wide text-slate-600">Service visit · {visitReasonLabels[visit.reason]}</p>
      <SiteHeading visit={visit} className="text-2xl" />
      <p className="text-slate-700">
        {actor.role !== 'client' ? `${visit.clientName} · ` : ''}
        {visit.technicianName} · started {formatTime(visit.startedAt, visit.timeZone)}
        {visit.endedAt ? ` · ended ${formatTime(visit.endedAt, visit.timeZone)}` : ''}
      </p>
      <div className="flex flex-wrap items-center gap-2">
        <VisitStatusBadge status={visit.status} reviewed={Boolean(visit.reviewedAt)} />
        {visit.canReview ? <NeedsReviewBadge /> : null}
        {visit.reopenedAt ? <span className="text-sm text-slate-700">Reopened {formatTime(visit.reopenedAt, visit.timeZone)}</span> : null}
      </div>
    </header>
  );

  // The service decides who works on the visit (lib/visits/permissions.ts), as the API does.
  if (visit.canAddEntries) {
    const [equipment, contexts, tagCodes] = await Promise.all([
      listEquipment(actor, { siteId: visit.siteId, status: ['in_service', 'out_of_service'], limit: 200, sort: 'name', dir: 'asc' }),
      siteEntryContexts(actor, visit.siteId),
      siteTagCodes(actor, visit.siteId),
    ]);
    return (
      <div className="space-y-4">
        {/* A phone's first screen is for the work: the visit in two lines. */}
        <header>
          <SiteHeading visit={visit} className="text-xl" />
          <p className="text-sm text-slate-700">
            {visitReasonLabels[visit.reason]} · {visit.technicianName} · started {formatTime(visit.startedAt, visit.timeZone)}
          </p>
        </header>
        {/* useSearchParams needs a boundary; the fallback is never seen on a server render with params. */}
        <Suspense fallback={<p role="status">Loading the visit…</p>}>
          <VisitWorkspace
            visit={visit}
            equipment={equipment.items}
            contexts={contexts}
            tagCodes={tagCodes}
            prefs={prefs}
          />
        </Suspense>
      </div>
    );
  }

  const byEquipment = new Map<string, EntryDto[]>();
  for (const e of visit.entries) byEquipment.set(e.equipmentId, [...(byEquipment.get(e.equipmentId) ?? []), e]);

  return (
    <div className="space-y-6">
      {header}
      {visit.status === 'closed' ? (
        <div className="flex flex-wrap gap-2">
          <a
            href={`/api/visits/${visit.id}/report`}
            className="inline-flex min-h-12 items-center gap-2 rounded-md border border-slate-300 bg-white px-5 text-base font-semibold text-slate-900 hover:bg-slate-100"
          >
            <Download aria-hidden className="size-5" /> Download report (PDF)
          </a>
        </div>
      ) : (
        <Alert tone="info" title="This visit is still open">
          {visit.technicianName} is working on it; entries appear as they are saved.
        </Alert>
      )}
      {visit.canReview || visit.canReopen ? (
        <Card>
          <h2 className="mb-3 text-lg font-semibold">Office review</h2>
          <ReviewActions visitId={visit.id} canReview={visit.canReview} canReopen={visit.canReopen} />
        </Card>
      ) : null}
      {visit.summary ? (
        <Card>
          <h2 className="text-lg font-semibold">Summary</h2>
          <p className="mt-2 whitespace-pre-line">{visit.summary}</p>
        </Card>
      ) : null}
      <section aria-labelledby="record-h" className="space-y-4">
        <h2 id="record-h" className="text-lg font-semibold">
          What was recorded
        </h2>
        {byEquipment.size === 0 ? <EmptyState title="No entries on this visit." /> : null}
        {[...byEquipment.values()].map((entries) => {
          const first = entries[0]!;
          return (
            <section key={first.equipmentId} aria-label={first.equipmentName} className="overflow-hidden rounded-lg border border-slate-200 bg-white">
              <Link href={`/equipment/${first.equipmentId}`} className="flex min-h-12 items-center gap-2 border-b border-slate-200 bg-slate-50 px-4 py-2 hover:bg-ice-50">
                <EquipmentTypeIcon type={first.equipmentType as EquipmentType} />
                <span className="font-semibold">{first.equipmentName}</span>
                <span className="text-sm text-slate-700">{equipmentTypeLabels[first.equipmentType as EquipmentType] ?? first.equipmentType}</span>
              </Link>
              <ol className="divide-y divide-slate-100">
                {entries.map((e) => (
                  <li key={e.id} className={cn('space-y-1 px-4 py-3', e.voidedAt && 'bg-slate-50')}>
                    <div className="flex flex-wrap items-baseline gap-x-3">
                      <EntryKindLabel kind={e.kind} />
                      <time dateTime={e.recordedAt} className="text-sm text-slate-600">
                        {formatTime(e.recordedAt, visit.timeZone)}
                      </time>
                      <span className="text-sm text-slate-600">{e.createdByName}</span>
                    </div>
                    <div className={cn(e.voidedAt && 'text-slate-600 line-through')}>
                      <EntrySummary entry={e} prefs={prefs} />
                    </div>
                    {e.voidedAt ? <p className="text-sm font-semibold">Struck out: {e.voidReason}</p> : null}
                  </li>
                ))}
              </ol>
            </section>
          );
        })}
      </section>
    </div>
  );
}
