import 'server-only';
import { sql, type Kysely, type Transaction } from 'kysely';
import { db as defaultDb } from '@/db';
import type { DB } from '@/db/schema.gen';
import type { Db, QueryRow } from '@/db/types';
import { decodeCursor, type Page } from '@/lib/api/cursor';
import { afterCursor, toPage } from '@/lib/api/paging';
import { clientScope } from '@/lib/auth/scope';
import { assertCan, can } from '@/lib/auth/access';
import type { Actor } from '@/lib/auth/actor';
import { recordAudit } from '@/lib/audit/service';
import { env } from '@/lib/env';
import { equipmentBaseQuery } from '@/lib/equipment/queries';
import { createEquipmentSchema } from '@/lib/equipment/schemas';
import { getEquipment, insertEquipment } from '@/lib/equipment/service';
import { equipmentTypeLabels, type EquipmentType } from '@/lib/equipment/types';
import { AppError } from '@/lib/errors';
import { getSite } from '@/lib/sites/service';
import { generateCode } from '@/lib/tags/code';
import {
  toTagDto,
  type AttachResultDto,
  type EquipmentTagInfoDto,
  type LabelLayoutDto,
  type PrintRunDetailDto,
  type PrintRunDto,
  type ScanResultDto,
  type TagDto,
  type TagResolution,
} from '@/lib/tags/dto';
import { renderCalibrationSheet, renderLabelSheet, type LabelContent } from '@/lib/tags/pdf';
import { chooseErrorCorrection, tagUrl } from '@/lib/tags/qr';
import { localDate } from '@/lib/format/dates';
import { lastScanQuery, layoutQuery, printRunQuery, tagByCodeQuery, tagQuery, toLayout } from '@/lib/tags/queries';
import type { AttachTagInput, CreatePrintRunInput, ListPrintRunsQuery, RetireTagInput, ScanVia } from '@/lib/tags/schemas';
import { deleteObject, getObjectBytes, objectKey, putObject } from '@/storage/objects';

// ------------------------------------------------------------------------------ layouts

export async function listLayouts(actor: Actor, db: Db = defaultDb): Promise<LabelLayoutDto[]> {
  assertCan(actor, 'tags.print');
  return (await layoutQuery(db).execute()).map(toLayout);
}

async function getLayout(db: Db, id: string): Promise<LabelLayoutDto> {
  const row = await layoutQuery(db).where('id', '=', id).executeTakeFirst();
  if (!row) throw new AppError('validation_failed', 'Choose a label layout.', [{ path: 'layoutId', message: 'This layout does not exist.' }]);
  return toLayout(row);
}

export async function calibrationPdf(actor: Actor, layoutId: string, db: Db = defaultDb): Promise<{ bytes: Uint8Array; filename: string }> {
  assertCan(actor, 'tags.print');
  const layout = await getLayout(db, layoutId);
  const { bytes } = await renderCalibrationSheet(layout);
  return { bytes, filename: `calibration-${layout.id}.pdf` };
}

// ------------------------------------------------------------------------------ print runs

type RunRow = QueryRow<typeof printRunQuery>;

function toPrintRunDto(row: RunRow): PrintRunDto {
  return {
    id: row.id,
    kind: row.kind as PrintRunDto['kind'],
    siteId: row.site_id,
    siteName: row.site_name,
    siteTimeZone: row.site_time_zone,
    layoutId: row.layout_id,
    layoutName: row.layout_name,
    startPosition: row.start_position,
    labelCount: row.label_count,
    claimedCount: row.claimed_count,
    errorCorrection: row.error_correction,
    pdfBytes: row.pdf_bytes,
    createdAt: row.created_at.toISOString(),
    createdByName: row.created_by_name,
  };
}

