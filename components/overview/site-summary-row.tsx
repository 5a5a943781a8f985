import Link from 'next/link';
import { siteFacts } from '@/components/overview/site-summary-card';
import { formatCount } from '@/lib/format/numbers';
import type { SiteSummary } from '@/lib/overview/service';
import { openFollowUpTotal } from '@/lib/overview/site-need';

/** What is open at a site, in words ("2 open follow-ups · 1 system over the leak-rate threshold"). */
function openItems(s: SiteSummary): string {
  const parts: string[] = [];
  const open = openFollowUpTotal(s);
  parts.push(open === 0 ? 'no open follow-ups' : `${formatCount(open)} open follow-up${open === 1 ? '' : 's'}`);
  if (s.systemsOverLeakThreshold > 0) parts.push(`${formatCount(s.systemsOverLeakThreshold)} over the leak-rate threshold`);
  if (s.pastExpectedLife > 0) parts.push(`${formatCount(s.pastExpectedLife)} past expected life`);
  return parts.join(' · ');
}

/** A site in one line, for the owner home's sites past the first cards. */
export function SiteSummaryRow({ summary }: { summary: SiteSummary }) {
  return (
    <li>
      <Link href={`/sites/${summary.siteId}`} className="block min-h-12 px-3 py-2 hover:bg-ice-50">
        <span className="font-semibold underline-offset-2 hover:underline">{summary.siteName}</span>
        <span className="block text-sm text-slate-700">
          {siteFacts(summary)} · {openItems(summary)}
        </span>
      </Link>
    </li>
  );
}
