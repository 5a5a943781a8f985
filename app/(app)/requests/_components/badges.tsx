import { CalendarClock, CheckCheck, CircleDot, Eye, Siren, Timer, XCircle, Clock3 } from 'lucide-react';
import { Pill } from '@/components/ui/pill';
import { requestStatusLabels, type RequestStatus, type Urgency } from '@/lib/requests/schemas';

const urgencyLook: Record<Urgency, { Icon: typeof Siren; box: string; word: string }> = {
  emergency: { Icon: Siren, box: 'border-red-400 bg-red-50 text-red-950', word: 'Emergency' },
  soon: { Icon: Timer, box: 'border-amber-400 bg-amber-50 text-amber-950', word: 'Soon' },
  routine: { Icon: Clock3, box: 'border-slate-300 bg-white text-slate-800', word: 'Routine' },
};

const statusLook: Record<RequestStatus, typeof Siren> = { new: CircleDot, acknowledged: Eye, scheduled: CalendarClock, done: CheckCheck, declined: XCircle };

export function UrgencyBadge({ urgency, title }: { urgency: Urgency; title?: string }) {
  const { Icon, box, word } = urgencyLook[urgency];
  return (
    <Pill Icon={Icon} box={box} title={title}>
      {word}
    </Pill>
  );
}

export function RequestStatusBadge({ status }: { status: RequestStatus }) {
  const Icon = statusLook[status];
  return (
    <Pill Icon={Icon} box="border-slate-300 bg-white text-slate-900">
      {requestStatusLabels[status]}
    </Pill>
  );
}
