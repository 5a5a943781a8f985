// The demo history that a fresh `npm start` loads: what the owners, the office and the
// technician then find through the services. Ends with the plain demo, as other files expect.
import { execFileSync } from 'node:child_process';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { seedDemoHistory, TAGGED_SITE, type HistoryCounts } from '@/docker-free-scripts/demo/history';
import { seedDemoLeakWork } from '@/docker-free-scripts/demo/leak-work';
import type { Signal } from '@/lib/attention/rank';
import { needsAttention } from '@/lib/attention/service';
import type { Actor } from '@/lib/auth/actor';
import { siteSummaries } from '@/lib/overview/service';
import { listPhotosQuerySchema } from '@/lib/photos/schemas';
import { addDays } from '@/lib/plans/days';
import { plansForTechnician } from '@/lib/plans/scheduling';
import { listPlans } from '@/lib/plans/service';
import { listPhotos } from '@/lib/photos/service';
import { refrigerantReport } from '@/lib/reports/service';
import { listRequestsQuerySchema } from '@/lib/requests/schemas';
import { listRequests } from '@/lib/requests/service';
import { resolveTag } from '@/lib/tags/service';
import { historyQuerySchema, listVisitsQuerySchema } from '@/lib/visits/schemas';
import { equipmentHistory } from '@/lib/visits/history';
import { getVisit, listVisits } from '@/lib/visits/service';
import { ensureBucket, headObject } from '@/storage/objects';
import { actorFor, createTestDb, demoEmails, resetToDemo } from '@/tests/helpers/db';

const db = createTestDb();
let counts: HistoryCounts | null;
let ownerOne: Actor;
let ownerTwo: Actor;
let office: Actor;
const now = new Date();

const clientOneSites = ['Commissary', 'Orchard Row Bistro', 'Pell Street Kitchen'];
const clientTwoSites = ['Linden Avenue Market', 'Quarry Road Market'];

beforeAll(async () => {
  await ensureBucket();
  await resetToDemo(db);
  await seedDemoLeakWork(db, now);
  counts = await seedDemoHistory(db, now);
  ownerOne = await actorFor(db, demoEmails.client);
  ownerTwo = await actorFor(db, demoEmails.clientTwo);
  office = await actorFor(db, demoEmails.office);
}, 120_000);
afterAll(async () => {
  await resetToDemo(db);
  await db.destroy();
});

const kinds = (units: { signals: Signal[] }[]) => new Set(units.flatMap((u) => u.signals.map((s) => s.kind)));

