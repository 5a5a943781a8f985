import type { Metadata } from 'next';
import Link from 'next/link';
import { SiteList } from '@/components/sites/site-list';
import { Alert } from '@/components/ui/alert';
import { ButtonLink } from '@/components/ui/button';
import { Card, PageHeader } from '@/components/ui/card';
import { requirePageActor } from '@/lib/auth';
import { roleLabels } from '@/lib/auth/permissions';
import { getHomeCounts } from '@/lib/home/service';
import { attentionPage } from '@/lib/attention/service';
import type { RankedUnit } from '@/lib/attention/rank';
import { dueWork } from '@/lib/overview/due';
import { ownerOverview } from '@/lib/overview/service';
import { listRequests } from '@/lib/requests/service';
import { listVisits } from '@/lib/visits/service';
import { listFollowUps } from '@/lib/follow-ups/service';
import { visitReasonLabels } from '@/lib/visits/schemas';
import { listSites } from '@/lib/sites/service';
import { getClient } from '@/lib/clients/service';
import { AttentionList } from '@/components/overview/attention-list';
import { OverviewCharts } from '@/components/overview/overview-charts';
import { SiteSummaryCard } from '@/components/overview/site-summary-card';
import { SiteSummaryRow } from '@/components/overview/site-summary-row';
import { sitesForHome } from '@/lib/overview/site-need';
import { formatCount } from '@/lib/format/numbers';
import { DueList } from '@/components/overview/due-list';
import { PlanCard } from '@/components/plans/plan-card';
import { StartPlanButton } from '@/components/plans/start-plan-button';
import { can } from '@/lib/auth/access';
import { plansForTechnician } from '@/lib/plans/scheduling';
import { Section, SectionLink } from '@/components/ui/section';

export const metadata: Metadata = { title: 'Home' };

function Stat({ label, value, href }: { label: string; value: number; href?: string }) {
  const body = (
    <>
      <span className="block text-3xl font-bold text-slate-900">{value}</span>
      <span className="text-sm font-medium text-slate-600">{label}</span>
    </>
  );
  return href ? (
    <Link href={href} className="block rounded-lg border border-slate-200 bg-white p-4 hover:border-ice-400">
      {body}
    </Link>
  ) : (
    <div className="rounded-lg border border-slate-200 bg-white p-4">{body}</div>
  );
}

export default async function HomePage({ searchParams }: { searchParams: Promise<{ denied?: string }> }) {
  const actor = await requirePageActor('/');
  const { denied } = await searchParams;
  // The owner home reads its own summaries; the staff homes need the counts and a few sites.
  const [counts, sites] =
    actor.role === 'client'
      ? [{ clients: 0, sites: 0, areas: 0, activeUsers: 0, openInvitations: 0 }, { items: [], nextCursor: null }]
      : await Promise.all([getHomeCounts(actor), listSites(actor, { limit: 8, archived: 'exclude' })]);
  const first = actor.name.split(' ')[0];
  // An owner's home is their business's page: titled with the client's name, not a role.
  const clientName = actor.role === 'client' && actor.clientId ? (await getClient(actor, actor.clientId)).name : null;

  return (
    <div className="space-y-6" data-home={actor.role}>
      {clientName ? <PageHeader title={clientName} subtitle={`Hello, ${first}`} /> : <PageHeader title={`Hello, ${first}`} subtitle={`${roleLabels[actor.role]} home`} />}
      {denied ? <Alert tone="warning" title="That page is not available to your role." /> : null}

      {actor.role === 'admin' ? (
        <Section id="admin-h" title="People and settings">
          <div className="grid grid-cols-2 gap-3 sm:grid-cols-4">
            <Stat label="Active users" value={counts.activeUsers} href="/settings/users" />
            <Stat label="Open invitations" value={counts.openInvitations} href="/settings/users" />
            <Stat label="Clients" value={counts.clients} href="/clients" />
            <Stat label="Sites" value={counts.sites} href="/sites" />
          </div>
          <div className="flex flex-wrap gap-2">
            <ButtonLink href="/settings/users" variant="secondary">Invite someone</ButtonLink>
            <ButtonLink href="/settings/company" variant="secondary">Company settings</ButtonLink>
          </div>
        </Section>
      ) : null}

      {actor.role === 'office' ? (
        <Section id="office-h" title="Customers">
          <div className="grid grid-cols-3 gap-3">
            <Stat label="Clients" value={counts.clients} href="/clients" />
            <Stat label="Sites" value={counts.sites} href="/sites" />
            <Stat label="Areas" value={counts.areas} />
          </div>
          <div className="flex flex-wrap gap-2">
            <ButtonLink href="/clients/new">New client</ButtonLink>
            <ButtonLink href="/sites/new" variant="secondary">New site</ButtonLink>
          </div>
        </Section>
      ) : null}

      {actor.role === 'technician' ? <TechnicianHome actor={actor} /> : null}

      {actor.role === 'client' ? <OwnerHome actor={actor} /> : null}
      {actor.role === 'office' || actor.role === 'admin' ? <OfficeOverview actor={actor} /> : null}

      {actor.role === 'client' ? null : (
        <Section
          id="sites-h"
          title="Sites"
          link={{ href: '/sites', label: 'All sites' }}
        >
          <SiteList sites={sites.items} showClient empty="No sites yet." />
        </Section>
      )}
    </div>
  );
}

