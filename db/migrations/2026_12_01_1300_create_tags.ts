import { sql, type Kysely } from 'kysely';
import { idAndCompany, timestamps } from '@/db/migration-columns';

// QR tags: label layouts (data rows, one per sheet or roll kind), print runs, the tags themselves
// (blank → attached → retired) and the scan log. Frozen in time: typed on Kysely<any>.


// Issued codes: 8 Crockford Base32 data symbols + 1 check symbol (lib/tags/code.ts). The check
// position allows the whole check alphabet so that the column holds any valid code.
const codePattern = '^[0-9A-HJKMNP-TV-Z]{8}[0-9A-HJKMNP-TV-Z*~$=U]$';

// Layouts are rows, not code: a new sheet or roll is one insert. All lengths in millimetres;
// positions run left to right, then top to bottom, from the top-left corner of the page.
const layouts = [
  {
    id: 'letter-30',
    name: 'US letter sheet, 30 labels (1 × 2⅝ in)',
    description: 'Letter paper (8½ × 11 in), 3 columns × 10 rows of 1 × 2⅝ in labels.',
    page_width_mm: 215.9,
    page_height_mm: 279.4,
    label_width_mm: 66.675,
    label_height_mm: 25.4,
    columns: 3,
    rows: 10,
    margin_left_mm: 4.7625,
    margin_top_mm: 12.7,
    pitch_x_mm: 69.85,
    pitch_y_mm: 25.4,
    padding_mm: 1.5,
    sort_order: 10,
  },
  {
    id: 'a4-24',
    name: 'A4 sheet, 24 labels (70 × 37 mm)',
    description: 'A4 paper (210 × 297 mm), 3 columns × 8 rows of 70 × 37 mm labels.',
    page_width_mm: 210,
    page_height_mm: 297,
    label_width_mm: 70,
    label_height_mm: 37,
    columns: 3,
    rows: 8,
    margin_left_mm: 0,
    margin_top_mm: 0.5,
    pitch_x_mm: 70,
    pitch_y_mm: 37,
    padding_mm: 3,
    sort_order: 20,
  },
  {
    id: 'thermal-2x1',
    name: 'Thermal roll, one label per page (2 × 1 in)',
    description: 'For thermal label printers: each page is one 2 × 1 in label.',
    page_width_mm: 50.8,
    page_height_mm: 25.4,
    label_width_mm: 50.8,
    label_height_mm: 25.4,
    columns: 1,
    rows: 1,
    margin_left_mm: 0,
    margin_top_mm: 0,
    pitch_x_mm: 50.8,
    pitch_y_mm: 25.4,
    padding_mm: 1.2,
    sort_order: 30,
  },
];

