import { ChevronRight, Waypoints } from 'lucide-react';
import Link from 'next/link';
import { ButtonLink } from '@/components/ui/button';
import { EmptyState } from '@/components/ui/card';
import type { SystemDto } from '@/lib/systems/dto';
import { applicationLabels } from '@/lib/equipment/types';
import { Section } from '@/components/ui/section';

export function SiteSystems({ siteId, systems, canWrite }: { siteId: string; systems: SystemDto[]; canWrite: boolean }) {
  return (
    <Section
      id="systems-h"
      title="Systems"
      actions={
        canWrite ? (
          <ButtonLink href={`/systems/new?siteId=${siteId}`} variant="secondary">
            New system
          </ButtonLink>
        ) : null
      }
    >
      {systems.length === 0 ? (
        <EmptyState title="No systems yet.">A system is one refrigeration circuit: a condensing unit or rack and the evaporators and controls it serves.</EmptyState>
      ) : (
        <ul className="divide-y divide-slate-200 overflow-hidden rounded-lg border border-slate-200 bg-white">
          {systems.map((s) => (
            <li key={s.id}>
              <Link href={`/systems/${s.id}`} className="flex min-h-14 items-start gap-3 px-4 py-3 hover:bg-ice-50">
                <Waypoints aria-hidden className="mt-0.5 size-5 shrink-0 text-ice-700" />
                <span className="min-w-0 flex-1">
                  <span className="block font-semibold text-slate-900">{s.name}</span>
                  <span className="block text-sm text-slate-700">
                    <span className="font-semibold">{s.refrigerant}</span> · {applicationLabels[s.application]}
                    {s.areaName ? ` · ${s.areaName}` : ''}
                  </span>
                  <span className="block text-sm text-slate-600">
                    {s.condensingUnit ? `Condensing unit: ${s.condensingUnit.name}` : 'No condensing unit registered'} · {s.equipmentCount}{' '}
                    {s.equipmentCount === 1 ? 'piece' : 'pieces'} of equipment
                  </span>
                </span>
                <ChevronRight aria-hidden className="mt-0.5 size-5 shrink-0 text-slate-400" />
              </Link>
            </li>
          ))}
        </ul>
      )}
    </Section>
  );
}