/** The first units of the attention list, linked to the whole list and its ordering rule. */
function AttentionSection({ id, linkLabel, units }: { id: string; linkLabel: string; units: RankedUnit[] }) {
  return (
    <Section id={id} title="Needs attention" link={{ href: '/attention', label: linkLabel }}>
      <AttentionList units={units} />
    </Section>
  );
}

async function OwnerHome({ actor }: { actor: Awaited<ReturnType<typeof requirePageActor>> }) {
  const [{ summaries, charts }, attention, requests] = await Promise.all([
    ownerOverview(actor),
    attentionPage(actor, { limit: 5, withTotal: false }),
    listRequests(actor, { status: ['new', 'acknowledged', 'scheduled'], limit: 5 }),
  ]);
  const { cards, rest } = sitesForHome(summaries);
  return (
    <>
      <div className="flex flex-wrap gap-2">
        <ButtonLink href="/requests/new" size="lg">
          Ask for service
        </ButtonLink>
        <ButtonLink href="/reports" variant="secondary" size="lg">
          Reports
        </ButtonLink>
        {requests.length > 0 ? (
          <ButtonLink href="/requests" variant="secondary" size="lg">
            {requests.length} open {requests.length === 1 ? 'request' : 'requests'}
          </ButtonLink>
        ) : null}
      </div>
      <AttentionSection id="attention-h" linkLabel="How this list is ordered · all" units={attention.items} />
      <Section
        id="sites-summary-h"
        title="Your sites"
        link={rest.length > 0 ? { href: '/sites', label: `All ${formatCount(summaries.length)} sites` } : undefined}
      >
        {summaries.length === 0 ? <p className="text-slate-700">No sites are shared with your account yet.</p> : null}
        {summaries.length > 1 ? <p className="text-sm text-slate-700">Sites with the most pressing open items come first.</p> : null}
        <div className="grid gap-3 md:grid-cols-2">
          {cards.map((s) => (
            <SiteSummaryCard key={s.siteId} summary={s} showClient={false} />
          ))}
        </div>
        {rest.length > 0 ? (
          <section aria-labelledby="sites-rest-h" className="space-y-2">
            <h3 id="sites-rest-h" className="font-semibold">
              Your other {formatCount(rest.length)} {rest.length === 1 ? 'site' : 'sites'}
            </h3>
            <ul className="divide-y divide-slate-200 rounded-lg border border-slate-200 bg-white">
              {rest.map((s) => (
                <SiteSummaryRow key={s.siteId} summary={s} />
              ))}
            </ul>
          </section>
        ) : null}
      </Section>
      <Section id="charts-h" title="At a glance">
        <OverviewCharts data={charts} prefs={{ units: actor.units, metricPressure: actor.metricPressure }} />
      </Section>
    </>
  );
}

