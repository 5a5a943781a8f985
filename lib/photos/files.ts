import 'server-only';
// A photo's bytes for download, and the admin's storage check and repair.
import type { Kysely } from 'kysely';
import { db as defaultDb } from '@/db';
import type { DB } from '@/db/schema.gen';
import type { Db } from '@/db/types';
import { assertCan } from '@/lib/auth/access';
import type { Actor } from '@/lib/auth/actor';
import { AppError } from '@/lib/errors';
import { inspectPhotoStorage, repairPhotoStorage } from '@/lib/photos/consistency';
import type { StorageReportDto, StorageRepairDto } from '@/lib/photos/dto';
import type { PhotoVariant } from '@/lib/photos/schemas';
import { getObjectStream, storageErrorKind } from '@/storage/objects';
import { visiblePhotos } from '@/lib/photos/service';

export interface PhotoFile {
  body: ReadableStream;
  contentType: string;
  contentLength: number | null;
  fileName: string;
}

/** The bytes of one variant, after the same access check as the photo itself. */
export async function openPhotoFile(actor: Actor, id: string, variant: PhotoVariant, db: Db = defaultDb): Promise<PhotoFile> {
  assertCan(actor, 'photos.read');
  const row = await visiblePhotos(actor, db)
    .where('photos.id', '=', id)
    .select(['photos.original_key', 'photos.display_key', 'photos.thumb_key', 'photos.content_type', 'photos.original_name', 'photos.kind'])
    .executeTakeFirst();
  if (!row) throw new AppError('not_found', 'Photo not found.');
  const key = variant === 'original' ? row.original_key : variant === 'display' ? row.display_key : row.thumb_key;
  try {
    const file = await getObjectStream(key);
    const ext = variant === 'original' ? { 'image/jpeg': 'jpg', 'image/png': 'png', 'image/webp': 'webp' }[row.content_type] ?? 'img' : 'webp';
    return {
      body: file.body,
      contentType: variant === 'original' ? row.content_type : 'image/webp',
      contentLength: file.contentLength,
      fileName: variant === 'original' && row.original_name ? row.original_name : `${row.kind}-${id.slice(0, 8)}.${ext}`,
    };
  } catch (error) {
    const kind = storageErrorKind(error);
    if (kind === 'not_found') throw new AppError('not_found', 'The image file is missing from storage. An admin can run the storage check under Settings.');
    if (kind === 'unavailable') throw new AppError('unavailable', 'The photo store cannot be reached right now. Try again in a moment.');
    throw error;
  }
}

export async function checkPhotoStorage(actor: Actor, db: Kysely<DB> = defaultDb): Promise<StorageReportDto> {
  assertCan(actor, 'photos.maintain');
  try {
    return await inspectPhotoStorage(db, actor.companyId);
  } catch (error) {
    if (storageErrorKind(error) === 'unavailable') throw new AppError('unavailable', 'The photo store cannot be reached right now. Try the check again in a moment.');
    throw error;
  }
}

export async function repairStorage(actor: Actor, db: Kysely<DB> = defaultDb): Promise<StorageRepairDto> {
  assertCan(actor, 'photos.maintain');
  try {
    return await repairPhotoStorage(db, actor.companyId, actor);
  } catch (error) {
    if (storageErrorKind(error) === 'unavailable') throw new AppError('unavailable', 'The photo store cannot be reached right now. Nothing was repaired; try again in a moment.');
    throw error;
  }
}
