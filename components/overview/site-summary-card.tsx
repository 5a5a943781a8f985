import { Droplets, Hourglass, MapPin } from 'lucide-react';
import Link from 'next/link';
import { conditionLook } from '@/components/equipment/condition-badge';
import { severityLooks } from '@/components/visits/badges';
import { formatCount } from '@/lib/format/numbers';
import { formatDay } from '@/lib/format/dates';
import type { SiteSummary } from '@/lib/overview/service';
import { openFollowUpTotal } from '@/lib/overview/site-need';
import { severityLabels, SEVERITIES } from '@/lib/visits/schemas';
import { cn } from '@/lib/utils';

function Count({ Icon, label, value, box }: { Icon: typeof MapPin; label: string; value: number; box?: string }) {
  return (
    <li className={cn('flex items-center gap-1.5 rounded-md border px-2 py-1 text-sm', box ?? 'border-slate-200 bg-white')}>
      <Icon aria-hidden className="size-4 shrink-0" />
      <span className="font-bold">{formatCount(value)}</span> {label}
    </li>
  );
}

/** "120 units · last visit Dec 1, 2026", the day on the site's own calendar. */
export function siteFacts(summary: SiteSummary): string {
  const units = `${formatCount(summary.equipmentCount)} ${summary.equipmentCount === 1 ? 'unit' : 'units'}`;
  return `${units} · ${summary.lastVisitAt ? `last visit ${formatDay(summary.lastVisitAt, summary.timeZone)}` : 'no visits recorded yet'}`;
}

/** One site at a glance: condition, open follow-ups, leaks, ageing units, last visit. Words and icons, never colour alone. */
export function SiteSummaryCard({ summary, showClient }: { summary: SiteSummary; showClient: boolean }) {
  const ratings = ([1, 2, 3, 4, 5] as const).filter((r) => summary.byCondition[r] > 0);
  const openTotal = openFollowUpTotal(summary);
  return (
    <article className="rounded-lg border border-slate-200 bg-white p-4 shadow-sm" aria-labelledby={`site-${summary.siteId}`}>
      <h3 id={`site-${summary.siteId}`} className="text-lg font-semibold">
        <Link href={`/sites/${summary.siteId}`} className="inline-flex min-h-11 items-center underline-offset-2 hover:underline">
          {summary.siteName}
        </Link>
      </h3>
      {showClient ? <p className="text-sm text-slate-600">{summary.clientName}</p> : null}
      <p className="mt-1 text-sm text-slate-700">{siteFacts(summary)}</p>
      {summary.equipmentCount > 0 ? (
        <>
          <h4 className="mt-3 text-xs font-semibold uppercase tracking-wide text-slate-600">Condition</h4>
          <ul className="mt-1 flex flex-wrap gap-1.5">
            {ratings.map((r) => {
              const look = conditionLook(r);
              return <Count key={r} Icon={look.Icon} label={look.word.toLowerCase()} value={summary.byCondition[r]} box={look.box} />;
            })}
            {summary.byCondition.unrated > 0 ? <Count Icon={conditionLook(null).Icon} label="not rated" value={summary.byCondition.unrated} /> : null}
          </ul>
        </>
      ) : null}
      <h4 className="mt-3 text-xs font-semibold uppercase tracking-wide text-slate-600">Open items</h4>
      <ul className="mt-1 flex flex-wrap gap-1.5">
        {openTotal === 0 ? <li className="text-sm text-slate-700">No open follow-ups</li> : null}
        {SEVERITIES.filter((s) => summary.openFollowUps[s] > 0).map((s) => (
          <Count key={s} Icon={severityLooks[s].Icon} label={`${severityLabels[s].toLowerCase()} follow-up${summary.openFollowUps[s] === 1 ? '' : 's'}`} value={summary.openFollowUps[s]} box={severityLooks[s].box} />
        ))}
        {summary.systemsOverLeakThreshold > 0 ? (
          <Count Icon={Droplets} label={`${summary.systemsOverLeakThreshold === 1 ? 'system' : 'systems'} over the leak-rate threshold, not yet repaired and verified`} value={summary.systemsOverLeakThreshold} box="border-red-400 bg-red-50 text-red-950" />
        ) : null}
        {summary.pastExpectedLife > 0 ? <Count Icon={Hourglass} label="past expected life" value={summary.pastExpectedLife} box="border-amber-400 bg-amber-50 text-amber-950" /> : null}
      </ul>
    </article>
  );
}
