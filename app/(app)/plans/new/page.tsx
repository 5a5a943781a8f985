import { ChevronRight, MapPin } from 'lucide-react';
import type { Metadata } from 'next';
import Link from 'next/link';
import { z } from 'zod';
import { PlanForm } from '@/components/plans/plan-form';
import { Alert } from '@/components/ui/alert';
import { Card, EmptyState, PageHeader } from '@/components/ui/card';
import { orNotFound } from '@/lib/api/page';
import { requirePageActor } from '@/lib/auth';
import { listEquipment } from '@/lib/equipment/service';
import { localDate } from '@/lib/format/dates';
import { listPlanTechnicians } from '@/lib/plans/service';
import { siteAddress } from '@/lib/sites/dto';
import { getSite, listSites } from '@/lib/sites/service';
import { listSystems } from '@/lib/systems/service';
import { VISIT_REASONS } from '@/lib/visits/terms';

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
  const actor = await requirePageActor(`/plans/new${query.siteId ? `?siteId=${query.siteId}` : ''}`, 'plans.write');

  if (!query.siteId) {
    const sites = await listSites(actor, { limit: 200, archived: 'exclude' });
    return (
      <div className="space-y-5">
        <PageHeader title="Plan a visit" subtitle="Choose the site first." />
        {sites.items.length === 0 ? (
          <EmptyState title="No sites yet." />
        ) : (
          <ul className="grid grid-cols-1 gap-2 sm:grid-cols-2">
            {sites.items.map((s) => (
              <li key={s.id}>
                <Link href={`/plans/new?siteId=${s.id}`} className="flex min-h-16 items-center gap-3 rounded-lg border-2 border-slate-300 bg-white px-4 py-2 hover:border-ice-700 hover:bg-ice-50">
                  <MapPin aria-hidden className="size-6 shrink-0 text-ice-700" />
                  <span className="min-w-0 flex-1">
                    <span className="block font-semibold">{s.name}</span>
                    <span className="block text-sm text-slate-700">
                      {s.clientName}
                      {siteAddress(s) ? ` · ${siteAddress(s)}` : ''}
                    </span>
                  </span>
                  <ChevronRight aria-hidden className="size-5 text-slate-500" />
                </Link>
              </li>
            ))}
          </ul>
        )}
      </div>
    );
  }

  const site = await orNotFound(getSite(actor, query.siteId));
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
        subtitle={
          <>
            <Link href={`/sites/${site.id}`} className="inline-flex min-h-11 items-center font-semibold text-ice-800 underline">
              {site.name}
            </Link>{' '}
            · {site.clientName} · times in the site’s time zone ({site.timeZone})
          </>
        }
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
