import { sql, type Kysely } from 'kysely';
import { idAndCompany, timestamps } from '@/db/migration-columns';

// Planned visits: the office plans a visit for a site (optionally naming systems or units), a
// technician, a day and a time window in the site's own time zone. A plan is never deleted: it is
// cancelled, or started (then it names the visit). Every change is an audit event. A company may
// have the client's contacts e-mailed when a visit is planned, moved or cancelled.


export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .createTable('visit_plans')
    .$call(idAndCompany)
    .addColumn('site_id', 'uuid', (c) => c.notNull().references('sites.id').onDelete('restrict'))
    .addColumn('reason', 'text', (c) =>
      c.notNull().check(sql`reason in ('no_cooling', 'maintenance', 'install', 'inspection', 'leak_check', 'follow_up')`),
    )
    .addColumn('technician_id', 'uuid', (c) => c.notNull().references('users.id').onDelete('restrict'))
    // A calendar day and wall-clock times at the site: they mean the same hours whatever the
    // reader's time zone, and a daylight-saving change does not move them.
    .addColumn('day', 'date', (c) => c.notNull())
    .addColumn('window_start', 'time', (c) => c.notNull())
    .addColumn('window_end', 'time', (c) => c.notNull())
    .addColumn('status', 'text', (c) => c.notNull().defaultTo('planned').check(sql`status in ('planned', 'started', 'cancelled')`))
    .addColumn('note', 'text')
    .addColumn('visit_id', 'uuid', (c) => c.references('visits.id').onDelete('restrict').unique())
    .addColumn('cancel_reason', 'text')
    .addColumn('created_by', 'uuid', (c) => c.notNull().references('users.id').onDelete('restrict'))
    .addColumn('updated_by', 'uuid', (c) => c.notNull().references('users.id').onDelete('restrict'))
    .$call(timestamps)
    .addCheckConstraint('visit_plans_window_order', sql`window_end > window_start`)
    .addCheckConstraint('visit_plans_started_has_visit', sql`(status = 'started') = (visit_id is not null)`)
    .execute();
  await db.schema.createIndex('visit_plans_day_idx').on('visit_plans').columns(['company_id', 'day']).execute();
  await db.schema.createIndex('visit_plans_site_idx').on('visit_plans').columns(['site_id', 'day']).execute();
  await db.schema.createIndex('visit_plans_technician_idx').on('visit_plans').columns(['technician_id', 'day']).execute();

  // What the visit is for, when the office names it: whole systems, single units, or both.
  await db.schema
    .createTable('visit_plan_systems')
    .addColumn('plan_id', 'uuid', (c) => c.notNull().references('visit_plans.id').onDelete('cascade'))
    .addColumn('system_id', 'uuid', (c) => c.notNull().references('systems.id').onDelete('restrict'))
    .addPrimaryKeyConstraint('visit_plan_systems_pkey', ['plan_id', 'system_id'])
    .execute();
  await db.schema.createIndex('visit_plan_systems_system_idx').on('visit_plan_systems').column('system_id').execute();
  await db.schema
    .createTable('visit_plan_equipment')
    .addColumn('plan_id', 'uuid', (c) => c.notNull().references('visit_plans.id').onDelete('cascade'))
    .addColumn('equipment_id', 'uuid', (c) => c.notNull().references('equipment.id').onDelete('restrict'))
    .addPrimaryKeyConstraint('visit_plan_equipment_pkey', ['plan_id', 'equipment_id'])
    .execute();

  await db.schema.alterTable('companies').addColumn('mail_visit_plans', 'boolean', (c) => c.notNull().defaultTo(false)).execute();
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.alterTable('companies').dropColumn('mail_visit_plans').execute();
  await db.schema.dropTable('visit_plan_equipment').execute();
  await db.schema.dropTable('visit_plan_systems').execute();
  await db.schema.dropTable('visit_plans').execute();
}
