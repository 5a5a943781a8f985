import 'server-only';
import { sql, type Kysely, type Transaction } from 'kysely';
import { db as defaultDb } from '@/db';
import { siteVisibleTo } from '@/db/helpers';
import type { DB } from '@/db/schema.gen';
import { decodeCursor, encodeCursor, type Page } from '@/lib/api/cursor';
import { assertCan, can } from '@/lib/auth/access';
import type { Actor } from '@/lib/auth/actor';
import { recordAudit } from '@/lib/audit/service';
import { evaluateLeakEvent } from '@/lib/calc/leak-rate';
import { assertEquipmentVisible, getEquipment } from '@/lib/equipment/service';
import { AppError } from '@/lib/errors';
import { getSite } from '@/lib/sites/service';
import { computeReading, computeSettingChange, type EntryContext } from '@/lib/visits/compute';
import type { EntryDto, VisitDetailDto, VisitDto } from '@/lib/visits/dto';
import { buildHistoryQuery, entryQuery, type HistoryScope } from '@/lib/visits/queries';
import type { CloseVisitInput, CreateEntryInput, EntryKind, HistoryQuery, ListVisitsQuery, StartVisitInput, VisitReason } from '@/lib/visits/schemas';

type Db = Kysely<DB> | Transaction<DB>;

function visitQuery(actor: Actor, db: Db) {
  return db
    .selectFrom('visits')
    .innerJoin('sites', 'sites.id', 'visits.site_id')
    .innerJoin('clients', 'clients.id', 'sites.client_id')
    .innerJoin('users as tech', 'tech.id', 'visits.technician_id')
    .where(siteVisibleTo(actor))
    .where('visits.company_id', '=', actor.companyId)
    .select((eb) => [
      'visits.id',
      'visits.site_id',
      'sites.name as site_name',
      'clients.name as client_name',
      'sites.time_zone',
      'visits.technician_id',
      'tech.name as technician_name',
      'visits.reason',
      'visits.status',
      'visits.started_at',
      'visits.ended_at',
      'visits.summary',
      'visits.reviewed_at',
      'visits.reopened_at',
      'visits.report_key',
      eb.selectFrom('entries').whereRef('entries.visit_id', '=', 'visits.id').where('entries.voided_at', 'is', null).select(eb.fn.countAll<number>().as('n')).as('entry_count'),
    ]);
}

type VisitRow = Awaited<ReturnType<ReturnType<typeof visitQuery>['executeTakeFirstOrThrow']>>;

function toVisitDto(r: VisitRow): VisitDto {
  return {
    id: r.id,
    siteId: r.site_id,
    siteName: r.site_name,
    clientName: r.client_name,
    timeZone: r.time_zone,
    technicianId: r.technician_id,
    technicianName: r.technician_name,
    reason: r.reason as VisitReason,
    status: r.status as VisitDto['status'],
    startedAt: r.started_at.toISOString(),
    endedAt: r.ended_at?.toISOString() ?? null,
    summary: r.summary,
    reviewedAt: r.reviewed_at?.toISOString() ?? null,
    reopenedAt: r.reopened_at?.toISOString() ?? null,
    hasReport: Boolean(r.report_key),
    entryCount: Number(r.entry_count ?? 0),
  };
}

/** Owners see a visit only once it is closed: an open visit is work in progress. */
function visibleVisits(actor: Actor, db: Db) {
  const q = visitQuery(actor, db);
  return actor.role === 'client' ? q.where('visits.status', '=', 'closed') : q;
}

export async function getVisitSummary(actor: Actor, id: string, db: Db = defaultDb): Promise<VisitDto> {
  assertCan(actor, 'visits.read');
  const row = await visibleVisits(actor, db).where('visits.id', '=', id).executeTakeFirst();
  if (!row) throw new AppError('not_found', 'Visit not found.');
  return toVisitDto(row);
}

type EntryRow = Awaited<ReturnType<ReturnType<typeof entryQuery>['executeTakeFirstOrThrow']>>;

