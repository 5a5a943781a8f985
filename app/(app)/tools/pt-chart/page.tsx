import type { Metadata } from 'next';
import { PageHeader } from '@/components/ui/card';
import { requirePageActor } from '@/lib/auth';
import { can } from '@/lib/auth/access';
import { findRefrigerant } from '@/lib/calc/refrigerants';
import { listSites } from '@/lib/sites/service';
import { PtChartTool, type SiteElevation } from '@/app/(app)/tools/pt-chart/_components/pt-chart-tool';

export const metadata: Metadata = { title: 'P-T chart' };

export default async function PtChartPage({ searchParams }: { searchParams: Promise<{ refrigerant?: string | string[] }> }) {
  const actor = await requirePageActor('/tools/pt-chart', 'calc.use');
  const asked = (await searchParams).refrigerant;
  const refrigerant = findRefrigerant(typeof asked === 'string' ? asked : 'R-404A')?.id ?? 'R-404A';
  // The first 200 sites by name are plenty for a picker; the elevation field covers the rest.
  const sites: SiteElevation[] = can(actor, 'sites.read')
    ? (await listSites(actor, { limit: 200, archived: 'exclude' })).items.map((s) => ({
        id: s.id,
        label: actor.role === 'client' ? s.name : `${s.name} · ${s.clientName}`,
        elevationM: s.elevationM,
      }))
    : [];
  const metric = actor.units === 'metric';
  return (
    <>
      <PageHeader title="Pressure–temperature chart" subtitle="Saturation pressures for common refrigerants, with bubble and dew points for blends." />
      <PtChartTool
        initialRefrigerant={refrigerant}
        initialTemperatureUnit={metric ? 'C' : 'F'}
        initialPressureUnit={metric ? (actor.metricPressure === 'bar' ? 'barG' : 'kPaG') : 'psig'}
        lengthUnit={metric ? 'm' : 'ft'}
        sites={sites}
      />
    </>
  );
}
