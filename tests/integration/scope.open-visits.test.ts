// lib/auth/scope.ts: an owner sees entries of closed visits only, in every place built from
// entries (attention list, site cards, history, reading charts, the unit header, refrigerant
// report); staff see them while the visit is open. Closing the visit shows them to the owner.
import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { needsAttention } from '@/lib/attention/service';
import type { Actor } from '@/lib/auth/actor';
import { getUnitFacts } from '@/lib/equipment/service';
import { siteSummaries } from '@/lib/overview/service';
import { refrigerantReport } from '@/lib/reports/service';
import { closeVisit } from '@/lib/visits/close';
import { addEntry } from '@/lib/visits/entries';
import { equipmentHistory } from '@/lib/visits/history';
import { getVisitSummary, startVisit } from '@/lib/visits/service';
import { createTestDb } from '@/tests/helpers/db';
import { demoWithCircuit, type CoolerCircuit } from '@/tests/helpers/registry';
import { call, mockAuthModule, session } from '@/tests/helpers/session';

vi.mock('@/lib/auth', () => mockAuthModule());

const db = createTestDb();
const lb = 0.45359237;
const DAY = 86_400_000;
let tech: Actor;
let office: Actor;
let owner: Actor;
let circuit: CoolerCircuit;
let closedId: string;
let openId: string;
const entry = <T extends object>(equipmentId: string, body: T) => ({ equipmentId, clientEntryId: randomUUID(), ...body });
const ago = (days: number) => new Date(Date.now() - days * DAY).toISOString();
const kinds = async (actor: Actor) => (await needsAttention(actor, circuit.siteId)).flatMap((u) => u.reasons.map((r) => `${u.equipmentName}: ${r.kind}`)).sort();
const pell = async (actor: Actor) => (await siteSummaries(actor)).find((s) => s.siteId === circuit.siteId)!;
const year = new Date(Date.now() - 2 * DAY).getUTCFullYear();
const prefs = { units: 'imperial', metricPressure: 'kPa' } as const;

beforeAll(async () => {
  ({ tech, office, owner, circuit } = await demoWithCircuit(db));
  const first = await startVisit(tech, { siteId: circuit.siteId, reason: 'no_cooling', startedAt: ago(20) });
  await addEntry(tech, first.id, entry(circuit.condensingUnitId, { kind: 'refrigerant' as const, recordedAt: ago(20), data: { direction: 'added' as const, amountKg: 2 * lb, refrigerant: 'R-404A' as const } }));
  await addEntry(tech, first.id, entry(circuit.evaporatorId, { kind: 'condition' as const, recordedAt: ago(20), data: { rating: 4 } }));
  await closeVisit(tech, first.id, { summary: 'Topped up.', confirmBypassRemoved: false });
  closedId = first.id;
  // Still open: a second no-cooling call, a large addition (over the leak-rate threshold) and a worse rating.
  const second = await startVisit(tech, { siteId: circuit.siteId, reason: 'no_cooling', startedAt: ago(2) });
  await addEntry(tech, second.id, entry(circuit.condensingUnitId, { kind: 'refrigerant' as const, recordedAt: ago(2), data: { direction: 'added' as const, amountKg: 30 * lb, refrigerant: 'R-404A' as const } }));
  await addEntry(tech, second.id, entry(circuit.evaporatorId, { kind: 'condition' as const, recordedAt: ago(2), data: { rating: 2 } }));
  openId = second.id;
});
afterAll(async () => {
  await db.destroy();
});

describe('entries of an open visit', () => {
  it('count for staff in the attention list and on the site card', async () => {
    expect(await kinds(office)).toEqual(
      expect.arrayContaining(['Cooler condensing unit: leak_over_threshold', 'Cooler condensing unit: repeat_no_cooling', 'Cooler evaporator: condition_worsening']),
    );
    expect((await pell(office)).systemsOverLeakThreshold).toBe(1);
  });

  it('do not reach the owner: attention list, site card, history, unit header, report', async () => {
    const reasons = await kinds(owner);
    expect(reasons.filter((r) => /leak_over_threshold|repeat_no_cooling|condition_worsening/.test(r))).toEqual([]);
    expect(JSON.stringify(await needsAttention(owner, circuit.siteId))).not.toContain(openId);
    expect((await pell(owner)).systemsOverLeakThreshold).toBe(0);
    const history = await equipmentHistory(owner, circuit.condensingUnitId, { limit: 50 });
    expect(history.items.map((e) => e.visitId)).toEqual([closedId]);
    expect((await equipmentHistory(office, circuit.condensingUnitId, { limit: 50 })).items.map((e) => e.visitId).sort()).toEqual([closedId, openId].sort());
    expect((await getUnitFacts(owner, { id: circuit.condensingUnitId, siteId: circuit.siteId })).lastVisit?.id).toBe(closedId);
    const addedThisYear = async (actor: Actor) => (await refrigerantReport(actor, circuit.systemId, year, prefs)).rows.filter((r) => r[1] === 'Added').length;
    expect(await addedThisYear(office)).toBe((await addedThisYear(owner)) + 1);
    await expect(getVisitSummary(owner, openId)).rejects.toMatchObject({ code: 'not_found' });
  });

  it('reach the owner once the visit closes', async () => {
    await closeVisit(tech, openId, { summary: 'Leak search booked.', confirmBypassRemoved: false });
    expect(await kinds(owner)).toEqual(
      expect.arrayContaining(['Cooler condensing unit: leak_over_threshold', 'Cooler condensing unit: repeat_no_cooling', 'Cooler evaporator: condition_worsening']),
    );
    expect((await pell(owner)).systemsOverLeakThreshold).toBe(1);
    expect((await equipmentHistory(owner, circuit.condensingUnitId, { limit: 50 })).items).toHaveLength(2);
  });
});

describe('site fields by role', () => {
  it('GET /api/sites/:id sends access notes to staff, not to the owner (as the site page)', async () => {
    await db.updateTable('sites').set({ access_notes: 'Key safe 4471 by the loading door' }).where('id', '=', circuit.siteId).execute();
    const route = await import('@/app/api/sites/[id]/route');
    const read = async (actor: Actor) => {
      session.actor = actor;
      const res = await call(route.GET as never, { path: `/api/sites/${circuit.siteId}`, params: { id: circuit.siteId } });
      expect(res.status).toBe(200);
      return (res.body as { accessNotes: string | null }).accessNotes;
    };
    expect(await read(tech)).toBe('Key safe 4471 by the loading door');
    expect(await read(office)).toBe('Key safe 4471 by the loading door');
    expect(await read(owner)).toBeNull();
  });
});