function toEntryDto(r: EntryRow): EntryDto {
  return {
    id: r.id,
    visitId: r.visit_id,
    equipmentId: r.equipment_id,
    equipmentName: r.equipment_name,
    equipmentType: r.equipment_type,
    kind: r.kind as EntryKind,
    data: r.data as Record<string, unknown>,
    computed: (r.computed as Record<string, unknown> | null) ?? null,
    recordedAt: r.recorded_at.toISOString(),
    createdBy: r.created_by,
    createdByName: r.author_name,
    voidedAt: r.voided_at?.toISOString() ?? null,
    voidReason: r.void_reason,
    clientEntryId: r.client_entry_id,
  };
}

function openBypasses(entries: EntryDto[]): VisitDetailDto['openBypasses'] {
  const removed = new Set(entries.filter((e) => e.kind === 'action' && typeof e.data.bypassRemovalOf === 'string').map((e) => e.data.bypassRemovalOf as string));
  return entries
    .filter((e) => e.kind === 'action' && e.data.bypassedControl === true && !e.voidedAt && !removed.has(e.id))
    .map((e) => ({ entryId: e.id, description: String(e.data.bypassDescription ?? 'a control') }));
}

export async function getVisit(actor: Actor, id: string, db: Db = defaultDb): Promise<VisitDetailDto> {
  const visit = await getVisitSummary(actor, id, db);
  const entries = (await entryQuery(db).where('entries.visit_id', '=', id).orderBy('entries.recorded_at').orderBy('entries.id').execute()).map(toEntryDto);
  return { ...visit, entries, openBypasses: openBypasses(entries) };
}

export async function listVisits(actor: Actor, query: ListVisitsQuery, db: Db = defaultDb): Promise<Page<VisitDto>> {
  assertCan(actor, 'visits.read');
  const cursor = decodeCursor(query.cursor);
  let q = visibleVisits(actor, db);
  if (query.siteId) q = q.where('visits.site_id', '=', query.siteId);
  if (query.status) q = q.where('visits.status', '=', query.status);
  if (query.technicianId) q = q.where('visits.technician_id', '=', query.technicianId);
  if (query.review === 'needed') q = q.where('visits.status', '=', 'closed').where('visits.reviewed_at', 'is', null);
  if (cursor) q = q.where(sql<boolean>`(visits.started_at, visits.id) < (${String(cursor.k)}::timestamptz, ${cursor.id}::uuid)`);
  const rows = await q.orderBy('visits.started_at', 'desc').orderBy('visits.id', 'desc').limit(query.limit + 1).execute();
  const items = rows.slice(0, query.limit).map(toVisitDto);
  const last = items.at(-1);
  return { items, nextCursor: rows.length > query.limit && last ? encodeCursor({ k: last.startedAt, id: last.id }) : null };
}

export async function startVisit(actor: Actor, input: StartVisitInput, db: Kysely<DB> = defaultDb): Promise<VisitDto> {
  assertCan(actor, 'visits.start');
  return db.transaction().execute(async (trx) => {
    const site = await getSite(actor, input.siteId, trx);
    if (site.archivedAt) throw new AppError('validation_failed', 'This site is archived.');
    const open = await trx
      .selectFrom('visits')
      .select('id')
      .where('technician_id', '=', actor.id)
      .where('site_id', '=', input.siteId)
      .where('status', '=', 'open')
      .executeTakeFirst();
    if (open) throw new AppError('conflict', `You already have an open visit at this site (${open.id}). Continue it or close it first.`);
    const row = await trx
      .insertInto('visits')
      .values({
        company_id: actor.companyId,
        site_id: input.siteId,
        technician_id: actor.id,
        reason: input.reason,
        started_at: input.startedAt ? new Date(input.startedAt) : sql`now()`,
      })
      .returning('id')
      .executeTakeFirstOrThrow();
    const visit = await getVisitSummary(actor, row.id, trx);
    await recordAudit(trx, actor, { action: 'create', entityType: 'visit', entityId: row.id, after: visit });
    return visit;
  });
}

