import 'server-only';
import { sql, type Kysely, type Transaction } from 'kysely';
import { db as defaultDb } from '@/db';
import type { DB } from '@/db/schema.gen';
import type { Db } from '@/db/types';
import { assertCan } from '@/lib/auth/access';
import type { Actor } from '@/lib/auth/actor';
import { recordAudit } from '@/lib/audit/service';
import { getEquipment } from '@/lib/equipment/service';
import { AppError } from '@/lib/errors';
import { localDate } from '@/lib/format/dates';
import { entryContext } from '@/lib/visits/context';
import type { EntryDto } from '@/lib/visits/dto';
import { kindDef } from '@/lib/visits/kinds';
import { EntryRefusal, type EntryServerTools, type ServerEntryContext } from '@/lib/visits/kinds/types';
import { entryQuery } from '@/lib/visits/queries';
import { replaceComponent } from '@/lib/visits/replace-component';
import type { CreateEntryInput } from '@/lib/visits/schemas';
import { entryKindLabels } from '@/lib/visits/terms';
import { entryCanVoid, mayVoidEntryOf } from '@/lib/visits/permissions';
import { getVisitSummary, openVisitForWriting, toEntryDto } from '@/lib/visits/service';

// Entries are saved one by one as they are made, each with its computed values, and what they
// imply for the unit (condition, settings, follow-ups, a replaced component) in one transaction.
// Each kind's module says what to compute and apply; this file gives it the means.


/**
 * Saves one entry. Retrying with the same clientEntryId returns the first save instead of a
 * duplicate.
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
  const visit = await getVisitSummary(actor, visitId, db);
  const row = await entryQuery(db).where('entries.id', '=', existing.id).executeTakeFirstOrThrow();
  return toEntryDto(row, entryCanVoid(actor, visit, { createdBy: row.created_by, voidedAt: row.voided_at?.toISOString() ?? null }));
}

async function insertEntry(actor: Actor, visitId: string, input: CreateEntryInput, trx: Transaction<DB>): Promise<EntryDto> {
  const visit = await openVisitForWriting(actor, visitId, trx);
  const equipment = await getEquipment(actor, input.equipmentId, trx).catch(() => {
    throw new AppError('validation_failed', 'Choose equipment on this site.', [{ path: 'equipmentId', message: 'This equipment was not found.' }]);
  });
  if (equipment.siteId !== visit.siteId) throw new AppError('validation_failed', 'Choose equipment on this site.', [{ path: 'equipmentId', message: 'That equipment is on another site.' }]);
  const ctx = await entryContext(trx, equipment.id);
  const recordedAt = input.recordedAt ? new Date(input.recordedAt) : new Date();
  const def = kindDef(input.kind);
  const data = input.data as Record<string, unknown>;
  const tools = serverTools(actor, trx, { equipmentId: equipment.id, siteId: visit.siteId, visitId, ctx, recordedAt, timeZone: visit.timeZone });

  let computed: Record<string, unknown> | null;
  try {
    computed = (await def.compute?.(data, tools)) ?? null;
  } catch (error) {
    if (error instanceof EntryRefusal) throw new AppError('validation_failed', error.message, [{ path: error.path, message: error.fieldMessage }]);
    throw error;
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
  tools.entryId = row.id;
  await def.apply?.(data, tools);
  const what = entryKindLabels[input.kind].toLowerCase();
  if (equipment.status === 'removed') {
    // Made on the phone before the unit was marked removed (or on the wrong record): the entry
    // stands, and the office is told so it can check which unit it belongs to.
    await tools.raiseFollowUp({ title: `Check: ${what} recorded on ${equipment.name} after it was marked removed`.slice(0, 200), severity: 'minor' });
  } else if (await movedSince(trx, actor, equipment.id, recordedAt)) {
    // Made on the phone before the office moved the unit to another system or area: the entry
    // lands on the unit as it is now, and the office checks it belongs there (a refrigerant
    // entry counts towards the new system's leak rate).
    await tools.raiseFollowUp({ title: `Check: ${what} on ${equipment.name} was recorded before it moved to ${equipment.systemName ?? equipment.areaName ?? 'its new place'}`.slice(0, 200), severity: 'minor' });
  }
  // Just saved on an open visit by the actor: theirs to strike out.
  const dto = toEntryDto(await entryQuery(trx).where('entries.id', '=', row.id).executeTakeFirstOrThrow(), mayVoidEntryOf(actor, { createdBy: actor.id }));
  await recordAudit(trx, actor, { action: 'create', entityType: 'entry', entityId: row.id, after: dto });
  return dto;
}

/** Did the office move the unit to another system or area after `at`? (Units never change site.) */
async function movedSince(trx: Db, actor: Actor, equipmentId: string, at: Date): Promise<boolean> {
  const moved = await trx
    .selectFrom('audit_events')
    .select('id')
    .where('company_id', '=', actor.companyId)
    .where('entity_type', '=', 'equipment')
    .where('entity_id', '=', equipmentId)
    .where('action', '=', 'update')
    .where('created_at', '>', at)
    // Kysely joins where() calls with "and" and no brackets: the "or" needs its own.
    .where(sql<boolean>`((before->>'systemId') is distinct from (after->>'systemId') or (before->>'areaId') is distinct from (after->>'areaId'))`)
    .limit(1)
    .executeTakeFirst();
  return Boolean(moved);
}

