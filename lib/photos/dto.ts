import type { Page } from '@/lib/api/cursor';
import type { PhotoContentType, PhotoKind, PhotoVariant } from '@/lib/photos/schemas';

export interface PhotoDto {
  id: string;
  equipmentId: string;
  kind: PhotoKind;
  caption: string | null;
  /** From the camera's metadata when it had a believable one. */
  takenAt: string | null;
  uploadedAt: string;
  /** takenAt, else uploadedAt: what the gallery sorts and compares by. */
  sortAt: string;
  uploadedBy: { id: string; name: string };
  width: number;
  height: number;
  contentType: PhotoContentType;
  byteSize: number;
  originalName: string | null;
  locationKept: boolean;
  /** The viewer may change its kind and caption, and delete it. */
  canEdit: boolean;
  /** Access-checked app routes; the browser never sees a storage address. */
  urls: Record<PhotoVariant, string> & { download: string };
}

export interface PhotoListDto extends Page<PhotoDto> {
  /** Photos of this equipment per kind, whatever the current filter. */
  kindCounts: Record<PhotoKind, number>;
  total: number;
  canUpload: boolean;
  /** The site's time zone, for showing when photos were taken. */
  timeZone: string;
}

export interface PhotoRowForDto {
  id: string;
  equipment_id: string;
  kind: string;
  caption: string | null;
  taken_at: Date | null;
  created_at: Date;
  sort_at: Date;
  uploaded_by: string;
  uploader_name: string;
  width: number;
  height: number;
  content_type: string;
  byte_size: number;
  original_name: string | null;
  location_kept: boolean;
}

export function photoUrls(id: string): PhotoDto['urls'] {
  const base = `/api/photos/${id}`;
  return { thumb: `${base}/thumb`, display: `${base}/display`, original: `${base}/original`, download: `${base}/original?download=1` };
}

export function toPhotoDto(row: PhotoRowForDto, canEdit: boolean): PhotoDto {
  return {
    id: row.id,
    equipmentId: row.equipment_id,
    kind: row.kind as PhotoKind,
    caption: row.caption,
    takenAt: row.taken_at ? row.taken_at.toISOString() : null,
    uploadedAt: row.created_at.toISOString(),
    sortAt: row.sort_at.toISOString(),
    uploadedBy: { id: row.uploaded_by, name: row.uploader_name },
    width: row.width,
    height: row.height,
    contentType: row.content_type as PhotoContentType,
    byteSize: row.byte_size,
    originalName: row.original_name,
    locationKept: row.location_kept,
    canEdit,
    urls: photoUrls(row.id),
  };
}

export interface StorageProblemDto {
  photoId: string;
  equipmentId: string;
  equipmentName: string | null;
  kind: PhotoKind;
  uploadedAt: string;
  missing: PhotoVariant[];
  /** What a repair does: make the small copies again from the original, rebuild the original from the display copy, or remove a record whose image is gone. */
  repair: 'regenerate' | 'restore_original' | 'remove_record';
}

export interface OrphanObjectDto {
  key: string;
  size: number;
  lastModified: string | null;
}

export interface StorageReportDto {
  checkedAt: string;
  /** Objects younger than this may belong to an upload still in progress: reported, never removed. */
  graceMinutes: number;
  photoCount: number;
  objectCount: number;
  objectBytes: number;
  orphanObjects: OrphanObjectDto[];
  orphanBytes: number;
  recentObjects: OrphanObjectDto[];
  missing: StorageProblemDto[];
}

export interface StorageRepairDto {
  deletedObjects: number;
  regenerated: number;
  restored: number;
  removedRecords: number;
  failures: string[];
  report: StorageReportDto;
}
