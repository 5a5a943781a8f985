import type { Metadata } from 'next';
import { PageHeader } from '@/components/ui/card';
import { TextLink } from '@/components/ui/text-link';
import { orNotFound } from '@/lib/api/page';
import { requirePageActor } from '@/lib/auth';
import { getEquipment } from '@/lib/equipment/service';
import { listAreas } from '@/lib/sites/service';
import { listSystems } from '@/lib/systems/service';
import { EquipmentForm } from '@/app/(app)/equipment/_components/equipment-form';

export const metadata: Metadata = { title: 'Edit equipment' };

export default async function EditEquipmentPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const actor = await requirePageActor(`/equipment/${id}/edit`, 'equipment.write');
  const equipment = await orNotFound(getEquipment(actor, id));
  const [areas, systems] = await Promise.all([listAreas(actor, equipment.siteId), listSystems(actor, { siteId: equipment.siteId, limit: 200, archived: 'exclude' })]);
  // An archived system or area it still points at stays choosable, so saving does not drop it silently.
  const areaOptions = areas.map((a) => ({ id: a.id, name: a.name }));
  if (equipment.areaId && !areaOptions.some((a) => a.id === equipment.areaId)) areaOptions.push({ id: equipment.areaId, name: `${equipment.areaName ?? 'Current area'} (archived)` });
  const systemOptions = systems.map((s) => ({ id: s.id, name: s.name, refrigerant: s.refrigerant }));
  if (equipment.systemId && !systemOptions.some((s) => s.id === equipment.systemId)) {
    systemOptions.push({ id: equipment.systemId, name: `${equipment.systemName ?? 'Current system'} (archived)`, refrigerant: equipment.refrigerant ?? '?' });
  }
  return (
    <>
      <PageHeader
        title={`Edit ${equipment.name}`}
        subtitle={
          <TextLink href={`/sites/${equipment.siteId}`}>{equipment.siteName}</TextLink>
        }
      />
      <EquipmentForm equipment={equipment} siteId={equipment.siteId} areas={areaOptions} systems={systemOptions} prefs={{ units: actor.units, metricPressure: actor.metricPressure }} />
    </>
  );
}
