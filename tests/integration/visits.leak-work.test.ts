// Leak work entries (inspection, repair, verification tests) stored on the system, refused without
// a write when incomplete, listed in the yearly refrigerant report, and loaded as demo history.
import { execFileSync } from 'node:child_process';
import { randomUUID } from 'node:crypto';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, beforeEach, describe, expect, it, vi } from 'vitest';
import { down as revertLeakKind } from '@/db/migrations/2026_12_02_0900_add_leak_entry_kind';
import { seedDemoLeakWork } from '@/docker-free-scripts/demo/leak-work';
import type { Actor } from '@/lib/auth/actor';
import { refrigerantReport, reportFile } from '@/lib/reports/service';
import { describeEntry } from '@/lib/visits/report-content';
import { leakDataSchema } from '@/lib/visits/schemas';
import { closeVisit } from '@/lib/visits/close';
import { addEntry, voidEntry } from '@/lib/visits/entries';
import { startVisit } from '@/lib/visits/service';
import { actorFor, createTestDb, demoEmails, resetToDemo } from '@/tests/helpers/db';
import { createCoolerCircuit } from '@/tests/helpers/registry';
import { call, mockAuthModule, session } from '@/tests/helpers/session';

vi.mock('@/lib/auth', () => mockAuthModule());

const db = createTestDb();
const lb = 0.45359237;
const imperial = { units: 'imperial', metricPressure: 'kPa' } as const;
let tech: Actor;
let office: Actor;
let owner: Actor;
let circuit: Awaited<ReturnType<typeof createCoolerCircuit>>;

beforeEach(async () => {
  await resetToDemo(db);
  tech = await actorFor(db, demoEmails.technician);
  office = await actorFor(db, demoEmails.office);
  owner = await actorFor(db, demoEmails.client);
  circuit = await createCoolerCircuit(db);
});
afterAll(async () => {
  await db.destroy();
});

const entry = <T extends object>(equipmentId: string, recordedAt: string, body: T) => ({ equipmentId, clientEntryId: randomUUID(), recordedAt, ...body });
const leak = (equipmentId: string, recordedAt: string, data: Parameters<typeof leakDataSchema.parse>[0]) => entry(equipmentId, recordedAt, { kind: 'leak' as const, data: leakDataSchema.parse(data) });
const addition = (equipmentId: string, recordedAt: string, pounds: number) =>
  entry(equipmentId, recordedAt, { kind: 'refrigerant' as const, data: { direction: 'added' as const, amountKg: pounds * lb, refrigerant: 'R-404A' as const } });
const count = async (table: 'entries' | 'audit_events') => Number((await db.selectFrom(table).select((eb) => eb.fn.countAll<number>().as('n')).executeTakeFirstOrThrow()).n);

