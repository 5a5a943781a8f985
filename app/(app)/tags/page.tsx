import { FileDown, Printer } from 'lucide-react';
import type { Metadata } from 'next';
import Link from 'next/link';
import { ButtonLink } from '@/components/ui/button';
import { EmptyState, PageHeader } from '@/components/ui/card';
import { LinkRow } from '@/components/ui/link-row';
import { requirePageActor } from '@/lib/auth';
import { formatStamp } from '@/lib/format/dates';
import { listPrintRunsQuerySchema } from '@/lib/tags/schemas';
import { listLayouts, listPrintRuns } from '@/lib/tags/print-runs';

export const metadata: Metadata = { title: 'Tags' };

export default async function TagsPage({ searchParams }: { searchParams: Promise<Record<string, string | undefined>> }) {
  const actor = await requirePageActor('/tags', 'tags.print');
  const query = listPrintRunsQuerySchema.parse({ cursor: (await searchParams).cursor, limit: 30 });
  const [page, layouts] = await Promise.all([listPrintRuns(actor, query), listLayouts(actor)]);
  return (
    <>
      <PageHeader
        title="Tags"
        subtitle="Print runs of QR tags: for registered equipment, or blank tags to attach on site."
        actions={
          <ButtonLink href="/tags/new" size="lg">
            <Printer aria-hidden className="size-5" /> New print run
          </ButtonLink>
        }
      />
      {page.items.length === 0 ? (
        <EmptyState title="No tags printed yet.">Start a print run for a site&apos;s equipment, or print blank tags for a new site.</EmptyState>
      ) : (
        <ul className="divide-y divide-slate-200 rounded-lg border border-slate-200 bg-white" aria-label="Print runs">
          {page.items.map((r) => (
            <LinkRow
              key={r.id}
              href={`/tags/runs/${r.id}`}
              icon={Printer}
              tall
              title={
                <>
                  {r.labelCount} {r.kind === 'blank' ? 'blank' : 'equipment'} {r.labelCount === 1 ? 'tag' : 'tags'}
                  {r.siteName ? ` · ${r.siteName}` : ' · several sites'}
                </>
              }
              detail={
                <>
                  {r.claimedCount} of {r.labelCount} attached on site · {r.layoutName} · {formatStamp(r.createdAt, r.siteTimeZone ?? 'UTC')}
                  {r.createdByName ? ` · ${r.createdByName}` : ''}
                </>
              }
            />
          ))}
        </ul>
      )}
      {page.nextCursor ? (
        <p className="mt-3">
          <Link className="font-semibold text-ice-800 underline" href={`/tags?cursor=${page.nextCursor}`}>
            Older print runs
          </Link>
        </p>
      ) : null}
      <section aria-labelledby="cal-h" className="mt-8 space-y-2">
        <h2 id="cal-h" className="text-lg font-semibold">
          Check the printer first
        </h2>
        <p className="text-sm text-slate-700">A calibration page shows every label outline and a ruler, so scaling and margins can be checked on plain paper.</p>
        <ul className="flex flex-wrap gap-2">
          {layouts.map((l) => (
            <li key={l.id}>
              <a href={`/api/print-runs/calibration?layoutId=${l.id}`} className="flex min-h-11 items-center gap-2 rounded-md border border-slate-300 bg-white px-3 text-sm font-semibold hover:bg-slate-100">
                <FileDown aria-hidden className="size-4" /> {l.name}
              </a>
            </li>
          ))}
        </ul>
      </section>
    </>
  );
}
