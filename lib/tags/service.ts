import 'server-only';
import { sql, type Kysely } from 'kysely';
import { db as defaultDb } from '@/db';
import type { DB } from '@/db/schema.gen';
import type { Db } from '@/db/types';
import { clientScope } from '@/lib/auth/scope';
import { assertCan, can } from '@/lib/auth/access';
import type { Actor } from '@/lib/auth/actor';
import { recordAudit } from '@/lib/audit/service';
import { equipmentFlags } from '@/lib/equipment/permissions';
import { equipmentBaseQuery } from '@/lib/equipment/queries';
import type { EquipmentStatus } from '@/lib/equipment/types';
import { createEquipmentSchema } from '@/lib/equipment/schemas';
import { getEquipment, insertEquipment } from '@/lib/equipment/service';
import { AppError } from '@/lib/errors';
import { getSite } from '@/lib/sites/service';
import { toTagDto, type AttachResultDto, type EquipmentTagInfoDto, type ScanResultDto, type TagDto, type TagResolution } from '@/lib/tags/dto';
import { lastScanQuery, tagByCodeQuery, tagQuery } from '@/lib/tags/queries';
import type { AttachTagInput, RetireTagInput, ScanVia } from '@/lib/tags/schemas';

// Tags in the field: resolving and scanning a code, attaching and retiring (print runs: print-runs.ts).

// ------------------------------------------------------------------------------ scanning

async function tagByCode(db: Db, actor: Actor, code: string): Promise<TagDto> {
  const row = await tagByCodeQuery(db, actor.companyId, code).executeTakeFirst();
  // Unknown, or another company's: the same answer, so nothing about other companies leaks.
  if (!row) throw new AppError('not_found', 'Tag not found.');
  return toTagDto(row);
}

/** Can this viewer see the equipment (company and client scope)? */
async function equipmentVisible(db: Db, actor: Actor, equipmentId: string): Promise<{ id: string; name: string; timeZone: string; status: EquipmentStatus } | null> {
  const row = await equipmentBaseQuery(actor, db)
    .where('equipment.id', '=', equipmentId)
    .where('equipment.deleted_at', 'is', null)
    .select(['equipment.id', 'equipment.name', 'sites.time_zone', 'equipment.status'])
    .executeTakeFirst();
  return row ? { id: row.id, name: row.name, timeZone: row.time_zone, status: row.status as EquipmentStatus } : null;
}

/** Can this viewer see the site (company and client scope)? */
async function siteVisible(db: Db, actor: Actor, siteId: string | null): Promise<boolean> {
  // A tag printed for no site is the company's own: staff only.
  if (!siteId) return clientScope(actor) === null;
  return getSite(actor, siteId, db).then(
    () => true,
    () => false,
  );
}

export function scanTarget(code: string): string {
  return `/scan/${code}`;
}

/**
 * What a scanned code opens for this viewer. Anything the viewer may not see reads as not found.
 * With `via`, the scan is written to the scan log (who, when, which tag).
 */
export async function resolveTag(actor: Actor, code: string, via?: ScanVia, db: Db = defaultDb): Promise<TagResolution> {
  assertCan(actor, 'tags.scan');
  return resolveFound(actor, await tagByCode(db, actor, code), via, db);
}

async function resolveFound(actor: Actor, tag: TagDto, via: ScanVia | undefined, db: Db): Promise<TagResolution> {
  let resolution: TagResolution;
  if (tag.state === 'attached' && tag.equipmentId) {
    if (!(await equipmentVisible(db, actor, tag.equipmentId))) throw new AppError('not_found', 'Tag not found.');
    resolution = { state: 'attached', tag, equipmentId: tag.equipmentId, target: `/equipment/${tag.equipmentId}` };
  } else if (tag.state === 'blank') {
    if (!(await siteVisible(db, actor, tag.siteId))) throw new AppError('not_found', 'Tag not found.');
    const canClaim = can(actor, 'tags.claim');
    resolution = { state: 'blank', tag, canClaim, canCreateEquipment: canClaim && Boolean(tag.siteId) && can(actor, 'equipment.write'), target: scanTarget(tag.code) };
  } else {
    // A retired tag is shown to whoever may see the equipment it was on (or, never used, its site).
    const equipment = tag.equipmentId ? await equipmentVisible(db, actor, tag.equipmentId) : null;
    if (tag.equipmentId ? !equipment : !(await siteVisible(db, actor, tag.siteId))) throw new AppError('not_found', 'Tag not found.');
    const current = equipment
      ? await db.selectFrom('tags').select('code').where('equipment_id', '=', equipment.id).where('state', '=', 'attached').executeTakeFirst()
      : undefined;
    resolution = { state: 'retired', tag, equipment: equipment ? { id: equipment.id, name: equipment.name } : null, currentCode: current?.code ?? null, target: scanTarget(tag.code) };
  }
  if (via) {
    await db
      .insertInto('tag_scans')
      .values({
        company_id: actor.companyId,
        tag_id: tag.id,
        equipment_id: resolution.state === 'attached' ? resolution.equipmentId : resolution.state === 'retired' ? (resolution.equipment?.id ?? null) : null,
        user_id: actor.id,
        via,
      })
      .execute();
  }
  return resolution;
}

