// components/visits/visit-group-title.tsx: groupByVisit splits a newest-first list into runs of one
// visit, keeping order, and asks for each run's visit once.
import { describe, expect, it, vi } from 'vitest';
import { groupByVisit } from '@/components/visits/visit-group-title';

describe('groupByVisit', () => {
  it('groups consecutive entries of a visit and keeps a visit seen again later as its own group', () => {
    const entries = [
      { id: 'e1', visitId: 'v2' },
      { id: 'e2', visitId: 'v2' },
      { id: 'e3', visitId: 'v1' },
      { id: 'e4', visitId: 'v2' },
    ];
    const visitOf = vi.fn((e: { visitId: string }) => `visit ${e.visitId}`);
    const groups = groupByVisit(entries, visitOf);
    expect(groups.map((g) => [g.visitId, g.visit, g.entries.map((e) => e.id)])).toEqual([
      ['v2', 'visit v2', ['e1', 'e2']],
      ['v1', 'visit v1', ['e3']],
      ['v2', 'visit v2', ['e4']],
    ]);
    expect(visitOf).toHaveBeenCalledTimes(3);
  });

  it('gives no groups for no entries', () => {
    expect(groupByVisit([], () => null)).toEqual([]);
  });
});
