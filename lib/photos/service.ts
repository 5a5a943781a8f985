import 'server-only';
import { randomUUID } from 'node:crypto';
import { type Kysely, type Transaction } from 'kysely';
import { db as defaultDb } from '@/db';
import { atVisibleSite, photoVisibleTo } from '@/lib/auth/scope';
import type { DB } from '@/db/schema.gen';
import type { Db } from '@/db/types';
import { keysetPage } from '@/lib/api/paging';
import { assertCan, can } from '@/lib/auth/access';
import type { Actor } from '@/lib/auth/actor';
import { recordAudit } from '@/lib/audit/service';
import { AppError } from '@/lib/errors';
import { logger } from '@/lib/logger';
import { toPhotoDto, type PhotoDto, type PhotoListDto } from '@/lib/photos/dto';
import { checkPhoto } from '@/lib/photos/process';
import { photoKinds, type ListPhotosQuery, type PhotoKind } from '@/lib/photos/schemas';
import { deleteObject, objectKey, putObject, storageErrorKind } from '@/storage/objects';

const storeDown = () => new AppError('unavailable', 'The photo store cannot be reached right now. Nothing was saved; try again in a moment.');

/** Photos the actor may see: same company, equipment not deleted, site within a client user's scope. */
export function visiblePhotos(actor: Actor, db: Db) {
  return db
    .selectFrom('photos')
    .innerJoin('equipment', 'equipment.id', 'photos.equipment_id')
    .innerJoin('sites', 'sites.id', 'equipment.site_id')
    .innerJoin('users as uploader', 'uploader.id', 'photos.uploaded_by')
    .where(photoVisibleTo(actor))
    .where('equipment.deleted_at', 'is', null);
}

export const dtoColumns = [
  'photos.id',
  'photos.equipment_id',
  'photos.kind',
  'photos.caption',
  'photos.taken_at',
  'photos.created_at',
  'photos.sort_at',
  'photos.uploaded_by',
  'uploader.name as uploader_name',
  'photos.width',
  'photos.height',
  'photos.content_type',
  'photos.byte_size',
  'photos.original_name',
  'photos.location_kept',
] as const;

/** Office and admin may change any photo; a technician the ones they uploaded. */
export function canEdit(actor: Actor, uploadedBy: string): boolean {
  return can(actor, 'photos.manage') || (can(actor, 'photos.upload') && uploadedBy === actor.id);
}

/** The equipment a photo is attached to, in the actor's scope, with what processing needs. */
async function equipmentForPhotos(actor: Actor, equipmentId: string, db: Db) {
  const row = await db
    .selectFrom('equipment')
    .$call(atVisibleSite(actor, 'equipment'))
    .innerJoin('companies', 'companies.id', 'equipment.company_id')
    .where('equipment.id', '=', equipmentId)
    .where('equipment.deleted_at', 'is', null)
    .select(['equipment.id', 'equipment.name', 'sites.time_zone', 'companies.keep_photo_location'])
    .executeTakeFirst();
  if (!row) throw new AppError('not_found', 'Equipment not found.');
  return row;
}

export async function listPhotos(actor: Actor, equipmentId: string, query: ListPhotosQuery, db: Db = defaultDb): Promise<PhotoListDto> {
  assertCan(actor, 'photos.read');
  const equipment = await equipmentForPhotos(actor, equipmentId, db);
  let q = visiblePhotos(actor, db).where('photos.equipment_id', '=', equipmentId).select(dtoColumns);
  if (query.kind.length) q = q.where('photos.kind', 'in', query.kind);
  const newestFirst = { key: 'photos.sort_at', id: 'photos.id', direction: 'desc', cast: 'timestamptz' } as const;
  const page = await keysetPage(q, newestFirst, query, (r) => toPhotoDto(r, canEdit(actor, r.uploaded_by)));
  const counts = await db
    .selectFrom('photos')
    .where('photos.equipment_id', '=', equipmentId)
    .where('photos.company_id', '=', actor.companyId)
    .select(['kind', (eb) => eb.fn.countAll<number>().as('n')])
    .groupBy('kind')
    .execute();
  const kindCounts = Object.fromEntries(photoKinds.map((k) => [k, 0])) as Record<PhotoKind, number>;
  for (const c of counts) kindCounts[c.kind as PhotoKind] = Number(c.n);
  return {
    ...page,
    kindCounts,
    total: Object.values(kindCounts).reduce((a, b) => a + b, 0),
    canUpload: can(actor, 'photos.upload'),
    timeZone: equipment.time_zone,
  };
}

export async function getPhoto(actor: Actor, id: string, db: Db = defaultDb): Promise<PhotoDto> {
  assertCan(actor, 'photos.read');
  const row = await visiblePhotos(actor, db).where('photos.id', '=', id).select(dtoColumns).executeTakeFirst();
  if (!row) throw new AppError('not_found', 'Photo not found.');
  return toPhotoDto(row, canEdit(actor, row.uploaded_by));
}

/** The newest photos of a site's equipment, for the site page. */
export async function recentSitePhotos(actor: Actor, siteId: string, limit = 8, db: Db = defaultDb): Promise<(PhotoDto & { equipmentName: string })[]> {
  assertCan(actor, 'photos.read');
  const rows = await visiblePhotos(actor, db)
    .where('equipment.site_id', '=', siteId)
    .select([...dtoColumns, 'equipment.name as equipment_name'])
    .orderBy('photos.sort_at', 'desc')
    .orderBy('photos.id', 'desc')
    .limit(limit)
    .execute();
  return rows.map((r) => ({ ...toPhotoDto(r, canEdit(actor, r.uploaded_by)), equipmentName: r.equipment_name }));
}

