import 'server-only';
import { sql, type Kysely, type Transaction } from 'kysely';
import { db as defaultDb } from '@/db';
import { atVisibleSite } from '@/lib/auth/scope';
import type { DB } from '@/db/schema.gen';
import type { Db, QueryRow } from '@/db/types';
import { assertCan, can } from '@/lib/auth/access';
import type { Actor } from '@/lib/auth/actor';
import { auditedChange } from '@/lib/audit/change';
import { recordAudit } from '@/lib/audit/service';
import { changedColumns } from '@/lib/changed-columns';
import { getEquipment } from '@/lib/equipment/service';
import { storePhoto } from '@/lib/photos/service';
import { env } from '@/lib/env';
import { AppError, foundOr404 } from '@/lib/errors';
import { escapeHtml } from '@/lib/mail/escape';
import { enqueueMail, kickMailDelivery } from '@/lib/mail/outbox';
import {
  urgencyLabels,
  type CreateRequestInput,
  type ListRequestsQuery,
  type RequestStatus,
  type UpdateRequestInput,
  type Urgency,
} from '@/lib/requests/schemas';
import type { ServiceRequestDto } from '@/lib/requests/dto';
import { getSite } from '@/lib/sites/service';

function requestQuery(actor: Actor, db: Db) {
  return db
    .selectFrom('service_requests')
    .$call(atVisibleSite(actor, 'service_requests'))
    .innerJoin('clients', 'clients.id', 'sites.client_id')
    .leftJoin('equipment', 'equipment.id', 'service_requests.equipment_id')
    .innerJoin('users as requester', 'requester.id', 'service_requests.requested_by')
    .select([
      'service_requests.id',
      'service_requests.site_id',
      'sites.name as site_name',
      'clients.name as client_name',
      'service_requests.equipment_id',
      'equipment.name as equipment_name',
      'requester.name as requester_name',
      'service_requests.description',
      'service_requests.urgency',
      'service_requests.photo_id',
      'service_requests.status',
      'service_requests.office_note',
      'service_requests.visit_id',
      'service_requests.created_at',
      'service_requests.updated_at',
    ]);
}

type Row = QueryRow<typeof requestQuery>;

function toDto(actor: Actor, r: Row): ServiceRequestDto {
  return {
    id: r.id,
    siteId: r.site_id,
    siteName: r.site_name,
    clientName: r.client_name,
    equipmentId: r.equipment_id,
    equipmentName: r.equipment_name,
    requestedByName: r.requester_name,
    description: r.description,
    urgency: r.urgency as Urgency,
    photoId: r.photo_id,
    status: r.status as RequestStatus,
    officeNote: r.office_note,
    visitId: r.visit_id,
    createdAt: r.created_at.toISOString(),
    updatedAt: r.updated_at.toISOString(),
    canManage: can(actor, 'requests.manage'),
  };
}

const urgencyRank = sql<number>`case service_requests.urgency when 'emergency' then 0 when 'soon' then 1 else 2 end`;

export async function listRequests(actor: Actor, query: ListRequestsQuery, db: Db = defaultDb): Promise<ServiceRequestDto[]> {
  assertCan(actor, 'requests.read');
  let q = requestQuery(actor, db);
  if (query.siteId) q = q.where('service_requests.site_id', '=', query.siteId);
  if (query.status?.length) q = q.where('service_requests.status', 'in', query.status);
  const rows = await q.orderBy(urgencyRank).orderBy('service_requests.created_at', 'desc').limit(query.limit).execute();
  return rows.map((r) => toDto(actor, r));
}

export async function getRequest(actor: Actor, id: string, db: Db = defaultDb): Promise<ServiceRequestDto> {
  assertCan(actor, 'requests.read');
  const row = foundOr404(await requestQuery(actor, db).where('service_requests.id', '=', id).executeTakeFirst(), 'Service request not found.');
  return toDto(actor, row);
}

/** A photo sent with a request: the bytes as uploaded, checked and stored like any unit photo. */
export interface RequestPhoto {
  fileName: string | null;
  bytes: Uint8Array;
}

/**
 * Records the request and queues an e-mail to the office in the same transaction. A photo sent
 * with it is stored in that transaction too (it joins the unit's photos), so a refused photo or
 * a store outage leaves neither a request without its photo nor a photo without its request.
 */
export async function createRequest(actor: Actor, input: CreateRequestInput, db: Kysely<DB> = defaultDb, photo?: RequestPhoto): Promise<ServiceRequestDto> {
  assertCan(actor, 'requests.create');
  if (photo && !input.equipmentId) {
    throw new AppError('validation_failed', 'A photo belongs to a unit.', [{ path: 'equipmentId', message: 'Choose the unit the photo shows, or send the request without a photo.' }]);
  }
  if (photo && input.photoId) throw new AppError('validation_failed', 'Send either a new photo or an uploaded one, not both.', [{ path: 'photoId', message: 'Leave this out when sending a file.' }]);
  const record = (trx: Transaction<DB>, photoId: string | null) => insertRequest(actor, input, photoId, trx);
  let dto: ServiceRequestDto;
  if (photo) {
    // Cheap checks first: a wrong site or unit is refused before any image work or storage.
    await checkPlace(actor, input, db);
    const caption = `Sent with a service request: ${input.description.length > 200 ? `${input.description.slice(0, 199)}…` : input.description}`;
    const stored = await storePhoto(actor, { equipmentId: input.equipmentId!, kind: 'damage', caption, fileName: photo.fileName, bytes: photo.bytes }, db, record);
    dto = stored.result!;
  } else {
    dto = await db.transaction().execute((trx) => record(trx, input.photoId ?? null));
  }
  kickMailDelivery();
  return dto;
}

