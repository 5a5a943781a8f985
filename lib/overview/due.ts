import 'server-only';
import { sql, type ExpressionBuilder } from 'kysely';
import { db as defaultDb } from '@/db';
import { siteVisibleTo } from '@/lib/auth/scope';
import type { Db } from '@/db/types';
import type { DB } from '@/db/schema.gen';
import { assertCan } from '@/lib/auth/access';
import type { Actor } from '@/lib/auth/actor';
import { getRefrigerant } from '@/lib/calc/refrigerants';
import { plannedCover } from '@/lib/plans/coverage';
import type { VisitReason } from '@/lib/visits/terms';
import { formatTonnesCo2e } from '@/lib/format/numbers';

const DAY_MS = 86_400_000;

export interface DueItem {
  systemId: string;
  systemName: string;
  siteId: string;
  siteName: string;
  clientName: string;
  kind: 'maintenance' | 'leak_inspection';
  lastDoneAt: string | null;
  dueOn: string;
  overdueDays: number;
  /** Why it is due: the interval and its basis. */
  basis: string;
  /** A planned visit that covers it: then it counts as planned, not as due. */
  planned: { planId: string; day: string; technicianName: string } | null;
}

/** The visit reasons whose closed visit does the work: it counts as done, and a planned one covers it. */
const reasonsCovering: Record<DueItem['kind'], readonly VisitReason[]> = {
  maintenance: ['maintenance'],
  leak_inspection: ['leak_check', 'maintenance', 'inspection'],
};

/** When a closed visit for one of `reasons` last recorded something on the system (its start). */
function lastClosedVisit(eb: ExpressionBuilder<DB, 'systems'>, reasons: readonly VisitReason[]) {
  return eb
    .selectFrom('visits')
    .innerJoin('entries', 'entries.visit_id', 'visits.id')
    .whereRef('entries.system_id', '=', 'systems.id')
    .where('visits.reason', 'in', reasons)
    .where('visits.status', '=', 'closed')
    .select(sql<Date>`max(visits.started_at)`.as('m'));
}

/**
 * Periodic leak checks by charge in tonnes CO2-equivalent (charge × GWP), as in the EU F-gas
 * regulation 2024/573 (TRADE-REFERENCE §6.4; intervals from memory, confirm locally). US federal
 * rules set no fixed interval below the automatic-leak-detection size; local rules may.
 */
export function leakCheckIntervalMonths(chargeKg: number, gwp: number): number | null {
  const tonnesCo2e = (chargeKg * gwp) / 1000;
  if (tonnesCo2e >= 500) return 3;
  if (tonnesCo2e >= 50) return 6;
  if (tonnesCo2e >= 5) return 12;
  return null;
}

/** Maintenance by each system's interval, and leak inspections by rule; overdue first. */
export async function dueWork(actor: Actor, db: Db = defaultDb, today = new Date()): Promise<DueItem[]> {
  assertCan(actor, 'due.read');
  const systems = await db
    .selectFrom('systems')
    .innerJoin('sites', 'sites.id', 'systems.site_id')
    .innerJoin('clients', 'clients.id', 'sites.client_id')
    .where(siteVisibleTo(actor))
    .where('systems.archived_at', 'is', null)
    .where('sites.archived_at', 'is', null)
    .select((eb) => [
      'systems.id',
      'systems.name',
      'systems.refrigerant',
      'systems.full_charge_kg',
      'systems.maintenance_interval_days',
      'systems.created_at',
      'sites.id as site_id',
      'sites.name as site_name',
      'clients.name as client_name',
      lastClosedVisit(eb, reasonsCovering.maintenance).as('last_maintenance'),
      lastClosedVisit(eb, reasonsCovering.leak_inspection).as('last_leak_check'),
      // A leak inspection or verification test recorded on any visit counts as a check too.
      eb
        .selectFrom('entries')
        .innerJoin('visits', 'visits.id', 'entries.visit_id')
        .whereRef('entries.system_id', '=', 'systems.id')
        .where('entries.kind', '=', 'leak')
        .where('entries.voided_at', 'is', null)
        .where(sql<string>`entries.data->>'activity'`, 'in', ['inspection', 'initial_verification', 'follow_up_verification'])
        .where('visits.status', '=', 'closed')
        .select(sql<Date>`max(entries.recorded_at)`.as('m'))
        .as('last_leak_work'),
    ])
    .execute();
  const items: DueItem[] = [];
  const push = (s: (typeof systems)[number], kind: DueItem['kind'], last: Date | null, intervalDays: number, basis: string) => {
    const from = last ?? s.created_at;
    const due = new Date(new Date(from).getTime() + intervalDays * DAY_MS);
    const daysLeft = Math.floor((due.getTime() - today.getTime()) / DAY_MS);
    if (daysLeft > 30) return;
    items.push({
      systemId: s.id,
      systemName: s.name,
      siteId: s.site_id,
      siteName: s.site_name,
      clientName: s.client_name,
      kind,
      lastDoneAt: last ? new Date(last).toISOString() : null,
      dueOn: due.toISOString().slice(0, 10),
      overdueDays: Math.max(0, -daysLeft),
      basis,
      planned: null,
    });
  };
  for (const s of systems) {
    if (s.maintenance_interval_days) push(s, 'maintenance', s.last_maintenance ? new Date(s.last_maintenance) : null, s.maintenance_interval_days, `Every ${s.maintenance_interval_days} days (this system's maintenance interval)`);
    if (s.full_charge_kg) {
      const gwp = getRefrigerant(s.refrigerant).gwpEu517;
      const months = leakCheckIntervalMonths(Number(s.full_charge_kg), gwp);
      if (months) {
        const tonnes = formatTonnesCo2e((Number(s.full_charge_kg) * gwp) / 1000);
        const checks = [s.last_leak_check, s.last_leak_work].filter(Boolean).map((d) => new Date(d!).getTime());
        push(s, 'leak_inspection', checks.length ? new Date(Math.max(...checks)) : null, Math.round(months * 30.44), `Leak check every ${months} months for ${tonnes} (charge × GWP as EU 517/2014 counts it), per the F-gas rule table — confirm the rule that applies locally`);
      }
    }
  }
  const cover = await plannedCover(actor, [...new Set(items.map((i) => i.systemId))], db);
  for (const item of items) {
    const plan = cover.find((c) => c.systemId === item.systemId && reasonsCovering[item.kind].includes(c.reason));
    if (plan) item.planned = { planId: plan.planId, day: plan.day, technicianName: plan.technicianName };
  }
  return items.sort((a, b) => b.overdueDays - a.overdueDays || a.dueOn.localeCompare(b.dueOn));
}
