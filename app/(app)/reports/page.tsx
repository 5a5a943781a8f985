import { FileDown, FileSpreadsheet } from 'lucide-react';
import type { Metadata } from 'next';
import { Card, EmptyState, PageHeader } from '@/components/ui/card';
import { requirePageActor } from '@/lib/auth';
import { listSites } from '@/lib/sites/service';
import { listSystems } from '@/lib/systems/service';
import { RefrigerantReportPicker } from '@/app/(app)/reports/_components/refrigerant-report-picker';

export const metadata: Metadata = { title: 'Reports' };

function Download({ href, label, kind }: { href: string; label: string; kind: 'pdf' | 'csv' }) {
  const Icon = kind === 'pdf' ? FileDown : FileSpreadsheet;
  return (
    <a href={href} className="inline-flex min-h-11 items-center gap-1.5 rounded-md border border-slate-300 bg-white px-3 text-sm font-semibold hover:bg-ice-50" download>
      <Icon aria-hidden className="size-4" />
      {label}
    </a>
  );
}

export default async function ReportsPage() {
  const actor = await requirePageActor('/reports', 'reports.read');
  const [sites, systems] = await Promise.all([listSites(actor, { limit: 200, archived: 'exclude' }), listSystems(actor, { limit: 200, archived: 'exclude' })]);
  return (
    <div className="space-y-6">
      <PageHeader title="Reports" subtitle="For owners' records, audits and regulators: download as PDF to print or CSV for a spreadsheet." />
      <section aria-labelledby="site-h" className="space-y-2">
        <h2 id="site-h" className="text-lg font-semibold">
          Site equipment report
        </h2>
        <p className="text-sm text-slate-700">Every unit of a site with its age, expected service life, condition, open follow-ups and last service.</p>
        {sites.items.length === 0 ? <EmptyState title="No sites yet." /> : null}
        <ul className="divide-y divide-slate-200 rounded-lg border border-slate-200 bg-white">
          {sites.items.map((s) => (
            <li key={s.id} className="flex flex-wrap items-center gap-2 px-4 py-2">
              <span className="min-w-0 flex-1 font-medium">
                {s.name}
                {actor.role !== 'client' ? <span className="text-sm font-normal text-slate-600"> · {s.clientName}</span> : null}
              </span>
              <Download href={`/api/reports/site-equipment?siteId=${s.id}&format=pdf`} label="PDF" kind="pdf" />
              <Download href={`/api/reports/site-equipment?siteId=${s.id}&format=csv`} label="CSV" kind="csv" />
            </li>
          ))}
        </ul>
      </section>
      <section aria-labelledby="ref-h" className="space-y-2">
        <h2 id="ref-h" className="text-lg font-semibold">
          Yearly refrigerant report
        </h2>
        <Card className="text-sm text-slate-700">
          Additions and recoveries of one system in a calendar year, with the leak rate of each addition (annualizing method, 40 CFR 82.152), the threshold for its
          application, repair deadlines, leak-check visits and the year's totals. Federal US rules summarised for guidance; local rules may be stricter.
        </Card>
        <RefrigerantReportPicker systems={systems.map((s) => ({ id: s.id, label: `${s.name} — ${s.siteName} (${s.refrigerant})` }))} />
      </section>
    </div>
  );
}