export async function listPrintRuns(actor: Actor, query: ListPrintRunsQuery, db: Db = defaultDb): Promise<Page<PrintRunDto>> {
  assertCan(actor, 'tags.print');
  const cursor = decodeCursor(query.cursor);
  let q = printRunQuery(db, actor.companyId);
  if (cursor) q = q.where(afterCursor(cursor, 'print_runs.created_at', 'print_runs.id', 'desc', 'timestamptz'));
  const rows = await q.orderBy('print_runs.created_at', 'desc').orderBy('print_runs.id', 'desc').limit(query.limit + 1).execute();
  return toPage(rows, query.limit, toPrintRunDto, (r) => ({ k: r.created_at.toISOString(), id: r.id }));
}

export async function getPrintRun(actor: Actor, id: string, db: Db = defaultDb): Promise<PrintRunDetailDto> {
  assertCan(actor, 'tags.print');
  const row = await printRunQuery(db, actor.companyId).where('print_runs.id', '=', id).executeTakeFirst();
  if (!row) throw new AppError('not_found', 'Print run not found.');
  const tags = await tagQuery(db, actor.companyId).where('tags.print_run_id', '=', id).orderBy('tags.created_at').orderBy('tags.code').execute();
  return { ...toPrintRunDto(row), tags: tags.map(toTagDto) };
}

export async function getPrintRunPdf(actor: Actor, id: string, db: Db = defaultDb): Promise<{ bytes: Uint8Array; filename: string }> {
  assertCan(actor, 'tags.print');
  const row = await db
    .selectFrom('print_runs')
    .leftJoin('sites', 'sites.id', 'print_runs.site_id')
    .select(['print_runs.pdf_key', 'print_runs.created_at', 'sites.time_zone'])
    .where('print_runs.id', '=', id)
    .where('print_runs.company_id', '=', actor.companyId)
    .executeTakeFirst();
  if (!row?.pdf_key) throw new AppError('not_found', 'Print run not found.');
  return { bytes: await getObjectBytes(row.pdf_key), filename: `tags-${localDate(row.created_at, row.time_zone ?? 'UTC')}-${id.slice(0, 8)}.pdf` };
}

/** Inserts `count` fresh tags; a code that collides with any tag of the installation is drawn again. */
async function insertNewTags(
  trx: Transaction<DB>,
  rows: { company_id: string; print_run_id: string; site_id: string | null; equipment_id: string | null; attached_by: string | null }[],
): Promise<{ id: string; code: string }[]> {
  const out: { id: string; code: string }[] = new Array(rows.length);
  let pending = rows.map((_, i) => i);
  for (let attempt = 0; pending.length > 0; attempt++) {
    if (attempt > 20) throw new Error('Could not draw unique tag codes');
    const codes = pending.map(() => generateCode());
    const inserted = await trx
      .insertInto('tags')
      .values(
        pending.map((i, k) => {
          const r = rows[i]!;
          const attached = r.equipment_id !== null;
          return {
            company_id: r.company_id,
            code: codes[k]!,
            print_run_id: r.print_run_id,
            site_id: r.site_id,
            equipment_id: r.equipment_id,
            state: attached ? 'attached' : 'blank',
            attached_at: attached ? sql<Date>`now()` : null,
            attached_by: attached ? r.attached_by : null,
          };
        }),
      )
      .onConflict((oc) => oc.column('code').doNothing())
      .returning(['id', 'code'])
      .execute();
    const byCode = new Map(inserted.map((t) => [t.code, t]));
    const still: number[] = [];
    pending.forEach((i, k) => {
      const hit = byCode.get(codes[k]!);
      if (hit) out[i] = hit;
      else still.push(i);
    });
    pending = still;
  }
  return out;
}

interface EquipmentForLabel {
  id: string;
  type: string;
  name: string;
  site_id: string;
  site_name: string;
  area_name: string | null;
}

