import { describe, expect, it } from 'vitest';
import type { SiteSummary } from '@/lib/overview/service';
import { bySiteNeed, HOME_SITE_CARDS, openFollowUpTotal, sitesForHome } from '@/lib/overview/site-need';

function site(name: string, over: { safety?: number; down?: number; degraded?: number; minor?: number; leaks?: number; failing?: number; poor?: number; pastLife?: number } = {}): SiteSummary {
  return {
    siteId: `id-${name}`,
    siteName: name,
    clientName: 'Client',
    timeZone: 'UTC',
    equipmentCount: 10,
    byCondition: { 1: over.failing ?? 0, 2: over.poor ?? 0, 3: 0, 4: 0, 5: 0, unrated: 10 },
    openFollowUps: { safety: over.safety ?? 0, down: over.down ?? 0, degraded: over.degraded ?? 0, minor: over.minor ?? 0 },
    systemsOverLeakThreshold: over.leaks ?? 0,
    pastExpectedLife: over.pastLife ?? 0,
    lastVisitAt: null,
  };
}

const names = (list: SiteSummary[]) => list.map((s) => s.siteName);

describe('owner home site order', () => {
  it('puts a safety item above any number of lesser items, then down, leaks, degraded, failing, poor, past life, minor', () => {
    const sites = [
      site('Minor', { minor: 9 }),
      site('Past life', { pastLife: 9 }),
      site('Poor', { poor: 9 }),
      site('Failing', { failing: 9 }),
      site('Degraded', { degraded: 9 }),
      site('Leak', { leaks: 9 }),
      site('Down', { down: 9, degraded: 20 }),
      site('Safety', { safety: 1 }),
      site('Quiet'),
    ];
    expect(names([...sites].sort(bySiteNeed))).toEqual(['Safety', 'Down', 'Leak', 'Degraded', 'Failing', 'Poor', 'Past life', 'Minor', 'Quiet']);
  });

  it('ranks more of the same item higher and breaks ties by name', () => {
    const sorted = [site('Birch', { down: 1 }), site('Alder', { down: 1 }), site('Cedar', { down: 2 }), site('Aspen')].sort(bySiteNeed);
    expect(names(sorted)).toEqual(['Cedar', 'Alder', 'Birch', 'Aspen']);
  });

  it('shows the first six as cards and keeps every other site, in order, for the short list', () => {
    const sites = Array.from({ length: 50 }, (_, i) => site(`Store ${String(i).padStart(2, '0')}`, { degraded: i % 5 }));
    const { cards, rest } = sitesForHome(sites);
    expect(HOME_SITE_CARDS).toBe(6);
    expect(cards).toHaveLength(6);
    expect(rest).toHaveLength(44);
    expect(new Set(names([...cards, ...rest]))).toEqual(new Set(names(sites)));
    // Ten sites have four degraded items: the first six of them by name are the cards.
    expect(names(cards)).toEqual(['Store 04', 'Store 09', 'Store 14', 'Store 19', 'Store 24', 'Store 29']);
    expect(rest[0]!.siteName).toBe('Store 34');
    expect(rest.at(-1)!.openFollowUps.degraded).toBe(0);
  });

  it('shows every site as a card when there are six or fewer', () => {
    const { cards, rest } = sitesForHome([site('One'), site('Two', { safety: 1 })]);
    expect(names(cards)).toEqual(['Two', 'One']);
    expect(rest).toEqual([]);
  });

  it('totals the open follow-ups of every severity', () => {
    expect(openFollowUpTotal(site('x', { safety: 1, down: 2, degraded: 3, minor: 4 }))).toBe(10);
  });
});
