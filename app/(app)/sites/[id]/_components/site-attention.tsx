import { FileDown, FileSpreadsheet } from 'lucide-react';
import { AttentionList } from '@/components/overview/attention-list';
import type { Actor } from '@/lib/auth/actor';
import { attentionPage } from '@/lib/attention/service';
import { Section, SectionLink } from '@/components/ui/section';

/** What needs attention on this site and its equipment report, for everyone who can see the site. */
export async function SiteAttention({ actor, siteId }: { actor: Actor; siteId: string }) {
  const { items: units } = await attentionPage(actor, { siteId, limit: 5, withTotal: false });
  return (
    <Section
      id="site-attention-h"
      title="Needs attention"
      align="end"
      actions={
        <div className="flex flex-wrap gap-2 text-sm">
          <SectionLink href={`/attention?siteId=${siteId}`}>How this is ranked</SectionLink>
          <a href={`/api/reports/site-equipment?siteId=${siteId}&format=pdf`} className="inline-flex min-h-11 items-center gap-1 rounded-md border border-slate-300 bg-white px-3 font-semibold" download>
            <FileDown aria-hidden className="size-4" /> Equipment report PDF
          </a>
          <a href={`/api/reports/site-equipment?siteId=${siteId}&format=csv`} className="inline-flex min-h-11 items-center gap-1 rounded-md border border-slate-300 bg-white px-3 font-semibold" download>
            <FileSpreadsheet aria-hidden className="size-4" /> CSV
          </a>
        </div>
      }
    >
      <AttentionList units={units} showSite={false} />
    </Section>
  );
}
