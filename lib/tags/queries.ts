import { sql } from 'kysely';
import type { Db } from '@/db/types';
import type { LabelLayout } from '@/lib/tags/layouts';

// Query builders only (no connection of their own, no 'server-only'): the service executes them,
// and the benchmark times the very same SQL straight through pg.

/** Tags with the names people read beside them. */
export function tagQuery(db: Db, companyId: string) {
  return db
    .selectFrom('tags')
    .leftJoin('sites', 'sites.id', 'tags.site_id')
    .leftJoin('equipment', 'equipment.id', 'tags.equipment_id')
    .leftJoin('users as attacher', 'attacher.id', 'tags.attached_by')
    .leftJoin('tags as successor', 'successor.id', 'tags.replaced_by_id')
    .where('tags.company_id', '=', companyId)
    .select([
      'tags.id',
      'tags.code',
      'tags.state',
      'tags.print_run_id',
      'tags.site_id',
      'sites.name as site_name',
      'sites.time_zone as site_time_zone',
      'tags.equipment_id',
      'equipment.name as equipment_name',
      'tags.attached_at',
      'attacher.name as attached_by_name',
      'tags.retired_at',
      'tags.retired_reason',
      'tags.retired_note',
      'successor.code as replaced_by_code',
      'tags.created_at',
    ]);
}

/** The one lookup a scan makes: the unique code index, then the company check (another company's tag reads as unknown). */
export function tagByCodeQuery(db: Db, companyId: string, code: string) {
  return tagQuery(db, companyId).where('tags.code', '=', code);
}

export function layoutQuery(db: Db) {
  return db
    .selectFrom('label_layouts')
    .where('archived_at', 'is', null)
    .select([
      'id',
      'name',
      'description',
      'page_width_mm',
      'page_height_mm',
      'label_width_mm',
      'label_height_mm',
      'columns',
      'rows',
      'margin_left_mm',
      'margin_top_mm',
      'pitch_x_mm',
      'pitch_y_mm',
      'padding_mm',
    ])
    .orderBy('sort_order')
    .orderBy('name');
}

export function toLayout(row: {
  id: string;
  name: string;
  description: string | null;
  page_width_mm: number;
  page_height_mm: number;
  label_width_mm: number;
  label_height_mm: number;
  columns: number;
  rows: number;
  margin_left_mm: number;
  margin_top_mm: number;
  pitch_x_mm: number;
  pitch_y_mm: number;
  padding_mm: number;
}): LabelLayout {
  return {
    id: row.id,
    name: row.name,
    description: row.description,
    pageWidthMm: Number(row.page_width_mm),
    pageHeightMm: Number(row.page_height_mm),
    labelWidthMm: Number(row.label_width_mm),
    labelHeightMm: Number(row.label_height_mm),
    columns: row.columns,
    rows: row.rows,
    marginLeftMm: Number(row.margin_left_mm),
    marginTopMm: Number(row.margin_top_mm),
    pitchXMm: Number(row.pitch_x_mm),
    pitchYMm: Number(row.pitch_y_mm),
    paddingMm: Number(row.padding_mm),
  };
}

/** Print runs with their claimed counts (tags of the run that have ever been on equipment). */
export function printRunQuery(db: Db, companyId: string) {
  return db
    .selectFrom('print_runs')
    .innerJoin('label_layouts', 'label_layouts.id', 'print_runs.layout_id')
    .leftJoin('sites', 'sites.id', 'print_runs.site_id')
    .leftJoin('users', 'users.id', 'print_runs.created_by')
    .where('print_runs.company_id', '=', companyId)
    .select([
      'print_runs.id',
      'print_runs.kind',
      'print_runs.site_id',
      'sites.name as site_name',
      'sites.time_zone as site_time_zone',
      'print_runs.layout_id',
      'label_layouts.name as layout_name',
      'print_runs.start_position',
      'print_runs.label_count',
      'print_runs.error_correction',
      'print_runs.pdf_bytes',
      'print_runs.created_at',
      'users.name as created_by_name',
      sql<number>`(select count(*) from tags t where t.print_run_id = print_runs.id and t.attached_at is not null)::int`.as('claimed_count'),
    ]);
}

/** The last scan of a piece of equipment (any of its tags), with who scanned it. */
export function lastScanQuery(db: Db, companyId: string, equipmentId: string) {
  return db
    .selectFrom('tag_scans')
    .innerJoin('users', 'users.id', 'tag_scans.user_id')
    .innerJoin('tags', 'tags.id', 'tag_scans.tag_id')
    .where('tag_scans.company_id', '=', companyId)
    .where('tag_scans.equipment_id', '=', equipmentId)
    .select(['tag_scans.scanned_at', 'users.name as by_name', 'tags.code', 'tag_scans.via'])
    .orderBy('tag_scans.scanned_at', 'desc')
    .limit(1);
}