describe('leak work entries', () => {
  it('are stored on the equipment’s system; a repair says whether it met the deadline of the addition over the threshold', async () => {
    const visit = await startVisit(tech, { siteId: circuit.siteId, reason: 'leak_check', startedAt: '2026-03-02T15:00:00Z' });
    // 30 lb into a 100 lb R-404A charge, first addition (365 days): 30 % > 20 %, covered by
    // 40 CFR 84 Subpart C from 2026 → repair due 30 days after the addition.
    const added = await addEntry(tech, visit.id, addition(circuit.condensingUnitId, '2026-03-02T16:00:00Z', 30));
    expect((added.computed as { leak: { repairDueDate: string } }).leak.repairDueDate).toBe('2026-04-01');

    const inspection = await addEntry(tech, visit.id, leak(circuit.evaporatorId, '2026-03-02T16:30:00Z', { activity: 'inspection', method: 'electronic_detector', result: 'leak_found', location: 'TXV inlet flare' }));
    expect(inspection.kind).toBe('leak');
    expect(inspection.data).toEqual({ activity: 'inspection', method: 'electronic_detector', result: 'leak_found', location: 'TXV inlet flare', note: undefined });
    expect(inspection.computed).toBeNull();

    const repair = await addEntry(tech, visit.id, leak(circuit.evaporatorId, '2026-03-10T16:00:00Z', { activity: 'repair', location: 'TXV inlet flare', note: 'New flare nut' }));
    expect(repair.computed).toEqual({ repairDueDate: '2026-04-01', repairedOn: '2026-03-10', onTime: true, additionEntryId: added.id });
    const late = await addEntry(tech, visit.id, leak(circuit.evaporatorId, '2026-04-15T16:00:00Z', { activity: 'repair', location: 'Distributor tube' }));
    expect(late.computed).toMatchObject({ onTime: false });
    expect(describeEntry(late, imperial)).toBe('Leak repair at Distributor tube, AFTER the repair deadline of 2026-04-01');
    expect(describeEntry(inspection, imperial)).toBe('Leak inspection (electronic leak detector): leak found at TXV inlet flare');

    const rows = await db.selectFrom('entries').select(['system_id', 'kind']).where('visit_id', '=', visit.id).where('kind', '=', 'leak').execute();
    expect(rows).toHaveLength(3);
    expect(rows.every((r) => r.system_id === circuit.systemId)).toBe(true);
  });

  it('the database still refuses unknown kinds, and will not drop the leak kind while leak records exist', async () => {
    const visit = await startVisit(tech, { siteId: circuit.siteId, reason: 'leak_check' });
    const saved = await addEntry(tech, visit.id, leak(circuit.evaporatorId, '2026-05-01T16:00:00Z', { activity: 'repair', location: 'Drier flare' }));
    const row = { company_id: tech.companyId, visit_id: visit.id, equipment_id: circuit.evaporatorId, data: '{}', recorded_at: new Date(), created_by: tech.id, client_entry_id: randomUUID() };
    await expect(db.insertInto('entries').values({ ...row, kind: 'leak_repair' }).execute()).rejects.toMatchObject({ code: '23514', constraint: 'entries_kind_check' });
    await expect(revertLeakKind(db)).rejects.toThrow('1 leak work entries exist; they are records and are not deleted, so this migration cannot be reverted.');
    expect((await db.selectFrom('entries').select('kind').where('id', '=', saved.id).executeTakeFirstOrThrow()).kind).toBe('leak');
  });

  it('a repair with no over-threshold addition before it has no deadline to meet', async () => {
    const visit = await startVisit(tech, { siteId: circuit.siteId, reason: 'maintenance', startedAt: '2026-05-01T15:00:00Z' });
    const repair = await addEntry(tech, visit.id, leak(circuit.evaporatorId, '2026-05-01T16:00:00Z', { activity: 'repair', location: 'Drain pan fitting' }));
    expect(repair.computed).toBeNull();
    expect(describeEntry(repair, imperial)).toBe('Leak repair at Drain pan fitting');
  });

  it('incomplete leak work is refused through the API with the field’s message, and nothing is written', async () => {
    const visit = await startVisit(tech, { siteId: circuit.siteId, reason: 'leak_check' });
    const { POST } = await import('@/app/api/visits/[id]/entries/route');
    session.actor = tech;
    const before = [await count('entries'), await count('audit_events')];
    const post = (data: unknown, visitId = visit.id) =>
      call(POST as never, { method: 'POST', path: `/api/visits/${visitId}/entries`, params: { id: visitId }, json: { kind: 'leak', equipmentId: circuit.evaporatorId, clientEntryId: randomUUID(), data } });

    const noPlace = await post({ activity: 'inspection', method: 'ultrasonic', result: 'leak_found' });
    expect(noPlace.status).toBe(422);
    expect(noPlace.body).toMatchObject({ error: { code: 'validation_failed', issues: [{ path: 'data.location', message: 'Say where on the system the leak was found.' }] } });
    const wrongResult = await post({ activity: 'initial_verification', method: 'pressure_test', result: 'leak_found' });
    expect(wrongResult.body).toMatchObject({ error: { issues: [{ path: 'data.result', message: 'A verification test passes or fails.' }] } });
    const noActivity = await post({ method: 'ultrasonic' });
    expect(noActivity.body).toMatchObject({ error: { issues: [{ path: 'data.activity' }] } });
    expect([await count('entries'), await count('audit_events')]).toEqual(before);

    const ok = await post({ activity: 'inspection', method: 'ultrasonic', result: 'no_leak_found' });
    expect(ok.status).toBe(201);
    expect(await count('entries')).toBe(before[0]! + 1);

    await closeVisit(tech, visit.id, { summary: 'No leak found.', confirmBypassRemoved: false });
    const closed = await post({ activity: 'inspection', method: 'ultrasonic', result: 'no_leak_found' });
    expect(closed.status).toBe(409);
    expect(await count('entries')).toBe(before[0]! + 1);
    session.actor = null;
  });
});

