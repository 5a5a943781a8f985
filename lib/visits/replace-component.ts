import 'server-only';
import { sql, type Kysely, type Transaction } from 'kysely';
import type { DB } from '@/db/schema.gen';
import type { Actor } from '@/lib/auth/actor';
import { recordAudit } from '@/lib/audit/service';

/**
 * A replaced component: the old record is marked removed and kept with its history; a new record
 * takes its place (same type, site, area, system, nameplate), with its tag and relations.
 */
export async function replaceComponent(actor: Actor, equipmentId: string, newSerial: string | null, trx: Kysely<DB> | Transaction<DB>): Promise<string> {
  const old = await trx.selectFrom('equipment').selectAll().where('id', '=', equipmentId).executeTakeFirstOrThrow();
  const created = await trx
    .insertInto('equipment')
    .values({
      company_id: old.company_id,
      site_id: old.site_id,
      area_id: old.area_id,
      system_id: old.system_id,
      type: old.type,
      name: old.name,
      make: old.make,
      model: old.model,
      serial: newSerial,
      installed_on: sql`current_date`,
      condition: 5,
      status: 'in_service',
      nameplate: JSON.stringify(old.nameplate ?? {}),
    })
    .returning('id')
    .executeTakeFirstOrThrow();
  await trx.updateTable('equipment').set({ status: 'removed', removed_at: sql`now()`, replaced_by_id: created.id, updated_at: sql`now()` }).where('id', '=', equipmentId).execute();
  // The tag on the unit now identifies its replacement: scanning it opens the new record.
  await trx.updateTable('tags').set({ equipment_id: created.id, updated_at: sql`now()` }).where('equipment_id', '=', equipmentId).where('state', '=', 'attached').execute();
  await trx.updateTable('equipment_relations').set({ from_equipment_id: created.id }).where('from_equipment_id', '=', equipmentId).execute();
  await trx.updateTable('equipment_relations').set({ to_equipment_id: created.id }).where('to_equipment_id', '=', equipmentId).execute();
  await recordAudit(trx, actor, { action: 'replace', entityType: 'equipment', entityId: equipmentId, after: { replacedBy: created.id } });
  await recordAudit(trx, actor, { action: 'create', entityType: 'equipment', entityId: created.id, after: { replaces: equipmentId, serial: newSerial } });
  return created.id;
}
