// Leak work recorded on visits moves a leak through the attention list (repair, then the two
// verification tests of 40 CFR 82.157(e)) and counts as a leak check in the office's due list.
import { randomUUID } from 'node:crypto';
import { sql } from 'kysely';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Actor } from '@/lib/auth/actor';
import { needsAttention } from '@/lib/attention/service';
import { dueWork } from '@/lib/overview/due';
import { chartData, siteSummaries } from '@/lib/overview/service';
import { closeVisit } from '@/lib/visits/close';
import { addEntry } from '@/lib/visits/entries';
import { startVisit } from '@/lib/visits/service';
import type { LeakData } from '@/lib/visits/schemas';
import { createTestDb } from '@/tests/helpers/db';
import { demoWithCircuit, type CoolerCircuit } from '@/tests/helpers/registry';
import { formatDay } from '@/lib/format/dates';

const db = createTestDb();
let tech: Actor;
let office: Actor;
let owner: Actor;
let circuit: CoolerCircuit;
const lb = 0.45359237;
const daysAgo = (n: number) => new Date(Date.now() - n * 86_400_000).toISOString();

async function leakVisit(at: number, items: { equipmentId: string; data: LeakData; at?: number }[]) {
  const visit = await startVisit(tech, { siteId: circuit.siteId, reason: 'follow_up', startedAt: daysAgo(at) });
  for (const item of items) await addEntry(tech, visit.id, { kind: 'leak', equipmentId: item.equipmentId, clientEntryId: randomUUID(), recordedAt: daysAgo(item.at ?? at), data: item.data });
  await closeVisit(tech, visit.id, { summary: 'Leak work.', confirmBypassRemoved: false, endedAt: daysAgo(at - 0.01) });
}

const leakReason = async () => (await needsAttention(owner)).find((u) => u.equipmentId === circuit.condensingUnitId)?.reasons.find((r) => r.kind === 'leak_over_threshold');
const leakingSystems = async () => (await siteSummaries(owner)).find((s) => s.siteId === circuit.siteId)?.systemsOverLeakThreshold;
const leakScore = async () => (await needsAttention(owner)).find((u) => u.equipmentId === circuit.condensingUnitId)?.score ?? 0;
const leakPriority = async () => (await needsAttention(owner)).find((u) => u.equipmentId === circuit.condensingUnitId)?.priority;

beforeAll(async () => {
  ({ tech, office, owner, circuit } = await demoWithCircuit(db));
  // The system has existed for a year, so its six-monthly leak check (178 t CO2e) is overdue.
  await sql`update systems set created_at = now() - interval '400 days' where id = ${circuit.systemId}`.execute(db);
  const visit = await startVisit(tech, { siteId: circuit.siteId, reason: 'no_cooling', startedAt: daysAgo(12) });
  // 30 lb into a 100 lb charge with no earlier addition: 30 % a year, over the 20 % threshold.
  await addEntry(tech, visit.id, { kind: 'refrigerant', equipmentId: circuit.condensingUnitId, clientEntryId: randomUUID(), recordedAt: daysAgo(12), data: { direction: 'added', amountKg: 30 * lb, refrigerant: 'R-404A' } });
  await closeVisit(tech, visit.id, { summary: 'Topped up; leak search booked.', confirmBypassRemoved: false, endedAt: daysAgo(11.9) });
});
afterAll(async () => {
  await db.destroy();
});

describe('leak work and the attention list', () => {
  it('the owner\'s refrigerant chart names the circuit with its site', async () => {
    const site = await db.selectFrom('sites').select('name').where('id', '=', circuit.siteId).executeTakeFirstOrThrow();
    const system = await db.selectFrom('systems').select('name').where('id', '=', circuit.systemId).executeTakeFirstOrThrow();
    const rows = (await chartData(owner, null)).refrigerantAddedByYear;
    expect(rows).toContainEqual({ year: new Date(daysAgo(12)).getUTCFullYear(), system: system.name, site: site.name, kg: Math.round(30 * lb * 100) / 100 });
  });

  it('an unrepaired leak over the threshold scores 80 with its repair deadline', async () => {
    expect((await leakReason())?.text).toMatch(/over the 20 % threshold; repair due by [A-Z][a-z]{2} \d{1,2}, \d{4}$/);
    expect(await leakScore()).toBe(80);
    expect(await leakPriority()).toBe('urgent');
    // No leak check yet: the six-monthly one is overdue (the due-list test below sees it go).
    expect((await dueWork(office)).find((d) => d.systemId === circuit.systemId && d.kind === 'leak_inspection')?.lastDoneAt).toBeNull();
  });

  it('a repair on another unit of the same circuit lowers it to 40 until the tests pass', async () => {
    await leakVisit(10, [
      { equipmentId: circuit.evaporatorId, data: { activity: 'inspection', method: 'electronic_detector', result: 'leak_found', location: 'Evaporator return bend' } },
      { equipmentId: circuit.evaporatorId, data: { activity: 'repair', location: 'Evaporator return bend, brazed' } },
      { equipmentId: circuit.evaporatorId, data: { activity: 'initial_verification', method: 'bubble_solution', result: 'passed' } },
    ]);
    expect((await leakReason())?.text).toContain(`repaired on ${formatDay(daysAgo(10).slice(0, 10))}, verification tests still to pass`);
    expect(await leakScore()).toBe(40);
    expect(await leakPriority()).toBe('soon');
    expect(await leakingSystems()).toBe(1);
  });

  it('a failed follow-up test puts it back to 80', async () => {
    await leakVisit(5, [{ equipmentId: circuit.evaporatorId, data: { activity: 'follow_up_verification', method: 'electronic_detector', result: 'failed' } }]);
    expect((await leakReason())?.text).toContain('a verification test failed — repair again');
    expect(await leakScore()).toBe(80);
    expect(await leakPriority()).toBe('urgent');
  });

  it('a new repair with both tests passed takes the leak off the list', async () => {
    await leakVisit(3, [
      { equipmentId: circuit.evaporatorId, data: { activity: 'repair', location: 'Evaporator return bend, re-brazed' } },
      { equipmentId: circuit.evaporatorId, data: { activity: 'initial_verification', method: 'pressure_test', result: 'passed' } },
    ]);
    expect(await leakScore()).toBe(40);
    await leakVisit(1, [{ equipmentId: circuit.evaporatorId, data: { activity: 'follow_up_verification', method: 'electronic_detector', result: 'passed' } }]);
    expect(await leakReason()).toBeUndefined();
    // The site card agrees: no system left with an open leak over the threshold.
    expect(await leakingSystems()).toBe(0);
  });
});

describe('leak work and the due list', () => {
  it('a recorded leak inspection counts as the system’s last leak check', async () => {
    const due = (await dueWork(office)).find((d) => d.systemId === circuit.systemId && d.kind === 'leak_inspection');
    // The last check is the newest leak inspection or verification test entry (the follow-up a day ago).
    expect(due).toBeUndefined();
    const rows = await dueWork(office, db, new Date(Date.now() + 200 * 86_400_000));
    const later = rows.find((d) => d.systemId === circuit.systemId && d.kind === 'leak_inspection');
    expect(later?.lastDoneAt?.slice(0, 10)).toBe(daysAgo(1).slice(0, 10));
  });
});
