import { BellRing } from 'lucide-react';
import type { Metadata } from 'next';
import Link from 'next/link';
import type { ReactNode } from 'react';
import { ConditionBadge } from '@/components/equipment/condition-badge';
import { EquipmentTypeIcon } from '@/components/equipment/equipment-type-icon';
import { EquipmentStatusBadge } from '@/components/equipment/status-badge';
import { EquipmentPhotos } from '@/components/photos/equipment-photos';
import { EquipmentTagPanel } from '@/components/tags/equipment-tag-panel';
import { ButtonLink } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { EquipmentHistory } from '@/components/visits/equipment-history';
import { ReadingChart } from '@/components/visits/reading-chart';
import { orNotFound } from '@/lib/api/page';
import { requirePageActor } from '@/lib/auth';
import { can } from '@/lib/auth/access';
import { nameplateFields } from '@/lib/equipment/nameplate';
import { getEquipment } from '@/lib/equipment/service';
import { equipmentTypeLabels } from '@/lib/equipment/types';
import { HISTORY_PAGE_SIZE } from '@/lib/visits/schemas';
import { equipmentHistory } from '@/lib/visits/service';
import { DeleteEquipmentButton } from '@/app/(app)/equipment/[id]/_components/delete-equipment-button';
import { RelationManager } from '@/app/(app)/equipment/[id]/_components/relation-manager';
import { formatNameplateValue } from '@/app/(app)/equipment/_components/nameplate-values';
import { formatDay } from '@/lib/format/dates';

export const metadata: Metadata = { title: 'Equipment' };

function formatDate(iso: string | null): string | null {
  if (!iso) return null;
  return formatDay(iso);
}

function Detail({ label, children }: { label: string; children: ReactNode }) {
  return (
    <div className="flex flex-col gap-0.5 py-2 sm:flex-row sm:gap-4">
      <dt className="text-sm font-medium text-slate-600 sm:w-48 sm:shrink-0">{label}</dt>
      <dd className="min-w-0 break-words font-medium text-slate-900">{children}</dd>
    </div>
  );
}

/** Recorded values as a list; the rest named in one line, so a phone does not scroll past blanks. */
function DetailList({ rows }: { rows: { label: string; value: ReactNode }[] }) {
  const recorded = rows.filter((r) => r.value !== null && r.value !== undefined && r.value !== '');
  const missing = rows.filter((r) => !recorded.includes(r)).map((r) => r.label);
  return (
    <>
      {recorded.length > 0 ? (
        <dl className="mt-2 divide-y divide-slate-100">
          {recorded.map((r) => (
            <Detail key={r.label} label={r.label}>
              {r.value}
            </Detail>
          ))}
        </dl>
      ) : null}
      {missing.length > 0 ? (
        <p className="mt-2 border-t border-slate-100 pt-2 text-sm text-slate-600">
          <span className="font-medium">Not recorded:</span> {missing.join(', ')}.
        </p>
      ) : null}
    </>
  );
}