/** The technician works on their own open visit; office and admin may add to any open one. */
async function openVisitForWriting(actor: Actor, visitId: string, trx: Db): Promise<VisitDto> {
  const visit = await getVisitSummary(actor, visitId, trx);
  if (visit.status !== 'open') throw new AppError('conflict', 'This visit is closed. Ask the office to reopen it to add entries.');
  if (visit.technicianId !== actor.id && !can(actor, 'visits.review')) throw new AppError('forbidden', 'Only the visit’s technician can add entries.');
  return visit;
}

type EntryContextRow = EntryContext & { systemId: string | null; application: string | null; fullChargeKg: number | null };

/** The context rows of many pieces of equipment; the visit form gets these so its live values match what is stored. */
async function entryContextRows(trx: Db, scope: { equipmentId: string } | { siteId: string }): Promise<Map<string, EntryContextRow>> {
  let q = trx
    .selectFrom('equipment')
    .innerJoin('sites', 'sites.id', 'equipment.site_id')
    .leftJoin('systems', 'systems.id', 'equipment.system_id')
    .select((eb) => [
      'equipment.system_id',
      'equipment.nameplate',
      'sites.elevation_m',
      'systems.refrigerant',
      'systems.application',
      'systems.full_charge_kg',
      'systems.design_box_temp_c',
      eb
        .selectFrom('equipment as cu')
        .whereRef('cu.system_id', '=', 'equipment.system_id')
        .where('cu.type', '=', 'condensing_unit')
        .where('cu.deleted_at', 'is', null)
        .select(sql<number | null>`(cu.nameplate->>'designPressureHighKpa')::float8`.as('p'))
        .limit(1)
        .as('design_high'),
      'equipment.id',
    ]);
  q = 'equipmentId' in scope ? q.where('equipment.id', '=', scope.equipmentId) : q.where('equipment.site_id', '=', scope.siteId).where('equipment.deleted_at', 'is', null);
  const out = new Map<string, EntryContextRow>();
  for (const row of await q.execute()) out.set(row.id, toEntryContext(row));
  return out;
}

function toEntryContext(row: {
  system_id: string | null;
  nameplate: unknown;
  elevation_m: unknown;
  refrigerant: string | null;
  application: string | null;
  full_charge_kg: unknown;
  design_box_temp_c: unknown;
  design_high: number | null;
}): EntryContextRow {
  const plate = (row.nameplate ?? {}) as Record<string, unknown>;
  const num = (v: unknown) => (typeof v === 'number' ? v : null);
  return {
    systemId: row.system_id,
    application: row.application,
    fullChargeKg: row.full_charge_kg === null ? null : Number(row.full_charge_kg),
    refrigerant: row.refrigerant ?? (typeof plate.refrigerant === 'string' ? plate.refrigerant : null),
    elevationM: Number(row.elevation_m),
    designBoxTempC: row.design_box_temp_c === null ? null : Number(row.design_box_temp_c),
    nameplateVoltage: num(plate.voltage),
    controlVoltageNominal: num(plate.controlVoltage),
    designPressureHighKpaG: num(plate.designPressureHighKpa) ?? (row.design_high === null ? null : Number(row.design_high)),
  };
}

async function entryContext(trx: Db, equipmentId: string): Promise<EntryContextRow> {
  const ctx = (await entryContextRows(trx, { equipmentId })).get(equipmentId);
  if (!ctx) throw new AppError('not_found', 'Equipment not found.');
  return ctx;
}

/**
 * The calculation context of every piece of equipment on a site, keyed by equipment id: the same
 * values addEntry computes with, so the form's live values equal the stored ones.
 */
export async function siteEntryContexts(actor: Actor, siteId: string, db: Db = defaultDb): Promise<Record<string, EntryContext>> {
  assertCan(actor, 'entries.write');
  await getSite(actor, siteId, db);
  const rows = await entryContextRows(db, { siteId });
  return Object.fromEntries(
    [...rows].map(([id, c]) => [
      id,
      {
        refrigerant: c.refrigerant,
        elevationM: c.elevationM,
        designBoxTempC: c.designBoxTempC,
        nameplateVoltage: c.nameplateVoltage,
        controlVoltageNominal: c.controlVoltageNominal,
        designPressureHighKpaG: c.designPressureHighKpaG,
      } satisfies EntryContext,
    ]),
  );
}

