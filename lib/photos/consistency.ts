import 'server-only';
import type { Kysely } from 'kysely';
import sharp from 'sharp';
import type { DB } from '@/db/schema.gen';
import type { Actor } from '@/lib/auth/actor';
import { recordAudit } from '@/lib/audit/service';
import { comparePhotoStorage, isPhotoObjectKey, ORPHAN_GRACE_MS, repairFor, type ListedObject } from '@/lib/photos/compare';
import type { OrphanObjectDto, StorageRepairDto, StorageReportDto } from '@/lib/photos/dto';
import { displayPipeline, thumbPipeline, uprightImage } from '@/lib/photos/process';
import type { PhotoKind } from '@/lib/photos/schemas';
import { deleteObject, getObjectBytes, listObjects, putObject } from '@/storage/objects';

// The storage check behind the admin page and `npm run photos:check`: photo objects with no row,
// and rows whose objects are gone. No access check here; the service and the script decide who
// may run it. `companyId` null means every company (the script).

type AuditActor = Pick<Actor, 'id' | 'companyId'> | { id: null; companyId: string };

async function loadRows(db: Kysely<DB>, companyId: string | null) {
  let q = db
    .selectFrom('photos')
    .leftJoin('equipment', 'equipment.id', 'photos.equipment_id')
    .select([
      'photos.id',
      'photos.company_id',
      'photos.equipment_id',
      'equipment.name as equipment_name',
      'photos.kind',
      'photos.created_at',
      'photos.original_key',
      'photos.display_key',
      'photos.thumb_key',
    ]);
  if (companyId) q = q.where('photos.company_id', '=', companyId);
  return q.orderBy('photos.created_at').execute();
}

async function loadObjects(companyId: string | null): Promise<ListedObject[]> {
  const objects = await listObjects(companyId ? `${companyId}/photos/` : '');
  return objects.filter((o) => isPhotoObjectKey(o.key));
}

const toOrphanDto = (o: ListedObject): OrphanObjectDto => ({ key: o.key, size: o.size, lastModified: o.lastModified?.toISOString() ?? null });

async function inspect(db: Kysely<DB>, companyId: string | null, now: Date, graceMs: number) {
  // Objects first: a row inserted after the listing cannot then look like it lost its objects.
  const objects = await loadObjects(companyId);
  const rows = await loadRows(db, companyId);
  const result = comparePhotoStorage(rows, objects, now, graceMs);
  const byId = new Map(rows.map((r) => [r.id, r]));
  const report: StorageReportDto = {
    checkedAt: now.toISOString(),
    graceMinutes: Math.round(graceMs / 60_000),
    photoCount: rows.length,
    objectCount: objects.length,
    objectBytes: objects.reduce((a, o) => a + o.size, 0),
    orphanObjects: result.orphans.map(toOrphanDto),
    orphanBytes: result.orphans.reduce((a, o) => a + o.size, 0),
    recentObjects: result.recent.map(toOrphanDto),
    missing: result.missing.map((m) => {
      const row = byId.get(m.id)!;
      return {
        photoId: m.id,
        equipmentId: row.equipment_id,
        equipmentName: row.equipment_name,
        kind: row.kind as PhotoKind,
        uploadedAt: row.created_at.toISOString(),
        missing: m.missing,
        repair: repairFor(m.missing),
      };
    }),
  };
  return { report, rows: byId };
}

export async function inspectPhotoStorage(db: Kysely<DB>, companyId: string | null, now = new Date(), graceMs = ORPHAN_GRACE_MS): Promise<StorageReportDto> {
  return (await inspect(db, companyId, now, graceMs)).report;
}

/**
 * Repairs what the check found: deletes orphan objects (never recent ones), makes missing display
 * copies and thumbnails again from the original, rebuilds a lost original from the display copy,
 * and removes (with an audit event) a row whose image is gone entirely. `actor` null: the script.
 */
export async function repairPhotoStorage(
  db: Kysely<DB>,
  companyId: string | null,
  actor: Pick<Actor, 'id' | 'companyId'> | null,
  now = new Date(),
  graceMs = ORPHAN_GRACE_MS,
): Promise<StorageRepairDto> {
  const { report, rows } = await inspect(db, companyId, now, graceMs);
  const failures: string[] = [];
  let deletedObjects = 0;
  let regenerated = 0;
  let restored = 0;
  let removedRecords = 0;

  for (const o of report.orphanObjects) {
    try {
      await deleteObject(o.key);
      deletedObjects++;
    } catch (error) {
      failures.push(`Could not delete ${o.key}: ${error instanceof Error ? error.message : String(error)}`);
    }
  }

  for (const problem of report.missing) {
    const row = rows.get(problem.photoId)!;
    const auditActor: AuditActor = actor ?? { id: null, companyId: row.company_id };
    try {
      if (problem.repair === 'regenerate') {
        const original = Buffer.from(await getObjectBytes(row.original_key));
        if (problem.missing.includes('display')) await putObject(row.display_key, await displayPipeline(uprightImage(original)).toBuffer(), 'image/webp');
        if (problem.missing.includes('thumb')) await putObject(row.thumb_key, await thumbPipeline(uprightImage(original)).toBuffer(), 'image/webp');
        regenerated++;
      } else if (problem.repair === 'restore_original') {
        // The camera's file is lost; the display copy is the best image left, so it becomes the original.
        const display = Buffer.from(await getObjectBytes(row.display_key));
        const meta = await sharp(display).metadata();
        await putObject(row.original_key, display, 'image/webp');
        if (problem.missing.includes('thumb')) await putObject(row.thumb_key, await thumbPipeline(sharp(display)).toBuffer(), 'image/webp');
        await db.transaction().execute(async (trx) => {
          await trx
            .updateTable('photos')
            .set({ content_type: 'image/webp', byte_size: display.byteLength, width: meta.width ?? 1, height: meta.height ?? 1, original_name: null })
            .where('id', '=', row.id)
            .execute();
          await recordAudit(trx, auditActor, { action: 'repair', entityType: 'photo', entityId: row.id, after: { originalRebuiltFromDisplayCopy: true } });
        });
        restored++;
      } else {
        await db.transaction().execute(async (trx) => {
          await trx.deleteFrom('photos').where('id', '=', row.id).execute();
          await recordAudit(trx, auditActor, {
            action: 'delete',
            entityType: 'photo',
            entityId: row.id,
            before: { equipmentId: row.equipment_id, kind: row.kind, reason: 'storage check: image files missing', missing: problem.missing },
          });
        });
        for (const key of [row.original_key, row.display_key, row.thumb_key]) await deleteObject(key).catch(() => undefined);
        removedRecords++;
      }
    } catch (error) {
      failures.push(`Could not repair photo ${row.id}: ${error instanceof Error ? error.message : String(error)}`);
    }
  }

  return { deletedObjects, regenerated, restored, removedRecords, failures, report: await inspectPhotoStorage(db, companyId, now, graceMs) };
}
