import { sql, type Kysely } from 'kysely';
import { idAndCompany, timestamps } from '@/db/migration-columns';

// Systems (refrigeration circuits), equipment with type-specific nameplate data, and the
// relations between pieces of equipment. Frozen in time: typed on Kysely<any>.


export async function up(db: Kysely<any>): Promise<void> {
  await sql`create extension if not exists pg_trgm`.execute(db);

  await db.schema
    .createTable('systems')
    .$call(idAndCompany)
    .addColumn('site_id', 'uuid', (c) => c.notNull().references('sites.id').onDelete('restrict'))
    .addColumn('area_id', 'uuid', (c) => c.references('areas.id').onDelete('restrict'))
    .addColumn('name', 'text', (c) => c.notNull())
    .addColumn('refrigerant', 'text', (c) => c.notNull())
    .addColumn('full_charge_kg', 'numeric', (c) => c.check(sql`full_charge_kg is null or full_charge_kg > 0`))
    .addColumn('application', 'text', (c) =>
      c.notNull().check(sql`application in ('commercial_refrigeration', 'industrial_process', 'comfort_cooling')`),
    )
    .addColumn('design_box_temp_c', 'numeric')
    .addColumn('maintenance_interval_days', 'integer', (c) => c.check(sql`maintenance_interval_days is null or maintenance_interval_days > 0`))
    .addColumn('notes', 'text')
    .addColumn('archived_at', 'timestamptz')
    .$call(timestamps)
    .execute();
  await db.schema.createIndex('systems_site_idx').on('systems').columns(['company_id', 'site_id']).execute();

  await db.schema
    .createTable('equipment')
    .$call(idAndCompany)
    .addColumn('site_id', 'uuid', (c) => c.notNull().references('sites.id').onDelete('restrict'))
    .addColumn('area_id', 'uuid', (c) => c.references('areas.id').onDelete('restrict'))
    .addColumn('system_id', 'uuid', (c) => c.references('systems.id').onDelete('restrict'))
    .addColumn('type', 'text', (c) => c.notNull())
    .addColumn('name', 'text', (c) => c.notNull())
    .addColumn('make', 'text')
    .addColumn('model', 'text')
    .addColumn('serial', 'text')
    .addColumn('manufactured_on', 'date')
    .addColumn('installed_on', 'date')
    .addColumn('condition', 'smallint', (c) => c.check(sql`condition between 1 and 5`))
    .addColumn('condition_note', 'text')
    .addColumn('status', 'text', (c) => c.notNull().defaultTo('in_service').check(sql`status in ('in_service', 'out_of_service', 'removed')`))
    .addColumn('nameplate', 'jsonb', (c) => c.notNull().defaultTo(sql`'{}'::jsonb`))
    // One lower-case text for partial matches over name, make, model and serial (trigram index).
    .addColumn('search_text', 'text', (c) =>
      c.generatedAlwaysAs(sql`lower(name || ' ' || coalesce(make, '') || ' ' || coalesce(model, '') || ' ' || coalesce(serial, ''))`).stored(),
    )
    .addColumn('deleted_at', 'timestamptz')
    .$call(timestamps)
    .execute();
  await sql`create index equipment_search_trgm_idx on equipment using gin (search_text gin_trgm_ops)`.execute(db);
  await sql`create index equipment_company_name_idx on equipment (company_id, lower(name), id) where deleted_at is null`.execute(db);
  await db.schema.createIndex('equipment_site_idx').on('equipment').columns(['site_id', 'area_id']).execute();
  await db.schema.createIndex('equipment_system_idx').on('equipment').column('system_id').execute();

  await db.schema
    .createTable('equipment_relations')
    .$call(idAndCompany)
    .addColumn('from_equipment_id', 'uuid', (c) => c.notNull().references('equipment.id').onDelete('cascade'))
    .addColumn('to_equipment_id', 'uuid', (c) => c.notNull().references('equipment.id').onDelete('cascade'))
    .addColumn('kind', 'text', (c) => c.notNull().check(sql`kind in ('controls', 'serves')`))
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addUniqueConstraint('equipment_relations_unique', ['from_equipment_id', 'to_equipment_id', 'kind'])
    .addCheckConstraint('equipment_relations_not_self', sql`from_equipment_id <> to_equipment_id`)
    .execute();
  await db.schema.createIndex('equipment_relations_to_idx').on('equipment_relations').column('to_equipment_id').execute();
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropTable('equipment_relations').ifExists().execute();
  await db.schema.dropTable('equipment').ifExists().execute();
  await db.schema.dropTable('systems').ifExists().execute();
}
