import type { Metadata } from 'next';
import { Card, PageHeader } from '@/components/ui/card';
import { SiteLine } from '@/components/sites/site-line';
import { orNotFound } from '@/lib/api/page';
import { requirePageActor } from '@/lib/auth';
import { csvColumns } from '@/lib/equipment/csv';
import { getSite } from '@/lib/sites/service';
import { ImportWizard } from '@/app/(app)/sites/[id]/import/_components/import-wizard';

export const metadata: Metadata = { title: 'Import equipment' };

export default async function ImportEquipmentPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const actor = await requirePageActor(`/sites/${id}/import`, 'equipment.import');
  const site = await orNotFound(getSite(actor, id));
  // The template is the header row of an export, so an exported file always imports as-is.
  const template = `data:text/csv;charset=utf-8,${encodeURIComponent(`${csvColumns.join(',')}\r\n`)}`;
  return (
    <div className="space-y-6">
      <PageHeader
        title="Import equipment from CSV"
        subtitle={<SiteLine site={site} lead="Into" />}
      />
      <Card className="space-y-2 text-sm text-slate-700">
        <p>
          Use the columns of an exported file: start from the{' '}
          <a href={template} download="equipment-template.csv" className="font-semibold text-ice-800 underline">
            empty template
          </a>{' '}
          or from an{' '}
          <a href={`/api/equipment/export?siteId=${site.id}`} download className="font-semibold text-ice-800 underline">
            export of this site
          </a>
          . Values are SI (kPa gauge, °C, kg), as each column’s name says; types and statuses use the codes an export shows (e.g. <code>condensing_unit</code>,{' '}
          <code>in_service</code>).
        </p>
        <p>Areas and systems named in the file that the site does not have yet are created with the import. Nothing is imported until every row is valid and you confirm.</p>
      </Card>
      <ImportWizard siteId={site.id} siteName={site.name} />
    </div>
  );
}
