import { CalendarCheck, CalendarClock, Droplets, Wrench } from 'lucide-react';
import Link from 'next/link';
import { formatDay } from '@/lib/format/dates';
import { formatWeekday } from '@/lib/format/local-times';
import type { DueItem } from '@/lib/overview/due';

/** Where "Plan a visit" opens for a due item: its site, its system and the reason that does the work. */
function planHref(d: DueItem): string {
  return `/plans/new?siteId=${d.siteId}&systemId=${d.systemId}&reason=${d.kind === 'maintenance' ? 'maintenance' : 'leak_check'}`;
}

function DueRow({ d, canPlan }: { d: DueItem; canPlan: boolean }) {
  const Icon = d.kind === 'maintenance' ? Wrench : Droplets;
  return (
    <li className="px-3 py-2" data-due={`${d.systemId}-${d.kind}`}>
      <p className="flex flex-wrap items-center gap-1.5 font-semibold">
        <Icon aria-hidden className="size-4" />
        {d.kind === 'maintenance' ? 'Maintenance' : 'Leak check'}:{' '}
        <Link className="inline-flex min-h-11 items-center underline" href={`/systems/${d.systemId}`}>
          {d.systemName}
        </Link>
      </p>
      <p className="text-sm text-slate-700">
        {d.siteName} · {d.clientName}
      </p>
      <p className="flex flex-wrap items-center gap-1 text-sm">
        <CalendarClock aria-hidden className="size-4" />
        {d.overdueDays > 0 ? <strong>Overdue by {d.overdueDays} days</strong> : <>Due {formatDay(d.dueOn)}</>}
        {d.lastDoneAt ? ` · last ${formatDay(d.lastDoneAt)}` : ' · never recorded'}
      </p>
      {d.planned ? (
        <p className="flex flex-wrap items-center gap-1 text-sm font-semibold text-emerald-900">
          <CalendarCheck aria-hidden className="size-4" />
          Visit planned: {formatWeekday(d.planned.day)} · {d.planned.technicianName}
        </p>
      ) : null}
      <p className="text-xs text-slate-600">{d.basis}</p>
      {canPlan && !d.planned ? (
        <Link href={planHref(d)} className="mt-1 inline-flex min-h-11 items-center rounded-md border border-slate-300 bg-white px-4 text-sm font-semibold text-slate-900 hover:bg-slate-100">
          Plan a visit
        </Link>
      ) : null}
    </li>
  );
}

/** Work due by interval or rule; what a planned visit covers is listed apart, as planned. */
export function DueList({ items, canPlan = false }: { items: DueItem[]; canPlan?: boolean }) {
  if (items.length === 0) return <p className="text-sm text-slate-700">Nothing due. Systems with a maintenance interval or a leak-check rule show here 30 days ahead.</p>;
  const due = items.filter((d) => !d.planned);
  const planned = items.filter((d) => d.planned);
  return (
    <div className="space-y-3">
      <p className="text-sm font-semibold text-slate-800" data-due-counts>
        {due.length} due · {planned.length} planned
      </p>
      {due.length ? (
        <ul aria-label="Due, not planned yet" className="divide-y divide-slate-200 rounded-lg border border-slate-200 bg-white">
          {due.map((d) => (
            <DueRow key={`${d.systemId}-${d.kind}`} d={d} canPlan={canPlan} />
          ))}
        </ul>
      ) : null}
      {planned.length ? (
        <>
          <h3 className="font-semibold">Planned</h3>
          <ul aria-label="Planned" className="divide-y divide-slate-200 rounded-lg border border-slate-200 bg-white">
            {planned.map((d) => (
              <DueRow key={`${d.systemId}-${d.kind}`} d={d} canPlan={canPlan} />
            ))}
          </ul>
        </>
      ) : null}
    </div>
  );
}
