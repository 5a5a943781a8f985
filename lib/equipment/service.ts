import 'server-only';
import { sql, type Kysely } from 'kysely';
import { db as defaultDb } from '@/db';
import type { DB } from '@/db/schema.gen';
import type { Db } from '@/db/types';
import type { Page } from '@/lib/api/cursor';
import { cursorKey, toPage } from '@/lib/api/paging';
import { zodIssues } from '@/lib/api/issues';
import { assertCan, can } from '@/lib/auth/access';
import { entryVisibleTo } from '@/lib/auth/scope';
import type { Actor } from '@/lib/auth/actor';
import { auditedChange, auditedCreate } from '@/lib/audit/change';
import { recordAudit } from '@/lib/audit/service';
import { changedColumns } from '@/lib/changed-columns';
import { toEquipmentDto, type EquipmentDetailDto, type EquipmentDto, type RelationDto, type UnitFactsDto } from '@/lib/equipment/dto';
import { nameplateSchemaFor } from '@/lib/equipment/nameplate';
import { equipmentFlags } from '@/lib/equipment/permissions';
import { buildEquipmentListQuery, equipmentBaseQuery, refrigerantExpr, selection } from '@/lib/equipment/queries';
import type { CreateEquipmentInput, CreateRelationInput, ListEquipmentQuery, UpdateEquipmentInput } from '@/lib/equipment/schemas';
import type { EquipmentType, RelationKind } from '@/lib/equipment/types';
import { AppError } from '@/lib/errors';
import { getSite } from '@/lib/sites/service';

export async function listEquipment(actor: Actor, query: ListEquipmentQuery, db: Db = defaultDb): Promise<Page<EquipmentDto>> {
  assertCan(actor, 'equipment.read');
  const rows = await buildEquipmentListQuery(actor, query, db).execute();
  return toPage(rows, query.limit, toEquipmentDto, (r) => ({ k: cursorKey(r.sort_key), id: r.id }));
}

async function relationsOf(db: Db, id: string): Promise<RelationDto[]> {
  const rows = await db
    .selectFrom('equipment_relations as r')
    .innerJoin('equipment as other', (join) =>
      join.on(sql<boolean>`other.id = case when r.from_equipment_id = ${id}::uuid then r.to_equipment_id else r.from_equipment_id end`),
    )
    .where((eb) => eb.or([eb('r.from_equipment_id', '=', id), eb('r.to_equipment_id', '=', id)]))
    .where('other.deleted_at', 'is', null)
    .select(['r.id', 'r.kind', 'r.from_equipment_id', 'other.id as other_id', 'other.name as other_name', 'other.type as other_type'])
    .orderBy('r.kind')
    .orderBy('other.name')
    .execute();
  return rows.map((r) => ({
    id: r.id,
    kind: r.kind as RelationKind,
    direction: r.from_equipment_id === id ? 'forward' : 'backward',
    other: { id: r.other_id, name: r.other_name, type: r.other_type as EquipmentType },
  }));
}

export async function getEquipment(actor: Actor, id: string, db: Db = defaultDb): Promise<EquipmentDetailDto> {
  assertCan(actor, 'equipment.read');
  // The relations are read beside the unit (one round trip, not two) and dropped unless the
  // unit's own scoped lookup found it.
  const [found, relations] = await Promise.allSettled([
    equipmentBaseQuery(actor, db)
      .where('equipment.id', '=', id)
      .where('equipment.deleted_at', 'is', null)
      .select([...selection, refrigerantExpr.as('refrigerant'), 'sites.elevation_m', 'systems.design_box_temp_c'])
      .executeTakeFirst(),
    relationsOf(db, id),
  ]);
  if (found.status === 'rejected') throw found.reason;
  const row = found.value;
  if (!row) throw new AppError('not_found', 'Equipment not found.');
  if (relations.status === 'rejected') throw relations.reason;
  const dto = toEquipmentDto(row);
  return {
    ...dto,
    ...equipmentFlags(actor, dto),
    relations: relations.value,
    siteElevationM: Number(row.elevation_m),
    systemDesignBoxTempC: row.design_box_temp_c === null ? null : Number(row.design_box_temp_c),
  };
}

/** A cheap scope check for reads that only need to know the caller may see this equipment. */
export async function assertEquipmentVisible(actor: Actor, id: string, db: Db = defaultDb): Promise<void> {
  assertCan(actor, 'equipment.read');
  const row = await equipmentBaseQuery(actor, db).where('equipment.id', '=', id).where('equipment.deleted_at', 'is', null).select('equipment.id').executeTakeFirst();
  if (!row) throw new AppError('not_found', 'Equipment not found.');
}

