import 'server-only';
import { sql, type Kysely } from 'kysely';
import { db as defaultDb } from '@/db';
import { escapeLike } from '@/db/helpers';
import { atVisibleSite } from '@/lib/auth/scope';
import type { DB } from '@/db/schema.gen';
import type { Db, QueryRow } from '@/db/types';
import { assertCan } from '@/lib/auth/access';
import type { Actor } from '@/lib/auth/actor';
import { archivedView, setArchived } from '@/lib/audit/archive';
import { auditedChange, auditedCreate } from '@/lib/audit/change';
import { changedColumns } from '@/lib/changed-columns';
import type { SystemDto } from '@/lib/systems/dto';
import { systemFlags } from '@/lib/systems/permissions';
import type { CreateSystemInput, ListSystemsQuery, UpdateSystemInput } from '@/lib/systems/schemas';
import { AppError, foundOr404 } from '@/lib/errors';
import { getSite } from '@/lib/sites/service';

function systemQuery(actor: Actor, db: Db) {
  return db
    .selectFrom('systems')
    .$call(atVisibleSite(actor, 'systems'))
    .leftJoin('areas', 'areas.id', 'systems.area_id')
    .select((eb) => [
      'systems.id',
      'systems.site_id',
      'sites.name as site_name',
      'systems.area_id',
      'areas.name as area_name',
      'systems.name',
      'systems.refrigerant',
      'systems.full_charge_kg',
      'systems.application',
      'systems.design_box_temp_c',
      'systems.maintenance_interval_days',
      'systems.notes',
      'systems.archived_at',
      'systems.created_at',
      'systems.updated_at',
      eb
        .selectFrom('equipment')
        .whereRef('equipment.system_id', '=', 'systems.id')
        .where('equipment.deleted_at', 'is', null)
        .select(eb.fn.countAll<number>().as('n'))
        .as('equipment_count'),
      eb
        .selectFrom('equipment')
        .whereRef('equipment.system_id', '=', 'systems.id')
        .where('equipment.deleted_at', 'is', null)
        .where('equipment.type', '=', 'condensing_unit')
        .select(sql<string>`json_build_object('id', equipment.id, 'name', equipment.name)::text`.as('cu'))
        .orderBy('equipment.created_at')
        .limit(1)
        .as('condensing_unit'),
    ]);
}

type SystemRow = QueryRow<typeof systemQuery>;

function toSystemDto(actor: Actor, row: SystemRow): SystemDto {
  const archivedAt = row.archived_at?.toISOString() ?? null;
  return {
    ...systemFlags(actor, { archivedAt }),
    id: row.id,
    siteId: row.site_id,
    siteName: row.site_name,
    areaId: row.area_id,
    areaName: row.area_name,
    name: row.name,
    refrigerant: row.refrigerant,
    fullChargeKg: row.full_charge_kg === null ? null : Number(row.full_charge_kg),
    application: row.application as SystemDto['application'],
    designBoxTempC: row.design_box_temp_c === null ? null : Number(row.design_box_temp_c),
    maintenanceIntervalDays: row.maintenance_interval_days,
    notes: row.notes,
    equipmentCount: Number(row.equipment_count ?? 0),
    condensingUnit: row.condensing_unit ? (JSON.parse(row.condensing_unit) as { id: string; name: string }) : null,
    archivedAt,
    createdAt: row.created_at.toISOString(),
    updatedAt: row.updated_at.toISOString(),
  };
}

export async function listSystems(actor: Actor, query: ListSystemsQuery, db: Db = defaultDb): Promise<SystemDto[]> {
  assertCan(actor, 'systems.read');
  let q = systemQuery(actor, db);
  if (query.siteId) q = q.where('systems.site_id', '=', query.siteId);
  q = q.where(archivedView('systems', query.archived));
  if (query.q) q = q.where('systems.name', 'ilike', `%${escapeLike(query.q)}%`);
  const rows = await q.orderBy('sites.name').orderBy('systems.name').limit(query.limit).execute();
  return rows.map((r) => toSystemDto(actor, r));
}

export async function getSystem(actor: Actor, id: string, db: Db = defaultDb): Promise<SystemDto> {
  assertCan(actor, 'systems.read');
  const row = foundOr404(await systemQuery(actor, db).where('systems.id', '=', id).executeTakeFirst(), 'System not found.');
  return toSystemDto(actor, row);
}

async function assertAreaOnSite(db: Db, siteId: string, areaId: string | null | undefined): Promise<void> {
  if (!areaId) return;
  const area = await db.selectFrom('areas').select('id').where('id', '=', areaId).where('site_id', '=', siteId).executeTakeFirst();
  if (!area) throw new AppError('validation_failed', 'That area is not on this site.', [{ path: 'areaId', message: 'Choose an area of this site.' }]);
}

export async function createSystem(actor: Actor, input: CreateSystemInput, db: Kysely<DB> = defaultDb): Promise<SystemDto> {
  assertCan(actor, 'systems.write');
  return auditedCreate(db, actor, 'system', async (trx) => {
    await getSite(actor, input.siteId, trx);
    await assertAreaOnSite(trx, input.siteId, input.areaId);
    const row = await trx
      .insertInto('systems')
      .values({
        company_id: actor.companyId,
        site_id: input.siteId,
        area_id: input.areaId ?? null,
        name: input.name,
        refrigerant: input.refrigerant,
        full_charge_kg: input.fullChargeKg ?? null,
        application: input.application,
        design_box_temp_c: input.designBoxTempC ?? null,
        maintenance_interval_days: input.maintenanceIntervalDays ?? null,
        notes: input.notes ?? null,
      })
      .returning('id')
      .executeTakeFirstOrThrow();
    return row.id;
  }, (trx, id) => getSystem(actor, id, trx));
}

export async function updateSystem(actor: Actor, id: string, input: UpdateSystemInput, db: Kysely<DB> = defaultDb): Promise<SystemDto> {
  assertCan(actor, 'systems.write');
  const set = changedColumns({
    name: input.name,
    area_id: input.areaId,
    refrigerant: input.refrigerant,
    full_charge_kg: input.fullChargeKg,
    application: input.application,
    design_box_temp_c: input.designBoxTempC,
    maintenance_interval_days: input.maintenanceIntervalDays,
    notes: input.notes,
  });
  return auditedChange(db, actor, { entityType: 'system', id }, (trx) => getSystem(actor, id, trx), async (trx, before) => {
    if (input.areaId !== undefined) await assertAreaOnSite(trx, before.siteId, input.areaId);
    await trx.updateTable('systems').set({ ...set, updated_at: sql`now()` }).where('id', '=', id).where('company_id', '=', actor.companyId).execute();
  });
}

export async function setSystemArchived(actor: Actor, id: string, archived: boolean, db: Kysely<DB> = defaultDb): Promise<SystemDto> {
  assertCan(actor, 'systems.write');
  return setArchived(db, actor, { table: 'systems', entityType: 'system', id }, archived, (trx) => getSystem(actor, id, trx));
}
