import type { Metadata } from 'next';
import { z } from 'zod';
import { ButtonLink } from '@/components/ui/button';
import { PageHeader } from '@/components/ui/card';
import { SeverityBadge } from '@/components/visits/badges';
import { FollowUpList } from '@/components/visits/follow-up-list';
import { requirePageActor } from '@/lib/auth';
import { can } from '@/lib/auth/access';
import { FOLLOW_UP_STATUSES, followUpStatusLabels, type FollowUpStatus } from '@/lib/follow-ups/schemas';
import { countOpenBySeverity, listFollowUps } from '@/lib/follow-ups/service';
import { listSites } from '@/lib/sites/service';
import { SEVERITIES, severityLabels } from '@/lib/visits/schemas';
import { listVisits } from '@/lib/visits/service';
import { FilterSelect } from '@/components/forms/filter-select';
import { optionsOf } from '@/components/forms/select-options';

export const metadata: Metadata = { title: 'Follow-ups' };

const statusViews = ['live', ...FOLLOW_UP_STATUSES, 'all'] as const;
type StatusView = (typeof statusViews)[number];
const statusViewLabels: Record<StatusView, string> = { live: 'Open and scheduled', ...followUpStatusLabels, all: 'All' };
const statusesFor = (v: StatusView): FollowUpStatus[] => (v === 'live' ? ['open', 'scheduled'] : v === 'all' ? [...FOLLOW_UP_STATUSES] : [v]);

const querySchema = z.object({
  siteId: z.uuid().optional().catch(undefined),
  severity: z.enum(SEVERITIES).optional().catch(undefined),
  status: z.enum(statusViews).optional().catch(undefined),
  cursor: z.string().max(500).optional().catch(undefined),
});

export default async function FollowUpsPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const query = querySchema.parse(await searchParams);
  const actor = await requirePageActor('/follow-ups', 'followups.read');
  const status = query.status ?? 'live';
  const [page, counts, sites, myOpen] = await Promise.all([
    listFollowUps(actor, { siteId: query.siteId, severity: query.severity ? [query.severity] : undefined, status: statusesFor(status), cursor: query.cursor, limit: 100 }),
    countOpenBySeverity(actor, query.siteId ?? null),
    listSites(actor, { limit: 200, archived: 'exclude' }),
    can(actor, 'visits.start') ? listVisits(actor, { status: 'open', technicianId: actor.id, limit: 100 }) : Promise.resolve(null),
  ]);
  const openVisitBySite = Object.fromEntries((myOpen?.items ?? []).map((v) => [v.siteId, v.id]));
  const total = Object.values(counts).reduce((a, b) => a + b, 0);
  const more = new URLSearchParams();
  if (query.siteId) more.set('siteId', query.siteId);
  if (query.severity) more.set('severity', query.severity);
  if (query.status) more.set('status', query.status);
  if (page.nextCursor) more.set('cursor', page.nextCursor);

  return (
    <div className="space-y-5">
      <PageHeader
        title="Follow-ups"
        subtitle={actor.role === 'client' ? 'Work found on visits that is still to be done at your sites.' : 'Work found on visits and still to be done, oldest first.'}
      />
      <section aria-label="Open and scheduled by severity" className="flex flex-wrap items-center gap-2">
        <span className="font-semibold">{total} open or scheduled:</span>
        {SEVERITIES.map((s) => (
          <span key={s} className="inline-flex items-center gap-1">
            <SeverityBadge severity={s} />
            <span className="font-bold tabular-nums">{counts[s]}</span>
          </span>
        ))}
      </section>

      <form method="get" action="/follow-ups" className="grid grid-cols-1 gap-2 sm:grid-cols-4 sm:items-end">
        <FilterSelect name="siteId" label="Site" value={query.siteId ?? ''} empty="All sites" options={sites.items.map((s) => ({ value: s.id, label: s.name }))} />
        <FilterSelect name="severity" label="Severity" value={query.severity ?? ''} empty="Any severity" options={optionsOf(SEVERITIES, severityLabels)} />
        <FilterSelect name="status" label="Status" value={status} options={optionsOf(statusViews, statusViewLabels)} />
        <button type="submit" className="min-h-11 rounded-md border border-slate-300 bg-white px-4 font-semibold hover:bg-slate-100">
          Show
        </button>
      </form>

      <FollowUpList items={page.items} openVisitBySite={openVisitBySite} empty="No follow-ups match." />
      {page.nextCursor ? (
        <ButtonLink href={`/follow-ups?${more}`} variant="secondary" size="lg">
          More follow-ups
        </ButtonLink>
      ) : null}
    </div>
  );
}
