// The kept no-cooling visit rows behind "no cooling twice within 90 days" (table
// no_cooling_visits, migration 2026_12_05_0800): after each change that can alter what someone
// sees (a visit's entries added, the visit closed, reopened and closed again, an entry voided, a
// visit of another reason, the 90-day window moving on) the attention list says what grouping
// every visible visit's entries says, for staff (open visits count) and for the owner (closed
// visits only).
import { sql } from 'kysely';
import { describe, it, vi } from 'vitest';
import { needsAttention } from '@/lib/attention/service';
import type { Actor } from '@/lib/auth/actor';
import { visitVisibleTo } from '@/lib/auth/scope';
import { closeVisit } from '@/lib/visits/close';
import { voidEntry } from '@/lib/visits/entries';
import { reopenVisit, startVisit } from '@/lib/visits/service';
import { createTestDb } from '@/tests/helpers/db';
import { ago, DAY, expectBothAudiences, expectRebuildKeepsRows, rate, ratedVisitDemo } from '@/tests/helpers/kept-rows';
import { mockAuthModule } from '@/tests/helpers/session';

vi.mock('@/lib/auth', () => mockAuthModule());

const db = createTestDb();
const demo = ratedVisitDemo(db, { reason: 'no_cooling', days: 40, evaporator: 3, condensingUnit: 4, summary: 'Iced coil; defrost reset.' });

/** What the attention list says had no cooling twice on the circuit's site: unit, then its visits. */
async function listed(actor: Actor, today: Date): Promise<string[]> {
  const units = await needsAttention(actor, demo.circuit.siteId, db, today);
  return units.flatMap((u) => u.signals.flatMap((s) => (s.kind === 'repeat_no_cooling' ? [`${u.equipmentId} ${s.visitIds.join(',')}`] : []))).sort();
}

/** The same, grouped from every visible no-cooling visit's entries (the query the kept rows replace). */
async function grouped(actor: Actor, today: Date): Promise<string[]> {
  const rows = await db
    .selectFrom('visits')
    .innerJoin('sites', 'sites.id', 'visits.site_id')
    .innerJoin('entries', 'entries.visit_id', 'visits.id')
    .where(visitVisibleTo(actor))
    .where('visits.reason', '=', 'no_cooling')
    .where('visits.started_at', '>', new Date(today.getTime() - 90 * DAY))
    .where('entries.equipment_id', 'in', (eb) => eb.selectFrom('equipment').select('equipment.id').where('equipment.site_id', '=', demo.circuit.siteId))
    .select(['entries.equipment_id as id', sql<string[]>`array_agg(distinct visits.id::text)`.as('visit_ids')])
    .groupBy('entries.equipment_id')
    .having(sql<boolean>`count(distinct visits.id) >= 2`)
    .execute();
  return rows.map((r) => `${r.id} ${r.visit_ids.join(',')}`).sort();
}

const expectBoth = (staff: string[], ownerSees: string[], today = new Date()) =>
  expectBothAudiences(demo, { listed: (a) => listed(a, today), replaced: (a) => grouped(a, today) }, staff, ownerSees);

let second: string;
let secondEntry: string;
const both = () => [demo.first, second].sort().join(',');

describe('no cooling twice within 90 days, from the kept rows', () => {
  it('one no-cooling visit is not a repeat', async () => {
    await expectBoth([], []);
  });

  it('a second one, still open, counts for staff only', async () => {
    second = (await startVisit(demo.tech, { siteId: demo.circuit.siteId, reason: 'no_cooling', startedAt: ago(3) })).id;
    secondEntry = (await rate(demo.tech, second, demo.circuit.evaporatorId, 2, 3)).id;
    await expectBoth([`${demo.circuit.evaporatorId} ${both()}`], []);
  });

  it('closing it shows it to the owner', async () => {
    await closeVisit(demo.tech, second, { summary: 'Fan motor seized.', confirmBypassRemoved: false });
    await expectBoth([`${demo.circuit.evaporatorId} ${both()}`], [`${demo.circuit.evaporatorId} ${both()}`]);
  });

  it('reopening hides it from the owner again; closing it again shows it', async () => {
    await reopenVisit(demo.office, second);
    await expectBoth([`${demo.circuit.evaporatorId} ${both()}`], []);
    await closeVisit(demo.tech, second, { summary: 'Fan motor replaced.', confirmBypassRemoved: false });
    await expectBoth([`${demo.circuit.evaporatorId} ${both()}`], [`${demo.circuit.evaporatorId} ${both()}`]);
  });

  it('a voided entry still ties its visit to the unit, as the grouped query counts it', async () => {
    await reopenVisit(demo.office, second);
    await voidEntry(demo.tech, secondEntry, 'Rated the wrong evaporator.');
    await closeVisit(demo.tech, second, { summary: 'Fan motor replaced.', confirmBypassRemoved: false });
    await expectBoth([`${demo.circuit.evaporatorId} ${both()}`], [`${demo.circuit.evaporatorId} ${both()}`]);
  });

  it('a visit for another reason adds nothing', async () => {
    const other = (await startVisit(demo.tech, { siteId: demo.circuit.siteId, reason: 'maintenance', startedAt: ago(2) })).id;
    await rate(demo.tech, other, demo.circuit.condensingUnitId, 4, 2);
    await closeVisit(demo.tech, other, { summary: 'Routine check.', confirmBypassRemoved: false });
    await expectBoth([`${demo.circuit.evaporatorId} ${both()}`], [`${demo.circuit.evaporatorId} ${both()}`]);
  });

  it('once the first visit is more than 90 days back, the unit drops off both lists', async () => {
    const later = new Date(Date.now() + 55 * DAY);
    await expectBoth([], [], later);
  });

  it('keeps one row per unit and audience, rebuilt by the migration exactly as the triggers left it', async () => {
    await expectRebuildKeepsRows(db, 'no_cooling_visits');
  });
});
