// The lists that page through keysetPage (lib/api/paging.ts): walking page after page gives
// exactly the rows, in exactly the order, of one page large enough for them all.
import { describe, expect, it } from 'vitest';
import type { Page } from '@/lib/api/cursor';
import { createClient, listClients } from '@/lib/clients/service';
import { createFollowUp, listFollowUps } from '@/lib/follow-ups/service';
import { listSites } from '@/lib/sites/service';
import { listVisits, startVisit } from '@/lib/visits/service';
import { actorFor, createTestDb, demoEmails } from '@/tests/helpers/db';
import { resetDemoEach } from '@/tests/helpers/registry';

const db = createTestDb();

resetDemoEach(db);

/** Every page of a list, `limit` at a time, as the ids in the order the pages gave them. */
async function walk(list: (cursor: string | undefined) => Promise<Page<{ id: string }>>): Promise<string[]> {
  const seen: string[] = [];
  let cursor: string | undefined;
  let pages = 0;
  do {
    const page = await list(cursor);
    seen.push(...page.items.map((r) => r.id));
    cursor = page.nextCursor ?? undefined;
    pages += 1;
  } while (cursor && pages < 100);
  return seen;
}

describe('keyset pages', () => {
  it('clients come in name order, case folded, page after page', async () => {
    const office = await actorFor(db, demoEmails.office);
    for (const name of ['aster row market', 'Birchgate Pantry', 'cobble lane deli', 'Dunmere Ice House']) {
      await createClient(office, { name, notes: null });
    }
    const all = await listClients(office, { limit: 100, archived: 'exclude' });
    expect(all.nextCursor).toBeNull();
    expect(all.items.length).toBeGreaterThan(4);
    const folded = all.items.map((c) => c.name.toLowerCase());
    expect(folded).toEqual([...folded].sort((a, b) => (a < b ? -1 : a > b ? 1 : 0)));
    expect(await walk((cursor) => listClients(office, { limit: 2, cursor, archived: 'exclude' }))).toEqual(all.items.map((c) => c.id));
  });

  it('sites page in the same order as one full page', async () => {
    const office = await actorFor(db, demoEmails.office);
    const all = await listSites(office, { limit: 100, archived: 'exclude' });
    expect(all.items.length).toBeGreaterThan(2);
    expect(await walk((cursor) => listSites(office, { limit: 2, cursor, archived: 'exclude' }))).toEqual(all.items.map((s) => s.id));
  });

  it('follow-ups come oldest first, page after page', async () => {
    const tech = await actorFor(db, demoEmails.technician);
    const office = await actorFor(db, demoEmails.office);
    const site = (await listSites(office, { limit: 1, archived: 'exclude' })).items[0]!;
    for (const title of ['Check the door heater', 'Clean the condenser coil', 'Re-seal the wall sleeve']) {
      await createFollowUp(tech, { siteId: site.id, title, severity: 'minor' });
    }
    const all = await listFollowUps(office, { limit: 200 });
    expect(all.items.length).toBeGreaterThan(2);
    const created = all.items.map((f) => f.createdAt);
    expect(created).toEqual([...created].sort());
    expect(await walk((cursor) => listFollowUps(office, { limit: 2, cursor }))).toEqual(all.items.map((f) => f.id));
  });

  it('visits come newest first, page after page, ties on the start time kept apart by id', async () => {
    const tech = await actorFor(db, demoEmails.technician);
    const office = await actorFor(db, demoEmails.office);
    const sites = (await listSites(office, { limit: 3, archived: 'exclude' })).items;
    expect(sites.length).toBe(3);
    // Two visits start at the same instant: the page boundary falls between them with limit 2.
    const starts = ['2026-11-02T09:15:00.000Z', '2026-11-02T09:15:00.000Z', '2026-11-01T07:00:00.000Z'];
    for (const [i, site] of sites.entries()) await startVisit(tech, { siteId: site.id, reason: 'maintenance', startedAt: starts[i] });
    const all = await listVisits(office, { limit: 100 });
    expect(all.items.length).toBeGreaterThan(2);
    const started = all.items.map((v) => v.startedAt);
    expect(started).toEqual([...started].sort().reverse());
    expect(await walk((cursor) => listVisits(office, { limit: 2, cursor }))).toEqual(all.items.map((v) => v.id));
  });

  it('follow-ups made within the same millisecond are neither repeated nor lost', async () => {
    // created_at has microseconds: a cursor rounded to milliseconds would repeat the row.
    const tech = await actorFor(db, demoEmails.technician);
    const office = await actorFor(db, demoEmails.office);
    const site = (await listSites(office, { limit: 1, archived: 'exclude' })).items[0]!;
    const made = await Promise.all(['Label the isolation valve', 'Replace the sight glass cap'].map((title) => createFollowUp(tech, { siteId: site.id, title, severity: 'minor' })));
    const ids = await walk((cursor) => listFollowUps(office, { limit: 1, cursor, siteId: site.id }));
    expect(new Set(ids).size).toBe(ids.length);
    expect(ids).toEqual(expect.arrayContaining(made.map((f) => f.id)));
  });
});
