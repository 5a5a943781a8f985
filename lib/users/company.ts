import 'server-only';
// The company's own settings: name, service phone, label line, default units, photo and mail choices.
import { sql, type Kysely } from 'kysely';
import { db as defaultDb } from '@/db';
import type { DB } from '@/db/schema.gen';
import type { Db } from '@/db/types';
import { assertCan } from '@/lib/auth/access';
import type { Actor } from '@/lib/auth/actor';
import { recordAudit } from '@/lib/audit/service';
import type { CompanyDto } from '@/lib/users/dto';
import type { UpdateCompanyInput } from '@/lib/users/schemas';

function toCompanyDto(row: {
  id: string;
  name: string;
  service_phone: string | null;
  label_line: string | null;
  default_units: string;
  keep_photo_location: boolean;
  mail_visit_plans: boolean;
}): CompanyDto {
  return {
    id: row.id,
    name: row.name,
    servicePhone: row.service_phone,
    labelLine: row.label_line,
    defaultUnits: row.default_units as CompanyDto['defaultUnits'],
    keepPhotoLocation: row.keep_photo_location,
    mailVisitPlans: row.mail_visit_plans,
  };
}

export async function getCompany(actor: Actor, db: Db = defaultDb): Promise<CompanyDto> {
  const row = await db.selectFrom('companies').selectAll().where('id', '=', actor.companyId).executeTakeFirstOrThrow();
  return toCompanyDto(row);
}

export async function updateCompany(actor: Actor, input: UpdateCompanyInput, db: Kysely<DB> = defaultDb): Promise<CompanyDto> {
  assertCan(actor, 'company.settings');
  return db.transaction().execute(async (trx) => {
    const before = await getCompany(actor, trx);
    const row = await trx
      .updateTable('companies')
      .set({
        ...(input.name !== undefined ? { name: input.name } : {}),
        ...(input.servicePhone !== undefined ? { service_phone: input.servicePhone || null } : {}),
        ...(input.labelLine !== undefined ? { label_line: input.labelLine || null } : {}),
        ...(input.defaultUnits !== undefined ? { default_units: input.defaultUnits } : {}),
        ...(input.keepPhotoLocation !== undefined ? { keep_photo_location: input.keepPhotoLocation } : {}),
        ...(input.mailVisitPlans !== undefined ? { mail_visit_plans: input.mailVisitPlans } : {}),
        updated_at: sql`now()`,
      })
      .where('id', '=', actor.companyId)
      .returningAll()
      .executeTakeFirstOrThrow();
    const after = toCompanyDto(row);
    await recordAudit(trx, actor, { action: 'update', entityType: 'company', entityId: actor.companyId, before, after });
    return after;
  });
}
