import 'server-only';
// Label layouts and print runs: new codes reserved in a run and its label sheet stored as a PDF.
import { sql, type Kysely, type Transaction } from 'kysely';
import { db as defaultDb } from '@/db';
import type { DB } from '@/db/schema.gen';
import type { Db, QueryRow } from '@/db/types';
import type { Page } from '@/lib/api/cursor';
import { keysetPage } from '@/lib/api/paging';
import { assertCan } from '@/lib/auth/access';
import type { Actor } from '@/lib/auth/actor';
import { recordAudit } from '@/lib/audit/service';
import { env } from '@/lib/env';
import { equipmentBaseQuery } from '@/lib/equipment/queries';
import { equipmentTypeLabels, type EquipmentType } from '@/lib/equipment/types';
import { AppError, foundOr404 } from '@/lib/errors';
import { getSite } from '@/lib/sites/service';
import { generateCode } from '@/lib/tags/code';
import { toTagDto, type LabelLayoutDto, type PrintRunDetailDto, type PrintRunDto } from '@/lib/tags/dto';
import { renderCalibrationSheet, renderLabelSheet, type LabelContent } from '@/lib/tags/pdf';
import { chooseErrorCorrection, tagUrl } from '@/lib/tags/qr';
import { localDate } from '@/lib/format/dates';
import { layoutQuery, printRunQuery, tagQuery, toLayout } from '@/lib/tags/queries';
import type { CreatePrintRunInput, ListPrintRunsQuery } from '@/lib/tags/schemas';
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
  const newestFirst = { key: 'print_runs.created_at', id: 'print_runs.id', direction: 'desc', cast: 'timestamptz' } as const;
  return keysetPage(printRunQuery(db, actor.companyId), newestFirst, query, toPrintRunDto);
}

export async function getPrintRun(actor: Actor, id: string, db: Db = defaultDb): Promise<PrintRunDetailDto> {
  assertCan(actor, 'tags.print');
  const row = foundOr404(await printRunQuery(db, actor.companyId).where('print_runs.id', '=', id).executeTakeFirst(), 'Print run not found.');
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
