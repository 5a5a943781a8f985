import 'server-only';
import Papa from 'papaparse';
import { escapeFormulae } from '@/lib/equipment/csv-cells';
import { sql } from 'kysely';
import { db as defaultDb } from '@/db';
import { atVisibleSite, entryVisibleTo } from '@/lib/auth/scope';
import type { Db } from '@/db/types';
import { assertCan } from '@/lib/auth/access';
import type { Actor } from '@/lib/auth/actor';
import { getComplianceRules } from '@/lib/calc/compliance-rules';
import { yearlyTotals } from '@/lib/calc/refrigerant-totals';
import { serviceLifeOutlook, SERVICE_LIFE_SOURCE, type EquipmentType } from '@/lib/calc/service-life';
import { equipmentTypeLabels, conditionLabels, type Condition } from '@/lib/equipment/types';
import { AppError } from '@/lib/errors';
import { renderTablePdf, type TableReport } from '@/lib/reports/table-pdf';
import { getSite } from '@/lib/sites/service';
import { localDate } from '@/lib/format/dates';
import { formatPercent } from '@/lib/format/numbers';
import { formatDecimal } from '@/lib/calc/format';
import { formatQuantity, type UnitPrefs } from '@/lib/units/quantities';
import { leakActivityLabels, leakMethodLabels, leakResultLabels, type LeakData } from '@/lib/visits/schemas';


export interface ReportFile {
  filename: string;
  contentType: string;
  body: Uint8Array | string;
}

/** The site equipment report: every unit with its age, expected life, condition and open follow-ups. */
export async function siteEquipmentReport(actor: Actor, siteId: string, db: Db = defaultDb, today = new Date()): Promise<TableReport> {
  assertCan(actor, 'reports.read');
  const site = await getSite(actor, siteId, db);
  const rows = await db
    .selectFrom('equipment')
    .leftJoin('areas', 'areas.id', 'equipment.area_id')
    .leftJoin('systems', 'systems.id', 'equipment.system_id')
    .where('equipment.site_id', '=', site.id)
    .where('equipment.company_id', '=', actor.companyId)
    .where('equipment.deleted_at', 'is', null)
    .select((eb) => [
      'equipment.id',
      'equipment.name',
      'equipment.type',
      'equipment.make',
      'equipment.model',
      'equipment.serial',
      'equipment.installed_on',
      'equipment.condition',
      'equipment.status',
      'areas.name as area_name',
      'systems.name as system_name',
      eb.selectFrom('follow_ups').whereRef('follow_ups.equipment_id', '=', 'equipment.id').where('follow_ups.status', 'in', ['open', 'scheduled']).select(eb.fn.countAll<number>().as('n')).as('open_follow_ups'),
      eb
        .selectFrom('entries')
        .innerJoin('visits', 'visits.id', 'entries.visit_id')
        .whereRef('entries.equipment_id', '=', 'equipment.id')
        .where('visits.status', '=', 'closed')
        .select(sql<Date>`max(visits.started_at)`.as('m'))
        .as('last_service'),
    ])
    .orderBy('areas.name')
    .orderBy('equipment.name')
    .execute();
  // Days are the site's calendar days (a 7 PM visit in Denver is that day, not the next UTC one).
  const asOf = localDate(today, site.timeZone);
  return {
    title: `Site equipment report — ${site.name}`,
    facts: [
      ['Client', site.clientName],
      ['Site', site.name],
      ['As of', asOf],
      ['Units', String(rows.length)],
    ],
    columns: [
      { label: 'Unit', width: 16 },
      { label: 'Type', width: 12 },
      { label: 'Area', width: 10 },
      { label: 'System', width: 11 },
      { label: 'Make / model', width: 13 },
      { label: 'Serial', width: 10 },
      { label: 'Installed', width: 8 },
      { label: 'Age (y)', width: 5 },
      { label: 'Expected life (y)', width: 7 },
      { label: 'Outlook', width: 9 },
      { label: 'Condition', width: 8 },
      { label: 'Open follow-ups', width: 6 },
      { label: 'Last service', width: 8 },
    ],
    rows: rows.map((r) => {
      const outlook = r.installed_on
        ? serviceLifeOutlook({ equipmentType: r.type as EquipmentType, installedOn: r.installed_on, asOf, condition: (r.condition ?? undefined) as 1 | 2 | 3 | 4 | 5 | undefined })
        : null;
      return [
        r.name + (r.status === 'removed' ? ' (removed)' : ''),
        equipmentTypeLabels[r.type as EquipmentType] ?? r.type,
        r.area_name ?? '',
        r.system_name ?? '',
        [r.make, r.model].filter(Boolean).join(' '),
        r.serial ?? '',
        r.installed_on ?? '',
        outlook ? formatDecimal(outlook.ageYears, 1) : '',
        outlook?.medianYears ? String(outlook.medianYears) : '',
        outlook ? outlook.outlook.replace(/_/g, ' ') : 'unknown',
        r.condition ? `${r.condition} ${conditionLabels[r.condition as Condition]}` : 'not rated',
        String(Number(r.open_follow_ups ?? 0)),
        r.last_service ? localDate(new Date(r.last_service), site.timeZone) : '',
      ];
    }),
    notes: [
      `Expected service life: median years from ${SERVICE_LIFE_SOURCE}. Guidance, not a prediction.`,
      'Condition is rated by the technician from 1 (failing) to 5 (like new).',
    ],
  };
}

