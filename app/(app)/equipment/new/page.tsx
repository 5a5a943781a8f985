import type { Metadata } from 'next';
import { Button } from '@/components/ui/button';
import { EmptyState, PageHeader } from '@/components/ui/card';
import { Field, Select } from '@/components/ui/field';
import { SiteLine } from '@/components/sites/site-line';
import { orNotFound } from '@/lib/api/page';
import { requirePageActor } from '@/lib/auth';
import { EQUIPMENT_TYPES, type EquipmentType } from '@/lib/equipment/types';
import { getSite, listAreas, listSites } from '@/lib/sites/service';
import { listSystems } from '@/lib/systems/service';
import { EquipmentForm } from '@/app/(app)/equipment/_components/equipment-form';

export const metadata: Metadata = { title: 'Register equipment' };

type Search = { siteId?: string; areaId?: string; systemId?: string; type?: string };

export default async function NewEquipmentPage({ searchParams }: { searchParams: Promise<Search> }) {
  const search = await searchParams;
  const query = new URLSearchParams(Object.entries(search).filter((e): e is [string, string] => typeof e[1] === 'string'));
  const actor = await requirePageActor(`/equipment/new${query.size ? `?${query}` : ''}`, 'equipment.write');

  if (!search.siteId) {
    const sites = await listSites(actor, { limit: 200, archived: 'exclude' });
    if (sites.items.length === 0) {
      return (
        <>
          <PageHeader title="Register equipment" />
          <EmptyState title="There are no sites yet.">Equipment is registered at a site: create the client’s site first.</EmptyState>
        </>
      );
    }
    return (
      <>
        <PageHeader title="Register equipment" subtitle="First choose the site where the equipment is." />
        {/* A plain GET form: works before any script has loaded. */}
        <form method="get" action="/equipment/new" className="grid max-w-xl gap-4">
          <Field id="siteId" label="Site">
            <Select id="siteId" name="siteId" required>
              {sites.items.map((s) => (
                <option key={s.id} value={s.id}>
                  {s.name} · {s.clientName}
                </option>
              ))}
            </Select>
          </Field>
          <div>
            <Button type="submit" size="lg">
              Continue
            </Button>
          </div>
        </form>
      </>
    );
  }

  const site = await orNotFound(getSite(actor, search.siteId));
  const [areas, systems] = await Promise.all([listAreas(actor, site.id), listSystems(actor, { siteId: site.id, limit: 200, archived: 'exclude' })]);
  // Presets from links (a system page, an area) only count when they belong to this site.
  const preset = {
    areaId: areas.some((a) => a.id === search.areaId) ? search.areaId : (systems.find((s) => s.id === search.systemId)?.areaId ?? undefined),
    systemId: systems.some((s) => s.id === search.systemId) ? search.systemId : undefined,
    type: (EQUIPMENT_TYPES as readonly string[]).includes(search.type ?? '') ? (search.type as EquipmentType) : undefined,
  };
  return (
    <>
      <PageHeader
        title="Register equipment"
        subtitle={<SiteLine site={site} lead="At" showClient={actor.role !== 'client'} />}
      />
      <EquipmentForm
        siteId={site.id}
        areas={areas.map((a) => ({ id: a.id, name: a.name }))}
        systems={systems.map((s) => ({ id: s.id, name: s.name, refrigerant: s.refrigerant }))}
        preset={preset}
        prefs={{ units: actor.units, metricPressure: actor.metricPressure }}
      />
    </>
  );
}
