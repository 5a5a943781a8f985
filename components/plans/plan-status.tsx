import { AlertTriangle, CalendarClock, CircleX, PlayCircle } from 'lucide-react';
import { StatusPill, type Look } from '@/components/status/status-pill';
import { Pill } from '@/components/ui/pill';
import type { PlanDto } from '@/lib/plans/dto';
import { OVERDUE_LABEL, planStatusLabels, type PlanStatus } from '@/lib/plans/terms';

const looks: Record<PlanStatus, Look> = {
  planned: { Icon: CalendarClock, box: 'border-ice-300 bg-ice-50 text-ice-950' },
  started: { Icon: PlayCircle, box: 'border-emerald-300 bg-emerald-50 text-emerald-950' },
  cancelled: { Icon: CircleX, box: 'border-slate-300 bg-slate-100 text-slate-800' },
};

// A plan's state as a word with an icon; an overdue plan says so in words, in amber.
export function PlanStatusPill({ plan }: { plan: Pick<PlanDto, 'status' | 'overdue'> }) {
  if (plan.overdue) {
    return (
      <Pill Icon={AlertTriangle} box="border-amber-500 bg-amber-50 text-amber-950" srPrefix="Plan:">
        {OVERDUE_LABEL}
      </Pill>
    );
  }
  return <StatusPill value={plan.status} looks={looks} labels={planStatusLabels} srPrefix="Plan:" />;
}