/** The yearly refrigerant report of one system: additions, recoveries, leak rates, leak work and totals. */
export async function refrigerantReport(actor: Actor, systemId: string, year: number, prefs: UnitPrefs, db: Db = defaultDb): Promise<TableReport> {
  assertCan(actor, 'reports.read');
  const system = await db
    .selectFrom('systems')
    .$call(atVisibleSite(actor, 'systems'))
    .innerJoin('clients', 'clients.id', 'sites.client_id')
    .where('systems.id', '=', systemId)
    .select(['systems.id', 'systems.name', 'systems.refrigerant', 'systems.full_charge_kg', 'systems.application', 'sites.name as site_name', 'sites.time_zone', 'clients.name as client_name'])
    .executeTakeFirst();
  if (!system) throw new AppError('not_found', 'System not found.');
  // The year is the site's calendar year: midnight of Jan 1 where the site is.
  const siteMidnight = (y: number) => sql<Date>`(${`${y}-01-01 00:00`}::timestamp at time zone ${system.time_zone})`;
  const from = siteMidnight(year);
  const to = siteMidnight(year + 1);
  const q = db
    .selectFrom('entries')
    .innerJoin('visits', 'visits.id', 'entries.visit_id')
    .innerJoin('users as tech', 'tech.id', 'entries.created_by')
    .where(entryVisibleTo(actor))
    .where('entries.system_id', '=', systemId)
    .where('entries.kind', 'in', ['refrigerant', 'leak'])
    .where('entries.voided_at', 'is', null)
    .where('entries.recorded_at', '>=', from)
    .where('entries.recorded_at', '<', to)
    .select(['entries.id', 'entries.kind', 'entries.recorded_at', 'entries.data', 'entries.computed', 'visits.id as visit_id', 'visits.reason', 'tech.name as tech_name'])
    .orderBy('entries.recorded_at')
    .orderBy('entries.id');
  const entries = await q.execute();
  const leakChecks = await db
    .selectFrom('visits')
    .innerJoin('entries', 'entries.visit_id', 'visits.id')
    .where('entries.system_id', '=', systemId)
    .where('visits.reason', '=', 'leak_check')
    .where('visits.status', '=', 'closed')
    .where('visits.started_at', '>=', from)
    .where('visits.started_at', '<', to)
    .select([sql<Date>`min(visits.started_at)`.as('at'), 'visits.id'])
    .groupBy('visits.id')
    .execute();
  const tx = entries
    .filter((e) => e.kind === 'refrigerant')
    .map((e) => ({ e, d: e.data as unknown as RefrigerantRecord }));
  const work = entries.filter((e) => e.kind === 'leak').map((e) => e.data as unknown as LeakRecord);
  const totals = yearlyTotals(
    tx.map(({ e, d }) => ({ systemId, refrigerant: d.refrigerant, date: localDate(e.recorded_at, system.time_zone), kind: d.direction, amount: d.amountKg, unit: 'kg' as const })),
    system.full_charge_kg ? { [systemId]: Number(system.full_charge_kg) } : {},
  ).bySystem.find((t) => t.year === year);
  const rules = getComplianceRules();
  return {
    title: `Refrigerant report ${year} — ${system.name}`,
    facts: [
      ['Client', system.client_name],
      ['Site', system.site_name],
      ['System', `${system.name} (${system.refrigerant}, ${system.application.replace(/_/g, ' ')})`],
      ['Full charge', system.full_charge_kg ? formatQuantity(Number(system.full_charge_kg), 'mass', prefs) : 'not recorded'],
      ['Added in the year', formatQuantity(totals?.addedKg ?? 0, 'mass', prefs)],
      ['Recovered in the year', formatQuantity(totals?.recoveredKg ?? 0, 'mass', prefs)],
      ['Added as share of full charge', totals?.addedPctOfCharge != null ? `${formatPercent(totals.addedPctOfCharge)}${totals.chronicLeaker ? ' — at or over 125 %: chronic leaker reporting applies' : ''}` : 'needs the full charge'],
      ['Leak work in the year', leakWorkCounts(work)],
      ['Leak-check visits', leakChecks.length ? leakChecks.map((v) => localDate(new Date(v.at), system.time_zone)).join(', ') : 'none recorded'],
    ],
    columns: [
      { label: 'Date', width: 8 },
      { label: 'Event', width: 11 },
      { label: 'Amount', width: 6 },
      { label: 'Refrigerant', width: 7 },
      { label: 'Cylinder', width: 7 },
      { label: 'Technician', width: 10 },
      { label: 'Certification', width: 8 },
      { label: 'Leak rate (annualized)', width: 8 },
      { label: 'Threshold', width: 7 },
      { label: 'Repair due', width: 8 },
      { label: 'Details', width: 25 },
    ],
    rows: entries.map((e) => {
      const day = localDate(e.recorded_at, system.time_zone);
      if (e.kind === 'leak') {
        const d = e.data as unknown as LeakRecord;
        return [day, leakActivityLabels[d.activity] ?? d.activity, '', '', '', e.tech_name, '', '', '', '', leakDetails(d, e.computed as RepairDeadline | null)];
      }
      const d = e.data as unknown as RefrigerantRecord;
      const leak = (e.computed as { leak?: LeakComputed | null } | null)?.leak ?? null;
      return [
        day,
        d.direction === 'added' ? 'Added' : 'Recovered',
        formatQuantity(d.amountKg, 'mass', prefs),
        d.refrigerant,
        d.cylinderId ?? '',
        e.tech_name,
        d.technicianCert ?? '',
        leak ? `${formatPercent(leak.ratePct)}${leak.exceedsThreshold ? ' OVER' : ''}` : '',
        leak ? `${leak.thresholdPct} %` : '',
        leak?.repairDueDate ?? '',
        '',
      ];
    }),
    notes: [
      'Leak rate: annualizing method of 40 CFR 82.152, computed on each addition; thresholds by application (82.157 / 84.106).',
      `Over the threshold, 40 CFR 82.157 asks for the leak to be repaired within ${rules.repairDays} days of the addition (${rules.repairDaysIprShutdown} with an industrial process shutdown), then an initial and a follow-up verification test; 40 CFR 84 Subpart C has parallel rules (from memory).`,
      `${rules.verification.initial} ${rules.verification.followUp} (The ${rules.verification.followUpDays}-day timing sometimes quoted for the follow-up test is from memory.)`,
      'Federal US rules only, summarised for guidance; state and local rules may be stricter. Records are kept without deletion.',
    ],
  };
}

