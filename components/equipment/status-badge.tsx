import { Archive, CircleCheck, PowerOff, type LucideIcon } from 'lucide-react';
import { statusLabels, type EquipmentStatus } from '@/lib/equipment/types';
import { Pill } from '@/components/ui/pill';

const looks: Record<EquipmentStatus, { Icon: LucideIcon; box: string }> = {
  in_service: { Icon: CircleCheck, box: 'border-slate-300 bg-white text-slate-800' },
  out_of_service: { Icon: PowerOff, box: 'border-amber-400 bg-amber-50 text-amber-950' },
  removed: { Icon: Archive, box: 'border-slate-300 bg-slate-100 text-slate-800' },
};

export function EquipmentStatusBadge({ status, size = 'md', className }: { status: EquipmentStatus; size?: 'md' | 'lg'; className?: string }) {
  const { Icon, box } = looks[status];
  return (
    <Pill Icon={Icon} box={box} size={size} srPrefix="Status:" className={className}>
      {statusLabels[status]}
    </Pill>
  );
}