/** A scan through the API: the resolution plus the equipment page's data when the tag leads to equipment. */
export async function scanTag(actor: Actor, code: string, via: ScanVia, db: Db = defaultDb): Promise<ScanResultDto> {
  assertCan(actor, 'tags.scan');
  const tag = await tagByCode(db, actor, code);
  if (tag.state === 'attached' && tag.equipmentId) {
    // The equipment page's data is the scope check too (one lookup instead of two); a unit the
    // viewer may not see reads as an unknown tag, and the scan is written only after it passed.
    const equipment = await getEquipment(actor, tag.equipmentId, db).catch((error: unknown) => {
      throw error instanceof AppError && error.code === 'not_found' ? new AppError('not_found', 'Tag not found.') : error;
    });
    await db.insertInto('tag_scans').values({ company_id: actor.companyId, tag_id: tag.id, equipment_id: equipment.id, user_id: actor.id, via }).execute();
    return { resolution: { state: 'attached', tag, equipmentId: equipment.id, target: `/equipment/${equipment.id}` }, equipment };
  }
  const resolution = await resolveFound(actor, tag, via, db);
  const equipmentId = resolution.state === 'attached' ? resolution.equipmentId : resolution.state === 'retired' ? resolution.equipment?.id : undefined;
  return { resolution, equipment: equipmentId ? await getEquipment(actor, equipmentId, db) : null };
}

/** Any tag of the company, for the scan page's retired/blank states and the API. */
export async function getTag(actor: Actor, code: string, db: Db = defaultDb): Promise<TagDto> {
  return (await resolveTag(actor, code, undefined, db)).tag;
}

// ------------------------------------------------------------------------------ claiming and replacing

/**
 * Puts a blank tag on equipment (existing, or created here on the tag's site). Equipment that already
 * carries a tag gets the new one and its old tag is retired as replaced; the old tag's scans keep
 * leading to the equipment.
 */
export async function attachTag(actor: Actor, code: string, input: AttachTagInput, db: Kysely<DB> = defaultDb): Promise<AttachResultDto> {
  assertCan(actor, 'tags.claim');
  return db.transaction().execute(async (trx) => {
    const locked = await trx
      .selectFrom('tags')
      .select(['id', 'state', 'site_id', 'equipment_id'])
      .where('code', '=', code)
      .where('company_id', '=', actor.companyId)
      .forUpdate()
      .executeTakeFirst();
    if (!locked || !(await siteVisible(trx, actor, locked.site_id))) throw new AppError('not_found', 'Tag not found.');
    if (locked.state === 'attached') throw new AppError('conflict', 'This tag is already on a piece of equipment.');
    if (locked.state === 'retired') throw new AppError('conflict', 'This tag was retired and cannot be used again.');

    let equipmentId: string;
    if ('equipmentId' in input) {
      const equipment = await getEquipment(actor, input.equipmentId, trx).catch(() => {
        throw new AppError('validation_failed', 'Choose the equipment.', [{ path: 'equipmentId', message: 'This equipment was not found.' }]);
      });
      if (!equipment.canAttachTag) throw new AppError('validation_failed', 'A removed unit gets no new tag.', [{ path: 'equipmentId', message: 'Choose a unit still in service.' }]);
      equipmentId = equipment.id;
    } else {
      if (!locked.site_id) {
        throw new AppError('validation_failed', 'This tag was printed without a site: choose existing equipment.', [{ path: 'newEquipment', message: 'Choose existing equipment.' }]);
      }
      assertCan(actor, 'equipment.write');
      const parsed = createEquipmentSchema.safeParse({ siteId: locked.site_id, nameplate: {}, ...input.newEquipment });
      if (!parsed.success) {
        throw new AppError(
          'validation_failed',
          'Some fields need attention.',
          parsed.error.issues.map((i) => ({ path: `newEquipment.${i.path.join('.')}`, message: i.message })),
        );
      }
      equipmentId = await insertEquipment(actor, parsed.data, trx);
      await recordAudit(trx, actor, { action: 'create', entityType: 'equipment', entityId: equipmentId, after: { ...parsed.data, viaTag: code } });
    }
    const equipmentSite = await trx.selectFrom('equipment').select('site_id').where('id', '=', equipmentId).executeTakeFirstOrThrow();

    const old = await trx
      .selectFrom('tags')
      .select(['id', 'code'])
      .where('equipment_id', '=', equipmentId)
      .where('state', '=', 'attached')
      .forUpdate()
      .executeTakeFirst();
    if (old) {
      await trx
        .updateTable('tags')
        .set({ state: 'retired', retired_at: sql`now()`, retired_by: actor.id, retired_reason: 'replaced', replaced_by_id: locked.id, updated_at: sql`now()` })
        .where('id', '=', old.id)
        .execute();
      await recordAudit(trx, actor, { action: 'retire', entityType: 'tag', entityId: old.id, after: { code: old.code, reason: 'replaced', replacedBy: code } });
    }
    await trx
      .updateTable('tags')
      .set({ state: 'attached', equipment_id: equipmentId, site_id: equipmentSite.site_id, attached_at: sql`now()`, attached_by: actor.id, updated_at: sql`now()` })
      .where('id', '=', locked.id)
      .execute();
    await recordAudit(trx, actor, { action: 'attach', entityType: 'tag', entityId: locked.id, after: { code, equipmentId, replaced: old?.code ?? null } });
    const tag = await tagByCode(trx, actor, code);
    const replaced = old ? await tagByCode(trx, actor, old.code) : null;
    return { tag, equipmentId, replaced };
  });
}

