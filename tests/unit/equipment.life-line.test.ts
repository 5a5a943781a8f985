// The age line in equipment lists. Condensing unit median life: 20 years, the "Compressors,
// reciprocating" row of the service-life table in ASHRAE Handbook—HVAC Applications, "Owning and
// Operating Costs" (medians from Akalin 1978).
import { describe, expect, it } from 'vitest';
import { lifeLine } from '@/lib/equipment/life-line';

const today = new Date('2026-12-01T12:00:00Z');

describe('equipment life line', () => {
  it('says how much expected life is left, or how far past it a unit is', () => {
    const median = 20;
    expect(lifeLine({ type: 'condensing_unit', installedOn: '2020-06-01' }, today)).toBe(`6 years old; about ${median - 6} years of expected life left (of ${median})`);
    expect(lifeLine({ type: 'condensing_unit', installedOn: '2004-06-03' }, today)).toBe(`22 years old; ${22 - median} years past its expected life of ${median} years`);
    expect(lifeLine({ type: 'condensing_unit', installedOn: `${2026 - median}-11-01` }, today)).toBe(`${median} years old; at its expected life of ${median} years`);
    expect(lifeLine({ type: 'condensing_unit', installedOn: '2026-10-01' }, today)).toMatch(/^under a year old; about 20 years/);
  });

  it('says what is missing instead of guessing', () => {
    expect(lifeLine({ type: 'condensing_unit', installedOn: null }, today)).toBe('Install date not recorded');
    expect(lifeLine({ type: 'condensing_unit', installedOn: '2027-01-01' }, today)).toBe('Installed 2027-01-01');
  });
});