const settingKeys = {
  low: { setting: 'lowCutInKpa', diff: 'lowDifferentialKpa' },
  high: { setting: 'highCutOutKpa', diff: 'highDifferentialKpa' },
  thermostat: { setting: 'setpointC', diff: 'differentialK' },
} as const;

/**
 * Saves one entry as it is made, with its computed values, and applies what it implies to the
 * equipment (condition, current settings, follow-ups, a replaced component). Retrying with the
 * same clientEntryId returns the first save instead of a duplicate.
 */
export async function addEntry(actor: Actor, visitId: string, input: CreateEntryInput, db: Kysely<DB> = defaultDb): Promise<EntryDto> {
  assertCan(actor, 'entries.write');
  try {
    return await db.transaction().execute(async (trx) => {
      const earlier = await firstSave(actor, visitId, input.clientEntryId, trx);
      return earlier ?? insertEntry(actor, visitId, input, trx);
    });
  } catch (error) {
    // Two sends of one entry at once (a retry while the first is still being saved): the second
    // waits on the unique key and fails when the first commits. It gets the first save, as any
    // later retry would.
    if (isDuplicateClientEntry(error)) {
      const earlier = await firstSave(actor, visitId, input.clientEntryId, db);
      if (earlier) return earlier;
    }
    throw error;
  }
}

function isDuplicateClientEntry(error: unknown): boolean {
  const pg = error as { code?: string; constraint?: string } | null;
  return pg?.code === '23505' && pg.constraint === 'entries_client_entry_key';
}

/** The entry already saved under this clientEntryId, if any; on another visit it is a conflict. */
async function firstSave(actor: Actor, visitId: string, clientEntryId: string, db: Db): Promise<EntryDto | null> {
  const existing = await db.selectFrom('entries').select(['id', 'visit_id']).where('company_id', '=', actor.companyId).where('client_entry_id', '=', clientEntryId).executeTakeFirst();
  if (!existing) return null;
  if (existing.visit_id !== visitId) throw new AppError('conflict', 'This entry was already saved on another visit.');
  return toEntryDto(await entryQuery(db).where('entries.id', '=', existing.id).executeTakeFirstOrThrow());
}

