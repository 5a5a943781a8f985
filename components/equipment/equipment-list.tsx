import { ChevronRight } from 'lucide-react';
import Link from 'next/link';
import { ConditionBadge } from '@/components/equipment/condition-badge';
import { EquipmentTypeIcon } from '@/components/equipment/equipment-type-icon';
import { RemovalLine } from '@/components/equipment/removal-line';
import { EquipmentStatusBadge } from '@/components/equipment/status-badge';
import { EmptyState } from '@/components/ui/card';
import type { EquipmentDto } from '@/lib/equipment/dto';
import { lifeLine } from '@/lib/equipment/life-line';
import { equipmentTypeLabels } from '@/lib/equipment/types';

/** Equipment as tappable cards: the site drill-down, a system's members, the table on a phone. */
export function EquipmentList({
  items,
  empty,
  showSite = false,
  showArea = false,
  showLife = false,
}: {
  items: EquipmentDto[];
  empty: string;
  showSite?: boolean;
  showArea?: boolean;
  /** Age against expected service life, for the pages an owner reads. */
  showLife?: boolean;
}) {
  const today = new Date();
  if (items.length === 0) return <EmptyState title={empty} />;
  return (
    <ul className="divide-y divide-slate-200 overflow-hidden rounded-lg border border-slate-200 bg-white">
      {items.map((e) => {
        const place = [showSite ? e.siteName : null, showArea ? e.areaName : null].filter(Boolean).join(' · ');
        const makeModel = [e.make, e.model].filter(Boolean).join(' ');
        return (
          <li key={e.id} data-removed={e.status === 'removed' || undefined}>
            <Link href={`/equipment/${e.id}`} className="flex min-h-14 items-start gap-3 px-4 py-3 hover:bg-ice-50">
              <EquipmentTypeIcon type={e.type} className="mt-0.5" />
              <span className="min-w-0 flex-1">
                <span className="block break-words font-semibold text-slate-900">{e.name}</span>
                <span className="block text-sm text-slate-600">
                  {equipmentTypeLabels[e.type]}
                  {makeModel ? ` · ${makeModel}` : ''}
                </span>
                {e.serial || place ? (
                  <span className="block text-sm text-slate-600">
                    {e.serial ? <span className="font-mono text-slate-800">{e.serial}</span> : null}
                    {e.serial && place ? ' · ' : ''}
                    {place}
                  </span>
                ) : null}
                {showLife ? <span className="block text-sm text-slate-700">{lifeLine(e, today)}</span> : null}
                <span className="mt-1.5 flex flex-wrap gap-1.5">
                  <ConditionBadge condition={e.condition} />
                  {e.status !== 'in_service' ? <EquipmentStatusBadge status={e.status} /> : null}
                </span>
              </span>
              <ChevronRight aria-hidden className="mt-0.5 size-5 shrink-0 text-slate-400" />
            </Link>
            {/* Outside the card's link: a link inside a link is not allowed. */}
            {e.status === 'removed' ? <RemovalLine equipment={e} className="block px-4 pb-3 pl-12" /> : null}
          </li>
        );
      })}
    </ul>
  );
}