export default async function EquipmentPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const actor = await requirePageActor(`/equipment/${id}`);
  const equipment = await orNotFound(getEquipment(actor, id));
  const prefs = { units: actor.units, metricPressure: actor.metricPressure };
  const fields = nameplateFields[equipment.type];

  return (
    <div className="space-y-6">
      <header className="space-y-3">
        <p className="flex items-center gap-2 text-sm font-semibold uppercase tracking-wide text-slate-600">
          <EquipmentTypeIcon type={equipment.type} className="size-5" />
          {equipmentTypeLabels[equipment.type]}
        </p>
        <div className="flex flex-col gap-3 sm:flex-row sm:items-start sm:justify-between">
          <div className="min-w-0">
            <h1 className="break-words text-2xl font-bold tracking-tight text-slate-900">{equipment.name}</h1>
            <p className="mt-1 text-slate-700">
              <Link href={`/sites/${equipment.siteId}`} className="font-medium text-ice-800 underline">
                {equipment.siteName}
              </Link>
              {equipment.areaName ? ` · ${equipment.areaName}` : ''}
              {actor.role !== 'client' ? <span className="text-slate-600"> · {equipment.clientName}</span> : null}
            </p>
          </div>
          <div className="flex flex-wrap gap-2">
            {can(actor, 'requests.create') ? (
              // Where a scan lands an owner: what to do when the unit is not right.
              <ButtonLink href={`/requests/new?siteId=${equipment.siteId}&equipmentId=${equipment.id}`} size={actor.role === 'client' ? 'lg' : undefined} variant={actor.role === 'client' ? 'primary' : 'secondary'}>
                <BellRing aria-hidden className="size-5" />
                {actor.role === 'client' ? 'Ask for service' : 'Log a service request'}
              </ButtonLink>
            ) : null}
            {can(actor, 'equipment.write') ? (
              <ButtonLink href={`/equipment/${equipment.id}/edit`} variant="secondary">
                Edit
              </ButtonLink>
            ) : null}
            {can(actor, 'equipment.delete') ? <DeleteEquipmentButton id={equipment.id} name={equipment.name} siteId={equipment.siteId} /> : null}
          </div>
        </div>
        <div className="flex flex-wrap gap-2">
          <ConditionBadge condition={equipment.condition} size="lg" />
          <EquipmentStatusBadge status={equipment.status} size="lg" />
        </div>
      </header>

      <div className="grid gap-4 lg:grid-cols-2">
        <Card>
          <h2 className="text-lg font-semibold">Details</h2>
          <DetailList
            rows={[
              { label: 'Make', value: equipment.make },
              { label: 'Model', value: equipment.model },
              { label: 'Serial', value: equipment.serial ? <span className="font-mono text-lg">{equipment.serial}</span> : null },
              {
                label: 'System',
                value: equipment.systemId ? (
                  <Link href={`/systems/${equipment.systemId}`} className="text-ice-800 underline">
                    {equipment.systemName}
                  </Link>
                ) : null,
              },
              { label: 'Refrigerant', value: equipment.refrigerant },
              { label: 'Area', value: equipment.areaName },
              { label: 'Manufactured', value: formatDate(equipment.manufacturedOn) },
              { label: 'Installed', value: formatDate(equipment.installedOn) },
              { label: 'Condition note', value: equipment.conditionNote ? <span className="whitespace-pre-line font-normal">{equipment.conditionNote}</span> : null },
            ]}
          />
        </Card>
        <Card>
          <h2 className="text-lg font-semibold">Nameplate</h2>
          <DetailList rows={fields.map((f) => ({ label: f.label, value: formatNameplateValue(f, equipment.nameplate[f.key], prefs) }))} />
        </Card>
      </div>

      <EquipmentTagPanel equipmentId={equipment.id} actor={actor} />

      <section aria-labelledby="relations-h" className="space-y-3">
        <h2 id="relations-h" className="text-lg font-semibold">
          Related equipment
        </h2>
        <RelationManager equipmentId={equipment.id} siteId={equipment.siteId} relations={equipment.relations} canWrite={can(actor, 'equipment.write')} />
      </section>

      <EquipmentPhotos equipmentId={equipment.id} />

      <section aria-labelledby="history-h" className="space-y-3">
        <div className="flex flex-wrap items-center justify-between gap-2">
          <h2 id="history-h" className="text-lg font-semibold">
            History
          </h2>
          {can(actor, 'visits.start') ? (
            <ButtonLink href={`/visits/new?siteId=${equipment.siteId}&equipmentId=${equipment.id}`} size="lg">
              Log a visit on this unit
            </ButtonLink>
          ) : null}
        </div>
        <EquipmentHistory scope="equipment" id={equipment.id} prefs={prefs} initialPage={await equipmentHistory(actor, equipment.id, { limit: HISTORY_PAGE_SIZE })} />
      </section>

      <section aria-labelledby="trend-h" className="space-y-3">
        <h2 id="trend-h" className="text-lg font-semibold">
          Readings over time
        </h2>
        <ReadingChart equipmentId={equipment.id} prefs={prefs} />
      </section>
    </div>
  );
}