async function insertEntry(actor: Actor, visitId: string, input: CreateEntryInput, trx: Transaction<DB>): Promise<EntryDto> {
  const visit = await openVisitForWriting(actor, visitId, trx);
  const equipment = await getEquipment(actor, input.equipmentId, trx).catch(() => {
    throw new AppError('validation_failed', 'Choose equipment on this site.', [{ path: 'equipmentId', message: 'This equipment was not found.' }]);
  });
  if (equipment.siteId !== visit.siteId) throw new AppError('validation_failed', 'Choose equipment on this site.', [{ path: 'equipmentId', message: 'That equipment is on another site.' }]);
  const ctx = await entryContext(trx, equipment.id);
  const recordedAt = input.recordedAt ? new Date(input.recordedAt) : new Date();
  let computed: Record<string, unknown> | null = null;
  const data: Record<string, unknown> = { ...input.data };

  if (input.kind === 'photo') {
    const photo = await trx
      .selectFrom('photos')
      .select('id')
      .where('id', '=', input.data.photoId)
      .where('company_id', '=', actor.companyId)
      .where('equipment_id', '=', equipment.id)
      .executeTakeFirst();
    if (!photo) throw new AppError('validation_failed', 'That photo does not belong to this equipment.', [{ path: 'data.photoId', message: 'Upload the photo on this unit first.' }]);
  }
  if (input.kind === 'reading') computed = { ...computeReading(input.data, ctx) };
  if (input.kind === 'setting_change') computed = { ...computeSettingChange(input.data, ctx) };
  if (input.kind === 'refrigerant') {
    if (ctx.refrigerant && input.data.refrigerant !== ctx.refrigerant) {
      throw new AppError('validation_failed', `This system holds ${ctx.refrigerant}. Never add a different refrigerant; record a retrofit on the system first.`, [
        { path: 'data.refrigerant', message: `The system holds ${ctx.refrigerant}.` },
      ]);
    }
    if (input.data.direction === 'added' && ctx.systemId && ctx.fullChargeKg && ctx.application) {
      const previous = await trx
        .selectFrom('entries')
        .select('recorded_at')
        .where('system_id', '=', ctx.systemId)
        .where('kind', '=', 'refrigerant')
        .where('voided_at', 'is', null)
        .where(sql<boolean>`data->>'direction' = 'added'`)
        .where('recorded_at', '<', recordedAt)
        .orderBy('recorded_at', 'desc')
        .limit(1)
        .executeTakeFirst();
      const leak = evaluateLeakEvent({
        refrigerant: input.data.refrigerant,
        application: ctx.application === 'industrial_process' ? 'industrial_process_refrigeration' : (ctx.application as 'commercial_refrigeration' | 'comfort_cooling'),
        fullCharge: ctx.fullChargeKg,
        added: input.data.amountKg,
        massUnit: 'kg',
        // Calendar days are the site's: an addition late in the evening counts on that local day.
        additionDate: localDate(recordedAt, visit.timeZone),
        previousAdditionDate: previous ? localDate(previous.recorded_at, visit.timeZone) : null,
      });
      computed = { leak };
    } else if (input.data.direction === 'added') {
      computed = { leak: null, problems: ['The leak rate needs the system’s full charge and application on record.'] };
    }
  }
  if (input.kind === 'leak' && input.data.activity === 'repair' && ctx.systemId) {
    computed = await repairDeadline(trx, ctx.systemId, recordedAt, visit.timeZone);
  }

  const row = await trx
    .insertInto('entries')
    .values({
      company_id: actor.companyId,
      visit_id: visitId,
      equipment_id: equipment.id,
      system_id: ctx.systemId,
      kind: input.kind,
      data: JSON.stringify(data),
      computed: computed ? JSON.stringify(computed) : null,
      recorded_at: recordedAt,
      created_by: actor.id,
      client_entry_id: input.clientEntryId,
    })
    .returning('id')
    .executeTakeFirstOrThrow();

  if (input.kind === 'condition') {
    await trx
      .updateTable('equipment')
      .set({ condition: input.data.rating, condition_note: input.data.note ?? null, updated_at: sql`now()` })
      .where('id', '=', equipment.id)
      .execute();
  }
  if (input.kind === 'setting_change') {
    const keys = settingKeys[input.data.control];
    const left = input.data.asLeft as Record<string, number>;
    const [settingValue, diffValue] = Object.values(left);
    await trx
      .updateTable('equipment')
      .set({
        nameplate: sql`nameplate || ${JSON.stringify({ [keys.setting]: settingValue, [keys.diff]: diffValue })}::jsonb`,
        updated_at: sql`now()`,
      })
      .where('id', '=', equipment.id)
      .execute();
  }
  if (input.kind === 'finding' && input.data.raiseFollowUp) {
    await trx
      .insertInto('follow_ups')
      .values({
        company_id: actor.companyId,
        site_id: visit.siteId,
        equipment_id: equipment.id,
        entry_id: row.id,
        raised_visit_id: visitId,
        title: input.data.followUpTitle ?? input.data.text.slice(0, 200),
        severity: input.data.severity,
        created_by: actor.id,
      })
      .execute();
  }
  if (input.kind === 'part' && input.data.replacesEquipment) {
    await replaceComponent(actor, equipment.id, input.data.newSerial ?? null, trx);
  }
  const dto = toEntryDto(await entryQuery(trx).where('entries.id', '=', row.id).executeTakeFirstOrThrow());
  await recordAudit(trx, actor, { action: 'create', entityType: 'entry', entityId: row.id, after: dto });
  return dto;
}

/**
 * Whether a repair met the deadline set by the system's last addition before it, when that
 * addition was over the leak-rate threshold (repair due date from lib/calc/leak-rate).
 */
