import 'server-only';
import { db as defaultDb } from '@/db';
import type { Db } from '@/db/types';
import { assertCan } from '@/lib/auth/access';
import type { Actor } from '@/lib/auth/actor';
import { AppError } from '@/lib/errors';
import { packFollowUpsQuery, packHistoryQuery, packOpenVisitQuery, packUnitsQuery } from '@/lib/sites/pack-queries';
import { SITE_PACK_VERSION, type PackEntry, type PackUnit, type PackVisit, type SitePack } from '@/lib/sites/pack-schema';
import { getSite } from '@/lib/sites/service';
import { normalizeCode } from '@/lib/tags/code';
import { siteEntryContexts } from '@/lib/visits/context';

// What a phone keeps of one site to work there without signal (lib/sites/pack-schema.ts). Staff
// who record entries only: an owner never gets a pack.

const iso = (d: Date | string) => (d instanceof Date ? d.toISOString() : new Date(d).toISOString());

export async function getSitePack(actor: Actor, siteId: string, db: Db = defaultDb): Promise<SitePack> {
  assertCan(actor, 'equipment.read');
  assertCan(actor, 'entries.write');
  if (actor.role === 'client') throw new AppError('forbidden');
  // Scoped like every site read: another company's site is a 404. Checked beside the pack's own
  // queries rather than before them (each is limited to the actor's company, and nothing is sent
  // unless the check passes), so the pack costs one round trip less.
  const [site, unitRows, historyRows, followUpRows, openVisit, contexts] = await Promise.all([
    getSite(actor, siteId, db),
    packUnitsQuery(actor, db, siteId).execute(),
    packHistoryQuery(actor, db, siteId).execute(),
    packFollowUpsQuery(actor, db, siteId).execute(),
    packOpenVisitQuery(actor, db, siteId).executeTakeFirst(),
    siteEntryContexts(actor, siteId, db),
  ]);

  const history = new Map<string, PackEntry[]>();
  const visits: SitePack['visits'] = {};
  for (const r of historyRows) {
    const list = history.get(r.equipment_id) ?? [];
    list.push({
      id: r.id,
      visitId: r.visit_id,
      kind: r.kind as PackEntry['kind'],
      data: (r.data ?? {}) as Record<string, unknown>,
      computed: (r.computed as Record<string, unknown> | null) ?? null,
      recordedAt: iso(r.recorded_at),
      createdByName: r.author_name,
    });
    history.set(r.equipment_id, list);
    visits[r.visit_id] ??= {
      reason: r.visit_reason as PackVisit['reason'],
      startedAt: iso(r.visit_started_at),
      technicianName: r.technician_name,
      status: r.visit_status as 'open' | 'closed',
      timeZone: r.visit_time_zone,
    };
  }

  const units: PackUnit[] = unitRows.map((r) => ({
    id: r.id,
    name: r.name,
    type: r.type as PackUnit['type'],
    areaId: r.area_id,
    areaName: r.area_name,
    systemId: r.system_id,
    systemName: r.system_name,
    refrigerant: r.refrigerant,
    make: r.make,
    model: r.model,
    serial: r.serial,
    nameplate: (r.nameplate ?? {}) as Record<string, unknown>,
    tagCode: r.tag_code ? normalizeCode(r.tag_code) : null,
    condition: r.condition,
    conditionNote: r.condition_note,
    status: r.status as PackUnit['status'],
    history: history.get(r.id) ?? [],
  }));
  const current = new Set(units.map((u) => u.id));

  return {
    version: SITE_PACK_VERSION,
    takenAt: new Date().toISOString(),
    viewer: { id: actor.id, name: actor.name, role: actor.role as SitePack['viewer']['role'], units: actor.units, metricPressure: actor.metricPressure },
    site: { id: site.id, name: site.name, clientName: site.clientName, timeZone: site.timeZone, elevationM: site.elevationM },
    openVisitId: openVisit?.id ?? null,
    openVisit: openVisit ? { id: openVisit.id, reason: openVisit.reason as PackVisit['reason'], startedAt: iso(openVisit.started_at) } : null,
    units,
    visits,
    followUps: followUpRows.map((f) => ({
      id: f.id,
      equipmentId: f.equipment_id,
      title: f.title,
      severity: f.severity as SitePack['followUps'][number]['severity'],
      status: f.status as 'open' | 'scheduled',
      scheduledFor: f.scheduled_for,
      createdAt: iso(f.created_at),
    })),
    // Contexts of the units the pack holds only.
    contexts: Object.fromEntries(Object.entries(contexts).filter(([id]) => current.has(id))),
  };
}
