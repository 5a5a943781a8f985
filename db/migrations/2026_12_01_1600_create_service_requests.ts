import { sql, type Kysely } from 'kysely';
import { idAndCompany, timestamps } from '@/db/migration-columns';

// Service requests: an owner asks for service on a site or a unit; the office works the queue.

export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .createTable('service_requests')
    .$call(idAndCompany)
    .addColumn('site_id', 'uuid', (c) => c.notNull().references('sites.id').onDelete('restrict'))
    .addColumn('equipment_id', 'uuid', (c) => c.references('equipment.id').onDelete('restrict'))
    .addColumn('requested_by', 'uuid', (c) => c.notNull().references('users.id').onDelete('restrict'))
    .addColumn('description', 'text', (c) => c.notNull())
    .addColumn('urgency', 'text', (c) => c.notNull().check(sql`urgency in ('emergency', 'soon', 'routine')`))
    .addColumn('photo_id', 'uuid')
    .addColumn('status', 'text', (c) => c.notNull().defaultTo('new').check(sql`status in ('new', 'acknowledged', 'scheduled', 'done', 'declined')`))
    .addColumn('office_note', 'text')
    .addColumn('visit_id', 'uuid', (c) => c.references('visits.id').onDelete('restrict'))
    .$call(timestamps)
    .execute();
  await db.schema.createIndex('service_requests_queue_idx').on('service_requests').columns(['company_id', 'status', 'created_at']).execute();
  await db.schema.createIndex('service_requests_site_idx').on('service_requests').column('site_id').execute();
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropTable('service_requests').ifExists().execute();
}