/** Area and system must sit on the equipment's own site; an archived system takes no new unit (`joinsSystem`). */
async function assertPlacement(db: Db, siteId: string, areaId: string | null | undefined, systemId: string | null | undefined, joinsSystem = true): Promise<void> {
  const issues = [];
  if (areaId) {
    const area = await db.selectFrom('areas').select('id').where('id', '=', areaId).where('site_id', '=', siteId).executeTakeFirst();
    if (!area) issues.push({ path: 'areaId', message: 'Choose an area of this site.' });
  }
  if (systemId) {
    const system = await db.selectFrom('systems').select(['id', 'archived_at']).where('id', '=', systemId).where('site_id', '=', siteId).executeTakeFirst();
    if (!system) issues.push({ path: 'systemId', message: 'Choose a system of this site.' });
    else if (joinsSystem && system.archived_at) issues.push({ path: 'systemId', message: 'This system is archived: restore it first.' });
  }
  if (issues.length) throw new AppError('validation_failed', 'Some fields need attention.', issues);
}

function parseNameplate(type: EquipmentType, value: unknown) {
  const parsed = nameplateSchemaFor(type).safeParse(value ?? {});
  if (!parsed.success) {
    throw new AppError(
      'validation_failed',
      'Some nameplate fields need attention.',
      zodIssues(parsed.error).map((i) => ({ path: `nameplate.${i.path}`, message: i.message })),
    );
  }
  // Empty fields are not stored, so "unknown" and "left blank" read the same.
  return Object.fromEntries(Object.entries(parsed.data as Record<string, unknown>).filter(([, v]) => v !== null && v !== undefined && v !== ''));
}

export async function insertEquipment(actor: Actor, input: CreateEquipmentInput, trx: Db): Promise<string> {
  await assertPlacement(trx, input.siteId, input.areaId, input.systemId);
  const row = await trx
    .insertInto('equipment')
    .values({
      company_id: actor.companyId,
      site_id: input.siteId,
      area_id: input.areaId ?? null,
      system_id: input.systemId ?? null,
      type: input.type,
      name: input.name,
      make: input.make ?? null,
      model: input.model ?? null,
      serial: input.serial ?? null,
      manufactured_on: input.manufacturedOn ?? null,
      installed_on: input.installedOn ?? null,
      condition: input.condition ?? null,
      condition_note: input.conditionNote ?? null,
      status: input.status,
      nameplate: JSON.stringify(parseNameplate(input.type, input.nameplate)),
    })
    .returning('id')
    .executeTakeFirstOrThrow();
  return row.id;
}

export async function createEquipment(actor: Actor, input: CreateEquipmentInput, db: Kysely<DB> = defaultDb): Promise<EquipmentDetailDto> {
  assertCan(actor, 'equipment.write');
  return auditedCreate(db, actor, 'equipment', async (trx) => {
    const site = await getSite(actor, input.siteId, trx);
    if (site.archivedAt) throw new AppError('validation_failed', 'This site is archived.', [{ path: 'siteId', message: 'Restore the site first.' }]);
    return insertEquipment(actor, input, trx);
  }, (trx, id) => getEquipment(actor, id, trx));
}

export async function updateEquipment(actor: Actor, id: string, input: UpdateEquipmentInput, db: Kysely<DB> = defaultDb): Promise<EquipmentDetailDto> {
  assertCan(actor, 'equipment.write');
  return auditedChange(db, actor, { entityType: 'equipment', id }, (trx) => getEquipment(actor, id, trx), async (trx, before) => {
    const areaId = input.areaId !== undefined ? input.areaId : before.areaId;
    const systemId = input.systemId !== undefined ? input.systemId : before.systemId;
    await assertPlacement(trx, before.siteId, areaId, systemId, systemId !== before.systemId);
    const manufacturedOn = input.manufacturedOn !== undefined ? input.manufacturedOn : before.manufacturedOn;
    const installedOn = input.installedOn !== undefined ? input.installedOn : before.installedOn;
    if (manufacturedOn && installedOn && installedOn < manufacturedOn) {
      throw new AppError('validation_failed', 'Some fields need attention.', [{ path: 'installedOn', message: 'The install date is before the manufacture date.' }]);
    }
    await trx
      .updateTable('equipment')
      .set({
        ...changedColumns({
          area_id: input.areaId,
          system_id: input.systemId,
          name: input.name,
          make: input.make,
          model: input.model,
          serial: input.serial,
          manufactured_on: input.manufacturedOn,
          installed_on: input.installedOn,
          condition: input.condition,
          condition_note: input.conditionNote,
          status: input.status,
        }),
        // The removal date is set once, when the unit leaves; a unit brought back is current again.
        ...(input.status === 'removed' && before.status !== 'removed' ? { removed_at: sql<Date>`now()` } : {}),
        ...(input.status !== undefined && input.status !== 'removed' && before.status === 'removed' ? { removed_at: null, replaced_by_id: null } : {}),
        ...(input.nameplate !== undefined ? { nameplate: JSON.stringify(parseNameplate(before.type, input.nameplate)) } : {}),
        updated_at: sql`now()`,
      })
      .where('id', '=', id)
      .where('company_id', '=', actor.companyId)
      .execute();
  });
}

/** Soft delete: the record and its history stay for audits; it leaves every list. */
export async function deleteEquipment(actor: Actor, id: string, db: Kysely<DB> = defaultDb): Promise<void> {
  assertCan(actor, 'equipment.delete');
  await db.transaction().execute(async (trx) => {
    const before = await getEquipment(actor, id, trx);
    await trx.updateTable('equipment').set({ deleted_at: sql`now()`, updated_at: sql`now()` }).where('id', '=', id).execute();
    await recordAudit(trx, actor, { action: 'delete', entityType: 'equipment', entityId: id, before });
  });
}

