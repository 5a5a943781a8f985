import type { Metadata } from 'next';
import { AttentionList } from '@/components/overview/attention-list';
import { Card, PageHeader } from '@/components/ui/card';
import { requirePageActor } from '@/lib/auth';
import { needsAttention } from '@/lib/attention/service';
import { rankingRule } from '@/lib/attention/rank';
import { orNotFound } from '@/lib/api/page';
import { getSite } from '@/lib/sites/service';

export const metadata: Metadata = { title: 'Needs attention' };

export default async function AttentionPage({ searchParams }: { searchParams: Promise<{ siteId?: string }> }) {
  const actor = await requirePageActor('/attention', 'overview.read');
  const { siteId } = await searchParams;
  const site = siteId && /^[0-9a-f-]{36}$/i.test(siteId) ? await orNotFound(getSite(actor, siteId)) : null;
  const units = await needsAttention(actor, site?.id ?? null);
  return (
    <div className="space-y-4">
      <PageHeader title="Needs attention" subtitle={site ? site.name : 'Every unit you can see, most urgent first'} />
      <Card className="text-sm">
        <h2 className="font-semibold">How this list is ranked</h2>
        <p className="mt-1 text-slate-700">{rankingRule}</p>
      </Card>
      <AttentionList units={units} showSite={!site} />
    </div>
  );
}