export interface UploadPhotoInput {
  equipmentId: string;
  kind: PhotoKind;
  caption: string | null;
  uploadKey?: string;
  fileName: string | null;
  bytes: Uint8Array;
  /** The bytes are the upload's own (nothing else reads them): location is removed in place. */
  handedOver?: boolean;
}

async function existingUpload(actor: Actor, uploadKey: string, equipmentId: string, db: Db): Promise<PhotoDto | null> {
  const row = await db
    .selectFrom('photos')
    .select(['id', 'uploaded_by', 'equipment_id'])
    .where('company_id', '=', actor.companyId)
    .where('upload_key', '=', uploadKey)
    .executeTakeFirst();
  if (!row) return null;
  if (row.uploaded_by !== actor.id || row.equipment_id !== equipmentId) {
    throw new AppError('conflict', 'This upload key was already used for another photo; choose the file again.');
  }
  return getPhoto(actor, row.id, db);
}

export async function removeObjects(keys: string[]): Promise<void> {
  const results = await Promise.allSettled(keys.map((k) => deleteObject(k)));
  const failed = results.filter((r) => r.status === 'rejected').length;
  // The storage check finds and removes whatever could not be deleted now.
  if (failed) logger.warn({ failed, keys }, 'photo objects left behind after a failed upload or delete');
}

/**
 * Checks, processes and stores one photo. Nothing is written until every check has passed; the
 * objects go first and the row last, and written objects are removed again if the row fails, so
 * a failed upload leaves neither a row without its image nor (barring a second failure, which the
 * storage check repairs) an image without its row.
 */
export async function uploadPhoto(actor: Actor, input: UploadPhotoInput, db: Kysely<DB> = defaultDb): Promise<PhotoDto> {
  assertCan(actor, 'photos.upload');
  if (input.uploadKey) {
    const equipment = await equipmentForPhotos(actor, input.equipmentId, db);
    const earlier = await existingUpload(actor, input.uploadKey, equipment.id, db);
    if (earlier) return earlier;
  }
  try {
    const { photoId } = await storePhoto(actor, input, db);
    return await getPhoto(actor, photoId, db);
  } catch (error) {
    // Two tries of the same file at once: the first one's photo is the answer to both.
    const pg = error as { code?: string; constraint?: string };
    if (input.uploadKey && pg.code === '23505' && pg.constraint === 'photos_upload_key_unique') {
      const earlier = await existingUpload(actor, input.uploadKey, input.equipmentId, db);
      if (earlier) return earlier;
    }
    throw error;
  }
}

/**
 * The storage half of an upload, for the services that take a photo with something else (a
 * service request): `alongside` runs in the same transaction as the photo's row, so the record
 * and its photo are stored together or not at all. The caller checks the permission; the
 * equipment must be in the actor's scope.
 */
export async function storePhoto<T = undefined>(
  actor: Actor,
  input: UploadPhotoInput,
  db: Kysely<DB>,
  alongside?: (trx: Transaction<DB>, photoId: string) => Promise<T>,
): Promise<{ photoId: string; result: T | undefined }> {
  const equipment = await equipmentForPhotos(actor, input.equipmentId, db);
  const processed = await checkPhoto(input.bytes, { keepLocation: equipment.keep_photo_location, timeZone: equipment.time_zone, handedOver: input.handedOver });

  const id = randomUUID();
  const keys = {
    original: objectKey(actor.companyId, 'photos', equipment.id, id, 'original'),
    display: objectKey(actor.companyId, 'photos', equipment.id, id, 'display'),
    thumb: objectKey(actor.companyId, 'photos', equipment.id, id, 'thumb'),
  };
  // Every check has passed: the original and thumbnail are stored while the display copy is
  // still being made, so most of the storage time hides behind the image work.
  const puts = [putObject(keys.original, processed.original, processed.contentType), putObject(keys.thumb, processed.thumb, 'image/webp')];
  const displayDone = processed.display.then((display) => putObject(keys.display, display, 'image/webp'));
  const results = await Promise.allSettled([...puts, displayDone]);
  const failed = results.find((r) => r.status === 'rejected');
  if (failed) {
    await removeObjects(Object.values(keys));
    const reason = (failed as PromiseRejectedResult).reason;
    if (reason instanceof AppError) throw reason;
    logger.warn({ err: reason }, 'photo upload could not write to the object store');
    throw storageErrorKind(reason) === 'other' ? new AppError('internal') : storeDown();
  }

  try {
    const result = await db.transaction().execute(async (trx) => {
      await trx
        .insertInto('photos')
        .values({
          id,
          company_id: actor.companyId,
          equipment_id: equipment.id,
          kind: input.kind,
          caption: input.caption,
          original_key: keys.original,
          display_key: keys.display,
          thumb_key: keys.thumb,
          content_type: processed.contentType,
          original_name: input.fileName,
          byte_size: processed.original.byteLength,
          width: processed.width,
          height: processed.height,
          taken_at: processed.takenAt,
          location_kept: processed.locationKept,
          uploaded_by: actor.id,
          ...(input.uploadKey ? { upload_key: input.uploadKey } : {}),
        })
        .execute();
      await recordAudit(trx, actor, {
        action: 'create',
        entityType: 'photo',
        entityId: id,
        after: {
          equipmentId: equipment.id,
          kind: input.kind,
          caption: input.caption,
          contentType: processed.contentType,
          byteSize: processed.original.byteLength,
          takenAt: processed.takenAt,
          locationRemoved: processed.hadLocation && !processed.locationKept,
        },
      });
      return alongside ? await alongside(trx, id) : undefined;
    });
    return { photoId: id, result };
  } catch (error) {
    await removeObjects(Object.values(keys));
    throw error;
  }
}