interface ToolScope {
  equipmentId: string;
  siteId: string;
  visitId: string;
  ctx: ServerEntryContext;
  recordedAt: Date;
  timeZone: string;
}

function serverTools(actor: Actor, trx: Transaction<DB>, s: ToolScope): EntryServerTools & { entryId: string | null } {
  const tools = {
    ctx: s.ctx,
    recordedAt: s.recordedAt,
    timeZone: s.timeZone,
    entryId: null as string | null,
    localDate: (at: Date) => localDate(at, s.timeZone),
    async lastAddition({ inclusive }: { inclusive: boolean }) {
      if (!s.ctx.systemId) return null;
      const row = await trx
        .selectFrom('entries')
        .select(['id', 'recorded_at', 'computed'])
        .where('system_id', '=', s.ctx.systemId)
        .where('kind', '=', 'refrigerant')
        .where('voided_at', 'is', null)
        .where(sql<boolean>`data->>'direction' = 'added'`)
        .where('recorded_at', inclusive ? '<=' : '<', s.recordedAt)
        .orderBy('recorded_at', 'desc')
        .limit(1)
        .executeTakeFirst();
      return row ? { id: row.id, recordedAt: row.recorded_at, computed: (row.computed as Record<string, unknown> | null) ?? null } : null;
    },
    async photoOnUnit(photoId: string) {
      const photo = await trx.selectFrom('photos').select('id').where('id', '=', photoId).where('company_id', '=', actor.companyId).where('equipment_id', '=', s.equipmentId).executeTakeFirst();
      return Boolean(photo);
    },
    async setCondition(rating: number, note: string | null) {
      await trx.updateTable('equipment').set({ condition: rating, condition_note: note, updated_at: sql`now()` }).where('id', '=', s.equipmentId).execute();
    },
    async applySettings(patch: Record<string, number>) {
      // Entries made offline may arrive late: the unit keeps the settings of its latest change.
      const later = await trx
        .selectFrom('entries')
        .select('id')
        .where('equipment_id', '=', s.equipmentId)
        .where('kind', '=', 'setting_change')
        .where('voided_at', 'is', null)
        .where('recorded_at', '>', s.recordedAt)
        .limit(1)
        .executeTakeFirst();
      if (later) return;
      await trx
        .updateTable('equipment')
        .set({ nameplate: sql`nameplate || ${JSON.stringify(patch)}::jsonb`, updated_at: sql`now()` })
        .where('id', '=', s.equipmentId)
        .execute();
    },
    async raiseFollowUp(input: { title: string; severity: string }) {
      await trx
        .insertInto('follow_ups')
        .values({
          company_id: actor.companyId,
          site_id: s.siteId,
          equipment_id: s.equipmentId,
          entry_id: tools.entryId!,
          raised_visit_id: s.visitId,
          title: input.title,
          severity: input.severity,
          created_by: actor.id,
        })
        .execute();
    },
    async replaceComponent(newSerial: string | null) {
      await replaceComponent(actor, s.equipmentId, newSerial, trx);
    },
  };
  return tools;
}

/**
 * Entries are records that must last: a mistake is struck out with a reason and kept. Once the
 * office has reviewed a visit (its report went out), its entries change only after a reopen.
 */
export async function voidEntry(actor: Actor, entryId: string, reason: string, db: Kysely<DB> = defaultDb): Promise<EntryDto> {
  assertCan(actor, 'entries.write');
  return db.transaction().execute(async (trx) => {
    const entry = await trx.selectFrom('entries').select(['id', 'visit_id', 'created_by', 'voided_at']).where('id', '=', entryId).where('company_id', '=', actor.companyId).executeTakeFirst();
    if (!entry) throw new AppError('not_found', 'Entry not found.');
    const visit = await getVisitSummary(actor, entry.visit_id, trx);
    if (!mayVoidEntryOf(actor, { createdBy: entry.created_by })) throw new AppError('forbidden', 'Only its author or the office can void an entry.');
    if (entry.voided_at) throw new AppError('conflict', 'This entry is already voided.');
    if (visit.status === 'closed' && visit.reviewedAt) throw new AppError('conflict', 'The office has reviewed this visit and its report was sent. Ask the office to reopen the visit first.');
    await trx.updateTable('entries').set({ voided_at: sql`now()`, voided_by: actor.id, void_reason: reason }).where('id', '=', entryId).execute();
    const dto = toEntryDto(await entryQuery(trx).where('entries.id', '=', entryId).executeTakeFirstOrThrow(), false);
    await recordAudit(trx, actor, { action: 'void', entityType: 'entry', entityId: entryId, after: { reason } });
    return dto;
  });
}
