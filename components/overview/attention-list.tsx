import { ArrowRight, Clock, Eye, Siren } from 'lucide-react';
import Link from 'next/link';
import { EmptyState } from '@/components/ui/card';
import { Pill } from '@/components/ui/pill';
import { TextLink } from '@/components/ui/text-link';
import { priorityLabels, type Priority, type RankedUnit } from '@/lib/attention/rank';

// A word and an icon for each priority; the colour only repeats them.
const priorityLook: Record<Priority, { Icon: typeof Siren; box: string }> = {
  urgent: { Icon: Siren, box: 'border-red-300 bg-red-50 text-red-800' },
  soon: { Icon: Clock, box: 'border-amber-300 bg-amber-50 text-amber-900' },
  watch: { Icon: Eye, box: 'border-slate-300 bg-slate-50 text-slate-800' },
};

export function PriorityPill({ priority }: { priority: Priority }) {
  const look = priorityLook[priority];
  return (
    <Pill Icon={look.Icon} box={look.box} srPrefix="Priority:" data-priority={priority}>
      {priorityLabels[priority]}
    </Pill>
  );
}

/** The ranked units, each reason with a link to its evidence. */
export function AttentionList({ units, showSite = true }: { units: RankedUnit[]; showSite?: boolean }) {
  if (units.length === 0) return <EmptyState title="Nothing needs attention right now.">No open safety findings, leaks over threshold, repeat no-cooling calls, worsening condition or units past their expected life.</EmptyState>;
  return (
    <ol className="space-y-2">
      {units.map((u, i) => (
        <li key={u.equipmentId} id={`unit-${i + 1}`} className="scroll-mt-4 rounded-lg border border-slate-200 bg-white p-3">
          <div className="flex items-start gap-2">
            <span className="text-sm font-bold text-slate-600">#{i + 1}</span>
            <div className="min-w-0 flex-1">
              <TextLink href={`/equipment/${u.equipmentId}`} className="text-slate-900 no-underline hover:underline">
                {u.equipmentName}
              </TextLink>
              {showSite ? <span className="block text-sm text-slate-600 sm:ml-2 sm:inline">{u.siteName}</span> : null}
            </div>
            <PriorityPill priority={u.priority} />
          </div>
          <ul className="mt-1 text-sm">
            {u.reasons.map((r) => (
              <li key={r.kind}>
                {r.href ? (
                  <Link href={r.href} className="flex min-h-11 items-center gap-1 underline underline-offset-2">
                    <ArrowRight aria-hidden className="size-4 shrink-0 text-slate-500" />
                    <span className="min-w-0">{r.text}</span>
                  </Link>
                ) : (
                  <span className="flex items-start gap-1 py-1">
                    <ArrowRight aria-hidden className="mt-0.5 size-4 shrink-0 text-slate-500" />
                    <span className="min-w-0">{r.text}</span>
                  </span>
                )}
              </li>
            ))}
          </ul>
        </li>
      ))}
    </ol>
  );
}
