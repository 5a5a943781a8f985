import type { Metadata } from 'next';
import Link from 'next/link';
import type { ReactNode } from 'react';
import { EquipmentList } from '@/components/equipment/equipment-list';
import { ButtonLink } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { EquipmentHistory } from '@/components/visits/equipment-history';
import { orNotFound } from '@/lib/api/page';
import { requirePageActor } from '@/lib/auth';
import { listEquipment } from '@/lib/equipment/service';
import { applicationLabels } from '@/lib/equipment/types';
import { getSystem } from '@/lib/systems/service';
import { formatQuantity } from '@/lib/units/quantities';
import { HISTORY_PAGE_SIZE } from '@/lib/visits/schemas';
import { systemHistory } from '@/lib/visits/history';
import { ArchiveSystemButton } from '@/app/(app)/systems/[id]/_components/archive-system-button';
import { Section } from '@/components/ui/section';
import { TextLink } from '@/components/ui/text-link';

export const metadata: Metadata = { title: 'System' };

function Detail({ label, children }: { label: string; children: ReactNode }) {
  return (
    <div className="py-2">
      <dt className="text-sm font-medium text-slate-600">{label}</dt>
      <dd className="text-lg font-semibold text-slate-900">{children}</dd>
    </div>
  );
}

export default async function SystemPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const actor = await requirePageActor(`/systems/${id}`);
  const system = await orNotFound(getSystem(actor, id));
  const members = await listEquipment(actor, { systemId: system.id, limit: 200, sort: 'type', dir: 'asc' });
  const prefs = { units: actor.units, metricPressure: actor.metricPressure };
  const registerHref = `/equipment/new?siteId=${system.siteId}&systemId=${system.id}${system.areaId ? `&areaId=${system.areaId}` : ''}`;

  return (
    <div className="space-y-6">
      <div className="mb-5 flex flex-col gap-3 sm:flex-row sm:items-end sm:justify-between">
        <div>
          <p className="text-sm font-semibold uppercase tracking-wide text-slate-600">Refrigeration system</p>
          <h1 className="text-2xl font-bold tracking-tight text-slate-900">{system.name}</h1>
          <p className="mt-1 text-slate-700">
            <TextLink href={`/sites/${system.siteId}`}>{system.siteName}</TextLink>
            {system.areaName ? ` · serves ${system.areaName}` : ''}
          </p>
        </div>
        <div className="flex flex-wrap gap-2">
          {system.canRegisterEquipment ? <ButtonLink href={registerHref}>Register equipment</ButtonLink> : null}
          {system.canPlan ? (
            <ButtonLink href={`/plans/new?siteId=${system.siteId}&systemId=${system.id}`} variant="secondary">
              Plan a visit
            </ButtonLink>
          ) : null}
          {system.canEdit ? (
            <ButtonLink href={`/systems/${system.id}/edit`} variant="secondary">
              Edit system
            </ButtonLink>
          ) : null}
          {system.canArchive ? <ArchiveSystemButton systemId={system.id} archived={Boolean(system.archivedAt)} /> : null}
        </div>
      </div>
      {system.archivedAt ? <p className="rounded bg-slate-200 px-3 py-2 text-sm font-medium">Archived system: kept with its equipment and history.</p> : null}

      <Card>
        <dl className="grid gap-x-6 sm:grid-cols-2 lg:grid-cols-3">
          <Detail label="Refrigerant">{system.refrigerant}</Detail>
          <Detail label="Application">{applicationLabels[system.application]}</Detail>
          <Detail label="Full charge">{formatQuantity(system.fullChargeKg, 'mass', prefs)}</Detail>
          <Detail label="Design box temperature">{formatQuantity(system.designBoxTempC, 'temperature', prefs)}</Detail>
          <Detail label="Condensing unit">
            {system.condensingUnit ? (
              <Link href={`/equipment/${system.condensingUnit.id}`} className="inline-flex min-h-11 items-center text-ice-800 underline">
                {system.condensingUnit.name}
              </Link>
            ) : (
              <span className="font-normal text-slate-600">Not registered yet</span>
            )}
          </Detail>
          <Detail label="Maintenance">{system.maintenanceIntervalDays ? `Every ${system.maintenanceIntervalDays} days` : <span className="font-normal text-slate-600">No plan set</span>}</Detail>
        </dl>
        {system.notes ? <p className="mt-3 whitespace-pre-line border-t border-slate-100 pt-3 text-sm">{system.notes}</p> : null}
      </Card>

      <Section id="members-h" title={<>Equipment in this system ({system.equipmentCount})</>}>
        <EquipmentList items={members.items} showArea showLife empty="No equipment registered in this system yet." />
        {members.nextCursor ? (
          <Link href={`/equipment?systemId=${system.id}`} className="inline-flex min-h-11 items-center font-semibold text-ice-800 underline">
            See all {system.equipmentCount} in the equipment table
          </Link>
        ) : null}
      </Section>

      <Section id="history-h" title="History of the whole system">
        <p className="text-sm text-slate-700">Every entry on this system’s equipment, newest first.</p>
        <EquipmentHistory scope="system" id={system.id} prefs={prefs} showEquipment initialPage={await systemHistory(actor, system.id, { limit: HISTORY_PAGE_SIZE })} />
      </Section>
    </div>
  );
}
