import { FileDown } from 'lucide-react';
import type { Metadata } from 'next';
import Link from 'next/link';
import { Card, PageHeader } from '@/components/ui/card';
import { TagCode } from '@/components/tags/tag-code';
import { TagStateBadge } from '@/components/tags/tag-state-badge';
import { orNotFound } from '@/lib/api/page';
import { requirePageActor } from '@/lib/auth';
import { formatStamp } from '@/lib/format/dates';
import { getPrintRun } from '@/lib/tags/print-runs';
import { idParamsSchema } from '@/lib/api/schemas';
import { notFound } from 'next/navigation';

export const metadata: Metadata = { title: 'Print run' };

// The QR code's error-correction level said as what it means on a roof: how much of the code can
// be scratched, dirty or covered and still scan (L 7 %, M 15 %, Q 25 %, H 30 % of it, ISO/IEC 18004).
const damageTolerance: Record<string, { word: string; hint: string }> = {
  L: { word: 'Low', hint: 'Scans only while the code is clean and whole.' },
  M: { word: 'Fair', hint: 'Still scans with a small part of the code scratched or dirty.' },
  Q: { word: 'Good', hint: 'Still scans with about a quarter of the code scratched, dirty or covered.' },
  H: { word: 'High', hint: 'Still scans with nearly a third of the code scratched, dirty or covered.' },
};

export default async function PrintRunPage({ params }: { params: Promise<{ id: string }> }) {
  const parsed = idParamsSchema.safeParse(await params);
  if (!parsed.success) notFound();
  const { id } = parsed.data;
  const actor = await requirePageActor(`/tags/runs/${id}`, 'tags.print');
  const run = await orNotFound(getPrintRun(actor, id));
  // The site's clock when the run is for one site; a run across sites says UTC.
  const created = formatStamp(run.createdAt, run.siteTimeZone ?? 'UTC');
  return (
    <>
      <PageHeader
        title={`${run.labelCount} ${run.kind === 'blank' ? 'blank' : 'equipment'} ${run.labelCount === 1 ? 'tag' : 'tags'}`}
        subtitle={`${run.siteName ?? 'Several sites'} · printed ${created}${run.createdByName ? ` by ${run.createdByName}` : ''}`}
        actions={
          <a
            href={`/api/print-runs/${run.id}/pdf`}
            className="inline-flex min-h-12 items-center gap-2 rounded-md bg-ice-900 px-5 text-base font-semibold text-white hover:bg-ice-800"
            data-testid="download-pdf"
          >
            <FileDown aria-hidden className="size-5" /> Download label PDF
          </a>
        }
      />
      <div className="mb-5 grid gap-3 sm:grid-cols-3">
        <Card>
          <p className="text-sm text-slate-600">Attached on site</p>
          <p className="text-2xl font-bold" data-testid="claimed-count">
            {run.claimedCount} of {run.labelCount}
          </p>
        </Card>
        <Card>
          <p className="text-sm text-slate-600">Layout</p>
          <p className="font-semibold">{run.layoutName}</p>
          <p className="text-sm text-slate-600">Started at label {run.startPosition}</p>
        </Card>
        <Card>
          <p className="text-sm text-slate-600">Damage tolerance</p>
          <p className="font-semibold">{damageTolerance[run.errorCorrection]?.word ?? run.errorCorrection}</p>
          {damageTolerance[run.errorCorrection] ? <p className="text-sm text-slate-600">{damageTolerance[run.errorCorrection]!.hint}</p> : null}
          <p className="text-sm text-slate-600">{run.pdfBytes ? `${Math.ceil(run.pdfBytes / 1024)} KB PDF kept` : 'No PDF stored'}</p>
        </Card>
      </div>
      <div className="overflow-x-auto rounded-lg border border-slate-200 bg-white">
        <table className="w-full text-left text-sm">
          <thead className="bg-slate-50 text-slate-700">
            <tr>
              <th scope="col" className="px-3 py-2">Code</th>
              <th scope="col" className="hidden px-3 py-2 sm:table-cell">State</th>
              <th scope="col" className="px-3 py-2">Equipment</th>
            </tr>
          </thead>
          <tbody className="divide-y divide-slate-100">
            {run.tags.map((t) => (
              <tr key={t.id}>
                <td className="px-3 py-2">
                  <TagCode code={t.code} className="text-base" />
                  {/* On a phone the state sits under the code, leaving the width to the unit's name. */}
                  <div className="mt-1 sm:hidden">
                    <TagStateBadge state={t.state} />
                  </div>
                </td>
                <td className="hidden px-3 py-2 sm:table-cell">
                  <TagStateBadge state={t.state} />
                </td>
                <td className="px-3 py-2">
                  {t.equipmentId ? (
                    <Link href={`/equipment/${t.equipmentId}`} className="inline-flex min-h-11 items-center text-ice-800 underline">
                      {t.equipmentName}
                    </Link>
                  ) : (
                    <span className="text-slate-600">Not attached yet</span>
                  )}
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </>
  );
}
