import type { Metadata } from 'next';
import { ButtonLink } from '@/components/ui/button';
import { PageHeader } from '@/components/ui/card';
import { requirePageActor } from '@/lib/auth';
import { can } from '@/lib/auth/access';
import { listEquipment } from '@/lib/equipment/service';
import { listSites } from '@/lib/sites/service';
import { getSystem } from '@/lib/systems/service';
import { EquipmentBrowser } from '@/app/(app)/equipment/_components/equipment-browser';
import { QueryProvider } from '@/components/query/query-provider';
import { parseFilters } from '@/app/(app)/equipment/_components/table-filters';

export const metadata: Metadata = { title: 'Equipment' };

type Search = Record<string, string | string[] | undefined>;

function toParams(search: Search): URLSearchParams {
  const params = new URLSearchParams();
  for (const [key, value] of Object.entries(search)) {
    for (const v of Array.isArray(value) ? value : value === undefined ? [] : [value]) params.append(key, v);
  }
  return params;
}

export default async function EquipmentIndexPage({ searchParams }: { searchParams: Promise<Search> }) {
  const params = toParams(await searchParams);
  const actor = await requirePageActor(`/equipment${params.size ? `?${params}` : ''}`);
  const filters = parseFilters(params);
  const [sites, page, system] = await Promise.all([
    listSites(actor, { limit: 200, archived: 'exclude' }),
    listEquipment(actor, { ...filters, limit: 50 }),
    filters.systemId ? getSystem(actor, filters.systemId).catch(() => null) : null,
  ]);
  return (
    <>
      <PageHeader
        title="Equipment"
        subtitle={actor.role === 'client' ? 'Everything registered at your sites.' : 'Every registered unit across your clients’ sites.'}
        actions={
          can(actor, 'equipment.write') ? <ButtonLink href={filters.siteId ? `/equipment/new?siteId=${filters.siteId}` : '/equipment/new'}>Register equipment</ButtonLink> : null
        }
      />
      {/* The provider is per page here: a unit's page under /equipment ships without it. */}
      <QueryProvider>
        <EquipmentBrowser
          sites={sites.items.map((s) => ({ id: s.id, name: s.name }))}
          initial={{ filters, page }}
          systemName={system?.name ?? null}
          showSite={actor.role !== 'client' || sites.items.length > 1}
        />
      </QueryProvider>
    </>
  );
}
