// A visit page built from a kept site pack (lib/offline/visit-copy): the shapes the visit page gets
// from the server, made on the phone for work without signal; and where the worker sends a visit
// page it never kept (lib/offline/cache-names). Sites, makes and people are invented.
import { describe, expect, it } from 'vitest';
import { offlineVisitTarget, pageCacheKey } from '@/lib/offline/cache-names';
import { visitFromPack } from '@/lib/offline/visit-copy';
import { SITE_PACK_VERSION, type PackUnit, type SitePack } from '@/lib/sites/pack-schema';

const visitId = '0a0a0a0a-0000-4000-8000-000000000001';
const otherVisit = '0a0a0a0a-0000-4000-8000-000000000002';

function unit(n: number, over: Partial<PackUnit> = {}): PackUnit {
  return {
    id: `1b1b1b1b-0000-4000-8000-00000000000${n}`,
    name: `Unit ${n}`,
    type: 'evaporator',
    areaId: null,
    areaName: 'Back of house',
    systemId: null,
    systemName: null,
    refrigerant: 'R-448A',
    make: 'Kelvrin',
    model: null,
    serial: null,
    nameplate: {},
    tagCode: null,
    condition: 4,
    conditionNote: null,
    status: 'in_service',
    history: [],
    ...over,
  };
}

const pack: SitePack = {
  version: SITE_PACK_VERSION,
  takenAt: '2026-12-04T07:00:00.000Z',
  viewer: { id: '2c2c2c2c-0000-4000-8000-000000000001', name: 'Tamsin Orrell', role: 'technician', units: 'imperial', metricPressure: 'kPa' },
  site: { id: '3d3d3d3d-0000-4000-8000-000000000001', name: 'Harbour Lane Grocer', clientName: 'Quaymart', timeZone: 'America/Denver', elevationM: 1610 },
  openVisitId: null,
  openVisit: null,
  units: [
    unit(2, {
      tagCode: 'K7QM3X9PA',
      history: [
        { id: '4e4e4e4e-0000-4000-8000-000000000002', visitId, kind: 'note', data: { text: 'second' }, computed: null, recordedAt: '2026-12-04T08:30:00.000Z', createdByName: 'Tamsin Orrell' },
        { id: '4e4e4e4e-0000-4000-8000-000000000009', visitId: otherVisit, kind: 'note', data: { text: 'old' }, computed: null, recordedAt: '2026-11-01T08:30:00.000Z', createdByName: 'Tamsin Orrell' },
      ],
    }),
    unit(1, { history: [{ id: '4e4e4e4e-0000-4000-8000-000000000001', visitId, kind: 'note', data: { text: 'first' }, computed: null, recordedAt: '2026-12-04T08:10:00.000Z', createdByName: 'Tamsin Orrell' }] }),
  ],
  visits: {},
  followUps: [],
  contexts: {},
};

describe('a visit from the phone’s copy', () => {
  it('is the pack person’s open visit at the pack’s site, with the units in service by name', () => {
    const copy = visitFromPack(pack, { id: visitId, reason: 'no_cooling', startedAt: '2026-12-04T08:00:00.000Z' });
    expect(copy.visit).toMatchObject({ id: visitId, siteName: 'Harbour Lane Grocer', timeZone: 'America/Denver', technicianName: 'Tamsin Orrell', technicianId: pack.viewer.id, status: 'open', reason: 'no_cooling' });
    expect(copy.equipment.map((e) => e.name)).toEqual(['Unit 1', 'Unit 2']);
    expect(copy.equipment[0]).toMatchObject({ siteId: pack.site.id, siteTimeZone: 'America/Denver', clientName: 'Quaymart', refrigerant: 'R-448A' });
    expect(copy.tagCodes).toEqual({ [unit(2).id]: 'K7QM3X9PA' });
    expect(copy.prefs).toEqual({ units: 'imperial', metricPressure: 'kPa' });
    expect(copy.actorId).toBe(pack.viewer.id);
  });

  it('holds the visit’s own entries the server had, oldest first, and none of other visits', () => {
    const copy = visitFromPack(pack, { id: visitId, reason: 'no_cooling', startedAt: '2026-12-04T08:00:00.000Z' });
    expect(copy.visit.entries.map((e) => [e.equipmentName, e.data.text])).toEqual([
      ['Unit 1', 'first'],
      ['Unit 2', 'second'],
    ]);
    expect(copy.visit.entryCount).toBe(2);
  });

  it('leaves removed units out of the units to work on', () => {
    const copy = visitFromPack({ ...pack, units: [...pack.units, unit(3, { status: 'removed' })] }, { id: visitId, reason: 'maintenance', startedAt: '2026-12-04T08:00:00.000Z' });
    expect(copy.equipment.map((e) => e.name)).not.toContain('Unit 3');
  });
});

describe('the worker and visit pages', () => {
  it('keeps one copy of a visit page whatever its query, and of the phone’s pages', () => {
    expect(pageCacheKey(new URL(`https://app.test/visits/${visitId}?equipment=x&kind=reading`))).toBe(`https://app.test/visits/${visitId}`);
    expect(pageCacheKey(new URL(`https://app.test/offline/visit?id=${visitId}`))).toBe('https://app.test/offline/visit');
    expect(pageCacheKey(new URL('https://app.test/offline/unit?code=K7QM3X9PA'))).toBe('https://app.test/offline/unit');
    // The start page reads its query on the server: each kept as it is.
    expect(pageCacheKey(new URL('https://app.test/visits/new?siteId=abc'))).toBeNull();
  });

  it('sends a visit page it never kept to the phone’s copy, with the place in the visit', () => {
    expect(offlineVisitTarget(new URL(`https://app.test/visits/${visitId.toUpperCase()}?equipment=e1&kind=reading`))).toBe(`/offline/visit?id=${visitId}&equipment=e1&kind=reading`);
    expect(offlineVisitTarget(new URL('https://app.test/visits/new'))).toBeNull();
  });
});