describe('the refrigerant report with leak work', () => {
  async function history() {
    const first = await startVisit(tech, { siteId: circuit.siteId, reason: 'no_cooling', startedAt: '2026-03-02T15:00:00Z' });
    await addEntry(tech, first.id, addition(circuit.condensingUnitId, '2026-03-02T16:00:00Z', 30));
    await addEntry(tech, first.id, leak(circuit.evaporatorId, '2026-03-02T16:30:00Z', { activity: 'inspection', method: 'electronic_detector', result: 'leak_found', location: 'TXV inlet flare' }));
    const mistaken = await addEntry(tech, first.id, leak(circuit.evaporatorId, '2026-03-02T16:40:00Z', { activity: 'inspection', method: 'bubble_solution', result: 'no_leak_found' }));
    await voidEntry(tech, mistaken.id, 'Recorded on the wrong system');
    await closeVisit(tech, first.id, { summary: 'Leak found at the TXV.', confirmBypassRemoved: false });

    const second = await startVisit(tech, { siteId: circuit.siteId, reason: 'follow_up', startedAt: '2026-03-10T15:00:00Z' });
    await addEntry(tech, second.id, leak(circuit.evaporatorId, '2026-03-10T16:00:00Z', { activity: 'repair', location: 'TXV inlet flare', note: 'New flare nut' }));
    await addEntry(tech, second.id, leak(circuit.evaporatorId, '2026-03-10T17:00:00Z', { activity: 'initial_verification', method: 'pressure_test', result: 'passed' }));
    await closeVisit(tech, second.id, { summary: 'Repaired.', confirmBypassRemoved: false });

    // Still open: the office sees it, the owner does not yet.
    const third = await startVisit(tech, { siteId: circuit.siteId, reason: 'leak_check', startedAt: '2026-03-24T15:00:00Z' });
    await addEntry(tech, third.id, leak(circuit.evaporatorId, '2026-03-24T16:00:00Z', { activity: 'follow_up_verification', method: 'electronic_detector', result: 'passed' }));
  }

  it('lists the leak work in date order with the additions, and counts it', async () => {
    await history();
    const forOwner = await refrigerantReport(owner, circuit.systemId, 2026, imperial);
    expect(forOwner.columns.map((c) => c.label)).toContain('Event');
    expect(forOwner.columns.at(-1)!.label).toBe('Details');
    expect(forOwner.rows.map((r) => r[1])).toEqual(['Added', 'Leak inspection', 'Leak repair', 'Initial verification test']);
    const [added, inspection, repair, initial] = forOwner.rows;
    expect(added![2]).toBe('30 lb');
    expect(added![7]).toMatch(/OVER/);
    expect(inspection![10]).toBe('Electronic leak detector; Leak found; at TXV inlet flare');
    expect(inspection![5]).toBe('Tomas Rivane');
    expect(repair![10]).toBe('at TXV inlet flare; within the repair deadline 2026-04-01; New flare nut');
    expect(initial![10]).toBe('Standing pressure test (dry nitrogen); Passed');
    const fact = (r: typeof forOwner, k: string) => r.facts.find(([key]) => key === k)?.[1];
    expect(fact(forOwner, 'Leak work in the year')).toBe('1 inspection(s), 1 finding a leak; 1 repair(s); 1 initial and 0 follow-up verification test(s)');
    expect(forOwner.notes.join(' ')).toContain('40 CFR 82.157');

    const forOffice = await refrigerantReport(office, circuit.systemId, 2026, imperial);
    expect(forOffice.rows.map((r) => r[1])).toEqual(['Added', 'Leak inspection', 'Leak repair', 'Initial verification test', 'Follow-up verification test']);
    expect(fact(forOffice, 'Leak work in the year')).toBe('1 inspection(s), 1 finding a leak; 1 repair(s); 1 initial and 1 follow-up verification test(s)');
    expect((await refrigerantReport(office, circuit.systemId, 2025, imperial)).rows).toEqual([]);
  });

  it('says the same in the CSV and the PDF', async () => {
    await history();
    const report = await refrigerantReport(owner, circuit.systemId, 2026, imperial);
    const csv = (await reportFile(report, 'csv', 'r')).body as string;
    expect(csv).toContain('2026-03-10,Leak repair,,,,Tomas Rivane,,,,,at TXV inlet flare; within the repair deadline 2026-04-01; New flare nut');
    const dir = mkdtempSync(path.join(tmpdir(), 'rl-leak-'));
    writeFileSync(path.join(dir, 'r.pdf'), (await reportFile(report, 'pdf', 'r')).body as Uint8Array);
    const text = execFileSync('pdftotext', ['-layout', path.join(dir, 'r.pdf'), '-']).toString();
    expect(text).toContain('Leak repair');
    expect(text).toContain('Initial verification test');
    // The details wrap inside their column rather than being cut off.
    expect(text).toContain('New flare nut');
    expect(text).toContain('40 CFR 82.157');
  });
});

describe('demo history', () => {
  it('adds the leak work story once, readable by the demo owner in the report', async () => {
    const now = new Date('2026-11-20T12:00:00Z');
    expect(await seedDemoLeakWork(db, now)).toBe(true);
    expect(await seedDemoLeakWork(db, now)).toBe(false);
    const system = await db
      .selectFrom('systems')
      .innerJoin('sites', 'sites.id', 'systems.site_id')
      .select('systems.id')
      .where('sites.name', '=', 'Orchard Row Bistro')
      .executeTakeFirstOrThrow();
    const report = await refrigerantReport(owner, system.id, 2026, imperial);
    expect(report.rows.map((r) => r[1])).toEqual(['Added', 'Leak inspection', 'Leak repair', 'Initial verification test', 'Follow-up verification test']);
    expect(report.rows[0]![7]).toMatch(/OVER/);
    expect(report.rows[2]![10]).toContain('within the repair deadline');
    // Stored as the visit form would have sent it.
    const seeded = await db.selectFrom('entries').select('data').where('system_id', '=', system.id).where('kind', '=', 'leak').execute();
    for (const row of seeded) expect(leakDataSchema.safeParse(row.data).success).toBe(true);
  });
});