export async function createPrintRun(actor: Actor, input: CreatePrintRunInput, db: Kysely<DB> = defaultDb): Promise<PrintRunDto> {
  assertCan(actor, 'tags.print');
  const layout = await getLayout(db, input.layoutId);
  const perPage = layout.columns * layout.rows;
  if (input.startPosition > perPage) {
    throw new AppError('validation_failed', 'Some fields need attention.', [{ path: 'startPosition', message: `This layout has ${perPage} labels per sheet.` }]);
  }
  const company = await db.selectFrom('companies').select(['name', 'service_phone', 'label_line']).where('id', '=', actor.companyId).executeTakeFirstOrThrow();

  let equipment: EquipmentForLabel[] = [];
  let siteId: string | null = null;
  if (input.kind === 'equipment') {
    equipment = await equipmentBaseQuery(actor, db)
      .where('equipment.id', 'in', input.equipmentIds)
      .where('equipment.deleted_at', 'is', null)
      .select(['equipment.id', 'equipment.type', 'equipment.name', 'equipment.site_id', 'sites.name as site_name', 'areas.name as area_name'])
      .orderBy('sites.name')
      .orderBy('areas.name')
      .orderBy('equipment.name')
      .execute();
    if (equipment.length !== input.equipmentIds.length) {
      throw new AppError('validation_failed', 'Some of the chosen equipment was not found.', [{ path: 'equipmentIds', message: 'Choose equipment again.' }]);
    }
    if (input.alreadyTagged === 'skip') {
      const tagged = new Set(
        (await db.selectFrom('tags').select('equipment_id').where('equipment_id', 'in', input.equipmentIds).where('state', '=', 'attached').execute()).map((t) => t.equipment_id),
      );
      equipment = equipment.filter((e) => !tagged.has(e.id));
      if (equipment.length === 0) {
        throw new AppError('validation_failed', 'All the chosen equipment already carries a tag.', [
          { path: 'equipmentIds', message: 'Choose untagged equipment, or choose to print replacement tags.' },
        ]);
      }
    }
    const sites = new Set(equipment.map((e) => e.site_id));
    siteId = sites.size === 1 ? equipment[0]!.site_id : null;
  } else {
    const site = await getSite(actor, input.siteId, db).catch(() => {
      throw new AppError('validation_failed', 'Choose a site.', [{ path: 'siteId', message: 'This site was not found.' }]);
    });
    if (site.archivedAt) throw new AppError('validation_failed', 'This site is archived.', [{ path: 'siteId', message: 'Restore the site first.' }]);
    siteId = site.id;
  }

  const errorCorrection = chooseErrorCorrection(env.APP_URL);
  const count = input.kind === 'equipment' ? equipment.length : input.count;
  let storedKey: string | null = null;
  try {
    return await db.transaction().execute(async (trx) => {
      const run = await trx
        .insertInto('print_runs')
        .values({
          company_id: actor.companyId,
          kind: input.kind,
          site_id: siteId,
          layout_id: layout.id,
          start_position: input.startPosition,
          label_count: count,
          error_correction: errorCorrection,
          created_by: actor.id,
        })
        .returning('id')
        .executeTakeFirstOrThrow();

      const previous =
        input.kind === 'equipment'
          ? await trx
              .selectFrom('tags')
              .select(['id', 'equipment_id'])
              .where('equipment_id', 'in', equipment.map((e) => e.id))
              .where('state', '=', 'attached')
              .forUpdate()
              .execute()
          : [];
      if (previous.length > 0) {
        // The old tags step aside first (one attached tag per equipment); they point at their successors below.
        await trx
          .updateTable('tags')
          .set({ state: 'retired', retired_at: sql`now()`, retired_by: actor.id, retired_reason: 'replaced', updated_at: sql`now()` })
          .where('id', 'in', previous.map((p) => p.id))
          .execute();
      }

      const tags = await insertNewTags(
        trx,
        Array.from({ length: count }, (_, i) => ({
          company_id: actor.companyId,
          print_run_id: run.id,
          site_id: input.kind === 'equipment' ? equipment[i]!.site_id : siteId,
          equipment_id: input.kind === 'equipment' ? equipment[i]!.id : null,
          attached_by: input.kind === 'equipment' ? actor.id : null,
        })),
      );
      for (const p of previous) {
        const i = equipment.findIndex((e) => e.id === p.equipment_id);
        await trx.updateTable('tags').set({ replaced_by_id: tags[i]!.id }).where('id', '=', p.id).execute();
      }

      const labels: LabelContent[] = tags.map((t, i) => {
        const e = input.kind === 'equipment' ? equipment[i]! : null;
        return {
          code: t.code,
          url: tagUrl(env.APP_URL, t.code),
          equipment: e ? { type: equipmentTypeLabels[e.type as EquipmentType] ?? e.type, name: e.name, site: e.site_name, area: e.area_name } : null,
        };
      });
      const sheet = await renderLabelSheet({
        layout,
        labels,
        startPosition: input.startPosition,
        company: { name: company.name, servicePhone: company.service_phone, labelLine: company.label_line },
        errorCorrection,
        title: `Tags: ${count} labels`,
      });
      const key = objectKey(actor.companyId, 'print-runs', run.id);
      await putObject(key, sheet.bytes, 'application/pdf');
      storedKey = key;
      await trx.updateTable('print_runs').set({ pdf_key: key, pdf_bytes: sheet.bytes.byteLength }).where('id', '=', run.id).execute();
      await recordAudit(trx, actor, {
        action: 'create',
        entityType: 'print_run',
        entityId: run.id,
        after: { kind: input.kind, siteId, layoutId: layout.id, labelCount: count, codes: tags.map((t) => t.code), replacedTagIds: previous.map((p) => p.id) },
      });
      return toPrintRunDto(await printRunQuery(trx, actor.companyId).where('print_runs.id', '=', run.id).executeTakeFirstOrThrow());
    });
  } catch (error) {
    // The PDF went to the store but the rows did not commit: take it back out.
    if (storedKey) await deleteObject(storedKey).catch(() => undefined);
    throw error;
  }
}

