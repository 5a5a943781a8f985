// The kept last-two-ratings rows behind "condition worse at the last rating than at the one
// before" (table condition_trends, migration 2026_12_05_0430): after each change that can alter a
// rating someone sees (a rating added, a visit closed, an entry voided, a visit reopened and a
// new rating, a unit moved) the attention list says what ranking every visible rating says, for
// staff (open visits count) and for the owner (closed visits only).
import { sql } from 'kysely';
import { describe, it, vi } from 'vitest';
import { needsAttention } from '@/lib/attention/service';
import type { Actor } from '@/lib/auth/actor';
import { entryVisibleTo } from '@/lib/auth/scope';
import { updateEquipment } from '@/lib/equipment/service';
import { createArea } from '@/lib/sites/service';
import { closeVisit } from '@/lib/visits/close';
import { voidEntry } from '@/lib/visits/entries';
import { reopenVisit, startVisit } from '@/lib/visits/service';
import { createTestDb } from '@/tests/helpers/db';
import { ago, expectBothAudiences, expectRebuildKeepsRows, rate, ratedVisitDemo } from '@/tests/helpers/kept-rows';
import { mockAuthModule } from '@/tests/helpers/session';

vi.mock('@/lib/auth', () => mockAuthModule());

const db = createTestDb();
const demo = ratedVisitDemo(db, { reason: 'maintenance', days: 30, evaporator: 4, condensingUnit: 3, summary: 'Routine check.' });

/** What the attention list says got worse on the circuit's site: unit, from, to, visit. */
async function listed(actor: Actor): Promise<string[]> {
  const units = await needsAttention(actor, demo.circuit.siteId);
  return units
    .flatMap((u) => u.signals.flatMap((s) => (s.kind === 'condition_worsening' ? [`${u.equipmentId} ${s.from}->${s.to} ${s.visitId}`] : [])))
    .sort();
}

/** The same, ranked from every rating the actor may see (the query the kept rows replace). */
async function ranked(actor: Actor): Promise<string[]> {
  const rows = await db
    .with('r', (w) =>
      w
        .selectFrom('entries')
        .innerJoin('equipment', 'equipment.id', 'entries.equipment_id')
        .where(entryVisibleTo(actor))
        .where('entries.kind', '=', 'condition')
        .where('entries.voided_at', 'is', null)
        .where('equipment.site_id', '=', demo.circuit.siteId)
        .select([
          'entries.equipment_id',
          'entries.visit_id',
          sql<number>`(entries.data->>'rating')::int`.as('rating'),
          sql<number>`row_number() over (partition by entries.equipment_id order by entries.recorded_at desc, entries.id desc)`.as('n'),
        ]),
    )
    .selectFrom('r as latest')
    .innerJoin('r as previous', (j) => j.onRef('previous.equipment_id', '=', 'latest.equipment_id').on('previous.n', '=', 2))
    .where('latest.n', '=', 1)
    .whereRef('latest.rating', '<', 'previous.rating')
    .select(['latest.equipment_id', 'latest.visit_id', 'latest.rating as to', 'previous.rating as from'])
    .execute();
  return rows.map((r) => `${r.equipment_id} ${r.from}->${r.to} ${r.visit_id}`).sort();
}

const expectBoth = (staff: string[], ownerSees: string[]) => expectBothAudiences(demo, { listed, replaced: ranked }, staff, ownerSees);

let second: string;
let worseEntry: string;

describe('condition got worse, from the kept rows', () => {
  it('a worse rating in an open visit counts for staff only', async () => {
    second = (await startVisit(demo.tech, { siteId: demo.circuit.siteId, reason: 'no_cooling', startedAt: ago(3) })).id;
    worseEntry = (await rate(demo.tech, second, demo.circuit.evaporatorId, 2, 3)).id;
    // Better is not worse: the condensing unit went from 3 to 5.
    await rate(demo.tech, second, demo.circuit.condensingUnitId, 5, 3);
    await expectBoth([`${demo.circuit.evaporatorId} 4->2 ${second}`], []);
  });

  it('closing the visit shows it to the owner', async () => {
    await closeVisit(demo.tech, second, { summary: 'Fan motor worn.', confirmBypassRemoved: false });
    await expectBoth([`${demo.circuit.evaporatorId} 4->2 ${second}`], [`${demo.circuit.evaporatorId} 4->2 ${second}`]);
  });

  it('voiding the worse rating takes it off both lists', async () => {
    await voidEntry(demo.tech, worseEntry, 'Rated the wrong evaporator.');
    await expectBoth([], []);
  });

  it('reopening hides the visit from the owner again, and a new rating there counts for staff at once', async () => {
    await reopenVisit(demo.office, second);
    await rate(demo.tech, second, demo.circuit.evaporatorId, 1, 2);
    // The owner sees only the first visit's rating again: one rating, nothing to compare.
    await expectBoth([`${demo.circuit.evaporatorId} 4->1 ${second}`], []);
    await closeVisit(demo.tech, second, { summary: 'Coil cleaned; motor on order.', confirmBypassRemoved: false });
    await expectBoth([`${demo.circuit.evaporatorId} 4->1 ${second}`], [`${demo.circuit.evaporatorId} 4->1 ${second}`]);
  });

  it('moving the unit to another area and off its system changes nothing', async () => {
    const area = await createArea(demo.office, demo.circuit.siteId, { name: 'Back dock', kind: 'other', notes: null });
    await updateEquipment(demo.office, demo.circuit.evaporatorId, { areaId: area.id, systemId: null });
    await expectBoth([`${demo.circuit.evaporatorId} 4->1 ${second}`], [`${demo.circuit.evaporatorId} 4->1 ${second}`]);
  });

  it('keeps one row per unit and audience, rebuilt by the migration exactly as the triggers left it', async () => {
    await expectRebuildKeepsRows(db, 'condition_trends');
  });
});
