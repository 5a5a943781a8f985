import type { EquipmentDto } from '@/lib/equipment/dto';
import type { Nameplate } from '@/lib/equipment/nameplate';
import type { PackUnit, SitePack } from '@/lib/sites/pack-schema';
import type { UnitPrefs } from '@/lib/units/quantities';
import type { EntryDto, VisitDetailDto } from '@/lib/visits/dto';
import type { EntryContext } from '@/lib/visits/kinds/types';
import type { VisitReason } from '@/lib/visits/terms';

// A visit page built from a kept site pack, for work without signal: the same shapes the server
// gives the visit page, so the phone's copy runs the same workspace. Pure, so a unit test covers it.

export interface VisitCopy {
  visit: VisitDetailDto;
  equipment: EquipmentDto[];
  contexts: Record<string, EntryContext>;
  tagCodes: Record<string, string>;
  prefs: UnitPrefs;
  actorId: string;
}

/** What the phone knows of the visit itself: from its own start, or from the pack's open visit. */
export interface VisitHead {
  id: string;
  reason: VisitReason;
  startedAt: string;
}

function equipmentOf(unit: PackUnit, pack: SitePack): EquipmentDto {
  return {
    id: unit.id,
    siteId: pack.site.id,
    siteName: pack.site.name,
    siteTimeZone: pack.site.timeZone,
    clientName: pack.site.clientName,
    areaId: unit.areaId,
    areaName: unit.areaName,
    systemId: unit.systemId,
    systemName: unit.systemName,
    refrigerant: unit.refrigerant,
    type: unit.type,
    name: unit.name,
    make: unit.make,
    model: unit.model,
    serial: unit.serial,
    manufacturedOn: null,
    installedOn: null,
    condition: unit.condition,
    conditionNote: unit.conditionNote,
    status: unit.status,
    // Stored by the server's own nameplate schema (the pack keeps it as stored).
    nameplate: unit.nameplate as Nameplate,
    removedAt: null,
    replacedById: null,
    replacedByName: null,
    deletedAt: null,
    createdAt: pack.takenAt,
    updatedAt: pack.takenAt,
  };
}

/** The visit `head` at the pack's site, as the visit page would show it to the pack's person. */
export function visitFromPack(pack: SitePack, head: VisitHead): VisitCopy {
  const units = pack.units.filter((u) => u.status === 'in_service' || u.status === 'out_of_service');
  // Entries of this visit the server had when the pack was taken (struck-out ones are never kept).
  const entries: EntryDto[] = pack.units.flatMap((u) =>
    u.history
      .filter((e) => e.visitId === head.id)
      .map((e) => ({
        id: e.id,
        visitId: e.visitId,
        equipmentId: u.id,
        equipmentName: u.name,
        equipmentType: u.type,
        kind: e.kind,
        data: e.data,
        computed: e.computed,
        recordedAt: e.recordedAt,
        // Not known from the pack; striking out needs the server anyway.
        createdBy: '',
        createdByName: e.createdByName,
        voidedAt: null,
        voidReason: null,
        clientEntryId: e.id,
        // Striking out needs the server; the page offers it once the server's copy loads.
        canVoid: false,
      })),
  );
  entries.sort((a, b) => a.recordedAt.localeCompare(b.recordedAt));
  return {
    visit: {
      id: head.id,
      siteId: pack.site.id,
      siteName: pack.site.name,
      clientName: pack.site.clientName,
      timeZone: pack.site.timeZone,
      technicianId: pack.viewer.id,
      technicianName: pack.viewer.name,
      reason: head.reason,
      status: 'open',
      startedAt: head.startedAt,
      endedAt: null,
      summary: null,
      reviewedAt: null,
      reopenedAt: null,
      hasReport: false,
      entryCount: entries.length,
      // The phone's person started it and works on it; review and reopen are the office's, online.
      canAddEntries: true,
      canClose: true,
      canReview: false,
      canReopen: false,
      entries,
      openBypasses: [],
    },
    equipment: units.map((u) => equipmentOf(u, pack)).sort((a, b) => a.name.localeCompare(b.name)),
    contexts: pack.contexts,
    tagCodes: Object.fromEntries(units.flatMap((u) => (u.tagCode ? [[u.id, u.tagCode]] : []))),
    prefs: { units: pack.viewer.units, metricPressure: pack.viewer.metricPressure },
    actorId: pack.viewer.id,
  };
}