describe('demo history', () => {
  it('gives every one of the first client’s sites equipment and a last visit', async () => {
    expect(counts).not.toBeNull();
    const summaries = await siteSummaries(ownerOne, db, now);
    expect(summaries.map((s) => s.siteName).sort()).toEqual(clientOneSites);
    for (const s of summaries) {
      expect(s.equipmentCount, s.siteName).toBeGreaterThan(0);
      expect(s.lastVisitAt, s.siteName).not.toBeNull();
      expect(Date.parse(s.lastVisitAt!)).toBeLessThan(now.getTime());
      expect(s.byCondition.unrated, s.siteName).toBe(0);
    }
    // The history stays within the last eighteen months.
    const oldest = await db.selectFrom('visits').select((eb) => eb.fn.min('started_at').as('first')).executeTakeFirstOrThrow();
    expect(now.getTime() - new Date(oldest.first as Date).getTime()).toBeLessThan(548 * 86_400_000);
  });

  it('puts each kind of reason on the needs-attention list, each on the unit the story gives it', async () => {
    const units = await needsAttention(office, null, db, now);
    expect(kinds(units)).toEqual(new Set(['open_safety_finding', 'leak_over_threshold', 'repeat_no_cooling', 'condition_worsening', 'past_expected_life']));
    const reasonsOf = (site: string, name: string) => kinds(units.filter((u) => u.siteName === site && u.equipmentName === name));
    expect(reasonsOf('Commissary', 'Freezer 2 condensing unit')).toContain('open_safety_finding');
    expect(reasonsOf('Pell Street Kitchen', 'Freezer condensing unit')).toEqual(new Set(['repeat_no_cooling', 'condition_worsening', 'past_expected_life']));
    expect(reasonsOf('Commissary', 'Freezer 1 condensing unit')).toEqual(new Set(['condition_worsening']));
    // The Tidewell leak: over the threshold, no repair recorded yet, so a repair is due.
    const leak = units.flatMap((u) => u.signals.map((s) => ({ u, s }))).find(({ s }) => s.kind === 'leak_over_threshold' && !s.repairedOn);
    expect(leak?.u.siteName).toBe('Linden Avenue Market');
    const signal = leak!.s as Extract<Signal, { kind: 'leak_over_threshold' }>;
    expect(signal.ratePct).toBeGreaterThan(signal.thresholdPct);
    expect(signal.repairDueDate! > signal.on).toBe(true);
    const three = units.find((u) => u.equipmentName === 'Freezer condensing unit')!.signals.find((s) => s.kind === 'repeat_no_cooling');
    expect(three && 'visitIds' in three ? three.visitIds.length : 0).toBe(3);
  });

  it('lets the second owner read the leaking system’s refrigerant report, addition and leak search included', async () => {
    const system = await db.selectFrom('systems').select('id').where('name', '=', 'Dairy case line').executeTakeFirstOrThrow();
    const years = await db
      .selectFrom('entries')
      .select('recorded_at')
      .where('system_id', '=', system.id)
      .where('kind', 'in', ['refrigerant', 'leak'])
      .execute();
    const year = new Date(years.map((r) => r.recorded_at.getTime()).reduce((a, b) => Math.max(a, b))).getUTCFullYear();
    const report = await refrigerantReport(ownerTwo, system.id, year, { units: 'imperial', metricPressure: 'kPa' }, db);
    expect(report.rows.length).toBeGreaterThanOrEqual(2);
    const text = report.rows.map((r) => r.join(' ')).join('\n');
    expect(text).toMatch(/R-448A/);
    expect(text).toMatch(/6(\.0)? lb/);
    await expect(refrigerantReport(ownerOne, system.id, year, { units: 'imperial', metricPressure: 'kPa' }, db)).rejects.toMatchObject({ code: 'not_found' });
  });

  it('stores readings with computed values in the plausible range for each refrigerant', async () => {
    const rows = await db.selectFrom('entries').select(['computed']).where('kind', '=', 'reading').execute();
    expect(rows.length).toBeGreaterThan(50);
    for (const r of rows) {
      const c = r.computed as { superheatK: number | null; subcoolingK: number | null; problems: string[] };
      expect(c.problems).toEqual([]);
      expect(c.superheatK).toBeGreaterThan(1);
      expect(c.superheatK).toBeLessThan(20);
      expect(c.subcoolingK).toBeGreaterThan(0);
      expect(c.subcoolingK).toBeLessThan(20);
    }
  });

  it('tags every unit on the first site so that a scanned label opens it, with blank tags left to claim', async () => {
    const site = await db.selectFrom('sites').select('id').where('name', '=', TAGGED_SITE).executeTakeFirstOrThrow();
    const inService = await db.selectFrom('equipment').select('id').where('site_id', '=', site.id).where('status', '=', 'in_service').execute();
    const tags = await db.selectFrom('tags').select(['code', 'equipment_id']).where('site_id', '=', site.id).where('state', '=', 'attached').execute();
    expect(tags.map((t) => t.equipment_id).sort()).toEqual(inService.map((e) => e.id).sort());
    for (const tag of tags) {
      const resolved = await resolveTag(ownerOne, tag.code, 'link', db);
      expect(resolved.state).toBe('attached');
      expect(resolved.state === 'attached' && resolved.equipmentId).toBe(tag.equipment_id);
      await expect(resolveTag(ownerTwo, tag.code, 'link', db)).rejects.toMatchObject({ code: 'not_found' });
    }
    const blank = await db.selectFrom('tags').select('code').where('state', '=', 'blank').execute();
    expect(blank.length).toBeGreaterThanOrEqual(3);
    expect((await resolveTag(office, blank[0]!.code, 'typed', db)).state).toBe('blank');
  });

  it('keeps every photo’s files in the object store and shows them to the owner', async () => {
    const photos = await db.selectFrom('photos').select(['id', 'equipment_id', 'original_key', 'display_key', 'thumb_key', 'taken_at']).execute();
    expect(photos.length).toBeGreaterThanOrEqual(4);
    for (const p of photos) {
      for (const key of [p.original_key, p.display_key, p.thumb_key]) expect(await headObject(key), key).not.toBeNull();
      // The camera clock says when the photo was taken on its visit, not when the demo was loaded.
      expect(p.taken_at!.getTime()).toBeLessThan(now.getTime() - 86_400_000);
    }
    const onClientOne = await db
      .selectFrom('photos')
      .innerJoin('equipment', 'equipment.id', 'photos.equipment_id')
      .innerJoin('sites', 'sites.id', 'equipment.site_id')
      .select('photos.equipment_id')
      .where('sites.name', 'in', clientOneSites)
      .executeTakeFirstOrThrow();
    expect((await listPhotos(ownerOne, onClientOne.equipment_id, listPhotosQuerySchema.parse({}), db)).items.length).toBeGreaterThan(0);
  });

  it('keeps the second owner out of the first client’s sites, visits and requests', async () => {
    expect((await siteSummaries(ownerTwo, db, now)).map((s) => s.siteName).sort()).toEqual(clientTwoSites);
    for (const u of await needsAttention(ownerTwo, null, db, now)) expect(clientTwoSites).toContain(u.siteName);
    for (const r of await listRequests(ownerTwo, listRequestsQuerySchema.parse({}), db)) expect(clientTwoSites).toContain(r.siteName);
    const visits = await listVisits(ownerTwo, listVisitsQuerySchema.parse({ limit: 100 }), db);
    expect(visits.items.length).toBeGreaterThan(0);
    for (const v of visits.items) expect(clientTwoSites).toContain(v.siteName);
  });

  it('has owner requests in each state, the finished one tied to its visit', async () => {
    const requests = await listRequests(office, listRequestsQuerySchema.parse({}), db);
    const byStatus = new Map(requests.map((r) => [r.status, r]));
    expect([...byStatus.keys()].sort()).toEqual(['acknowledged', 'done', 'new']);
    expect(byStatus.get('acknowledged')!.officeNote).toBeTruthy();
    const done = byStatus.get('done')!;
    const visit = await getVisit(ownerOne, done.visitId!, db);
    expect(visit.reason).toBe('no_cooling');
    expect(Date.parse(done.createdAt)).toBeLessThan(Date.parse(visit.startedAt));
  });

  it('shows a unit’s history newest first, with the technician’s open visit today hidden from owners', async () => {
    const open = await db.selectFrom('visits').select(['id', 'started_at']).where('status', '=', 'open').execute();
    expect(open).toHaveLength(1);
    expect(now.getTime() - open[0]!.started_at.getTime()).toBeLessThan(86_400_000);
    await expect(getVisit(ownerOne, open[0]!.id, db)).rejects.toMatchObject({ code: 'not_found' });
    const unit = await db.selectFrom('equipment').select('id').where('name', '=', 'Freezer 1 condensing unit').executeTakeFirstOrThrow();
    const history = await equipmentHistory(ownerOne, unit.id, historyQuerySchema.parse({ limit: 100 }), db);
    const ratings = history.items.filter((e) => e.kind === 'condition').map((e) => e.data.rating);
    expect(ratings).toEqual([2, 3, 3, 4, 4]);
  });

  it('leaves no mail waiting in the outbox', async () => {
    const pending = await db.selectFrom('mail_outbox').select('id').where('status', '=', 'pending').execute();
    expect(pending).toEqual([]);
  });

  it('loads once: a second run of the loader and of the seed script changes nothing', async () => {
    const tally = async () => {
      const out: Record<string, number> = {};
      for (const t of ['systems', 'equipment', 'visits', 'entries', 'follow_ups', 'photos', 'tags', 'service_requests', 'mail_outbox'] as const) {
        out[t] = Number((await db.selectFrom(t).select((eb) => eb.fn.countAll<number>().as('n')).executeTakeFirstOrThrow()).n);
      }
      return out;
    };
    const before = await tally();
    expect(await seedDemoHistory(db, now)).toBeNull();
    execFileSync('node_modules/.bin/tsx', ['docker-free-scripts/seed.ts'], { env: process.env, stdio: 'pipe' });
    expect(await tally()).toEqual(before);
  });

  it('plans the week ahead: the Linden leak work and the Commissary maintenance, for the technician, on the week view and their home', async () => {
    const plans = (await listPlans(office, { status: ['planned'], limit: 50 }, db, now)).items;
    expect(plans.map((p) => [p.siteName, p.reason])).toEqual([
      ['Linden Avenue Market', 'leak_check'],
      ['Commissary', 'maintenance'],
    ]);
    for (const p of plans) expect(p.day > p.siteToday).toBe(true);
    expect(plans[0]!.day).toBe(addDays(plans[0]!.siteToday, 1));
    const tech = await actorFor(db, demoEmails.technician);
    expect((await plansForTechnician(tech, 7, db, now)).map((p) => p.id)).toEqual(plans.map((p) => p.id));
    // The second owner sees the plan at their store, not the first client's.
    expect((await listPlans(ownerTwo, { limit: 50 }, db, now)).items.map((p) => p.siteName)).toEqual(['Linden Avenue Market']);
  });
});