export async function addRelation(actor: Actor, id: string, input: CreateRelationInput, db: Kysely<DB> = defaultDb): Promise<RelationDto[]> {
  assertCan(actor, 'equipment.write');
  return db.transaction().execute(async (trx) => {
    const self = await getEquipment(actor, id, trx);
    const other = await getEquipment(actor, input.otherId, trx).catch(() => {
      throw new AppError('validation_failed', 'Choose equipment on the same site.', [{ path: 'otherId', message: 'This equipment was not found.' }]);
    });
    if (other.status === 'removed' || !self.canEditRelations) {
      throw new AppError('validation_failed', 'Removed equipment cannot get new relations.', [{ path: 'otherId', message: 'Choose equipment still on site.' }]);
    }
    if (other.id === self.id) throw new AppError('validation_failed', 'Equipment cannot relate to itself.', [{ path: 'otherId', message: 'Choose another piece of equipment.' }]);
    if (other.siteId !== self.siteId) {
      throw new AppError('validation_failed', 'Choose equipment on the same site.', [{ path: 'otherId', message: 'That equipment is on another site.' }]);
    }
    const [from, to] = input.direction === 'from' ? [self.id, other.id] : [other.id, self.id];
    const row = await trx
      .insertInto('equipment_relations')
      .values({ company_id: actor.companyId, from_equipment_id: from, to_equipment_id: to, kind: input.kind })
      .returning('id')
      .executeTakeFirstOrThrow();
    await recordAudit(trx, actor, { action: 'create', entityType: 'equipment_relation', entityId: row.id, after: { from, to, kind: input.kind } });
    return relationsOf(trx, id);
  });
}

export async function removeRelation(actor: Actor, id: string, relationId: string, db: Kysely<DB> = defaultDb): Promise<void> {
  assertCan(actor, 'equipment.write');
  await db.transaction().execute(async (trx) => {
    const self = await getEquipment(actor, id, trx);
    if (!self.canEditRelations) throw new AppError('conflict', 'A removed unit keeps its connections as they were.');
    const row = await trx
      .deleteFrom('equipment_relations')
      .where('id', '=', relationId)
      .where('company_id', '=', actor.companyId)
      .where((eb) => eb.or([eb('from_equipment_id', '=', id), eb('to_equipment_id', '=', id)]))
      .returning(['id', 'from_equipment_id', 'to_equipment_id', 'kind'])
      .executeTakeFirst();
    if (!row) throw new AppError('not_found', 'Relation not found.');
    await recordAudit(trx, actor, { action: 'delete', entityType: 'equipment_relation', entityId: relationId, before: row });
  });
}

/** What the unit page's header says at a glance, for a unit the caller has already been shown. */
export async function getUnitFacts(actor: Actor, equipment: Pick<EquipmentDto, 'id' | 'siteId'>, db: Db = defaultDb): Promise<UnitFactsDto> {
  assertCan(actor, 'equipment.read');
  await assertEquipmentVisible(actor, equipment.id, db);
  const last = db
    .selectFrom('entries')
    .innerJoin('visits', 'visits.id', 'entries.visit_id')
    .innerJoin('sites', 'sites.id', 'visits.site_id')
    .where('entries.equipment_id', '=', equipment.id)
    .where(entryVisibleTo(actor))
    .where('entries.voided_at', 'is', null)
    .select(['visits.id', 'visits.started_at', 'sites.time_zone'])
    .orderBy('visits.started_at', 'desc')
    .limit(1);
  const [lastRow, followUps, openVisit, tag] = await Promise.all([
    last.executeTakeFirst(),
    db
      .selectFrom('follow_ups')
      .where('equipment_id', '=', equipment.id)
      .where('company_id', '=', actor.companyId)
      .where('status', 'in', ['open', 'scheduled'])
      .select((eb) => eb.fn.countAll<string>().as('n'))
      .executeTakeFirstOrThrow(),
    can(actor, 'visits.start')
      ? db
          .selectFrom('visits')
          .where('site_id', '=', equipment.siteId)
          .where('company_id', '=', actor.companyId)
          .where('technician_id', '=', actor.id)
          .where('status', '=', 'open')
          .select('id')
          .orderBy('started_at', 'desc')
          .limit(1)
          .executeTakeFirst()
      : undefined,
    db.selectFrom('tags').where('equipment_id', '=', equipment.id).where('company_id', '=', actor.companyId).where('state', '=', 'attached').select('code').orderBy('attached_at', 'desc').limit(1).executeTakeFirst(),
  ]);
  return {
    lastVisit: lastRow ? { id: lastRow.id, startedAt: new Date(lastRow.started_at).toISOString(), timeZone: lastRow.time_zone } : null,
    openFollowUps: Number(followUps.n),
    openVisitId: openVisit?.id ?? null,
    tagCode: tag?.code ?? null,
  };
}
