import type { Metadata } from 'next';
import Link from 'next/link';
import { EquipmentTagPanel } from '@/components/tags/equipment-tag-panel';
import { ButtonLink } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { DetailList } from '@/components/equipment/detail-list';
import { EquipmentHistory } from '@/components/visits/equipment-history';
import { orNotFound } from '@/lib/api/page';
import { requirePageActor } from '@/lib/auth';
import { nameplateFields } from '@/lib/equipment/nameplate';
import { equipmentTypeLabels, relationPhrases } from '@/lib/equipment/types';
import { getEquipment, getUnitFacts } from '@/lib/equipment/service';
import { getEquipmentTagInfo } from '@/lib/tags/service';
import { formatDay } from '@/lib/format/dates';
import { HISTORY_PAGE_SIZE } from '@/lib/visits/schemas';
import { equipmentHistory } from '@/lib/visits/history';
import { DeleteEquipmentButton } from '@/app/(app)/equipment/[id]/_components/delete-equipment-button';
import { RelationManager } from '@/app/(app)/equipment/[id]/_components/relation-manager';
import { UnitHeader } from '@/app/(app)/equipment/[id]/_components/unit-header';
import { UnitPhotos, UnitReadingChart } from '@/app/(app)/equipment/[id]/_components/unit-islands';
import { formatNameplateValue } from '@/app/(app)/equipment/_components/nameplate-values';
import { Section } from '@/components/ui/section';

export const metadata: Metadata = { title: 'Equipment' };

/**
 * Where a scanned tag lands. A phone's first screen holds the header (what, where, how it is, its
 * settings), the role's main action and the newest history; everything else sits below the
 * history (beside it on a wide screen), and editing tools open only when asked for.
 */
export default async function EquipmentPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const actor = await requirePageActor(`/equipment/${id}`);
  const equipment = await orNotFound(getEquipment(actor, id));
  const [facts, initialHistory, tagInfo] = await Promise.all([
    getUnitFacts(actor, equipment),
    equipmentHistory(actor, equipment.id, { limit: HISTORY_PAGE_SIZE }),
    getEquipmentTagInfo(actor, equipment.id),
  ]);
  const prefs = { units: actor.units, metricPressure: actor.metricPressure };
  const fields = nameplateFields[equipment.type];
  const { canEdit, canDelete, canLogRequest } = equipment;

  return (
    <div className="grid gap-4 lg:grid-cols-[minmax(0,3fr)_minmax(0,2fr)] lg:gap-x-8 lg:gap-y-5">
      <div className="lg:col-span-2">
        <UnitHeader equipment={equipment} facts={facts} prefs={prefs} />
      </div>

      <section aria-labelledby="history-h" className="min-w-0" data-testid="unit-history">
        <EquipmentHistory
          scope="equipment"
          id={equipment.id}
          prefs={prefs}
          initialPage={initialHistory}
          title={
            <h2 id="history-h" className="text-lg font-semibold">
              History
            </h2>
          }
        />
      </section>

      <aside aria-label="About this unit" className="min-w-0 space-y-5">
        <Card>
          <h2 className="text-lg font-semibold">Details</h2>
          <DetailList
            rows={[
              { label: 'Make', value: equipment.make },
              { label: 'Model', value: equipment.model },
              { label: 'Serial', value: equipment.serial ? <span className="font-mono text-lg">{equipment.serial}</span> : null },
              {
                // The unit is one part of a circuit: the words a technician uses.
                label: 'Part of',
                value: equipment.systemId ? (
                  <Link href={`/systems/${equipment.systemId}`} className="inline-flex min-h-11 items-center text-ice-800 underline">
                    {equipment.systemName}
                  </Link>
                ) : null,
              },
              { label: 'Refrigerant', value: equipment.refrigerant },
              ...(actor.role !== 'client' ? [{ label: 'Client', value: equipment.clientName }] : []),
              { label: 'Manufactured', value: equipment.manufacturedOn ? formatDay(equipment.manufacturedOn) : null },
              { label: 'Installed', value: equipment.installedOn ? formatDay(equipment.installedOn) : null },
              { label: 'Condition note', value: equipment.conditionNote ? <span className="whitespace-pre-line font-normal">{equipment.conditionNote}</span> : null },
            ]}
          />
        </Card>
        <Card>
          <h2 className="text-lg font-semibold">Nameplate</h2>
          <DetailList rows={fields.map((f) => ({ label: f.label, value: formatNameplateValue(f, equipment.nameplate[f.key], prefs) }))} />
        </Card>

        <EquipmentTagPanel info={tagInfo} />

        <Section id="relations-h" title="Connected equipment">
          <RelationManager
            equipmentId={equipment.id}
            siteId={equipment.siteId}
            relations={equipment.relations}
            canWrite={equipment.canEditRelations}
            words={{ phrases: relationPhrases, typeLabels: equipmentTypeLabels }}
          />
        </Section>

        <UnitPhotos equipmentId={equipment.id} />

        <Section id="trend-h" title="Readings over time">
          <UnitReadingChart equipmentId={equipment.id} prefs={prefs} timeZone={equipment.siteTimeZone} />
        </Section>

        {canEdit || canDelete || canLogRequest ? (
          <details className="group rounded-lg border border-slate-200 bg-white" data-testid="unit-manage">
            <summary className="flex min-h-12 cursor-pointer items-center px-4 font-semibold text-slate-900 hover:bg-slate-50">{`More for this unit: ${[canEdit && 'edit', canDelete && 'delete', canLogRequest && 'service request'].filter(Boolean).join(', ')}`}</summary>
            <div className="flex flex-wrap gap-2 border-t border-slate-200 p-4">
              {canEdit ? (
                <ButtonLink href={`/equipment/${equipment.id}/edit`} variant="secondary">
                  Edit
                </ButtonLink>
              ) : null}
              {canLogRequest ? (
                <ButtonLink href={`/requests/new?siteId=${equipment.siteId}&equipmentId=${equipment.id}`} variant="secondary">
                  Log a service request
                </ButtonLink>
              ) : null}
              {canDelete ? <DeleteEquipmentButton id={equipment.id} name={equipment.name} siteId={equipment.siteId} /> : null}
            </div>
          </details>
        ) : null}
      </aside>
    </div>
  );
}
