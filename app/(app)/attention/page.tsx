import type { Metadata } from 'next';
import { AttentionList } from '@/components/overview/attention-list';
import { ButtonLink } from '@/components/ui/button';
import { Card, PageHeader } from '@/components/ui/card';
import { requirePageActor } from '@/lib/auth';
import { attentionPage } from '@/lib/attention/service';
import { priorityLabels, priorityRule } from '@/lib/attention/rank';
import { orNotFound } from '@/lib/api/page';
import { getSite } from '@/lib/sites/service';
import { formatCount } from '@/lib/format/numbers';

export const metadata: Metadata = { title: 'Needs attention' };

/** Units shown per step: the top of the list is what gets acted on; the rest loads on request. */
const STEP = 50;

export default async function AttentionPage({ searchParams }: { searchParams: Promise<{ siteId?: string; show?: string }> }) {
  const actor = await requirePageActor('/attention', 'overview.read');
  const { siteId, show } = await searchParams;
  const site = siteId && /^[0-9a-f-]{36}$/i.test(siteId) ? await orNotFound(getSite(actor, siteId)) : null;
  const asked = Math.max(STEP, Math.ceil(Number(show) / STEP) * STEP || STEP);
  const page = await attentionPage(actor, { siteId: site?.id ?? null, limit: asked });
  const units = page.items;
  const total = page.total ?? units.length;
  const shown = units.length;
  const more = new URLSearchParams({ ...(site ? { siteId: site.id } : {}), show: String(shown + STEP) });
  return (
    <div className="space-y-4">
      <PageHeader title="Needs attention" subtitle={site ? site.name : 'Every unit you can see, urgent first, then soon, then watch'} />
      <Card className="text-sm">
        <h2 className="font-semibold">How this list is ordered</h2>
        <ul className="mt-1 space-y-1 text-slate-700" data-testid="priority-rule">
          {priorityRule.map((line) => (
            <li key={line.priority ?? 'order'}>
              {line.priority ? <span className="font-semibold text-slate-900">{priorityLabels[line.priority]}: </span> : null}
              {line.text}
            </li>
          ))}
        </ul>
      </Card>
      {total > 0 ? (
        <p className="text-sm text-slate-700" role="status">
          {total === 1 ? '1 unit needs attention.' : `${formatCount(total)} units need attention.`}
          {shown < total ? ` Showing the first ${formatCount(shown)}.` : ''}
        </p>
      ) : null}
      <AttentionList units={units} showSite={!site} />
      {shown < total ? (
        <ButtonLink href={`/attention?${more.toString()}#unit-${shown + 1}`} variant="secondary" size="lg" scroll={false}>
          Show {Math.min(STEP, total - shown)} more
        </ButtonLink>
      ) : null}
    </div>
  );
}