interface RefrigerantRecord {
  direction: 'added' | 'recovered';
  amountKg: number;
  refrigerant: string;
  cylinderId?: string | null;
  technicianCert?: string | null;
}
interface LeakComputed {
  ratePct: number;
  thresholdPct: number;
  exceedsThreshold: boolean;
  repairDueDate: string | null;
}
type LeakRecord = Pick<LeakData, 'activity' | 'method' | 'result' | 'location' | 'note'>;
interface RepairDeadline {
  repairDueDate?: string;
  onTime?: boolean;
}

function leakWorkCounts(work: LeakRecord[]): string {
  const n = (f: (d: LeakRecord) => boolean) => work.filter(f).length;
  const failed = n((d) => d.activity !== 'inspection' && d.activity !== 'repair' && d.result === 'failed');
  return [
    `${n((d) => d.activity === 'inspection')} inspection(s), ${n((d) => d.activity === 'inspection' && d.result === 'leak_found')} finding a leak`,
    `${n((d) => d.activity === 'repair')} repair(s)`,
    `${n((d) => d.activity === 'initial_verification')} initial and ${n((d) => d.activity === 'follow_up_verification')} follow-up verification test(s)${failed ? `, ${failed} failed` : ''}`,
  ].join('; ');
}

function leakDetails(d: LeakRecord, c: RepairDeadline | null): string {
  const parts = [
    d.method ? leakMethodLabels[d.method] : null,
    d.result ? leakResultLabels[d.result] : null,
    d.location ? `at ${d.location}` : null,
    c?.repairDueDate ? `${c.onTime ? 'within' : 'AFTER'} the repair deadline ${c.repairDueDate}` : null,
    d.note ?? null,
  ];
  return parts.filter(Boolean).join('; ');
}

export async function reportFile(report: TableReport, format: 'csv' | 'pdf', basename: string): Promise<ReportFile> {
  if (format === 'csv') {
    const csv = Papa.unparse({ fields: report.columns.map((c) => c.label), data: report.rows }, { newline: '\r\n', escapeFormulae });
    const header = report.facts.map(([k, v]) => Papa.unparse([[`# ${k}`, v]], { escapeFormulae })).join('\r\n');
    return { filename: `${basename}.csv`, contentType: 'text/csv; charset=utf-8', body: `${header}\r\n${csv}\r\n` };
  }
  return { filename: `${basename}.pdf`, contentType: 'application/pdf', body: await renderTablePdf(report) };
}
