import 'server-only';
import { sql, type Kysely } from 'kysely';
import { db as defaultDb } from '@/db';
import { escapeLike } from '@/db/helpers';
import { seesSiteAccessNotes, siteVisibleTo } from '@/lib/auth/scope';
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
import { getClient } from '@/lib/clients/service';
import { AppError, foundOr404 } from '@/lib/errors';
import { toAreaDto, toSiteDto, type AreaDto, type SiteDto } from '@/lib/sites/dto';
import { siteFlags } from '@/lib/sites/permissions';
import type {
  CreateAreaInput,
  CreateSiteInput,
  ListSitesQuery,
  UpdateAreaInput,
  UpdateSiteInput,
} from '@/lib/sites/schemas';

function siteQuery(actor: Actor, db: Db) {
  return db
    .selectFrom('sites')
    .innerJoin('clients', 'clients.id', 'sites.client_id')
    .where(siteVisibleTo(actor))
    .select([
      'sites.id',
      'sites.client_id',
      'clients.name as client_name',
      'sites.name',
      'sites.address_line1',
      'sites.address_line2',
      'sites.city',
      'sites.region',
      'sites.postal_code',
      'sites.country',
      'sites.time_zone',
      'sites.elevation_m',
      'sites.access_notes',
      'sites.archived_at',
      'sites.created_at',
      'sites.updated_at',
      liveChildCount('sites').as('area_count'),
    ]);
}

export async function listSites(actor: Actor, query: ListSitesQuery, db: Db = defaultDb): Promise<Page<SiteDto>> {
  assertCan(actor, 'sites.read');
  let q = siteQuery(actor, db);
  if (query.clientId) q = q.where('sites.client_id', '=', query.clientId);
  q = q.where(archivedView('sites', query.archived));
  if (query.q) {
    const like = `%${escapeLike(query.q)}%`;
    q = q.where((eb) => eb.or([eb('sites.name', 'ilike', like), eb('sites.city', 'ilike', like), eb('clients.name', 'ilike', like)]));
  }
  return keysetPage(q, byName('sites'), query, siteDtoFor(actor));
}

export async function getSite(actor: Actor, id: string, db: Db = defaultDb): Promise<SiteDto> {
  assertCan(actor, 'sites.read');
  const row = foundOr404(await siteQuery(actor, db).where('sites.id', '=', id).executeTakeFirst(), 'Site not found.');
  return siteDtoFor(actor)(row);
}

/** What this actor sees of a site: the page and GET /api/sites/:id alike (lib/auth/scope.ts). */
function siteDtoFor(actor: Actor) {
  return (row: Parameters<typeof toSiteDto>[0]): SiteDto => {
    const facts = toSiteDto(row);
    const dto = { ...facts, ...siteFlags(actor, facts) };
    return seesSiteAccessNotes(actor) ? dto : { ...dto, accessNotes: null };
  };
}

export async function createSite(actor: Actor, input: CreateSiteInput, db: Kysely<DB> = defaultDb): Promise<SiteDto> {
  assertCan(actor, 'sites.write');
  return auditedCreate(db, actor, 'site', async (trx) => {
    const client = await getClient(actor, input.clientId, trx).catch(() => {
      throw new AppError('validation_failed', 'Choose a client.', [{ path: 'clientId', message: 'This client does not exist.' }]);
    });
    if (client.archivedAt) throw new AppError('validation_failed', 'This client is archived.', [{ path: 'clientId', message: 'Restore the client first.' }]);
    const row = await trx
      .insertInto('sites')
      .values({
        company_id: actor.companyId,
        client_id: input.clientId,
        name: input.name,
        address_line1: input.addressLine1 ?? null,
        address_line2: input.addressLine2 ?? null,
        city: input.city ?? null,
        region: input.region ?? null,
        postal_code: input.postalCode ?? null,
        country: input.country,
        time_zone: input.timeZone,
        elevation_m: input.elevationM,
        access_notes: input.accessNotes ?? null,
      })
      .returning('id')
      .executeTakeFirstOrThrow();
    return row.id;
  }, (trx, id) => getSite(actor, id, trx));
}