// ------------------------------------------------------------------------------ scanning

async function tagByCode(db: Db, actor: Actor, code: string): Promise<TagDto> {
  const row = await tagByCodeQuery(db, actor.companyId, code).executeTakeFirst();
  // Unknown, or another company's: the same answer, so nothing about other companies leaks.
  if (!row) throw new AppError('not_found', 'Tag not found.');
  return toTagDto(row);
}

/** Can this viewer see the equipment (company and client scope)? */
async function equipmentVisible(db: Db, actor: Actor, equipmentId: string): Promise<{ id: string; name: string; timeZone: string } | null> {
  const row = await equipmentBaseQuery(actor, db)
    .where('equipment.id', '=', equipmentId)
    .where('equipment.deleted_at', 'is', null)
    .select(['equipment.id', 'equipment.name', 'sites.time_zone'])
    .executeTakeFirst();
  return row ? { id: row.id, name: row.name, timeZone: row.time_zone } : null;
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
  const tag = await tagByCode(db, actor, code);
  let resolution: TagResolution;
  if (tag.state === 'attached' && tag.equipmentId) {
    if (!(await equipmentVisible(db, actor, tag.equipmentId))) throw new AppError('not_found', 'Tag not found.');
    resolution = { state: 'attached', tag, equipmentId: tag.equipmentId, target: `/equipment/${tag.equipmentId}` };
  } else if (tag.state === 'blank') {
    if (!(await siteVisible(db, actor, tag.siteId))) throw new AppError('not_found', 'Tag not found.');
    resolution = { state: 'blank', tag, canClaim: can(actor, 'tags.claim'), target: scanTarget(tag.code) };
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
  const resolution = await resolveTag(actor, code, via, db);
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
  return {
    equipmentId,
    timeZone: equipment.timeZone,
    current: dtos.find((t) => t.state === 'attached') ?? null,
    previous: dtos.filter((t) => t.state !== 'attached'),
    lastScan: last ? { at: last.scanned_at.toISOString(), byName: last.by_name, code: last.code, via: last.via as ScanVia } : null,
    scanCount: Number(count.n),
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
