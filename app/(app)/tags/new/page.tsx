import type { Metadata } from 'next';
import { PageHeader } from '@/components/ui/card';
import { requirePageActor } from '@/lib/auth';
import { getEquipment } from '@/lib/equipment/service';
import { listSites } from '@/lib/sites/service';
import { listLayouts } from '@/lib/tags/print-runs';
import { PrintRunForm } from '@/app/(app)/tags/new/_components/print-run-form';

export const metadata: Metadata = { title: 'New print run' };

export default async function NewPrintRunPage({ searchParams }: { searchParams: Promise<Record<string, string | undefined>> }) {
  const actor = await requirePageActor('/tags/new', 'tags.print');
  const params = await searchParams;
  const [sites, layouts] = await Promise.all([listSites(actor, { limit: 200, archived: 'exclude' }), listLayouts(actor)]);
  // From an equipment page's "Print a new tag": that unit, preselected, replacing its tag.
  const equipment = params.equipment ? await getEquipment(actor, params.equipment).catch(() => null) : null;
  return (
    <>
      <PageHeader title="New print run" subtitle="Tags are created when the run is made; the label PDF is kept with the run to download again." />
      <PrintRunForm
        sites={sites.items.map((s) => ({ id: s.id, name: s.name, clientName: s.clientName }))}
        layouts={layouts}
        initial={
          equipment
            ? { kind: 'equipment', siteId: equipment.siteId, equipmentIds: [equipment.id], alreadyTagged: 'replace' }
            : { kind: params.kind === 'blank' ? 'blank' : 'equipment', siteId: sites.items.some((s) => s.id === params.siteId) ? params.siteId : undefined }
        }
      />
    </>
  );
}
