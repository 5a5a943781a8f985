import { sql, type Kysely } from 'kysely';
import { idAndCompany, timestamps } from '@/db/migration-columns';

// Visits, the timeline entries technicians record on equipment during them, and follow-ups.
// These are records an owner may have to show a regulator years later: nothing here is ever
// hard-deleted (entries are voided with a reason; visits are reopened, not removed).


export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .createTable('visits')
    .$call(idAndCompany)
    .addColumn('site_id', 'uuid', (c) => c.notNull().references('sites.id').onDelete('restrict'))
    .addColumn('technician_id', 'uuid', (c) => c.notNull().references('users.id').onDelete('restrict'))
    .addColumn('reason', 'text', (c) =>
      c.notNull().check(sql`reason in ('no_cooling', 'maintenance', 'install', 'inspection', 'leak_check', 'follow_up')`),
    )
    .addColumn('status', 'text', (c) => c.notNull().defaultTo('open').check(sql`status in ('open', 'closed')`))
    .addColumn('started_at', 'timestamptz', (c) => c.notNull())
    .addColumn('ended_at', 'timestamptz')
    .addColumn('summary', 'text')
    .addColumn('closed_by', 'uuid', (c) => c.references('users.id').onDelete('restrict'))
    .addColumn('reopened_at', 'timestamptz')
    .addColumn('reopened_by', 'uuid', (c) => c.references('users.id').onDelete('restrict'))
    .addColumn('reviewed_at', 'timestamptz')
    .addColumn('reviewed_by', 'uuid', (c) => c.references('users.id').onDelete('restrict'))
    .addColumn('report_key', 'text')
    .$call(timestamps)
    .addCheckConstraint('visits_closed_has_end', sql`status = 'open' or ended_at is not null`)
    .execute();
  // One open visit per technician per site.
  await sql`create unique index visits_one_open_idx on visits (technician_id, site_id) where status = 'open'`.execute(db);
  await db.schema.createIndex('visits_site_idx').on('visits').columns(['company_id', 'site_id', 'started_at']).execute();

  await db.schema
    .createTable('entries')
    .$call(idAndCompany)
    .addColumn('visit_id', 'uuid', (c) => c.notNull().references('visits.id').onDelete('restrict'))
    .addColumn('equipment_id', 'uuid', (c) => c.notNull().references('equipment.id').onDelete('restrict'))
    // Copied from the equipment at the time, so a system's history and refrigerant totals
    // survive the equipment moving later.
    .addColumn('system_id', 'uuid', (c) => c.references('systems.id').onDelete('restrict'))
    .addColumn('kind', 'text', (c) =>
      c.notNull().check(sql`kind in ('reading', 'finding', 'action', 'setting_change', 'part', 'refrigerant', 'condition', 'note', 'photo')`),
    )
    .addColumn('data', 'jsonb', (c) => c.notNull())
    .addColumn('computed', 'jsonb')
    .addColumn('recorded_at', 'timestamptz', (c) => c.notNull())
    .addColumn('created_by', 'uuid', (c) => c.notNull().references('users.id').onDelete('restrict'))
    // Generated on the phone: a retried save after a dropped connection finds the first one.
    .addColumn('client_entry_id', 'uuid', (c) => c.notNull())
    .addColumn('voided_at', 'timestamptz')
    .addColumn('voided_by', 'uuid', (c) => c.references('users.id').onDelete('restrict'))
    .addColumn('void_reason', 'text')
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addUniqueConstraint('entries_client_entry_key', ['company_id', 'client_entry_id'])
    .execute();
  await sql`create index entries_equipment_time_idx on entries (equipment_id, recorded_at desc, id desc)`.execute(db);
  await sql`create index entries_system_kind_idx on entries (system_id, kind, recorded_at desc) where system_id is not null`.execute(db);
  await db.schema.createIndex('entries_visit_idx').on('entries').column('visit_id').execute();

  await db.schema
    .createTable('follow_ups')
    .$call(idAndCompany)
    .addColumn('site_id', 'uuid', (c) => c.notNull().references('sites.id').onDelete('restrict'))
    .addColumn('equipment_id', 'uuid', (c) => c.references('equipment.id').onDelete('restrict'))
    .addColumn('entry_id', 'uuid', (c) => c.references('entries.id').onDelete('restrict'))
    .addColumn('raised_visit_id', 'uuid', (c) => c.references('visits.id').onDelete('restrict'))
    .addColumn('title', 'text', (c) => c.notNull())
    .addColumn('severity', 'text', (c) => c.notNull().check(sql`severity in ('safety', 'down', 'degraded', 'minor')`))
    .addColumn('status', 'text', (c) => c.notNull().defaultTo('open').check(sql`status in ('open', 'scheduled', 'resolved', 'declined')`))
    .addColumn('scheduled_for', 'date')
    .addColumn('closed_at', 'timestamptz')
    .addColumn('closed_by', 'uuid', (c) => c.references('users.id').onDelete('restrict'))
    .addColumn('closed_visit_id', 'uuid', (c) => c.references('visits.id').onDelete('restrict'))
    .addColumn('resolution', 'text')
    .addColumn('created_by', 'uuid', (c) => c.notNull().references('users.id').onDelete('restrict'))
    .$call(timestamps)
    .execute();
  await sql`create index follow_ups_open_idx on follow_ups (company_id, site_id, created_at) where status in ('open', 'scheduled')`.execute(db);
  await db.schema.createIndex('follow_ups_equipment_idx').on('follow_ups').column('equipment_id').execute();
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropTable('follow_ups').ifExists().execute();
  await db.schema.dropTable('entries').ifExists().execute();
  await db.schema.dropTable('visits').ifExists().execute();
}
