import 'server-only';
import { sql, type Kysely } from 'kysely';
import { db as defaultDb } from '@/db';
import type { DB } from '@/db/schema.gen';
import { assertCan } from '@/lib/auth/access';
import type { Actor } from '@/lib/auth/actor';
import { recordAudit } from '@/lib/audit/service';
import { AppError } from '@/lib/errors';
import { logger } from '@/lib/logger';
import { kickMailDelivery } from '@/lib/mail/outbox';
import type { VisitDto } from '@/lib/visits/dto';
import { buildVisitReport } from '@/lib/visits/report-content';
import { queueVisitReport } from '@/lib/visits/report-mail';
import { renderVisitReportPdf } from '@/lib/visits/report-pdf';
import type { CloseVisitInput } from '@/lib/visits/schemas';
import { getVisit, getVisitSummary, openVisitForWriting } from '@/lib/visits/service';
import { deleteObject, getObjectBytes, objectKey, putObject } from '@/storage/objects';

// Closing a visit, and what follows it: the report e-mail queued in the same transaction, then,
// after commit, the outbox woken and the PDF report made and kept.

/**
 * Closes a visit. A bypassed safety or operating control must be confirmed removed first; the
 * confirmation is recorded as an action entry.
 */
export async function closeVisit(
  actor: Actor,
  visitId: string,
  input: CloseVisitInput,
  db: Kysely<DB> = defaultDb,
  /** `report: 'on-download'` leaves the PDF to its first download (bulk loads such as the demo history). */
  opts: { report: 'now' | 'on-download' } = { report: 'now' },
): Promise<VisitDto> {
  assertCan(actor, 'visits.start');
  const result = await db.transaction().execute(async (trx) => {
    if (input.clientCloseId) {
      // The same close sent again (its answer was lost): it already went through.
      const done = await trx.selectFrom('visits').select('id').where('id', '=', visitId).where('status', '=', 'closed').where('close_client_id', '=', input.clientCloseId).executeTakeFirst();
      if (done) return { visit: await getVisitSummary(actor, visitId, trx), repeat: true };
    }
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
        close_client_id: input.clientCloseId ?? null,
        updated_at: sql`now()`,
      })
      .where('id', '=', visitId)
      .execute();
    const after = await getVisitSummary(actor, visitId, trx);
    await recordAudit(trx, actor, { action: 'close', entityType: 'visit', entityId: visitId, before: current, after });
    await queueVisitReport(actor, visitId, trx);
    return { visit: after, repeat: false };
  });
  if (result.repeat) return result.visit;
  kickMailDelivery();
  if (opts.report === 'on-download') return result.visit;
  // The PDF is made now when the store answers, else on the first download.
  await ensureVisitReport(actor, visitId, db).catch((err: unknown) => logger.warn({ err: String(err), visitId }, 'visit report not stored yet'));
  return result.visit;
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
  const company = await db.selectFrom('companies').select(['name', 'default_units']).where('id', '=', actor.companyId).executeTakeFirstOrThrow();
  const bytes = await renderVisitReportPdf(buildVisitReport(visit, { units: company.default_units as 'imperial' | 'metric', metricPressure: 'kPa' }, company.name));
  const key = objectKey(actor.companyId, 'visits', visitId, 'report');
  await putObject(key, Buffer.from(bytes), 'application/pdf');
  // Two concurrent first downloads may both render; the first key stored wins, the other object is removed.
  const updated = await db.updateTable('visits').set({ report_key: key }).where('id', '=', visitId).where('report_key', 'is', null).returning('report_key').executeTakeFirst();
  if (!updated) {
    await deleteObject(key).catch(() => undefined);
    return (await db.selectFrom('visits').select('report_key').where('id', '=', visitId).executeTakeFirstOrThrow()).report_key!;
  }
  return key;
}

/** The report's bytes for a download, made first if it is missing. */
export async function visitReportPdf(actor: Actor, visitId: string, db: Kysely<DB> = defaultDb): Promise<Uint8Array> {
  return getObjectBytes(await ensureVisitReport(actor, visitId, db));
}