async function repairDeadline(trx: Db, systemId: string, recordedAt: Date, timeZone: string): Promise<Record<string, unknown> | null> {
  const addition = await trx
    .selectFrom('entries')
    .select(['id', 'computed'])
    .where('system_id', '=', systemId)
    .where('kind', '=', 'refrigerant')
    .where('voided_at', 'is', null)
    .where(sql<boolean>`data->>'direction' = 'added'`)
    .where('recorded_at', '<=', recordedAt)
    .orderBy('recorded_at', 'desc')
    .limit(1)
    .executeTakeFirst();
  const due = (addition?.computed as { leak?: { exceedsThreshold?: boolean; repairDueDate?: string | null } | null } | null)?.leak;
  if (!addition || !due?.exceedsThreshold || !due.repairDueDate) return null;
  const repairedOn = localDate(recordedAt, timeZone);
  return { repairDueDate: due.repairDueDate, repairedOn, onTime: repairedOn <= due.repairDueDate, additionEntryId: addition.id };
}

/**
 * A replaced component: the old record is marked removed and kept with its history; a new record
 * takes its place (same type, site, area, system, nameplate), with its relations.
 */
async function replaceComponent(actor: Actor, equipmentId: string, newSerial: string | null, trx: Db): Promise<string> {
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
  await trx.updateTable('equipment').set({ status: 'removed', updated_at: sql`now()` }).where('id', '=', equipmentId).execute();
  // The tag on the unit now identifies its replacement: scanning it opens the new record.
  await trx.updateTable('tags').set({ equipment_id: created.id, updated_at: sql`now()` }).where('equipment_id', '=', equipmentId).where('state', '=', 'attached').execute();
  await trx.updateTable('equipment_relations').set({ from_equipment_id: created.id }).where('from_equipment_id', '=', equipmentId).execute();
  await trx.updateTable('equipment_relations').set({ to_equipment_id: created.id }).where('to_equipment_id', '=', equipmentId).execute();
  await recordAudit(trx, actor, { action: 'replace', entityType: 'equipment', entityId: equipmentId, after: { replacedBy: created.id } });
  await recordAudit(trx, actor, { action: 'create', entityType: 'equipment', entityId: created.id, after: { replaces: equipmentId, serial: newSerial } });
  return created.id;
}

export async function voidEntry(actor: Actor, entryId: string, reason: string, db: Kysely<DB> = defaultDb): Promise<EntryDto> {
  assertCan(actor, 'entries.write');
  return db.transaction().execute(async (trx) => {
    const entry = await trx.selectFrom('entries').select(['id', 'visit_id', 'created_by', 'voided_at']).where('id', '=', entryId).where('company_id', '=', actor.companyId).executeTakeFirst();
    if (!entry) throw new AppError('not_found', 'Entry not found.');
    await getVisitSummary(actor, entry.visit_id, trx);
    if (entry.created_by !== actor.id && !can(actor, 'visits.review')) throw new AppError('forbidden', 'Only its author or the office can void an entry.');
    if (entry.voided_at) throw new AppError('conflict', 'This entry is already voided.');
    await trx.updateTable('entries').set({ voided_at: sql`now()`, voided_by: actor.id, void_reason: reason }).where('id', '=', entryId).execute();
    const dto = toEntryDto(await entryQuery(trx).where('entries.id', '=', entryId).executeTakeFirstOrThrow());
    await recordAudit(trx, actor, { action: 'void', entityType: 'entry', entityId: entryId, after: { reason } });
    return dto;
  });
}

export interface CloseResult {
  visit: VisitDto;
}

/**
 * Closes a visit. A bypassed safety or operating control must be confirmed removed first; the
 * confirmation is recorded as an action entry. Report delivery is queued in the same transaction.
 */
