import 'server-only';
// Changing a photo's kind or caption, and deleting it: its uploader, the office or an admin.
import { sql, type Kysely } from 'kysely';
import { db as defaultDb } from '@/db';
import type { DB } from '@/db/schema.gen';
import type { Db } from '@/db/types';
import { assertCan } from '@/lib/auth/access';
import type { Actor } from '@/lib/auth/actor';
import { recordAudit } from '@/lib/audit/service';
import { AppError } from '@/lib/errors';
import type { PhotoDto } from '@/lib/photos/dto';
import type { UpdatePhotoInput } from '@/lib/photos/schemas';
import { canEdit, dtoColumns, getPhoto, removeObjects, visiblePhotos } from '@/lib/photos/service';

async function photoForChange(actor: Actor, id: string, db: Db) {
  const row = await visiblePhotos(actor, db)
    .where('photos.id', '=', id)
    .select([...dtoColumns, 'photos.original_key', 'photos.display_key', 'photos.thumb_key'])
    .executeTakeFirst();
  if (!row) throw new AppError('not_found', 'Photo not found.');
  if (!canEdit(actor, row.uploaded_by)) throw new AppError('forbidden', 'Only the person who uploaded this photo, the office or an admin can change it.');
  return row;
}

export async function updatePhoto(actor: Actor, id: string, input: UpdatePhotoInput, db: Kysely<DB> = defaultDb): Promise<PhotoDto> {
  assertCan(actor, 'photos.read');
  return db.transaction().execute(async (trx) => {
    const before = await photoForChange(actor, id, trx);
    await trx
      .updateTable('photos')
      .set({ ...(input.kind !== undefined ? { kind: input.kind } : {}), ...(input.caption !== undefined ? { caption: input.caption } : {}) })
      .where('id', '=', id)
      .execute();
    const after = await getPhoto(actor, id, trx);
    await recordAudit(trx, actor, {
      action: 'update',
      entityType: 'photo',
      entityId: id,
      before: { kind: before.kind, caption: before.caption },
      after: { kind: after.kind, caption: after.caption },
    });
    return after;
  });
}

/** Removes the row (with an audit event) and then its three objects; refused while a visit entry shows it. */
export async function deletePhoto(actor: Actor, id: string, db: Kysely<DB> = defaultDb): Promise<void> {
  assertCan(actor, 'photos.read');
  const keys = await db.transaction().execute(async (trx) => {
    const row = await photoForChange(actor, id, trx);
    // A photo recorded on a visit is part of a record that must last; it goes only once that
    // entry has been voided (with its reason) on the visit.
    const entry = await trx
      .selectFrom('entries')
      .select('id')
      .where('company_id', '=', actor.companyId)
      .where('kind', '=', 'photo')
      .where('voided_at', 'is', null)
      .where(sql<string>`data->>'photoId'`, '=', id)
      .executeTakeFirst();
    if (entry) throw new AppError('conflict', 'This photo is part of a visit record. Void its entry on the visit first; then the photo can be deleted.');
    await trx.deleteFrom('photos').where('id', '=', id).execute();
    await recordAudit(trx, actor, {
      action: 'delete',
      entityType: 'photo',
      entityId: id,
      before: { equipmentId: row.equipment_id, kind: row.kind, caption: row.caption, takenAt: row.taken_at, uploadedBy: row.uploaded_by, originalName: row.original_name },
    });
    return [row.original_key, row.display_key, row.thumb_key];
  });
  await removeObjects(keys);
}
