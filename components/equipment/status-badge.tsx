import { Archive, CircleCheck, PowerOff } from 'lucide-react';
import { statusLabels, type EquipmentStatus } from '@/lib/equipment/types';
import { StatusPill, type Look } from '@/components/status/status-pill';

const looks: Record<EquipmentStatus, Look> = {
  in_service: { Icon: CircleCheck, box: 'border-slate-300 bg-white text-slate-800' },
  out_of_service: { Icon: PowerOff, box: 'border-amber-400 bg-amber-50 text-amber-950' },
  removed: { Icon: Archive, box: 'border-slate-300 bg-slate-100 text-slate-800' },
};

export function EquipmentStatusBadge({ status, size = 'md', className }: { status: EquipmentStatus; size?: 'md' | 'lg'; className?: string }) {
  return <StatusPill value={status} looks={looks} labels={statusLabels} srPrefix="Status:" size={size} className={className} />;
}
