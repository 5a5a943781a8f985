import 'server-only';
import { sql, type Kysely } from 'kysely';
import { db as defaultDb } from '@/db';
import { escapeLike } from '@/db/helpers';
import { clientVisibleTo } from '@/lib/auth/scope';
import type { DB } from '@/db/schema.gen';
import type { Db } from '@/db/types';
import type { Page } from '@/lib/api/cursor';
import { byName, keysetPage } from '@/lib/api/paging';
import { assertCan } from '@/lib/auth/access';
import type { Actor } from '@/lib/auth/actor';
import { archivedView, liveChildCount, setArchived } from '@/lib/audit/archive';
import { auditedChange, auditedCreate } from '@/lib/audit/change';
import { recordAudit } from '@/lib/audit/service';
import { changedColumns } from '@/lib/changed-columns';
import { toClientFacts, toContactDto, type ClientDto, type ContactDto } from '@/lib/clients/dto';
import { clientFlags } from '@/lib/clients/permissions';
import type {
  CreateClientInput,
  CreateContactInput,
  ListClientsQuery,
  UpdateClientInput,
  UpdateContactInput,
} from '@/lib/clients/schemas';
import { AppError, foundOr404 } from '@/lib/errors';

/** What this actor sees of a client, with what they may do on it: the page and the API alike. */
function clientDtoFor(actor: Actor) {
  return (row: Parameters<typeof toClientFacts>[0]): ClientDto => {
    const facts = toClientFacts(row);
    return { ...facts, ...clientFlags(actor, facts) };
  };
}

function clientQuery(actor: Actor, db: Db) {
  return db
    .selectFrom('clients')
    .where(clientVisibleTo(actor))
    .select([
      'clients.id',
      'clients.name',
      'clients.notes',
      'clients.archived_at',
      'clients.created_at',
      'clients.updated_at',
      liveChildCount('clients').as('site_count'),
    ]);
}

export async function listClients(actor: Actor, query: ListClientsQuery, db: Db = defaultDb): Promise<Page<ClientDto>> {
  assertCan(actor, 'clients.read');
  let q = clientQuery(actor, db);
  q = q.where(archivedView('clients', query.archived));
  if (query.q) q = q.where('clients.name', 'ilike', `%${escapeLike(query.q)}%`);
  return keysetPage(q, byName('clients'), query, clientDtoFor(actor));
}

export async function getClient(actor: Actor, id: string, db: Db = defaultDb): Promise<ClientDto> {
  assertCan(actor, 'clients.read');
  const row = foundOr404(await clientQuery(actor, db).where('clients.id', '=', id).executeTakeFirst(), 'Client not found.');
  return clientDtoFor(actor)(row);
}

export async function createClient(actor: Actor, input: CreateClientInput, db: Kysely<DB> = defaultDb): Promise<ClientDto> {
  assertCan(actor, 'clients.write');
  const insert = async (trx: Db) =>
    (await trx.insertInto('clients').values({ company_id: actor.companyId, name: input.name, notes: input.notes ?? null }).returning('id').executeTakeFirstOrThrow()).id;
  return auditedCreate(db, actor, 'client', insert, (trx, id) => getClient(actor, id, trx));
}

export async function updateClient(actor: Actor, id: string, input: UpdateClientInput, db: Kysely<DB> = defaultDb): Promise<ClientDto> {
  assertCan(actor, 'clients.write');
  return auditedChange(db, actor, { entityType: 'client', id }, (trx) => getClient(actor, id, trx), (trx) =>
    trx
      .updateTable('clients')
      .set({ ...changedColumns({ name: input.name, notes: input.notes }), updated_at: sql`now()` })
      .where('id', '=', id)
      .where('company_id', '=', actor.companyId)
      .execute(),
  );
}

export async function setClientArchived(actor: Actor, id: string, archived: boolean, db: Kysely<DB> = defaultDb): Promise<ClientDto> {
  assertCan(actor, 'clients.write');
  return setArchived(db, actor, { table: 'clients', entityType: 'client', id }, archived, (trx) => getClient(actor, id, trx));
}

export async function listContacts(actor: Actor, clientId: string, db: Db = defaultDb): Promise<ContactDto[]> {
  assertCan(actor, 'contacts.read');
  await getClient(actor, clientId, db);
  const rows = await db
    .selectFrom('client_contacts')
    .selectAll()
    .where('client_id', '=', clientId)
    .where('company_id', '=', actor.companyId)
    .orderBy('name')
    .execute();
  return rows.map(toContactDto);
}

async function getContactRow(actor: Actor, clientId: string, contactId: string, db: Db) {
  const row = await db
    .selectFrom('client_contacts')
    .selectAll()
    .where('id', '=', contactId)
    .where('client_id', '=', clientId)
    .where('company_id', '=', actor.companyId)
    .executeTakeFirst();
  if (!row) throw new AppError('not_found', 'Contact not found.');
  return row;
}

export async function createContact(actor: Actor, clientId: string, input: CreateContactInput, db: Kysely<DB> = defaultDb): Promise<ContactDto> {
  assertCan(actor, 'contacts.write');
  return db.transaction().execute(async (trx) => {
    await getClient(actor, clientId, trx);
    const row = await trx
      .insertInto('client_contacts')
      .values({
        company_id: actor.companyId,
        client_id: clientId,
        name: input.name,
        email: input.email ?? null,
        phone: input.phone ?? null,
        title: input.title ?? null,
        receives_reports: input.receivesReports,
      })
      .returningAll()
      .executeTakeFirstOrThrow();
    const dto = toContactDto(row);
    await recordAudit(trx, actor, { action: 'create', entityType: 'client_contact', entityId: row.id, after: dto });
    return dto;
  });
}

export async function updateContact(
  actor: Actor,
  clientId: string,
  contactId: string,
  input: UpdateContactInput,
  db: Kysely<DB> = defaultDb,
): Promise<ContactDto> {
  assertCan(actor, 'contacts.write');
  const read = async (trx: Db) => toContactDto(await getContactRow(actor, clientId, contactId, trx));
  return auditedChange(db, actor, { entityType: 'client_contact', id: contactId }, read, (trx) =>
    trx
      .updateTable('client_contacts')
      .set({
        ...changedColumns({ name: input.name, email: input.email, phone: input.phone, title: input.title, receives_reports: input.receivesReports }),
        updated_at: sql`now()`,
      })
      .where('id', '=', contactId)
      .execute(),
  );
}

export async function deleteContact(actor: Actor, clientId: string, contactId: string, db: Kysely<DB> = defaultDb): Promise<void> {
  assertCan(actor, 'contacts.write');
  await db.transaction().execute(async (trx) => {
    const before = toContactDto(await getContactRow(actor, clientId, contactId, trx));
    await trx.deleteFrom('client_contacts').where('id', '=', contactId).execute();
    await recordAudit(trx, actor, { action: 'delete', entityType: 'client_contact', entityId: contactId, before });
  });
}