async function checkPlace(actor: Actor, input: CreateRequestInput, trx: Db) {
  const site = await getSite(actor, input.siteId, trx);
  if (input.equipmentId) {
    const e = await getEquipment(actor, input.equipmentId, trx);
    if (e.siteId !== site.id) throw new AppError('validation_failed', 'That unit is on another site.', [{ path: 'equipmentId', message: 'Choose a unit on this site.' }]);
    // As the unit's flags say (canAskForService, canLogRequest): a removed unit takes no new work.
    if (e.status === 'removed') throw new AppError('validation_failed', 'That unit was removed.', [{ path: 'equipmentId', message: 'Choose a unit still in service, or ask for the site.' }]);
  }
  return site;
}

async function insertRequest(actor: Actor, input: CreateRequestInput, photoId: string | null, trx: Transaction<DB>): Promise<ServiceRequestDto> {
  const site = await checkPlace(actor, input, trx);
  if (photoId && photoId === input.photoId) {
    // An earlier upload named by id: the requester's own photo of this unit.
    const photo = await trx
      .selectFrom('photos')
      .select('id')
      .where('id', '=', photoId)
      .where('company_id', '=', actor.companyId)
      .where('uploaded_by', '=', actor.id)
      .$if(Boolean(input.equipmentId), (q) => q.where('equipment_id', '=', input.equipmentId!))
      .executeTakeFirst();
    if (!photo) throw new AppError('validation_failed', 'That photo was not found.', [{ path: 'photoId', message: 'Upload the photo again.' }]);
  }
  const row = await trx
    .insertInto('service_requests')
    .values({
      company_id: actor.companyId,
      site_id: site.id,
      equipment_id: input.equipmentId ?? null,
      requested_by: actor.id,
      description: input.description,
      urgency: input.urgency,
      photo_id: photoId,
    })
    .returning('id')
    .executeTakeFirstOrThrow();
  const created = await getRequest(actor, row.id, trx);
  const office = await trx
    .selectFrom('users')
    .select('email')
    .where('company_id', '=', actor.companyId)
    .where('role', 'in', ['office', 'admin'])
    .where('deactivated_at', 'is', null)
    .execute();
  const url = `${env.APP_URL}/requests/${row.id}`;
  const what = created.equipmentName ? `${created.equipmentName} at ${created.siteName}` : created.siteName;
  const photoLine = photoId ? 'A photo came with it; open the request to see it.' : '';
  await enqueueMail(
    {
      companyId: actor.companyId,
      kind: 'service_request',
      to: office.map((u) => u.email),
      subject: `${input.urgency === 'emergency' ? 'EMERGENCY — ' : ''}Service request: ${what}`,
      text: `${created.requestedByName} (${created.clientName}) asks for service.\n\nWhere: ${what}\nUrgency: ${urgencyLabels[input.urgency]}\n\n${input.description}\n\n${photoLine ? `${photoLine}\n` : ''}Open the request: ${url}\n`,
      html: `<p><strong>${escapeHtml(created.requestedByName)}</strong> (${escapeHtml(created.clientName)}) asks for service.</p><p>Where: ${escapeHtml(what)}<br>Urgency: ${escapeHtml(urgencyLabels[input.urgency])}</p><p>${escapeHtml(input.description)}</p>${photoLine ? `<p>${photoLine}</p>` : ''}<p><a href="${escapeHtml(url)}">Open the request in Rimeline</a></p>`,
    },
    trx,
  );
  await recordAudit(trx, actor, { action: 'create', entityType: 'service_request', entityId: row.id, after: created });
  return created;
}

export async function updateRequest(actor: Actor, id: string, input: UpdateRequestInput, db: Kysely<DB> = defaultDb): Promise<ServiceRequestDto> {
  assertCan(actor, 'requests.manage');
  return auditedChange(db, actor, { entityType: 'service_request', id }, (trx) => getRequest(actor, id, trx), async (trx, before) => {
    if (input.visitId) {
      const visit = await trx.selectFrom('visits').select('site_id').where('id', '=', input.visitId).where('company_id', '=', actor.companyId).executeTakeFirst();
      if (!visit || visit.site_id !== before.siteId) throw new AppError('validation_failed', 'Choose a visit at this site.', [{ path: 'visitId', message: 'That visit is not at this site.' }]);
    }
    await trx
      .updateTable('service_requests')
      .set({ status: input.status, ...changedColumns({ office_note: input.officeNote, visit_id: input.visitId }), updated_at: sql`now()` })
      .where('id', '=', id)
      .execute();
  });
}
