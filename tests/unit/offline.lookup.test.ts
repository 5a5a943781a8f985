// Finding a unit among kept site packs, and which addresses the worker answers from the pack.
import { describe, expect, it } from 'vitest';
import { isFieldPage, offlineUnitTarget } from '@/lib/offline/cache-names';
import { findUnit } from '@/lib/offline/lookup';
import { SITE_PACK_VERSION, type PackUnit, type SitePack } from '@/lib/sites/pack-schema';

const unit = (id: string, name: string, tagCode: string | null): PackUnit => ({
  id,
  name,
  type: 'evaporator',
  areaId: null,
  areaName: null,
  systemId: null,
  systemName: null,
  refrigerant: null,
  make: null,
  model: null,
  serial: null,
  nameplate: {},
  tagCode,
  condition: null,
  conditionNote: null,
  status: 'in_service',
  history: [],
});

const pack = (siteId: string, takenAt: string, units: PackUnit[]): { pack: SitePack } => ({
  pack: {
    version: SITE_PACK_VERSION,
    takenAt,
    viewer: { id: '00000000-0000-4000-8000-000000000001', name: 'Tamsin Orrell', role: 'technician', units: 'imperial', metricPressure: 'kPa' },
    site: { id: siteId, name: `Site ${siteId.slice(-1)}`, clientName: 'Client', timeZone: 'UTC', elevationM: 0 },
    openVisitId: null,
    openVisit: null,
    units,
    visits: {},
    followUps: [],
    contexts: {},
  },
});

const A = '00000000-0000-4000-8000-00000000000a';
const B = '00000000-0000-4000-8000-00000000000b';
const U1 = '10000000-0000-4000-8000-000000000001';
const U2 = '10000000-0000-4000-8000-000000000002';

describe('findUnit', () => {
  const kept = [pack(A, '2026-12-01T10:00:00.000Z', [unit(U1, 'Walk-in evaporator', 'K7QM3X9PA')]), pack(B, '2026-12-03T10:00:00.000Z', [unit(U2, 'Reach-in', null)])];

  it('finds a unit by its tag code as a person types it (case, hyphens, look-alike letters)', () => {
    expect(findUnit(kept, { code: 'k7q-m3x-9pa' })?.unit.id).toBe(U1);
    expect(findUnit(kept, { code: 'K7QM3X9PA' })?.unit.name).toBe('Walk-in evaporator');
    // O is read as zero, so a code with an O never matches one with the letter.
    expect(findUnit(kept, { code: 'K7QM3X9PO' })).toBeNull();
  });

  it('finds a unit by equipment id, in any letter case, and says which kept site it came from', () => {
    const found = findUnit(kept, { id: U2.toUpperCase() });
    expect(found?.unit.name).toBe('Reach-in');
    expect(found?.kept.pack.site.id).toBe(B);
  });

  it('finds nothing for an unknown unit, an empty code or a unit without a tag', () => {
    expect(findUnit(kept, { id: '20000000-0000-4000-8000-000000000000' })).toBeNull();
    expect(findUnit(kept, { code: ' - ' })).toBeNull();
    expect(findUnit([], { code: 'K7QM3X9PA' })).toBeNull();
  });

  it('prefers the newest pack when a unit sits in two (moved between kept sites)', () => {
    const moved = [pack(A, '2026-12-01T10:00:00.000Z', [unit(U1, 'Old place', 'K7QM3X9PA')]), pack(B, '2026-12-04T10:00:00.000Z', [unit(U1, 'New place', 'K7QM3X9PA')])];
    expect(findUnit(moved, { code: 'K7QM3X9PA' })?.unit.name).toBe('New place');
  });
});

describe('worker addresses', () => {
  it('sends a unit’s own addresses to the pack’s unit page', () => {
    expect(offlineUnitTarget('/T/K7QM3X9PA')).toBe('/offline/unit?code=K7QM3X9PA');
    expect(offlineUnitTarget('/tag/k7q-m3x-9pa')).toBe('/offline/unit?code=k7q-m3x-9pa');
    expect(offlineUnitTarget(`/equipment/${U1.toUpperCase()}`)).toBe(`/offline/unit?id=${U1}`);
    expect(offlineUnitTarget(`/equipment/${U1}/edit`)).toBeNull();
    expect(offlineUnitTarget('/T/%E0%A4%A')).toBeNull();
    expect(offlineUnitTarget('/sites')).toBeNull();
  });

  it('keeps the field pages and never an API answer', () => {
    expect(isFieldPage('/scan')).toBe(true);
    expect(isFieldPage('/tools/pt-chart')).toBe(true);
    expect(isFieldPage('/offline/unit')).toBe(true);
    expect(isFieldPage(`/visits/${U1}`)).toBe(true);
    expect(isFieldPage('/visits/new')).toBe(true);
    expect(isFieldPage('/api/sites')).toBe(false);
    expect(isFieldPage('/settings')).toBe(false);
  });
});
