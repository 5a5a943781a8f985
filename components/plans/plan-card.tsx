import Link from 'next/link';
import type { ReactNode } from 'react';
import { PlanStatusPill } from '@/components/plans/plan-status';
import { formatTimeWindow, formatWeekday } from '@/lib/format/local-times';
import type { PlanDto } from '@/lib/plans/dto';
import { visitReasonLabels } from '@/lib/visits/terms';

/** One planned visit: when (site time), where, why, who, what for; actions below when given. */
export function PlanCard({ plan, showDay = false, showTechnician = true, linkSite = true, children }: { plan: PlanDto; showDay?: boolean; showTechnician?: boolean; linkSite?: boolean; children?: ReactNode }) {
  const targets = [...plan.systems.map((s) => s.name), ...plan.equipment.map((e) => e.name)];
  return (
    <article className="min-w-0 rounded-lg border border-slate-200 bg-white p-3" data-plan={plan.id} aria-label={`${visitReasonLabels[plan.reason]} at ${plan.siteName}`}>
      <div className="flex flex-wrap items-start justify-between gap-2">
        <p className="font-semibold">
          {showDay ? <span className="block">{plan.day === plan.siteToday ? `Today, ${formatWeekday(plan.day)}` : formatWeekday(plan.day)}</span> : null}
          <span>{formatTimeWindow(plan.windowStart, plan.windowEnd)}</span> <span className="text-sm font-normal text-slate-600">site time</span>
        </p>
        <PlanStatusPill plan={plan} />
      </div>
      <p className="mt-1 break-words">
        {linkSite ? (
          <Link href={`/sites/${plan.siteId}`} className="inline-flex min-h-11 items-center font-semibold text-ice-800 underline">
            {plan.siteName}
          </Link>
        ) : (
          <span className="font-semibold">{plan.siteName}</span>
        )}{' '}
        <span className="text-sm text-slate-700">· {plan.clientName}</span>
      </p>
      <p className="text-sm text-slate-800">
        {visitReasonLabels[plan.reason]}
        {showTechnician ? ` · ${plan.technicianName}` : ''}
      </p>
      {targets.length ? <p className="break-words text-sm text-slate-700">For: {targets.join(', ')}</p> : <p className="text-sm text-slate-700">For: the whole site</p>}
      {plan.note ? <p className="mt-1 whitespace-pre-line break-words text-sm text-slate-700">{plan.note}</p> : null}
      {plan.status === 'cancelled' && plan.cancelReason ? <p className="mt-1 text-sm text-slate-700">Why cancelled: {plan.cancelReason}</p> : null}
      {children ? <div className="mt-2 flex flex-wrap gap-2">{children}</div> : null}
    </article>
  );
}
