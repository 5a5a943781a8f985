import { sql, type Kysely } from 'kysely';
import { idAndCompany, timestamps } from '@/db/migration-columns';

// Companies, people and places: the tenancy every later table hangs from.
// Frozen in time: typed on Kysely<any>, importing nothing from the app (db/migration-columns never changes what it adds).

const id = sql`gen_random_uuid()`;

export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .createTable('companies')
    .addColumn('id', 'uuid', (c) => c.primaryKey().defaultTo(id))
    .addColumn('name', 'text', (c) => c.notNull())
    .addColumn('service_phone', 'text')
    .addColumn('label_line', 'text')
    .addColumn('default_units', 'text', (c) => c.notNull().defaultTo('imperial').check(sql`default_units in ('imperial', 'metric')`))
    .addColumn('keep_photo_location', 'boolean', (c) => c.notNull().defaultTo(false))
    .$call(timestamps)
    .execute();

  await db.schema
    .createTable('clients')
    .$call(idAndCompany)
    .addColumn('name', 'text', (c) => c.notNull())
    .addColumn('notes', 'text')
    .addColumn('archived_at', 'timestamptz')
    .$call(timestamps)
    .execute();
  await sql`create unique index clients_company_name_key on clients (company_id, lower(name))`.execute(db);

  await db.schema
    .createTable('users')
    .$call(idAndCompany)
    .addColumn('email', 'text', (c) => c.notNull().unique().check(sql`email = lower(email)`))
    .addColumn('name', 'text', (c) => c.notNull())
    .addColumn('role', 'text', (c) => c.notNull().check(sql`role in ('admin', 'office', 'technician', 'client')`))
    .addColumn('client_id', 'uuid', (c) => c.references('clients.id').onDelete('restrict'))
    .addColumn('password_hash', 'text')
    .addColumn('units', 'text', (c) => c.notNull().defaultTo('imperial').check(sql`units in ('imperial', 'metric')`))
    .addColumn('metric_pressure', 'text', (c) => c.notNull().defaultTo('kPa').check(sql`metric_pressure in ('kPa', 'bar')`))
    .addColumn('email_verified_at', 'timestamptz')
    .addColumn('last_sign_in_at', 'timestamptz')
    .addColumn('deactivated_at', 'timestamptz')
    .$call(timestamps)
    .addCheckConstraint('users_client_role_check', sql`(role = 'client') = (client_id is not null)`)
    .execute();
  await db.schema.createIndex('users_company_idx').on('users').column('company_id').execute();

  await db.schema
    .createTable('client_contacts')
    .$call(idAndCompany)
    .addColumn('client_id', 'uuid', (c) => c.notNull().references('clients.id').onDelete('cascade'))
    .addColumn('name', 'text', (c) => c.notNull())
    .addColumn('email', 'text')
    .addColumn('phone', 'text')
    .addColumn('title', 'text')
    .addColumn('receives_reports', 'boolean', (c) => c.notNull().defaultTo(false))
    .$call(timestamps)
    .execute();
  await db.schema.createIndex('client_contacts_client_idx').on('client_contacts').column('client_id').execute();

  await db.schema
    .createTable('sites')
    .$call(idAndCompany)
    .addColumn('client_id', 'uuid', (c) => c.notNull().references('clients.id').onDelete('restrict'))
    .addColumn('name', 'text', (c) => c.notNull())
    .addColumn('address_line1', 'text')
    .addColumn('address_line2', 'text')
    .addColumn('city', 'text')
    .addColumn('region', 'text')
    .addColumn('postal_code', 'text')
    .addColumn('country', 'text', (c) => c.notNull().defaultTo('US'))
    .addColumn('time_zone', 'text', (c) => c.notNull().defaultTo('America/Chicago'))
    .addColumn('elevation_m', 'numeric', (c) => c.notNull().defaultTo(0))
    .addColumn('access_notes', 'text')
    .addColumn('archived_at', 'timestamptz')
    .$call(timestamps)
    .execute();
  await db.schema.createIndex('sites_company_client_idx').on('sites').columns(['company_id', 'client_id']).execute();

  await db.schema
    .createTable('areas')
    .$call(idAndCompany)
    .addColumn('site_id', 'uuid', (c) => c.notNull().references('sites.id').onDelete('restrict'))
    .addColumn('name', 'text', (c) => c.notNull())
    .addColumn('kind', 'text', (c) => c.notNull().defaultTo('other'))
    .addColumn('notes', 'text')
    .addColumn('archived_at', 'timestamptz')
    .$call(timestamps)
    .execute();
  await db.schema.createIndex('areas_site_idx').on('areas').column('site_id').execute();

  await db.schema
    .createTable('invitations')
    .$call(idAndCompany)
    .addColumn('email', 'text', (c) => c.notNull().check(sql`email = lower(email)`))
    .addColumn('name', 'text', (c) => c.notNull())
    .addColumn('role', 'text', (c) => c.notNull().check(sql`role in ('admin', 'office', 'technician', 'client')`))
    .addColumn('client_id', 'uuid', (c) => c.references('clients.id').onDelete('restrict'))
    .addColumn('token_hash', 'text', (c) => c.notNull().unique())
    .addColumn('invited_by', 'uuid', (c) => c.notNull().references('users.id').onDelete('restrict'))
    .addColumn('expires_at', 'timestamptz', (c) => c.notNull())
    .addColumn('accepted_at', 'timestamptz')
    .addColumn('revoked_at', 'timestamptz')
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addCheckConstraint('invitations_client_role_check', sql`(role = 'client') = (client_id is not null)`)
    .execute();
  await db.schema.createIndex('invitations_company_idx').on('invitations').column('company_id').execute();

  await db.schema
    .createTable('audit_events')
    .$call(idAndCompany)
    .addColumn('actor_id', 'uuid', (c) => c.references('users.id').onDelete('restrict'))
    .addColumn('action', 'text', (c) => c.notNull())
    .addColumn('entity_type', 'text', (c) => c.notNull())
    .addColumn('entity_id', 'uuid', (c) => c.notNull())
    .addColumn('before', 'jsonb')
    .addColumn('after', 'jsonb')
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .execute();
  await db.schema
    .createIndex('audit_events_entity_idx')
    .on('audit_events')
    .columns(['company_id', 'entity_type', 'entity_id', 'created_at'])
    .execute();
  // Audit events are never edited: the database itself refuses updates and deletes.
  await sql`
    create function audit_events_immutable() returns trigger language plpgsql as $$
    begin raise exception 'audit events are never edited or deleted'; end $$`.execute(db);
  await sql`
    create trigger audit_events_no_change before update or delete on audit_events
    for each row execute function audit_events_immutable()`.execute(db);

  await db.schema
    .createTable('auth_verification_tokens')
    .addColumn('identifier', 'text', (c) => c.notNull())
    .addColumn('token', 'text', (c) => c.notNull())
    .addColumn('expires', 'timestamptz', (c) => c.notNull())
    .addPrimaryKeyConstraint('auth_verification_tokens_pkey', ['identifier', 'token'])
    .execute();

  await db.schema
    .createTable('sign_in_throttles')
    .addColumn('key', 'text', (c) => c.primaryKey())
    .addColumn('failures', 'integer', (c) => c.notNull().defaultTo(0))
    .addColumn('first_failure_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addColumn('locked_until', 'timestamptz')
    .execute();

  await db.schema
    .createTable('mail_outbox')
    .addColumn('id', 'uuid', (c) => c.primaryKey().defaultTo(id))
    .addColumn('company_id', 'uuid', (c) => c.references('companies.id').onDelete('restrict'))
    .addColumn('kind', 'text', (c) => c.notNull())
    .addColumn('to_addresses', sql`text[]`, (c) => c.notNull())
    .addColumn('subject', 'text', (c) => c.notNull())
    .addColumn('text_body', 'text', (c) => c.notNull())
    .addColumn('html_body', 'text')
    .addColumn('message_id', 'text', (c) => c.notNull().unique())
    .addColumn('status', 'text', (c) => c.notNull().defaultTo('pending').check(sql`status in ('pending', 'sent', 'failed')`))
    .addColumn('attempts', 'integer', (c) => c.notNull().defaultTo(0))
    .addColumn('next_attempt_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addColumn('locked_until', 'timestamptz')
    .addColumn('last_error', 'text')
    .addColumn('sent_at', 'timestamptz')
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .execute();
  await sql`create index mail_outbox_due_idx on mail_outbox (next_attempt_at) where status = 'pending'`.execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  for (const table of [
    'mail_outbox',
    'sign_in_throttles',
    'auth_verification_tokens',
    'audit_events',
    'invitations',
    'areas',
    'sites',
    'client_contacts',
    'users',
    'clients',
    'companies',
  ]) {
    await db.schema.dropTable(table).ifExists().execute();
  }
  await sql`drop function if exists audit_events_immutable()`.execute(db);
}
