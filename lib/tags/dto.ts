import type { EquipmentDetailDto } from '@/lib/equipment/dto';
import { formatCode } from '@/lib/tags/code';
import type { LabelLayout } from '@/lib/tags/layouts';
import type { RetireReason, ScanVia, TagState } from '@/lib/tags/schemas';

export interface TagDto {
  id: string;
  /** Canonical: upper case, no hyphens (what the QR URL holds). */
  code: string;
  /** For people: K7Q-M3X-9PA. */
  displayCode: string;
  state: TagState;
  printRunId: string | null;
  siteId: string | null;
  siteName: string | null;
  equipmentId: string | null;
  equipmentName: string | null;
  attachedAt: string | null;
  attachedByName: string | null;
  retiredAt: string | null;
  retiredReason: RetireReason | null;
  retiredNote: string | null;
  replacedByCode: string | null;
  createdAt: string;
}

export interface TagRow {
  id: string;
  code: string;
  state: string;
  print_run_id: string | null;
  site_id: string | null;
  site_name: string | null;
  equipment_id: string | null;
  equipment_name: string | null;
  attached_at: Date | null;
  attached_by_name: string | null;
  retired_at: Date | null;
  retired_reason: string | null;
  retired_note: string | null;
  replaced_by_code: string | null;
  created_at: Date;
}

export function toTagDto(row: TagRow): TagDto {
  return {
    id: row.id,
    code: row.code,
    displayCode: formatCode(row.code),
    state: row.state as TagState,
    printRunId: row.print_run_id,
    siteId: row.site_id,
    siteName: row.site_name,
    equipmentId: row.equipment_id,
    equipmentName: row.equipment_name,
    attachedAt: row.attached_at?.toISOString() ?? null,
    attachedByName: row.attached_by_name,
    retiredAt: row.retired_at?.toISOString() ?? null,
    retiredReason: row.retired_reason as RetireReason | null,
    retiredNote: row.retired_note,
    replacedByCode: row.replaced_by_code,
    createdAt: row.created_at.toISOString(),
  };
}

export type LabelLayoutDto = LabelLayout;

export interface PrintRunDto {
  id: string;
  kind: 'equipment' | 'blank';
  siteId: string | null;
  siteName: string | null;
  /** The site's time zone when the run is for one site; dates are shown in it (UTC otherwise). */
  siteTimeZone: string | null;
  layoutId: string;
  layoutName: string;
  startPosition: number;
  labelCount: number;
  /** Tags of the run that have been put on equipment (bound at print time, or claimed later). */
  claimedCount: number;
  errorCorrection: string;
  pdfBytes: number | null;
  createdAt: string;
  createdByName: string | null;
}

export interface PrintRunDetailDto extends PrintRunDto {
  tags: TagDto[];
}

export interface ScanDto {
  at: string;
  byName: string;
  code: string;
  via: ScanVia;
}

export interface EquipmentTagInfoDto {
  equipmentId: string;
  /** The site's time zone, for showing times. */
  timeZone: string;
  current: TagDto | null;
  /** Earlier tags of this equipment, newest first (retired: replaced, damaged, lost). */
  previous: TagDto[];
  lastScan: ScanDto | null;
  scanCount: number;
  /** The viewer may put a new tag on the unit (`canAttachTag` of the unit's flags). */
  canAttach: boolean;
  /** The viewer may print a new tag for the unit (`canPrintTag`). */
  canPrint: boolean;
}

/** What a scanned code opens, for the signed-in person who scanned it. */
export type TagResolution =
  | { state: 'attached'; tag: TagDto; equipmentId: string; target: string }
  | {
      state: 'blank';
      tag: TagDto;
      canClaim: boolean;
      /** The viewer may register a new unit on the tag's site while claiming it. */
      canCreateEquipment: boolean;
      target: string;
    }
  | {
      state: 'retired';
      tag: TagDto;
      /** The equipment the tag was on, when the viewer may see it. */
      equipment: { id: string; name: string } | null;
      /** The tag that equipment carries now. */
      currentCode: string | null;
      target: string;
    };

export interface ScanResultDto {
  resolution: TagResolution;
  /** The equipment page's data when the tag leads to equipment. */
  equipment: EquipmentDetailDto | null;
}

export interface AttachResultDto {
  tag: TagDto;
  equipmentId: string;
  replaced: TagDto | null;
}
