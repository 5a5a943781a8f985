import type { Metadata } from 'next';
import Link from 'next/link';
import { SiteList } from '@/components/sites/site-list';
import { Alert } from '@/components/ui/alert';
import { ButtonLink } from '@/components/ui/button';
import { Card, PageHeader } from '@/components/ui/card';
import { requirePageActor } from '@/lib/auth';
import { roleLabels } from '@/lib/auth/permissions';
import { getHomeCounts } from '@/lib/home/service';
import { listSites } from '@/lib/sites/service';

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
  const [counts, sites] = await Promise.all([getHomeCounts(actor), listSites(actor, { limit: 8, archived: 'exclude' })]);
  const first = actor.name.split(' ')[0];

  return (
    <div className="space-y-6" data-home={actor.role}>
      <PageHeader title={`Hello, ${first}`} subtitle={`${roleLabels[actor.role]} home`} />
      {denied ? <Alert tone="warning" title="That page is not available to your role." /> : null}

      {actor.role === 'admin' ? (
        <section aria-labelledby="admin-h" className="space-y-3">
          <h2 id="admin-h" className="text-lg font-semibold">People and settings</h2>
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
        </section>
      ) : null}

      {actor.role === 'office' ? (
        <section aria-labelledby="office-h" className="space-y-3">
          <h2 id="office-h" className="text-lg font-semibold">Customers</h2>
          <div className="grid grid-cols-3 gap-3">
            <Stat label="Clients" value={counts.clients} href="/clients" />
            <Stat label="Sites" value={counts.sites} href="/sites" />
            <Stat label="Areas" value={counts.areas} />
          </div>
          <div className="flex flex-wrap gap-2">
            <ButtonLink href="/clients/new">New client</ButtonLink>
            <ButtonLink href="/sites/new" variant="secondary">New site</ButtonLink>
          </div>
        </section>
      ) : null}

      {actor.role === 'technician' ? (
        <Card>
          <h2 className="text-lg font-semibold">Your work</h2>
          <p className="mt-1 text-slate-700">
            Open a site to see its areas. Scanning tags and logging visits arrive in later releases; until then nothing here is invented.
          </p>
        </Card>
      ) : null}

      {actor.role === 'client' ? (
        <Card>
          <h2 className="text-lg font-semibold">Your equipment, your sites</h2>
          <p className="mt-1 text-slate-700">
            You can see {counts.sites} {counts.sites === 1 ? 'site' : 'sites'} with {counts.areas} {counts.areas === 1 ? 'area' : 'areas'}. Equipment condition,
            visit reports and follow-ups will show here as your service company records them.
          </p>
        </Card>
      ) : null}

      <section aria-labelledby="sites-h" className="space-y-3">
        <div className="flex items-end justify-between">
          <h2 id="sites-h" className="text-lg font-semibold">{actor.role === 'client' ? 'Your sites' : 'Sites'}</h2>
          <Link href="/sites" className="min-h-11 py-2 text-sm font-semibold text-ice-800 underline">All sites</Link>
        </div>
        <SiteList sites={sites.items} showClient={actor.role !== 'client'} empty="No sites yet." />
      </section>
    </div>
  );
}