export async function closeVisit(
  actor: Actor,
  visitId: string,
  input: CloseVisitInput,
  db: Kysely<DB> = defaultDb,
  afterCommit: (visitId: string) => Promise<void> = async () => undefined,
): Promise<VisitDto> {
  assertCan(actor, 'visits.start');
  const visit = await db.transaction().execute(async (trx) => {
    const current = await openVisitForWriting(actor, visitId, trx);
    const detail = await getVisit(actor, visitId, trx);
    if (detail.openBypasses.length > 0) {
      if (!input.confirmBypassRemoved) {
        throw new AppError(
          'conflict',
          `A bypassed control is recorded on this visit (${detail.openBypasses.map((b) => b.description).join('; ')}). Confirm the jumper or bypass was removed before closing.`,
        );
      }
      for (const b of detail.openBypasses) {
        const source = detail.entries.find((e) => e.id === b.entryId)!;
        await trx
          .insertInto('entries')
          .values({
            company_id: actor.companyId,
            visit_id: visitId,
            equipment_id: source.equipmentId,
            system_id: null,
            kind: 'action',
            data: JSON.stringify({ text: `Bypass removed and control back in service: ${b.description}`, bypassedControl: false, bypassRemovalOf: b.entryId }),
            recorded_at: new Date(),
            created_by: actor.id,
            client_entry_id: sql`gen_random_uuid()`,
          })
          .execute();
      }
    }
    await trx
      .updateTable('visits')
      .set({
        status: 'closed',
        summary: input.summary,
        ended_at: input.endedAt ? new Date(input.endedAt) : sql`now()`,
        closed_by: actor.id,
        updated_at: sql`now()`,
      })
      .where('id', '=', visitId)
      .execute();
    const after = await getVisitSummary(actor, visitId, trx);
    await recordAudit(trx, actor, { action: 'close', entityType: 'visit', entityId: visitId, before: current, after });
    const { queueVisitReport } = await import('@/lib/visits/report-mail');
    await queueVisitReport(actor, visitId, trx);
    return after;
  });
  await afterCommit(visitId);
  return visit;
}

export async function reopenVisit(actor: Actor, visitId: string, db: Kysely<DB> = defaultDb): Promise<VisitDto> {
  assertCan(actor, 'visits.review');
  return db.transaction().execute(async (trx) => {
    const before = await getVisitSummary(actor, visitId, trx);
    if (before.status === 'open') throw new AppError('conflict', 'This visit is already open.');
    const clash = await trx
      .selectFrom('visits')
      .select('id')
      .where('technician_id', '=', before.technicianId)
      .where('site_id', '=', before.siteId)
      .where('status', '=', 'open')
      .executeTakeFirst();
    if (clash) throw new AppError('conflict', 'The technician has another open visit at this site; close it first.');
    await trx.updateTable('visits').set({ status: 'open', reopened_at: sql`now()`, reopened_by: actor.id, updated_at: sql`now()` }).where('id', '=', visitId).execute();
    const after = await getVisitSummary(actor, visitId, trx);
    await recordAudit(trx, actor, { action: 'reopen', entityType: 'visit', entityId: visitId, before, after });
    return after;
  });
}

export async function markReviewed(actor: Actor, visitId: string, db: Kysely<DB> = defaultDb): Promise<VisitDto> {
  assertCan(actor, 'visits.review');
  return db.transaction().execute(async (trx) => {
    const before = await getVisitSummary(actor, visitId, trx);
    if (before.status !== 'closed') throw new AppError('conflict', 'Only a closed visit can be reviewed.');
    await trx.updateTable('visits').set({ reviewed_at: sql`now()`, reviewed_by: actor.id }).where('id', '=', visitId).execute();
    const after = await getVisitSummary(actor, visitId, trx);
    await recordAudit(trx, actor, { action: 'review', entityType: 'visit', entityId: visitId, before, after });
    return after;
  });
}

/** Newest first, keyset on (recorded_at, id); owners see entries of closed visits only. */
export async function equipmentHistory(actor: Actor, equipmentId: string, query: HistoryQuery, db: Db = defaultDb): Promise<Page<EntryDto>> {
  assertCan(actor, 'visits.read');
  await assertEquipmentVisible(actor, equipmentId, db);
  return historyPage(actor, db, query, { equipmentId });
}

export async function systemHistory(actor: Actor, systemId: string, query: HistoryQuery, db: Db = defaultDb): Promise<Page<EntryDto>> {
  assertCan(actor, 'visits.read');
  const { getSystem } = await import('@/lib/systems/service');
  await getSystem(actor, systemId, db);
  return historyPage(actor, db, query, { systemId });
}

