import type { Metadata } from 'next';
import { ButtonLink } from '@/components/ui/button';
import { PageHeader } from '@/components/ui/card';
import { requirePageActor } from '@/lib/auth';
import { can } from '@/lib/auth/access';
import { listSites } from '@/lib/sites/service';
import { SiteBrowser } from '@/app/(app)/sites/_components/site-browser';

export const metadata: Metadata = { title: 'Sites' };

export default async function SitesPage() {
  const actor = await requirePageActor('/sites');
  const first = await listSites(actor, { limit: 50, archived: 'exclude' });
  return (
    <>
      <PageHeader
        title="Sites"
        subtitle={actor.role === 'client' ? 'Your sites' : 'Every address where a client has equipment.'}
        actions={can(actor, 'sites.write') ? <ButtonLink href="/sites/new">New site</ButtonLink> : null}
      />
      <SiteBrowser initial={first} showClient={actor.role !== 'client'} canSeeArchived={can(actor, 'sites.write')} />
    </>
  );
}
