// The owner home counts the units once for its site cards and its condition chart
// (ownerOverview): the same figures as siteSummaries and chartData asked for separately, and as
// the unit rows counted one by one, after a visit closes with a rating, a unit is removed,
// deleted or moved to another site, an install date changes and a site is archived.
import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { chartData, ownerOverview, siteSummaries } from '@/lib/overview/service';
import { medianServiceLife, type EquipmentType } from '@/lib/calc/service-life';
import { closeVisit } from '@/lib/visits/close';
import { addEntry } from '@/lib/visits/entries';
import { startVisit } from '@/lib/visits/service';
import type { Actor } from '@/lib/auth/actor';
import { createTestDb } from '@/tests/helpers/db';
import { demoWithCircuit, type CoolerCircuit } from '@/tests/helpers/registry';
import { mockAuthModule } from '@/tests/helpers/session';

vi.mock('@/lib/auth', () => mockAuthModule());

const db = createTestDb();
const today = new Date('2026-06-15T12:00:00Z');
const YEAR_MS = 365.25 * 86_400_000;
let tech: Actor;
let office: Actor;
let owner: Actor;
let circuit: CoolerCircuit;
let otherSiteId: string;
const added: string[] = [];

beforeAll(async () => {
  ({ tech, office, owner, circuit } = await demoWithCircuit(db));
  otherSiteId = (await db.selectFrom('sites').select('id').where('name', '=', 'Commissary').executeTakeFirstOrThrow()).id;
  // Every rating and none, several types, installed from 1970 on (many past their expected life,
  // more than the chart's 40).
  const types = ['condensing_unit', 'evaporator', 'thermostat', 'fan_motor', 'contactor', 'solenoid_valve'];
  const rows = Array.from({ length: 60 }, (_, i) => ({
    company_id: circuit.companyId,
    site_id: i % 3 === 0 ? otherSiteId : circuit.siteId,
    type: types[i % types.length]!,
    name: `Counted unit ${String(i).padStart(2, '0')}`,
    condition: i % 6 === 0 ? null : 1 + (i % 5),
    installed_on: i % 7 === 0 ? null : `${1970 + (i % 50)}-0${1 + (i % 9)}-15`,
  }));
  added.push(...(await db.insertInto('equipment').values(rows).returning('id').execute()).map((r) => r.id));
});
afterAll(async () => {
  await db.destroy();
});

/** The figures straight from the unit rows the owner may see, counted in JavaScript. */
async function countedByHand(actor: Actor, siteId: string | null = null) {
  const units = await db
    .selectFrom('equipment')
    .innerJoin('sites', 'sites.id', 'equipment.site_id')
    .where('sites.company_id', '=', actor.companyId)
    .$if(actor.role === 'client', (q) => q.where('sites.client_id', '=', actor.clientId!))
    .$if(siteId !== null, (q) => q.where('equipment.site_id', '=', siteId!))
    .where('equipment.deleted_at', 'is', null)
    .where('equipment.status', '<>', 'removed')
    .select(['equipment.site_id', 'sites.archived_at', 'equipment.name', 'equipment.type', 'equipment.condition', 'equipment.installed_on'])
    .execute();
  const pastLife = (u: (typeof units)[number]) => {
    const life = medianServiceLife(u.type as EquipmentType);
    return Boolean(u.installed_on && life && (today.getTime() - Date.parse(`${u.installed_on}T00:00:00Z`)) / YEAR_MS > life.medianYears);
  };
  const perSite = new Map<string, { n: number; rated: number[]; pastLife: number }>();
  for (const u of units.filter((x) => x.archived_at === null)) {
    const s = perSite.get(u.site_id) ?? { n: 0, rated: [0, 0, 0, 0, 0, 0], pastLife: 0 };
    s.n += 1;
    s.rated[u.condition ?? 0]! += 1;
    if (pastLife(u)) s.pastLife += 1;
    perSite.set(u.site_id, s);
  }
  const rating = (r: number | null) => units.filter((u) => u.condition === r).length;
  // Every dated unit with an expected life, oldest for that life first: the chart's 40.
  const oldest = units
    .flatMap((u) => {
      const life = medianServiceLife(u.type as EquipmentType);
      if (!u.installed_on || !life) return [];
      const age = (today.getTime() - Date.parse(`${u.installed_on}T00:00:00Z`)) / YEAR_MS;
      return [{ name: u.name, ageYears: Math.round(age * 10) / 10, medianYears: life.medianYears, ratio: age / life.medianYears }];
    })
    .sort((a, b) => b.ratio - a.ratio || (a.name < b.name ? -1 : a.name > b.name ? 1 : 0))
    .slice(0, 40)
    .map(({ ratio: _ratio, ...rest }) => rest);
  return {
    perSite,
    oldest,
    distribution: { '1 failing': rating(1), '2 poor': rating(2), '3 fair': rating(3), '4 good': rating(4), '5 like new': rating(5), 'not rated': rating(null) },
  };
}