export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .createTable('label_layouts')
    .addColumn('id', 'text', (c) => c.primaryKey().check(sql`id ~ '^[a-z0-9][a-z0-9-]{1,39}$'`))
    .addColumn('name', 'text', (c) => c.notNull())
    .addColumn('description', 'text')
    .addColumn('page_width_mm', 'numeric', (c) => c.notNull().check(sql`page_width_mm > 0`))
    .addColumn('page_height_mm', 'numeric', (c) => c.notNull().check(sql`page_height_mm > 0`))
    .addColumn('label_width_mm', 'numeric', (c) => c.notNull().check(sql`label_width_mm >= 20`))
    .addColumn('label_height_mm', 'numeric', (c) => c.notNull().check(sql`label_height_mm >= 12`))
    .addColumn('columns', 'integer', (c) => c.notNull().check(sql`columns between 1 and 20`))
    .addColumn('rows', 'integer', (c) => c.notNull().check(sql`rows between 1 and 40`))
    .addColumn('margin_left_mm', 'numeric', (c) => c.notNull().defaultTo(0).check(sql`margin_left_mm >= 0`))
    .addColumn('margin_top_mm', 'numeric', (c) => c.notNull().defaultTo(0).check(sql`margin_top_mm >= 0`))
    .addColumn('pitch_x_mm', 'numeric', (c) => c.notNull())
    .addColumn('pitch_y_mm', 'numeric', (c) => c.notNull())
    .addColumn('padding_mm', 'numeric', (c) => c.notNull().defaultTo(1.5).check(sql`padding_mm >= 0`))
    .addColumn('sort_order', 'integer', (c) => c.notNull().defaultTo(100))
    .addColumn('archived_at', 'timestamptz')
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    // Labels never overlap and the grid stays on the page.
    .addCheckConstraint('label_layouts_pitch_check', sql`pitch_x_mm >= label_width_mm and pitch_y_mm >= label_height_mm`)
    .addCheckConstraint(
      'label_layouts_fits_page_check',
      sql`margin_left_mm + (columns - 1) * pitch_x_mm + label_width_mm <= page_width_mm + 0.01
        and margin_top_mm + (rows - 1) * pitch_y_mm + label_height_mm <= page_height_mm + 0.01`,
    )
    .execute();
  await db.insertInto('label_layouts').values(layouts).execute();

  await db.schema
    .createTable('print_runs')
    .$call(idAndCompany)
    .addColumn('kind', 'text', (c) => c.notNull().check(sql`kind in ('equipment', 'blank')`))
    .addColumn('site_id', 'uuid', (c) => c.references('sites.id').onDelete('restrict'))
    .addColumn('layout_id', 'text', (c) => c.notNull().references('label_layouts.id').onDelete('restrict'))
    .addColumn('start_position', 'integer', (c) => c.notNull().defaultTo(1).check(sql`start_position >= 1`))
    .addColumn('label_count', 'integer', (c) => c.notNull().check(sql`label_count between 1 and 1000`))
    .addColumn('error_correction', 'text', (c) => c.notNull().check(sql`error_correction in ('L', 'M', 'Q', 'H')`))
    .addColumn('pdf_key', 'text')
    .addColumn('pdf_bytes', 'integer')
    .addColumn('created_by', 'uuid', (c) => c.references('users.id').onDelete('restrict'))
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addCheckConstraint('print_runs_blank_site_check', sql`kind <> 'blank' or site_id is not null`)
    .execute();
  await sql`create index print_runs_company_created_idx on print_runs (company_id, created_at desc, id desc)`.execute(db);

  await db.schema
    .createTable('tags')
    .$call(idAndCompany)
    // Unique across the installation, whatever the company: a scanned code names one tag.
    .addColumn('code', 'text', (c) => c.notNull().unique().check(sql`code ~ ${sql.lit(codePattern)}`))
    .addColumn('state', 'text', (c) => c.notNull().defaultTo('blank').check(sql`state in ('blank', 'attached', 'retired')`))
    .addColumn('print_run_id', 'uuid', (c) => c.references('print_runs.id').onDelete('restrict'))
    .addColumn('site_id', 'uuid', (c) => c.references('sites.id').onDelete('restrict'))
    .addColumn('equipment_id', 'uuid', (c) => c.references('equipment.id').onDelete('restrict'))
    .addColumn('attached_at', 'timestamptz')
    .addColumn('attached_by', 'uuid', (c) => c.references('users.id').onDelete('restrict'))
    .addColumn('retired_at', 'timestamptz')
    .addColumn('retired_by', 'uuid', (c) => c.references('users.id').onDelete('restrict'))
    .addColumn('retired_reason', 'text', (c) => c.check(sql`retired_reason in ('replaced', 'damaged', 'lost', 'unused')`))
    .addColumn('retired_note', 'text')
    .addColumn('replaced_by_id', 'uuid', (c) => c.references('tags.id').onDelete('restrict'))
    .$call(timestamps)
    .addCheckConstraint('tags_blank_check', sql`state <> 'blank' or (equipment_id is null and retired_at is null)`)
    .addCheckConstraint('tags_attached_check', sql`state <> 'attached' or (equipment_id is not null and attached_at is not null and retired_at is null)`)
    .addCheckConstraint('tags_retired_check', sql`state <> 'retired' or (retired_at is not null and retired_reason is not null)`)
    .execute();
  // One tag on a piece of equipment at a time; retired tags keep their equipment for history.
  await sql`create unique index tags_one_attached_per_equipment on tags (equipment_id) where state = 'attached'`.execute(db);
  await db.schema.createIndex('tags_equipment_idx').on('tags').column('equipment_id').execute();
  await db.schema.createIndex('tags_print_run_idx').on('tags').column('print_run_id').execute();

  await db.schema
    .createTable('tag_scans')
    .$call(idAndCompany)
    .addColumn('tag_id', 'uuid', (c) => c.notNull().references('tags.id').onDelete('restrict'))
    // The equipment the tag led to at the moment of the scan (null for a blank tag).
    .addColumn('equipment_id', 'uuid', (c) => c.references('equipment.id').onDelete('restrict'))
    .addColumn('user_id', 'uuid', (c) => c.notNull().references('users.id').onDelete('restrict'))
    .addColumn('via', 'text', (c) => c.notNull().check(sql`via in ('link', 'camera', 'typed')`))
    .addColumn('scanned_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .execute();
  await sql`create index tag_scans_tag_idx on tag_scans (tag_id, scanned_at desc)`.execute(db);
  await sql`create index tag_scans_equipment_idx on tag_scans (equipment_id, scanned_at desc) where equipment_id is not null`.execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropTable('tag_scans').ifExists().execute();
  await db.schema.dropTable('tags').ifExists().execute();
  await db.schema.dropTable('print_runs').ifExists().execute();
  await db.schema.dropTable('label_layouts').ifExists().execute();
}