/** Retires a tag without a successor: damaged or lost (attached), or a blank one never used. */
export async function retireTag(actor: Actor, code: string, input: RetireTagInput, db: Kysely<DB> = defaultDb): Promise<TagDto> {
  assertCan(actor, 'tags.claim');
  return db.transaction().execute(async (trx) => {
    const before = await tagByCode(trx, actor, code);
    if (before.state === 'retired') throw new AppError('conflict', 'This tag is already retired.');
    if (before.equipmentId && !(await equipmentVisible(trx, actor, before.equipmentId))) throw new AppError('not_found', 'Tag not found.');
    if (input.reason === 'unused' && before.state !== 'blank') {
      throw new AppError('validation_failed', 'Some fields need attention.', [{ path: 'reason', message: 'Only a blank tag can be voided as never used.' }]);
    }
    await trx
      .updateTable('tags')
      .set({ state: 'retired', retired_at: sql`now()`, retired_by: actor.id, retired_reason: input.reason, retired_note: input.note ?? null, updated_at: sql`now()` })
      .where('id', '=', before.id)
      .execute();
    const after = await tagByCode(trx, actor, code);
    await recordAudit(trx, actor, { action: 'retire', entityType: 'tag', entityId: before.id, before, after });
    return after;
  });
}

// ------------------------------------------------------------------------------ equipment page

export async function getEquipmentTagInfo(actor: Actor, equipmentId: string, db: Db = defaultDb): Promise<EquipmentTagInfoDto> {
  assertCan(actor, 'equipment.read');
  const equipment = await equipmentVisible(db, actor, equipmentId);
  if (!equipment) throw new AppError('not_found', 'Equipment not found.');
  const [tags, last, count] = await Promise.all([
    tagQuery(db, actor.companyId).where('tags.equipment_id', '=', equipmentId).orderBy('tags.attached_at', 'desc').execute(),
    lastScanQuery(db, actor.companyId, equipmentId).executeTakeFirst(),
    db
      .selectFrom('tag_scans')
      .select((eb) => eb.fn.countAll<number>().as('n'))
      .where('company_id', '=', actor.companyId)
      .where('equipment_id', '=', equipmentId)
      .executeTakeFirstOrThrow(),
  ]);
  const dtos = tags.map(toTagDto);
  const flags = equipmentFlags(actor, equipment);
  return {
    equipmentId,
    timeZone: equipment.timeZone,
    current: dtos.find((t) => t.state === 'attached') ?? null,
    previous: dtos.filter((t) => t.state !== 'attached'),
    lastScan: last ? { at: last.scanned_at.toISOString(), byName: last.by_name, code: last.code, via: last.via as ScanVia } : null,
    scanCount: Number(count.n),
    canAttach: flags.canAttachTag,
    canPrint: flags.canPrintTag,
  };
}

/** For the signed-out tag page: does any tag of the installation carry this code? Says nothing more. */
export async function isRegisteredCode(code: string, db: Db = defaultDb): Promise<boolean> {
  return (await db.selectFrom('tags').select('id').where('code', '=', code).executeTakeFirst()) !== undefined;
}

/** Current tag codes of the equipment on a site, by equipment id (claim flow and print-run form). */
export async function siteTagCodes(actor: Actor, siteId: string, db: Db = defaultDb): Promise<Record<string, string>> {
  assertCan(actor, 'equipment.read');
  await getSite(actor, siteId, db);
  const rows = await db
    .selectFrom('tags')
    .innerJoin('equipment', 'equipment.id', 'tags.equipment_id')
    .select(['tags.equipment_id', 'tags.code'])
    .where('tags.company_id', '=', actor.companyId)
    .where('equipment.site_id', '=', siteId)
    .where('tags.state', '=', 'attached')
    .execute();
  return Object.fromEntries(rows.map((r) => [r.equipment_id!, r.code]));
}
