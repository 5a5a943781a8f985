import { CalendarClock, Droplets, Wrench } from 'lucide-react';
import Link from 'next/link';
import type { DueItem } from '@/lib/overview/due';

export function DueList({ items }: { items: DueItem[] }) {
  if (items.length === 0) return <p className="text-sm text-slate-700">Nothing due. Systems with a maintenance interval or a leak-check rule show here 30 days ahead.</p>;
  return (
    <ul className="divide-y divide-slate-200 rounded-lg border border-slate-200 bg-white">
      {items.map((d) => {
        const Icon = d.kind === 'maintenance' ? Wrench : Droplets;
        return (
          <li key={`${d.systemId}-${d.kind}`} className="px-3 py-2">
            <p className="flex items-center gap-1.5 font-semibold">
              <Icon aria-hidden className="size-4" />
              {d.kind === 'maintenance' ? 'Maintenance' : 'Leak check'}:{' '}
              <Link className="underline" href={`/systems/${d.systemId}`}>
                {d.systemName}
              </Link>
            </p>
            <p className="text-sm text-slate-700">
              {d.siteName} · {d.clientName}
            </p>
            <p className="flex items-center gap-1 text-sm">
              <CalendarClock aria-hidden className="size-4" />
              {d.overdueDays > 0 ? <strong>Overdue by {d.overdueDays} days</strong> : <>Due {d.dueOn}</>}
              {d.lastDoneAt ? ` · last ${d.lastDoneAt.slice(0, 10)}` : ' · never recorded'}
            </p>
            <p className="text-xs text-slate-600">{d.basis}</p>
          </li>
        );
      })}
    </ul>
  );
}
