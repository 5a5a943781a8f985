import type { Metadata } from 'next';
import { z } from 'zod';
import { PlanForm } from '@/components/plans/plan-form';
import { Alert } from '@/components/ui/alert';
import { Card, PageHeader } from '@/components/ui/card';
import { SiteLine } from '@/components/sites/site-line';
import { listEquipment } from '@/lib/equipment/service';
import { localDate } from '@/lib/format/dates';
import { listPlanTechnicians } from '@/lib/plans/scheduling';
import { listSystems } from '@/lib/systems/service';
import { VISIT_REASONS } from '@/lib/visits/terms';
import { siteFirst } from '@/app/(app)/site-first';

export const metadata: Metadata = { title: 'Plan a visit' };

const querySchema = z.object({
  siteId: z.uuid().optional().catch(undefined),
  systemId: z.uuid().optional().catch(undefined),
  equipmentId: z.uuid().optional().catch(undefined),
  reason: z.enum(VISIT_REASONS).optional().catch(undefined),
  day: z.iso.date().optional().catch(undefined),
});

export default async function PlanVisitPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const query = querySchema.parse(await searchParams);
  const at = await siteFirst('/plans/new', 'plans.write', query.siteId, { title: 'Plan a visit', subtitle: 'Choose the site first.' });
  if (!at.site) return at.picker;
  const { actor, site } = at;
  const [systems, equipment, technicians] = await Promise.all([
    listSystems(actor, { siteId: site.id, limit: 200, archived: 'exclude' }),
    listEquipment(actor, { siteId: site.id, limit: 200, sort: 'name', dir: 'asc' }),
    listPlanTechnicians(actor),
  ]);
  const systemIds = query.systemId && systems.some((s) => s.id === query.systemId) ? [query.systemId] : [];
  const equipmentIds = query.equipmentId && equipment.items.some((e) => e.id === query.equipmentId) ? [query.equipmentId] : [];

  return (
    <div className="space-y-5">
      <PageHeader
        title="Plan a visit"
        subtitle={<SiteLine site={site}> · times in the site’s time zone ({site.timeZone})</SiteLine>}
      />
      {site.archivedAt ? (
        <Alert tone="warning" title="This site is archived">
          Restore it to plan a visit.
        </Alert>
      ) : technicians.length === 0 ? (
        <Alert tone="warning" title="No technicians yet">
          Invite a technician first: a planned visit names who goes.
        </Alert>
      ) : (
        <Card>
          <PlanForm
            siteId={site.id}
            siteToday={localDate(new Date(), site.timeZone)}
            systems={systems.map((s) => ({ id: s.id, name: s.name }))}
            equipment={equipment.items.map((e) => ({ id: e.id, name: e.name }))}
            technicians={technicians}
            defaults={{ systemIds, equipmentIds, reason: query.reason, day: query.day }}
          />
        </Card>
      )}
    </div>
  );
}
