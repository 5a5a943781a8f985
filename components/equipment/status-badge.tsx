import { Archive, CircleCheck, PowerOff, type LucideIcon } from 'lucide-react';
import { statusLabels, type EquipmentStatus } from '@/lib/equipment/types';
import { cn } from '@/lib/utils';

const looks: Record<EquipmentStatus, { Icon: LucideIcon; box: string }> = {
  in_service: { Icon: CircleCheck, box: 'border-slate-300 bg-white text-slate-800' },
  out_of_service: { Icon: PowerOff, box: 'border-amber-400 bg-amber-50 text-amber-950' },
  removed: { Icon: Archive, box: 'border-slate-300 bg-slate-100 text-slate-800' },
};

export function EquipmentStatusBadge({ status, size = 'md', className }: { status: EquipmentStatus; size?: 'md' | 'lg'; className?: string }) {
  const { Icon, box } = looks[status];
  return (
    <span
      className={cn(
        'inline-flex items-center gap-1.5 whitespace-nowrap rounded-full border font-semibold',
        size === 'lg' ? 'px-3 py-1 text-base' : 'px-2 py-0.5 text-sm',
        box,
        className,
      )}
    >
      <Icon aria-hidden className={size === 'lg' ? 'size-5' : 'size-4'} />
      <span className="sr-only">Status: </span>
      {statusLabels[status]}
    </span>
  );
}
