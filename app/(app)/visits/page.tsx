import { Check, ChevronRight, Plus } from 'lucide-react';
import type { Metadata } from 'next';
import Link from 'next/link';
import { z } from 'zod';
import { ButtonLink } from '@/components/ui/button';
import { EmptyState, PageHeader } from '@/components/ui/card';
import { FilterSelect } from '@/components/forms/filter-select';
import { NeedsReviewBadge, VisitStatusBadge } from '@/components/visits/badges';
import { requirePageActor } from '@/lib/auth';
import { can } from '@/lib/auth/access';
import { listSites } from '@/lib/sites/service';
import { cn } from '@/lib/utils';
import type { VisitDto } from '@/lib/visits/dto';
import { formatTime } from '@/lib/visits/report-content';
import { visitReasonLabels } from '@/lib/visits/schemas';
import { listVisits } from '@/lib/visits/service';

export const metadata: Metadata = { title: 'Visits' };

const views = ['review', 'open', 'closed', 'mine', 'all'] as const;
type View = (typeof views)[number];
const viewLabels: Record<View, string> = { review: 'Needs review', open: 'Open', closed: 'Closed', mine: 'My visits', all: 'All' };

const querySchema = z.object({
  view: z.enum(views).optional().catch(undefined),
  siteId: z.uuid().optional().catch(undefined),
  cursor: z.string().max(500).optional().catch(undefined),
});

export default async function VisitsPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const query = querySchema.parse(await searchParams);
  const actor = await requirePageActor('/visits');
  const office = can(actor, 'visits.review');
  const staff = can(actor, 'visits.start');
  // Each role lands where its work is: the office on what awaits review, a technician on their own visits.
  const available: View[] = office ? ['review', 'open', 'closed', 'all'] : staff ? ['mine', 'open', 'closed', 'all'] : ['all'];
  const view: View = query.view && available.includes(query.view) ? query.view : available[0]!;
  const [page, sites, myOpen] = await Promise.all([
    listVisits(actor, {
      siteId: query.siteId,
      status: view === 'open' ? 'open' : view === 'closed' ? 'closed' : undefined,
      review: view === 'review' ? 'needed' : undefined,
      technicianId: view === 'mine' ? actor.id : undefined,
      cursor: query.cursor,
      limit: 30,
    }),
    listSites(actor, { limit: 200, archived: 'exclude' }),
    staff ? listVisits(actor, { status: 'open', technicianId: actor.id, limit: 10 }) : Promise.resolve(null),
  ]);
  const href = (next: Partial<{ view: View; siteId: string; cursor: string }>) => {
    const p = new URLSearchParams();
    const v = next.view ?? view;
    if (v !== available[0]) p.set('view', v);
    const s = 'siteId' in next ? next.siteId : query.siteId;
    if (s) p.set('siteId', s);
    if (next.cursor) p.set('cursor', next.cursor);
    const qs = p.toString();
    return `/visits${qs ? `?${qs}` : ''}`;
  };

  return (
    <div className="space-y-5">
      <PageHeader
        title="Visits"
        subtitle={office ? 'Closed visits wait here for review; open ones are in progress.' : undefined}
        actions={
          staff ? (
            <ButtonLink href="/visits/new" size="lg">
              <Plus aria-hidden className="size-5" /> Start a visit
            </ButtonLink>
          ) : null
        }
      />

      {myOpen && myOpen.items.length > 0 ? (
        <section aria-labelledby="mine-h" className="space-y-2">
          <h2 id="mine-h" className="text-lg font-semibold">
            Your open visits
          </h2>
          <VisitList visits={myOpen.items} showReview={false} />
        </section>
      ) : null}

      <nav aria-label="Which visits" className="flex flex-wrap gap-2">
        {available.map((v) => (
          <Link
            key={v}
            href={href({ view: v, cursor: undefined })}
            aria-current={v === view ? 'page' : undefined}
            className={cn(
              'inline-flex min-h-11 items-center rounded-full border-2 px-4 text-sm font-semibold',
              v === view ? 'border-ice-900 bg-ice-900 text-white' : 'border-slate-300 bg-white text-slate-900 hover:bg-slate-100',
            )}
          >
            {v === view ? (
              <>
                <Check aria-hidden className="mr-1 size-4" />
                <span className="sr-only">Showing: </span>
              </>
            ) : null}
            {viewLabels[v]}
          </Link>
        ))}
      </nav>

      <form method="get" action="/visits" className="flex flex-col gap-2 sm:flex-row sm:items-end">
        {view !== available[0] ? <input type="hidden" name="view" value={view} /> : null}
        <FilterSelect name="siteId" label="Site" value={query.siteId ?? ''} empty="All sites" options={sites.items.map((s) => ({ value: s.id, label: s.name }))} className="sm:w-80" />
        <button type="submit" className="min-h-11 rounded-md border border-slate-300 bg-white px-4 font-semibold hover:bg-slate-100">
          Show
        </button>
      </form>

      <section aria-label={viewLabels[view]}>
        {page.items.length === 0 ? (
          <EmptyState title={view === 'review' ? 'Nothing waits for review.' : 'No visits here.'} />
        ) : (
          <VisitList visits={page.items} showReview={office} />
        )}
      </section>
      {page.nextCursor ? (
        <ButtonLink href={href({ cursor: page.nextCursor })} variant="secondary" size="lg">
          Older visits
        </ButtonLink>
      ) : null}
    </div>
  );
}

function VisitList({ visits, showReview }: { visits: VisitDto[]; showReview: boolean }) {
  return (
    <ul className="divide-y divide-slate-200 overflow-hidden rounded-lg border border-slate-200 bg-white">
      {visits.map((v) => (
        <li key={v.id}>
          <Link href={`/visits/${v.id}`} className="flex min-h-16 items-start gap-3 px-4 py-3 hover:bg-ice-50">
            <span className="min-w-0 flex-1 space-y-1">
              <span className="block font-semibold text-slate-900">
                {v.siteName} · {visitReasonLabels[v.reason]}
              </span>
              <span className="block text-sm text-slate-700">
                {v.clientName} · {v.technicianName} · {formatTime(v.startedAt, v.timeZone)} · {v.entryCount} {v.entryCount === 1 ? 'entry' : 'entries'}
              </span>
              <span className="flex flex-wrap gap-1.5">
                <VisitStatusBadge status={v.status} reviewed={Boolean(v.reviewedAt)} />
                {showReview && v.status === 'closed' && !v.reviewedAt ? <NeedsReviewBadge /> : null}
              </span>
            </span>
            <ChevronRight aria-hidden className="mt-1 size-5 shrink-0 text-slate-500" />
          </Link>
        </li>
      ))}
    </ul>
  );
}
