import 'server-only';
// Scheduling around the plans: the office's today, a technician's coming week, who can be planned.
import { db as defaultDb } from '@/db';
import type { Db } from '@/db/types';
import { assertCan } from '@/lib/auth/access';
import type { Actor } from '@/lib/auth/actor';
import { localDate } from '@/lib/format/dates';
import { addDays } from '@/lib/plans/days';
import type { PlanDto } from '@/lib/plans/dto';
import { listPlans } from '@/lib/plans/service';

/**
 * The office's today for the week view: the calendar day in the time zone most of the company's
 * sites use (the office has no clock of its own here; UTC's day is wrong for an evening in the
 * Americas). A company without sites falls back to UTC.
 */
export async function officeToday(actor: Actor, db: Db = defaultDb, now = new Date()): Promise<string> {
  const row = await db
    .selectFrom('sites')
    .where('sites.company_id', '=', actor.companyId)
    .where('sites.archived_at', 'is', null)
    .select(['sites.time_zone', (eb) => eb.fn.countAll<number>().as('n')])
    .groupBy('sites.time_zone')
    .orderBy('n', 'desc')
    .orderBy('sites.time_zone')
    .executeTakeFirst();
  return localDate(now, row?.time_zone ?? 'UTC');
}

/** A technician's planned visits not yet started: overdue ones, today's, and the next `days` days. */
export async function plansForTechnician(actor: Actor, days = 7, db: Db = defaultDb, now = new Date()): Promise<PlanDto[]> {
  const today = now.toISOString().slice(0, 10);
  // A day either side of UTC's today covers every site's calendar; overdue ones go back 60 days.
  const page = await listPlans(actor, { technicianId: actor.id, status: ['planned'], from: addDays(today, -60), to: addDays(today, days + 1), limit: 200 }, db, now);
  return page.items.filter((p) => p.day <= addDays(p.siteToday, days));
}

/** Active technicians of the company, for the plan and move forms. */
export async function listPlanTechnicians(actor: Actor, db: Db = defaultDb): Promise<{ id: string; name: string }[]> {
  assertCan(actor, 'plans.write');
  return db
    .selectFrom('users')
    .select(['id', 'name'])
    .where('company_id', '=', actor.companyId)
    .where('role', '=', 'technician')
    .where('deactivated_at', 'is', null)
    .orderBy('name')
    .execute();
}
