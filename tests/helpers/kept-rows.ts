// Shared set-up and checks of the tests that hold a table kept by triggers (condition_trends,
// no_cooling_visits) against the query it replaces: both read the attention list of one cooler
// circuit, for staff and for the owner, and rebuild the table to see the triggers left it right.
import { randomUUID } from 'node:crypto';
import { sql, type Kysely } from 'kysely';
import { afterAll, beforeAll, expect } from 'vitest';
import type { DB } from '@/db/schema.gen';
import type { Actor } from '@/lib/auth/actor';
import { closeVisit } from '@/lib/visits/close';
import { addEntry } from '@/lib/visits/entries';
import { startVisit } from '@/lib/visits/service';
import { demoWithCircuit } from '@/tests/helpers/registry';

export const DAY = 86_400_000;
export const ago = (days: number) => new Date(Date.now() - days * DAY).toISOString();

/** A condition rating recorded `days` ago. */
export const rate = (tech: Actor, visitId: string, equipmentId: string, rating: number, days: number) =>
  addEntry(tech, visitId, { equipmentId, clientEntryId: randomUUID(), kind: 'condition' as const, recordedAt: ago(days), data: { rating } });

type RatedVisit = { reason: 'maintenance' | 'no_cooling'; days: number; evaporator: number; condensingUnit: number; summary: string };

/** The demo with a cooler circuit and one closed visit `days` ago that rated its evaporator and condensing unit. */
async function demoWithRatedVisit(db: Kysely<DB>, visit: RatedVisit) {
  const demo = await demoWithCircuit(db);
  const { tech, circuit } = demo;
  const first = (await startVisit(tech, { siteId: circuit.siteId, reason: visit.reason, startedAt: ago(visit.days) })).id;
  await rate(tech, first, circuit.evaporatorId, visit.evaporator, visit.days);
  await rate(tech, first, circuit.condensingUnitId, visit.condensingUnit, visit.days);
  await closeVisit(tech, first, { summary: visit.summary, confirmBypassRemoved: false });
  return { ...demo, first };
}

/**
 * A test file's hooks around that demo: set up once before all its tests (which then build on each
 * other's changes), the pool closed after all. The returned object is filled in by beforeAll.
 */
export function ratedVisitDemo(db: Kysely<DB>, visit: RatedVisit): Awaited<ReturnType<typeof demoWithRatedVisit>> {
  const demo = {} as Awaited<ReturnType<typeof demoWithRatedVisit>>;
  beforeAll(async () => {
    Object.assign(demo, await demoWithRatedVisit(db, visit));
  });
  afterAll(async () => {
    await db.destroy();
  });
  return demo;
}

type Reading = (actor: Actor) => Promise<string[]>;

/** The attention list and the replaced query agree, and say `staff` to the office and `ownerSees` to the owner. */
export async function expectBothAudiences(
  actors: { office: Actor; owner: Actor },
  readings: { listed: Reading; replaced: Reading },
  staff: string[],
  ownerSees: string[],
): Promise<void> {
  for (const [actor, expected] of [
    [actors.office, staff],
    [actors.owner, ownerSees],
  ] as const) {
    expect(await readings.listed(actor)).toEqual([...expected].sort());
    expect(await readings.replaced(actor)).toEqual([...expected].sort());
  }
}

/** The kept rows (one per unit and audience) come back the same when the migration's refresh rebuilds them all. */
export async function expectRebuildKeepsRows(db: Kysely<DB>, table: 'condition_trends' | 'no_cooling_visits'): Promise<void> {
  const rows = async () =>
    (await db.selectFrom(table).selectAll().orderBy('equipment_id').orderBy('company_id').orderBy(sql`client_id nulls first`).execute()).map((r) => JSON.stringify(r));
  const kept = await rows();
  expect(kept.length).toBeGreaterThanOrEqual(4);
  await sql`select ${sql.raw(`refresh_${table}`)}(array(select id from equipment))`.execute(db);
  expect(await rows()).toEqual(kept);
}
