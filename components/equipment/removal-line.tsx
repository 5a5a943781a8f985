import { ArrowRight } from 'lucide-react';
import Link from 'next/link';
import type { EquipmentDto } from '@/lib/equipment/dto';
import { formatDay } from '@/lib/format/dates';
import { cn } from '@/lib/utils';

/** A removed unit's removal date and, when it was replaced, a link to what took its place. */
export function RemovalLine({ equipment, className }: { equipment: Pick<EquipmentDto, 'removedAt' | 'replacedById' | 'replacedByName' | 'siteTimeZone'>; className?: string }) {
  return (
    <span className={cn('text-sm text-slate-700', className)} data-testid="removal-line">
      {equipment.removedAt ? `Removed ${formatDay(equipment.removedAt, equipment.siteTimeZone)}` : 'Removed'}
      {equipment.replacedById ? (
        <>
          {' · replaced by '}
          <Link href={`/equipment/${equipment.replacedById}`} className="inline-flex min-h-6 items-center gap-1 font-semibold text-ice-800 underline">
            {equipment.replacedByName}
            <ArrowRight aria-hidden className="size-3.5" />
          </Link>
        </>
      ) : null}
    </span>
  );
}
