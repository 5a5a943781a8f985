import { sql, type Kysely } from 'kysely';

// A removed unit keeps its record and history; these say when it left and what took its place, so
// lists can show it apart from the current unit of the same name. Earlier replacements are read
// back from their audit events; other removed rows take their last change as the removal date.

export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .alterTable('equipment')
    .addColumn('removed_at', 'timestamptz')
    .addColumn('replaced_by_id', 'uuid', (c) => c.references('equipment.id'))
    .execute();
  await sql`
    update equipment e
       set removed_at = a.created_at,
           replaced_by_id = (a.after->>'replacedBy')::uuid
      from (
        select distinct on (entity_id) entity_id, created_at, after
          from audit_events
         where entity_type = 'equipment' and action = 'replace' and after->>'replacedBy' ~* '^[0-9a-f-]{36}$'
         order by entity_id, created_at desc
      ) a
     where a.entity_id = e.id
       and e.status = 'removed'
       and exists (select 1 from equipment r where r.id = (a.after->>'replacedBy')::uuid)
  `.execute(db);
  await sql`update equipment set removed_at = updated_at where status = 'removed' and removed_at is null`.execute(db);
  await sql`create index equipment_replaced_by_idx on equipment (replaced_by_id) where replaced_by_id is not null`.execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  await sql`drop index if exists equipment_replaced_by_idx`.execute(db);
  await db.schema.alterTable('equipment').dropColumn('replaced_by_id').dropColumn('removed_at').execute();
}
