import { z } from 'zod';
import { EQUIPMENT_STATUSES, EQUIPMENT_TYPES } from '@/lib/equipment/types';
import { ENTRY_KINDS, SEVERITIES, VISIT_REASONS } from '@/lib/visits/terms';
import { SITE_PACK_VERSION } from '@/lib/sites/pack-version';

// A site pack: what a phone keeps of one site to work there without signal. Pure (zod only), so
// the server describes what it sends and the phone checks what it stores with the same schema.

export { SITE_PACK_VERSION };

/** The newest entries kept per unit. */
export const PACK_HISTORY_PER_UNIT = 20;

const iso = z.string().min(1);

/** An entry of a unit's history; its visit is in the pack's `visits` (said once, not per entry). */
export const packEntrySchema = z.object({
  id: z.uuid(),
  visitId: z.uuid(),
  kind: z.enum(ENTRY_KINDS),
  data: z.record(z.string(), z.unknown()),
  computed: z.record(z.string(), z.unknown()).nullable(),
  recordedAt: iso,
  createdByName: z.string(),
});

export const packVisitSchema = z.object({
  reason: z.enum(VISIT_REASONS),
  startedAt: iso,
  technicianName: z.string(),
  status: z.enum(['open', 'closed']),
  timeZone: z.string(),
});

export const packUnitSchema = z.object({
  id: z.uuid(),
  name: z.string(),
  type: z.enum(EQUIPMENT_TYPES),
  areaId: z.uuid().nullable(),
  areaName: z.string().nullable(),
  systemId: z.uuid().nullable(),
  systemName: z.string().nullable(),
  refrigerant: z.string().nullable(),
  make: z.string().nullable(),
  model: z.string().nullable(),
  serial: z.string().nullable(),
  /** The nameplate as stored (SI), current control settings included. */
  nameplate: z.record(z.string(), z.unknown()),
  /** The attached tag's code, normalised (lib/tags/code); null when the unit has no tag. */
  tagCode: z.string().nullable(),
  condition: z.number().int().nullable(),
  conditionNote: z.string().nullable(),
  status: z.enum(EQUIPMENT_STATUSES),
  /** Newest first, at most PACK_HISTORY_PER_UNIT, struck-out entries left out. */
  history: z.array(packEntrySchema),
});

export const packFollowUpSchema = z.object({
  id: z.uuid(),
  equipmentId: z.uuid().nullable(),
  title: z.string(),
  severity: z.enum(SEVERITIES),
  status: z.enum(['open', 'scheduled']),
  scheduledFor: z.string().nullable(),
  createdAt: iso,
});

export const entryContextSchema = z.object({
  refrigerant: z.string().nullable(),
  elevationM: z.number(),
  designBoxTempC: z.number().nullable(),
  nameplateVoltage: z.number().nullable(),
  controlVoltageNominal: z.number().nullable(),
  designPressureHighKpaG: z.number().nullable(),
});

export const sitePackSchema = z.object({
  version: z.literal(SITE_PACK_VERSION),
  /** Server time the pack was read. */
  takenAt: iso,
  /** Whose pack it is: a phone keeps it for this person only. */
  viewer: z.object({
    id: z.uuid(),
    name: z.string(),
    role: z.enum(['admin', 'office', 'technician']),
    units: z.enum(['imperial', 'metric']),
    metricPressure: z.enum(['kPa', 'bar']),
  }),
  site: z.object({
    id: z.uuid(),
    name: z.string(),
    clientName: z.string(),
    timeZone: z.string(),
    elevationM: z.number(),
  }),
  /** The viewer's own open visit at this site, to continue rather than start another. */
  openVisitId: z.uuid().nullable(),
  /** That visit, so the phone can show and continue it without signal. */
  openVisit: z.object({ id: z.uuid(), reason: z.enum(VISIT_REASONS), startedAt: iso }).nullable(),
  /** Units still on site (removed and deleted ones left out), by name. */
  units: z.array(packUnitSchema),
  /** The visits the kept entries belong to, keyed by visit id. */
  visits: z.record(z.string(), packVisitSchema),
  /** Follow-ups still to do (open or planned), oldest first. */
  followUps: z.array(packFollowUpSchema),
  /** What entries are computed against, keyed by equipment id (lib/visits/context). */
  contexts: z.record(z.string(), entryContextSchema),
});

export type SitePack = z.infer<typeof sitePackSchema>;
export type PackUnit = z.infer<typeof packUnitSchema>;
export type PackEntry = z.infer<typeof packEntrySchema>;
export type PackVisit = z.infer<typeof packVisitSchema>;
export type PackFollowUp = z.infer<typeof packFollowUpSchema>;