export async function updateSite(actor: Actor, id: string, input: UpdateSiteInput, db: Kysely<DB> = defaultDb): Promise<SiteDto> {
  assertCan(actor, 'sites.write');
  const set = changedColumns({
    name: input.name,
    address_line1: input.addressLine1,
    address_line2: input.addressLine2,
    city: input.city,
    region: input.region,
    postal_code: input.postalCode,
    country: input.country,
    time_zone: input.timeZone,
    elevation_m: input.elevationM,
    access_notes: input.accessNotes,
  });
  return auditedChange(db, actor, { entityType: 'site', id }, (trx) => getSite(actor, id, trx), (trx) =>
    trx.updateTable('sites').set({ ...set, updated_at: sql`now()` }).where('id', '=', id).where('company_id', '=', actor.companyId).execute(),
  );
}

export async function setSiteArchived(actor: Actor, id: string, archived: boolean, db: Kysely<DB> = defaultDb): Promise<SiteDto> {
  assertCan(actor, 'sites.write');
  return setArchived(db, actor, { table: 'sites', entityType: 'site', id }, archived, (trx) => getSite(actor, id, trx));
}

export async function listAreas(actor: Actor, siteId: string, includeArchived = false, db: Db = defaultDb): Promise<AreaDto[]> {
  assertCan(actor, 'areas.read');
  await getSite(actor, siteId, db);
  let q = db.selectFrom('areas').selectAll().where('site_id', '=', siteId).where('company_id', '=', actor.companyId);
  if (!includeArchived) q = q.where('archived_at', 'is', null);
  return (await q.orderBy('name').execute()).map(toAreaDto);
}

async function getAreaRow(actor: Actor, siteId: string, areaId: string, db: Db) {
  await getSite(actor, siteId, db);
  const row = await db
    .selectFrom('areas')
    .selectAll()
    .where('id', '=', areaId)
    .where('site_id', '=', siteId)
    .where('company_id', '=', actor.companyId)
    .executeTakeFirst();
  if (!row) throw new AppError('not_found', 'Area not found.');
  return row;
}

/** An area as its DTO, read within a change's transaction (also checks the caller sees the site). */
function readArea(actor: Actor, siteId: string, areaId: string) {
  return async (trx: Db) => toAreaDto(await getAreaRow(actor, siteId, areaId, trx));
}

export async function createArea(actor: Actor, siteId: string, input: CreateAreaInput, db: Kysely<DB> = defaultDb): Promise<AreaDto> {
  assertCan(actor, 'areas.write');
  return db.transaction().execute(async (trx) => {
    await getSite(actor, siteId, trx);
    const row = await trx
      .insertInto('areas')
      .values({ company_id: actor.companyId, site_id: siteId, name: input.name, kind: input.kind, notes: input.notes ?? null })
      .returningAll()
      .executeTakeFirstOrThrow();
    const dto = toAreaDto(row);
    await recordAudit(trx, actor, { action: 'create', entityType: 'area', entityId: row.id, after: dto });
    return dto;
  });
}

export async function updateArea(actor: Actor, siteId: string, areaId: string, input: UpdateAreaInput, db: Kysely<DB> = defaultDb): Promise<AreaDto> {
  assertCan(actor, 'areas.write');
  return auditedChange(db, actor, { entityType: 'area', id: areaId }, readArea(actor, siteId, areaId), (trx) =>
    trx
      .updateTable('areas')
      .set({ ...changedColumns({ name: input.name, kind: input.kind, notes: input.notes }), updated_at: sql`now()` })
      .where('id', '=', areaId)
      .execute(),
  );
}

export async function setAreaArchived(actor: Actor, siteId: string, areaId: string, archived: boolean, db: Kysely<DB> = defaultDb): Promise<AreaDto> {
  assertCan(actor, 'areas.write');
  const action = archived ? 'archive' : 'restore';
  return auditedChange(db, actor, { entityType: 'area', id: areaId, action }, readArea(actor, siteId, areaId), (trx) =>
    trx
      .updateTable('areas')
      .set({ archived_at: archived ? sql`coalesce(archived_at, now())` : null, updated_at: sql`now()` })
      .where('id', '=', areaId)
      .execute(),
  );
}