const sortedByName = <T extends { name: string; ageYears: number }>(list: T[]) =>
  [...list].sort((a, b) => (a.name < b.name ? -1 : a.name > b.name ? 1 : a.ageYears - b.ageYears));

async function expectSameFigures(actor: Actor) {
  const both = await ownerOverview(actor, db, today);
  // The same as the two functions the API routes call.
  expect(both.summaries).toEqual(await siteSummaries(actor, db, today));
  expect(both.charts).toEqual(await chartData(actor, null, db, today));
  const hand = await countedByHand(actor);
  // Units of one name and age may come in either order: compared as sorted lists.
  expect(both.charts.ageVsLife.length).toBe(Math.min(40, hand.oldest.length));
  expect(sortedByName(both.charts.ageVsLife)).toEqual(sortedByName(hand.oldest));
  expect(Object.fromEntries(both.charts.conditionDistribution.map((c) => [c.rating, c.count]))).toEqual(hand.distribution);
  for (const s of both.summaries) {
    const h = hand.perSite.get(s.siteId) ?? { n: 0, rated: [0, 0, 0, 0, 0, 0], pastLife: 0 };
    expect({ site: s.siteName, n: s.equipmentCount, pastLife: s.pastExpectedLife, byCondition: s.byCondition }).toEqual({
      site: s.siteName,
      n: h.n,
      pastLife: h.pastLife,
      byCondition: { 1: h.rated[1], 2: h.rated[2], 3: h.rated[3], 4: h.rated[4], 5: h.rated[5], unrated: h.rated[0] },
    });
  }
  return both;
}

describe('owner home counts, shared by the site cards and the charts', () => {
  it('match the unit rows, for the owner and for the office', async () => {
    const both = await expectSameFigures(owner);
    expect(both.summaries.find((s) => s.siteId === otherSiteId)!.equipmentCount).toBeGreaterThanOrEqual(12);
    await expectSameFigures(office);
  });

  it("rank one site's oldest units alike for the office and the owner (the site page's chart)", async () => {
    // One site's units are ranked directly, the whole company's through each type's install order:
    // both must give what the rows say.
    for (const actor of [office, owner]) {
      const hand = await countedByHand(actor, otherSiteId);
      const charts = await chartData(actor, otherSiteId, db, today);
      expect(hand.oldest.length).toBeGreaterThan(0);
      expect(sortedByName(charts.ageVsLife)).toEqual(sortedByName(hand.oldest));
    }
  });

  it('follow a rating recorded and the visit closed', async () => {
    const before = (await ownerOverview(owner, db, today)).charts.conditionDistribution.find((c) => c.rating === '1 failing')!.count;
    const visit = await startVisit(tech, { siteId: circuit.siteId, reason: 'maintenance' });
    await addEntry(tech, visit.id, { equipmentId: circuit.thermostatId, clientEntryId: randomUUID(), kind: 'condition' as const, data: { rating: 1 } });
    await closeVisit(tech, visit.id, { summary: 'Thermostat failing.', confirmBypassRemoved: false });
    const after = await expectSameFigures(owner);
    expect(after.charts.conditionDistribution.find((c) => c.rating === '1 failing')!.count).toBe(before + 1);
  });

  it('follow units removed, deleted, moved and re-dated, and a site archived', async () => {
    await db.updateTable('equipment').set({ status: 'removed' }).where('id', '=', added[1]!).execute();
    await db.updateTable('equipment').set({ deleted_at: new Date() }).where('id', '=', added[2]!).execute();
    await expectSameFigures(owner);
    await db.updateTable('equipment').set({ site_id: otherSiteId }).where('id', '=', added[4]!).execute();
    await expectSameFigures(owner);
    // Installed long ago: now past its expected life.
    await db.updateTable('equipment').set({ installed_on: '1970-01-01' }).where('id', '=', added[5]!).execute();
    await expectSameFigures(owner);
    // An archived site leaves the site cards; its units still count in the chart, as before.
    await db.updateTable('sites').set({ archived_at: new Date() }).where('id', '=', otherSiteId).execute();
    const both = await expectSameFigures(owner);
    expect(both.summaries.map((s) => s.siteId)).not.toContain(otherSiteId);
    await db.updateTable('sites').set({ archived_at: null }).where('id', '=', otherSiteId).execute();
  });
});