async function OfficeOverview({ actor }: { actor: Awaited<ReturnType<typeof requirePageActor>> }) {
  const [attention, due, requests] = await Promise.all([attentionPage(actor, { limit: 6, withTotal: false }), dueWork(actor), listRequests(actor, { status: ['new'], limit: 5 })]);
  return (
    <div className="grid gap-6 lg:grid-cols-2 [&>*]:min-w-0">
      <AttentionSection id="office-attention-h" linkLabel="All, and how they are ordered" units={attention.items} />
      <div className="space-y-6">
        <Section
          id="requests-h"
          title="New service requests"
          link={{ href: '/requests', label: 'All requests' }}
        >
          {requests.length === 0 ? (
            <p className="text-sm text-slate-700">No new requests.</p>
          ) : (
            <ul className="divide-y divide-slate-200 rounded-lg border border-slate-200 bg-white">
              {requests.map((r) => (
                <li key={r.id}>
                  <Link href={`/requests/${r.id}`} className="block px-3 py-2 hover:bg-ice-50">
                    <span className="font-semibold">{r.urgency === 'emergency' ? 'Emergency: ' : ''}{r.equipmentName ?? r.siteName}</span>
                    <span className="block truncate text-sm text-slate-700">{r.description}</span>
                  </Link>
                </li>
              ))}
            </ul>
          )}
        </Section>
        <Section
          id="due-h"
          title="Due in the next 30 days or overdue"
          link={{ href: '/plans', label: 'Planned visits' }}
        >
          <DueList items={due} canPlan={can(actor, 'plans.write')} />
        </Section>
      </div>
    </div>
  );
}

async function TechnicianHome({ actor }: { actor: Awaited<ReturnType<typeof requirePageActor>> }) {
  const [open, followUps, plans] = await Promise.all([
    listVisits(actor, { status: 'open', technicianId: actor.id, limit: 10 }),
    listFollowUps(actor, { limit: 5, severity: ['safety', 'down'] }),
    plansForTechnician(actor),
  ]);
  const startable = (p: (typeof plans)[number]) => p.canStart;
  return (
    <Section id="work-h" title="Your work">
      <div className="flex flex-wrap gap-2">
        <ButtonLink href="/scan" size="lg">
          Scan a tag
        </ButtonLink>
        <ButtonLink href="/visits/new" size="lg" variant="secondary">
          Start a visit
        </ButtonLink>
      </div>
      <section aria-labelledby="planned-h" className="space-y-2">
        <div className="flex flex-wrap items-end justify-between gap-2">
          <h3 id="planned-h" className="font-semibold">
            Planned for you
          </h3>
          <SectionLink href="/plans">All planned visits</SectionLink>
        </div>
        {plans.length === 0 ? (
          <p className="text-slate-700">Nothing planned for you in the next 7 days.</p>
        ) : (
          <ul className="grid gap-2 md:grid-cols-2">
            {plans.map((p) => (
              <li key={p.id} className="min-w-0">
                <PlanCard plan={p} showDay showTechnician={false}>
                  {startable(p) ? <StartPlanButton plan={p} /> : null}
                </PlanCard>
              </li>
            ))}
          </ul>
        )}
      </section>
      {open.items.length > 0 ? (
        <Card>
          <h3 className="font-semibold">Your open visits</h3>
          <ul className="mt-2 divide-y divide-slate-200">
            {open.items.map((v) => (
              <li key={v.id}>
                <Link href={`/visits/${v.id}`} className="flex min-h-12 items-center justify-between gap-2 py-2 font-medium underline-offset-2 hover:underline">
                  <span>
                    {v.siteName} · {visitReasonLabels[v.reason]}
                  </span>
                  <span className="text-sm text-slate-600">{v.entryCount} entries</span>
                </Link>
              </li>
            ))}
          </ul>
        </Card>
      ) : (
        <p className="text-slate-700">No open visits. Scan a unit's tag or start a visit from a site.</p>
      )}
      {followUps.items.length > 0 ? (
        <Card>
          <h3 className="font-semibold">Open safety and down follow-ups</h3>
          <ul className="mt-2 divide-y divide-slate-200 text-sm">
            {followUps.items.map((f) => (
              <li key={f.id}>
                {/* The whole row is the target, not only the title's words. */}
                <Link className="block min-h-12 py-2" href={f.equipmentId ? `/equipment/${f.equipmentId}` : `/sites/${f.siteId}`}>
                  <span className="font-medium underline underline-offset-2">{f.title}</span>
                  <span className="block text-slate-700">
                    {f.siteName} · open {f.ageDays} days
                  </span>
                </Link>
              </li>
            ))}
          </ul>
        </Card>
      ) : null}
    </Section>
  );
}