async function historyPage(
  actor: Actor,
  db: Db,
  query: HistoryQuery,
  scope: HistoryScope,
): Promise<Page<EntryDto>> {
  const rows = await buildHistoryQuery(actor, db, query, scope).execute();
  const items = rows.slice(0, query.limit).map((r) => ({
    ...toEntryDto(r),
    visit: {
      reason: r.visit_reason as VisitReason,
      startedAt: r.visit_started_at.toISOString(),
      technicianName: r.technician_name,
      status: r.visit_status as 'open' | 'closed',
      timeZone: r.visit_time_zone,
    },
  }));
  const last = items.at(-1);
  return { items, nextCursor: rows.length > query.limit && last ? encodeCursor({ k: last.recordedAt, id: last.id }) : null };
}

/** One reading over time, for a chart. */
export async function readingSeries(actor: Actor, equipmentId: string, key: string, db: Db = defaultDb): Promise<{ recordedAt: string; value: number }[]> {
  assertCan(actor, 'visits.read');
  await assertEquipmentVisible(actor, equipmentId, db);
  const computedKeys = new Set(['superheatK', 'subcoolingK', 'evaporatorTdK', 'condenserSplitK', 'compressionRatio', 'unbalancePct', 'evaporatingC', 'condensingC']);
  const column = computedKeys.has(key) ? 'computed' : 'data';
  let q = db
    .selectFrom('entries')
    .innerJoin('visits', 'visits.id', 'entries.visit_id')
    .select(['entries.recorded_at', sql<number>`(entries.${sql.raw(column)}->>${key})::float8`.as('value')])
    .where('entries.equipment_id', '=', equipmentId)
    .where('entries.kind', '=', 'reading')
    .where('entries.voided_at', 'is', null)
    .where(sql<boolean>`entries.${sql.raw(column)} ? ${key}`)
    .where(sql<boolean>`jsonb_typeof(entries.${sql.raw(column)}->${key}) = 'number'`);
  if (actor.role === 'client') q = q.where('visits.status', '=', 'closed');
  const rows = await q.orderBy('entries.recorded_at').limit(500).execute();
  return rows.map((r) => ({ recordedAt: r.recorded_at.toISOString(), value: Number(r.value) }));
}

/**
 * The visit's PDF report: made once after closing and kept in the object store; made again on
 * demand if the store was down then. Returns the object key.
 */
export async function ensureVisitReport(actor: Actor, visitId: string, db: Kysely<DB> = defaultDb): Promise<string> {
  const visit = await getVisit(actor, visitId, db);
  if (visit.status !== 'closed') throw new AppError('conflict', 'The report is made when the visit closes.');
  const row = await db.selectFrom('visits').select('report_key').where('id', '=', visitId).executeTakeFirstOrThrow();
  if (row.report_key) return row.report_key;
  const [{ renderVisitReportPdf }, { buildVisitReport }, storage] = await Promise.all([
    import('@/lib/visits/report-pdf'),
    import('@/lib/visits/report-content'),
    import('@/storage/objects'),
  ]);
  const company = await db.selectFrom('companies').select(['name', 'default_units']).where('id', '=', actor.companyId).executeTakeFirstOrThrow();
  const bytes = await renderVisitReportPdf(buildVisitReport(visit, { units: company.default_units as 'imperial' | 'metric', metricPressure: 'kPa' }, company.name));
  const key = storage.objectKey(actor.companyId, 'visits', visitId, 'report');
  await storage.putObject(key, Buffer.from(bytes), 'application/pdf');
  // Two concurrent first downloads may both render; the first key stored wins, the other object is removed.
  const updated = await db.updateTable('visits').set({ report_key: key }).where('id', '=', visitId).where('report_key', 'is', null).returning('report_key').executeTakeFirst();
  if (!updated) {
    await storage.deleteObject(key).catch(() => undefined);
    return (await db.selectFrom('visits').select('report_key').where('id', '=', visitId).executeTakeFirstOrThrow()).report_key!;
  }
  return key;
}

/** 'YYYY-MM-DD' of an instant in a time zone. */
function localDate(at: Date, timeZone: string): string {
  return new Intl.DateTimeFormat('en-CA', { timeZone, year: 'numeric', month: '2-digit', day: '2-digit' }).format(at);
}
