import type { Nameplate } from '@/lib/equipment/nameplate';
import type { EquipmentFlags } from '@/lib/equipment/permissions';
import type { EquipmentStatus, EquipmentType, RelationKind } from '@/lib/equipment/types';

export interface EquipmentDto {
  id: string;
  siteId: string;
  siteName: string;
  /** The site's time zone, for dates shown as the day they were there. */
  siteTimeZone: string;
  clientName: string;
  areaId: string | null;
  areaName: string | null;
  systemId: string | null;
  systemName: string | null;
  /** The system's refrigerant, else the nameplate's. */
  refrigerant: string | null;
  type: EquipmentType;
  name: string;
  make: string | null;
  model: string | null;
  serial: string | null;
  manufacturedOn: string | null;
  installedOn: string | null;
  condition: number | null;
  conditionNote: string | null;
  status: EquipmentStatus;
  nameplate: Nameplate;
  /** When the unit left service for good (status 'removed'); null while it is current. */
  removedAt: string | null;
  /** The unit that took its place, when it was replaced rather than just removed. */
  replacedById: string | null;
  replacedByName: string | null;
  deletedAt: string | null;
  createdAt: string;
  updatedAt: string;
}

export interface RelationDto {
  id: string;
  kind: RelationKind;
  /** 'forward': this equipment controls/serves the other; 'backward': the other controls/serves this. */
  direction: 'forward' | 'backward';
  other: { id: string; name: string; type: EquipmentType };
}

/** One unit with what the viewer may do on it (`EquipmentFlags`, lib/equipment/permissions.ts), decided by the service. */
export interface EquipmentDetailDto extends EquipmentDto, EquipmentFlags {
  relations: RelationDto[];
  siteElevationM: number;
  systemDesignBoxTempC: number | null;
}

export interface UnitFactsDto {
  /** The newest visit with an entry on this unit that the viewer may read (owners: closed visits). */
  lastVisit: { id: string; startedAt: string; timeZone: string } | null;
  /** Follow-ups on this unit still to do (open or planned). */
  openFollowUps: number;
  /** The viewer's own open visit at this unit's site, to continue rather than start another. */
  openVisitId: string | null;
  /** The code of the tag attached to the unit. */
  tagCode: string | null;
}

export interface EquipmentRow {
  id: string;
  site_id: string;
  site_name: string;
  site_time_zone: string;
  client_name: string;
  area_id: string | null;
  area_name: string | null;
  system_id: string | null;
  system_name: string | null;
  refrigerant: string | null;
  type: string;
  name: string;
  make: string | null;
  model: string | null;
  serial: string | null;
  manufactured_on: string | null;
  installed_on: string | null;
  condition: number | null;
  condition_note: string | null;
  status: string;
  nameplate: unknown;
  removed_at: Date | null;
  replaced_by_id: string | null;
  replaced_by_name: string | null;
  deleted_at: Date | null;
  created_at: Date;
  updated_at: Date;
}

export function toEquipmentDto(row: EquipmentRow): EquipmentDto {
  return {
    id: row.id,
    siteId: row.site_id,
    siteName: row.site_name,
    siteTimeZone: row.site_time_zone,
    clientName: row.client_name,
    areaId: row.area_id,
    areaName: row.area_name,
    systemId: row.system_id,
    systemName: row.system_name,
    refrigerant: row.refrigerant,
    type: row.type as EquipmentType,
    name: row.name,
    make: row.make,
    model: row.model,
    serial: row.serial,
    manufacturedOn: row.manufactured_on,
    installedOn: row.installed_on,
    condition: row.condition,
    conditionNote: row.condition_note,
    status: row.status as EquipmentStatus,
    nameplate: (row.nameplate ?? {}) as Nameplate,
    removedAt: row.removed_at?.toISOString() ?? null,
    replacedById: row.replaced_by_name === null ? null : row.replaced_by_id,
    replacedByName: row.replaced_by_name,
    deletedAt: row.deleted_at?.toISOString() ?? null,
    createdAt: row.created_at.toISOString(),
    updatedAt: row.updated_at.toISOString(),
  };
}

