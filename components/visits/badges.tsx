import {
  Ban,
  CalendarClock,
  Camera,
  CheckCheck,
  CircleCheck,
  CircleDot,
  ClipboardCheck,
  CloudOff,
  Droplets,
  Eye,
  Gauge,
  Hammer,
  HeartPulse,
  LoaderCircle,
  Lock,
  NotebookPen,
  OctagonAlert,
  PowerOff,
  ScanSearch,
  Search,
  SlidersHorizontal,
  TriangleAlert,
  Unlock,
  Wrench,
  type LucideIcon,
} from 'lucide-react';
import { followUpStatusLabels, type FollowUpStatus } from '@/lib/follow-ups/schemas';
import { entryKindLabels, severityLabels, type EntryKind, type Severity } from '@/lib/visits/schemas';
import { StatusPill, type Look } from '@/components/status/status-pill';
import { Pill } from '@/components/ui/pill';
import { cn } from '@/lib/utils';

// Status is never colour alone: every badge here has its word and an icon (components/ui/pill.tsx).

export const severityLooks: Record<Severity, Look & { hint: string }> = {
  safety: { Icon: OctagonAlert, box: 'border-red-400 bg-red-50 text-red-950', hint: 'A hazard to people or property' },
  down: { Icon: PowerOff, box: 'border-red-300 bg-white text-red-900', hint: 'Not cooling or not running' },
  degraded: { Icon: TriangleAlert, box: 'border-amber-400 bg-amber-50 text-amber-950', hint: 'Running, but not as it should' },
  minor: { Icon: CircleDot, box: 'border-slate-300 bg-white text-slate-800', hint: 'Worth doing at a later visit' },
};

export function SeverityBadge({ severity, className }: { severity: Severity; className?: string }) {
  return <StatusPill value={severity} looks={severityLooks} labels={severityLabels} srPrefix="Severity:" className={className} />;
}

const followUpLooks: Record<FollowUpStatus, Look> = {
  open: { Icon: CircleDot, box: 'border-amber-400 bg-amber-50 text-amber-950' },
  scheduled: { Icon: CalendarClock, box: 'border-ice-300 bg-ice-50 text-ice-950' },
  resolved: { Icon: CircleCheck, box: 'border-emerald-300 bg-emerald-50 text-emerald-950' },
  declined: { Icon: Ban, box: 'border-slate-300 bg-slate-100 text-slate-800' },
};

export function FollowUpStatusBadge({ status, className }: { status: FollowUpStatus; className?: string }) {
  return <StatusPill value={status} looks={followUpLooks} labels={followUpStatusLabels} srPrefix="Status:" className={className} />;
}

export function VisitStatusBadge({ status, reviewed, className }: { status: 'open' | 'closed'; reviewed?: boolean; className?: string }) {
  const look =
    status === 'open'
      ? { Icon: Unlock, box: 'border-amber-400 bg-amber-50 text-amber-950', word: 'Open' }
      : reviewed
        ? { Icon: CheckCheck, box: 'border-emerald-300 bg-emerald-50 text-emerald-950', word: 'Closed · reviewed' }
        : { Icon: Lock, box: 'border-slate-300 bg-white text-slate-800', word: 'Closed' };
  return (
    <Pill Icon={look.Icon} box={look.box} srPrefix="Visit status:" className={className}>
      {look.word}
    </Pill>
  );
}

export function NeedsReviewBadge({ className }: { className?: string }) {
  return (
    <Pill Icon={Eye} box="border-ice-400 bg-white text-ice-950" className={className}>
      Needs review
    </Pill>
  );
}

export const entryKindIcons: Record<EntryKind, LucideIcon> = {
  reading: Gauge,
  finding: Search,
  action: Wrench,
  setting_change: SlidersHorizontal,
  part: Hammer,
  refrigerant: Droplets,
  leak: ScanSearch,
  condition: HeartPulse,
  note: NotebookPen,
  photo: Camera,
};

export function EntryKindLabel({ kind, className }: { kind: EntryKind; className?: string }) {
  const Icon = entryKindIcons[kind];
  return (
    <span className={cn('inline-flex items-center gap-1.5 font-semibold text-slate-900', className)}>
      <Icon aria-hidden className="size-4 shrink-0 text-ice-700" />
      {entryKindLabels[kind]}
    </span>
  );
}

export type SaveState = 'saved' | 'sending' | 'waiting' | 'refused';

const saveLooks: Record<SaveState, Look & { word: string }> = {
  saved: { Icon: ClipboardCheck, box: 'border-emerald-300 bg-emerald-50 text-emerald-950', word: 'Saved' },
  sending: { Icon: LoaderCircle, box: 'border-ice-300 bg-ice-50 text-ice-950', word: 'Saving…' },
  waiting: { Icon: CloudOff, box: 'border-amber-400 bg-amber-50 text-amber-950', word: 'Waiting for signal — kept on this phone' },
  refused: { Icon: OctagonAlert, box: 'border-red-400 bg-red-50 text-red-950', word: 'Not saved' },
};

/** Whether an entry has reached the server: the technician must be able to tell at a glance. */
export function SaveStateBadge({ state, className }: { state: SaveState; className?: string }) {
  const { Icon, box, word } = saveLooks[state];
  return (
    <Pill data-save-state={state} Icon={Icon} box={box} className={cn('whitespace-normal', className)} iconClassName={cn('shrink-0', state === 'sending' && 'animate-spin motion-reduce:animate-none')}>
      {word}
    </Pill>
  );
}
