// The calculation JSON API (issue 4): the route handlers called directly with a stubbed session.
// Every value check names its external source: the CoolProp 8.0.0 reference data
// (tests/fixtures/reference/saturation.csv) or a section of tests/fixtures/reference/TRADE-REFERENCE.md ("TR §n").
import fc from 'fast-check';
import { describe, expect, it, vi } from 'vitest';
import { actorFor, createTestDb, demoEmails } from '@/tests/helpers/db';
import { saturationRows } from '@/tests/helpers/reference-data';
import { signInOnDemo } from '@/tests/helpers/demo-session';
import { call, mockAuthModule, session } from '@/tests/helpers/session';

vi.mock('@/lib/auth', () => mockAuthModule());

const db = createTestDb();

signInOnDemo(db, 'technician');

type Json = Record<string, unknown>;
type Route = Record<string, (...args: never[]) => Promise<Response>>;

const KPA_PER_PSI = 6.894757293168361; // NIST SP 811 (TR §2): exact
const REFERENCE_CAUTION = "For service reference; verify against the equipment's documentation; local codes and licensed practice govern.";

const routes: Record<string, () => Promise<Route>> = {
  saturation: () => import('@/app/api/calc/saturation/route'),
  'pt-table': () => import('@/app/api/calc/pt-table/route'),
  refrigerants: () => import('@/app/api/calc/refrigerants/route'),
  readings: () => import('@/app/api/calc/readings/route'),
  'pressure-control': () => import('@/app/api/calc/pressure-control/route'),
  'voltage-unbalance': () => import('@/app/api/calc/voltage-unbalance/route'),
  'supply-voltage': () => import('@/app/api/calc/supply-voltage/route'),
  'control-voltage': () => import('@/app/api/calc/control-voltage/route'),
  'leak-rate': () => import('@/app/api/calc/leak-rate/route'),
  'service-life': () => import('@/app/api/calc/service-life/route'),
};

// One valid query per endpoint, used for the access and shape checks.
const validQueries: Record<string, string> = {
  saturation: 'refrigerant=R-404A&temperature=-20&unit=C',
  'pt-table': 'refrigerant=R-404A&from=-40&to=40&step=10&temperatureUnit=C&pressureUnit=psig',
  refrigerants: '',
  readings: 'refrigerant=R-404A&pressureUnit=psig&temperatureUnit=F&suctionPressure=20&suctionLineTemp=30',
  'pressure-control': 'type=low&refrigerant=R-404A&unit=psig&cutIn=30&differential=20',
  'voltage-unbalance': 'v1=460&v2=467&v3=450',
  'supply-voltage': 'measuredV=430&nameplateV=460',
  'control-voltage': 'measuredV=22',
  'leak-rate': 'refrigerant=R-404A&application=commercial_refrigeration&fullCharge=100&added=10&massUnit=lb&additionDate=2026-03-31&previousAdditionDate=2025-10-02',
  'service-life': 'equipmentType=compressor&installedOn=2010-01-01&asOf=2025-01-01&condition=3',
};

async function get(name: string, query: string): Promise<{ status: number; body: Json }> {
  const mod = await routes[name]!();
  const res = await call(mod.GET as never, { path: `/api/calc/${name}${query ? `?${query}` : ''}` });
  return { status: res.status, body: res.body as Json };
}

async function ok(name: string, query: string): Promise<Json> {
  const res = await get(name, query);
  expect(res.status, JSON.stringify(res.body)).toBe(200);
  return res.body;
}

async function unprocessable(name: string, query: string): Promise<{ message: string; issues: { path: string; message: string }[] }> {
  const res = await get(name, query);
  expect(res.status, JSON.stringify(res.body)).toBe(422);
  expect(res.body).toMatchObject({ error: { code: 'validation_failed', message: expect.any(String), issues: expect.any(Array) } });
  return (res.body as { error: { message: string; issues: { path: string; message: string }[] } }).error;
}

/** Relative difference, for the tolerances TR §0 suggests (±0.3 % pure/Lemmon blends, ±1.5 % HFO blends). */
const rel = (actual: number, expected: number): number => Math.abs(actual - expected) / Math.abs(expected);

function reference(id: string, tC: number, model?: string): { bubbleKpa: number; dewKpa: number } {
  const row = saturationRows().find((r) => r.id === id && r.tC === tC && (model === undefined || r.model === model));
  if (!row) throw new Error(`no CoolProp 8.0.0 reference row for ${id} at ${tC} °C`);
  return row;
}

describe('access', () => {
  for (const name of Object.keys(routes)) {
    it(`GET /api/calc/${name}: signed out → 401 with the error shape`, async () => {
      const saved = session.actor;
      session.actor = null;
      try {
        const res = await get(name, validQueries[name]!);
        expect(res.status).toBe(401);
        expect(res.body).toMatchObject({ error: { code: 'unauthorized', message: expect.any(String) } });
      } finally {
        session.actor = saved;
      }
    });

    it(`GET /api/calc/${name}: every role may use it (calc.use); the result names its basis and cautions`, async () => {
      const saved = session.actor;
      try {
        for (const email of [demoEmails.admin, demoEmails.office, demoEmails.technician, demoEmails.client]) {
          session.actor = await actorFor(db, email);
          const body = await ok(name, validQueries[name]!);
          expect(typeof body.basis, `${name} basis`).toBe('string');
          expect((body.basis as string).length).toBeGreaterThan(20);
          expect(Array.isArray(body.cautions), `${name} cautions`).toBe(true);
          expect((body.cautions as string[]).length).toBeGreaterThan(0);
        }
      } finally {
        session.actor = saved;
      }
    });
  }
});

describe('GET /api/calc/saturation', () => {
  it('temperature → pressure: the exact field names, R-404A at −20 °C against CoolProp 8.0.0 (Lemmon 2003 pseudo-pure)', async () => {
    const body = await ok('saturation', 'refrigerant=R-404A&temperature=-20&unit=C');
    expect(body.refrigerant).toBe('R-404A');
    expect(typeof body.bubbleKpaAbs).toBe('number');
    expect(typeof body.dewKpaAbs).toBe('number');
    const ref = reference('R-404A', -20, 'pseudo-pure'); // saturation.csv: 307.103 / 300.180 kPa abs
    expect(rel(body.bubbleKpaAbs as number, ref.bubbleKpa)).toBeLessThan(0.003);
    expect(rel(body.dewKpaAbs as number, ref.dewKpa)).toBeLessThan(0.003);
    expect(body.bubbleKpaAbs as number).toBeGreaterThan(body.dewKpaAbs as number);
    expect(body.cautions).toContain(REFERENCE_CAUTION);
  });

  it('accepts °F and lenient refrigerant spellings: R-134a at 32 °F = 0 °C is 292.80 kPa abs (TR §1.3), bubble = dew', async () => {
    const body = await ok('saturation', 'refrigerant=r134a&temperature=32&unit=F');
    expect(body.refrigerant).toBe('R-134a');
    expect(rel(body.bubbleKpaAbs as number, 292.8)).toBeLessThan(0.003);
    expect(body.dewKpaAbs).toBe(body.bubbleKpaAbs);
  });

  it('pure refrigerants give equal bubble and dew: R-22 at 0 °C is 497.99 kPa abs (TR §1.3)', async () => {
    const t = await ok('saturation', 'refrigerant=R-22&temperature=0&unit=C');
    expect(rel(t.bubbleKpaAbs as number, 497.99)).toBeLessThan(0.003);
    expect(t.dewKpaAbs).toBe(t.bubbleKpaAbs);
    // TR §1.3: R-22 at 0 °C is 57.5 psig.
    const p = await ok('saturation', 'refrigerant=R-22&pressure=57.5&unit=psig');
    expect(p.bubbleC).toBe(p.dewC);
    expect(p.glideK).toBe(0);
    expect(Math.abs(p.bubbleC as number)).toBeLessThan(0.1);
  });

  it('pressure → temperature: the exact field names; R-404A at its −20 °C bubble and dew pressures (CoolProp 8.0.0)', async () => {
    const ref = reference('R-404A', -20, 'pseudo-pure');
    const psigBubble = (ref.bubbleKpa - 101.325) / KPA_PER_PSI; // ≈ 29.85 psig
    const body = await ok('saturation', `refrigerant=R-404A&pressure=${psigBubble}&unit=psig`);
    expect(body.refrigerant).toBe('R-404A');
    expect(typeof body.bubbleC).toBe('number');
    expect(typeof body.dewC).toBe('number');
    // 0.3 % in pressure is about 0.1 K here.
    expect(Math.abs((body.bubbleC as number) + 20)).toBeLessThan(0.1);
    const dew = await ok('saturation', `refrigerant=R-404A&pressure=${ref.dewKpa}&unit=kPaAbs`);
    expect(Math.abs((dew.dewC as number) + 20)).toBeLessThan(0.1);
    expect(dew.glideK as number).toBeGreaterThan(0);
    expect(body.barometricKpa).toBe(101.325);
  });

  it('every pressure unit names the same state: 30 psig = 44.696 psia = 308.168 kPa abs = 206.843 kPa(g) = 3.08168 bar = 2.06843 bar(g) (TR §2)', async () => {
    const kpaAbs = 30 * KPA_PER_PSI + 101.325;
    const asked = [
      ['psig', 30],
      ['psia', 30 + 101.325 / KPA_PER_PSI],
      ['kPaAbs', kpaAbs],
      ['kPaG', kpaAbs - 101.325],
      ['bar', kpaAbs / 100],
      ['barG', (kpaAbs - 101.325) / 100],
    ] as const;
    const first = await ok('saturation', 'refrigerant=R-404A&pressure=30&unit=psig');
    for (const [unit, value] of asked) {
      const body = await ok('saturation', `refrigerant=R-404A&pressure=${value}&unit=${unit}`);
      expect(body.bubbleC as number, unit).toBeCloseTo(first.bubbleC as number, 6);
      expect(body.dewC as number, unit).toBeCloseTo(first.dewC as number, 6);
    }
  });

  it('gauge pressure against a site elevation: 1600 m gives the ISO 2533 barometer and a lower saturation temperature', async () => {
    const iso2533 = 101.325 * Math.pow(1 - 2.25577e-5 * 1600, 5.25588); // ICAO / ISO 2533 troposphere: ≈ 83.52 kPa
    const sea = await ok('saturation', 'refrigerant=R-404A&pressure=30&unit=psig');
    const high = await ok('saturation', 'refrigerant=R-404A&pressure=30&unit=psig&elevationM=1600');
    expect(high.barometricKpa as number).toBeCloseTo(iso2533, 6);
    expect(high.pressureKpaAbs as number).toBeCloseTo(30 * KPA_PER_PSI + iso2533, 6);
    expect(high.bubbleC as number).toBeLessThan(sea.bubbleC as number);
  });

  it('blends: bubble and dew against TR §1.4 (R-407C at 0 °C, ±0.3 %; R-448A at −30 °C, ±1.5 %)', async () => {
    const c = await ok('saturation', 'refrigerant=R-407C&temperature=0&unit=C');
    expect(rel(c.bubbleKpaAbs as number, 567.87)).toBeLessThan(0.003);
    expect(rel(c.dewKpaAbs as number, 460.71)).toBeLessThan(0.003);
    const a = await ok('saturation', 'refrigerant=R-448A&temperature=-30&unit=C');
    expect(rel(a.bubbleKpaAbs as number, 209.32)).toBeLessThan(0.015);
    expect(rel(a.dewKpaAbs as number, 159.05)).toBeLessThan(0.015);
  });

  it('a flammable refrigerant carries its handling caution (TR §10: A2L/A3)', async () => {
    const body = await ok('saturation', 'refrigerant=R-290&temperature=0&unit=C');
    expect(rel(body.bubbleKpaAbs as number, 474.46)).toBeLessThan(0.003); // TR §1.3
    expect(body.safetyClass).toBe('A3');
    expect((body.cautions as string[]).some((c) => c.includes('A3') && c.includes('flammable'))).toBe(true);
  });

  it('unknown refrigerant → 422 naming the known ones', async () => {
    const error = await unprocessable('saturation', 'refrigerant=R-999&temperature=0&unit=C');
    expect(error.issues[0]).toMatchObject({ path: 'refrigerant' });
    expect(error.issues[0]!.message).toContain('unknown refrigerant "R-999"');
    expect(error.issues[0]!.message).toContain('R-404A');
  });

  it('above the critical point → 422: R-744 at 35 °C (critical 30.98 °C, TR §1.2)', async () => {
    const error = await unprocessable('saturation', 'refrigerant=R-744&temperature=35&unit=C');
    expect(error.message).toContain('above its critical temperature 31 °C');
    expect(error.issues).toEqual([{ path: 'temperature', message: error.message }]);
  });

  it('above the critical pressure, quoted in the caller’s unit → 422', async () => {
    const error = await unprocessable('saturation', 'refrigerant=R-744&pressure=1500&unit=psig');
    expect(error.message).toContain('psig');
    expect(error.issues[0]).toMatchObject({ path: 'pressure' });
  });

  // Below a perfect vacuum (a pressure under −14.7 psig) is impossible, not merely out of range.
  it.each([
    ['refrigerant=R-404A&temperature=-20&unit=K', 'unit'],
    ['refrigerant=R-404A&pressure=30&unit=atm', 'unit'],
    ['refrigerant=R-404A&pressure=30&unit=C', 'unit'],
    ['refrigerant=R-404A&temperature=-20&pressure=30&unit=C', 'temperature'],
    ['refrigerant=R-404A&temperature=cold&unit=C', 'temperature'],
    ['temperature=-20&unit=C', 'refrigerant'],
    ['refrigerant=R-404A&pressure=-20&unit=psig', 'pressure'],
  ])('bad or missing units and inputs → 422 with the field named: %s → %s', async (query, path) => {
    expect((await unprocessable('saturation', query)).issues[0]).toMatchObject({ path });
  });
});

describe('GET /api/calc/pt-table', () => {
  it('rows in the caller’s units: R-404A −40…40 °C in psig against CoolProp 8.0.0', async () => {
    const body = await ok('pt-table', validQueries['pt-table']!);
    expect(body).toMatchObject({ refrigerant: 'R-404A', temperatureUnit: 'C', pressureUnit: 'psig', zeotropic: true, clipped: false, barometricKpa: 101.325 });
    const rows = body.rows as { temperature: number; bubble: number; dew: number }[];
    expect(rows.map((r) => r.temperature)).toEqual([-40, -30, -20, -10, 0, 10, 20, 30, 40]);
    for (const row of rows) {
      const ref = reference('R-404A', row.temperature, 'pseudo-pure');
      expect(rel(row.bubble * KPA_PER_PSI + 101.325, ref.bubbleKpa), `${row.temperature} °C bubble`).toBeLessThan(0.003);
      expect(rel(row.dew * KPA_PER_PSI + 101.325, ref.dewKpa), `${row.temperature} °C dew`).toBeLessThan(0.003);
    }
    // TR §1.4: R-404A at 40 °C is 250.6 / 248.5 psig.
    expect(rows.at(-1)!.bubble).toBeCloseTo(250.6, 0);
    expect(rows.at(-1)!.dew).toBeCloseTo(248.5, 0);
  });

  it('°F rows: R-134a at 32 °F is 27.8 psig (TR §1.3); a pure fluid has equal columns', async () => {
    const body = await ok('pt-table', 'refrigerant=R-134a&from=32&to=32&step=1&temperatureUnit=F&pressureUnit=psig');
    const rows = body.rows as { bubble: number; dew: number }[];
    expect(rows).toHaveLength(1);
    expect(rows[0]!.bubble).toBeCloseTo(27.8, 1);
    expect(rows[0]!.dew).toBe(rows[0]!.bubble);
  });

  it('clips at the critical point: R-744 0…40 °C stops at 30 °C (critical 30.98 °C, TR §1.2)', async () => {
    const body = await ok('pt-table', 'refrigerant=R-744&from=0&to=40&step=10&temperatureUnit=C&pressureUnit=kPaAbs');
    expect(body.clipped).toBe(true);
    const rows = body.rows as { temperature: number; bubble: number }[];
    expect(rows.map((r) => r.temperature)).toEqual([0, 10, 20, 30]);
    expect(rel(rows[0]!.bubble, 3485.14)).toBeLessThan(0.003); // TR §1.3
    expect(rel(rows[1]!.bubble, 4502.18)).toBeLessThan(0.003); // TR §1.3
  });

  it.each([
    ['from=40&to=-40&step=5&temperatureUnit=C&pressureUnit=psig', 'to'],
    ['from=-40&to=40&step=0&temperatureUnit=C&pressureUnit=psig', 'step'],
    ['from=-40&to=40&step=0.01&temperatureUnit=C&pressureUnit=psig', 'step'],
    ['from=-40&to=40&step=5&temperatureUnit=K&pressureUnit=psig', 'temperatureUnit'],
    ['from=-40&to=40&step=5&temperatureUnit=C&pressureUnit=psig&elevationM=20000', 'elevationM'],
  ])('rejects a bad range, step or unit → 422: refrigerant=R-404A&%s → %s', async (query, path) => {
    expect((await unprocessable('pt-table', `refrigerant=R-404A&${query}`)).issues[0]).toMatchObject({ path });
  });
});

describe('GET /api/calc/refrigerants', () => {
  it('lists all 16 refrigerants with class, GWP, glide and range (TR §1.1, §1.2)', async () => {
    const body = await ok('refrigerants', '');
    const items = body.items as Json[];
    expect(items).toHaveLength(16);
    expect(body.nextCursor).toBeNull();
    const byId = new Map(items.map((i) => [i.id as string, i]));
    expect(byId.get('R-404A')).toMatchObject({ safetyClass: 'A1', gwpAr4: 3922, zeotropic: true });
    expect(byId.get('R-404A')!.glideK as number).toBeCloseTo(0.75, 2); // TR §1.2 glide at 1 atm
    expect(byId.get('R-407C')!.glideK as number).toBeCloseTo(7.0, 1);
    expect(byId.get('R-507A')!.glideK).toBe(0);
    expect(byId.get('R-744')).toMatchObject({ glideK: null, range: { maxC: expect.closeTo(30.98, 2) } });
    expect(byId.get('R-32')).toMatchObject({ safetyClass: 'A2L', gwpAr4: 675 });
    expect((byId.get('R-32')!.cautions as string[]).join(' ')).toMatch(/A2L \(mildly flammable\)/);
    expect(byId.get('R-717')).toMatchObject({ safetyClass: 'B2L' });
    expect(byId.get('R-134a')!.cautions).toEqual([]);
  });
});

describe('GET /api/calc/readings', () => {
  it('superheat on the dew point, subcooling on the bubble point (TR §3), compression ratio on absolute pressures', async () => {
    const evap = reference('R-404A', -20, 'pseudo-pure');
    const cond = reference('R-404A', 40, 'pseudo-pure');
    const body = await ok(
      'readings',
      `refrigerant=R-404A&pressureUnit=kPaAbs&temperatureUnit=C&suctionPressure=${evap.dewKpa}&suctionLineTemp=-10&headPressure=${cond.bubbleKpa}&liquidLineTemp=35`,
    );
    expect((body.superheat as Json).value as number).toBeCloseTo(10, 1);
    expect((body.subcooling as Json).value as number).toBeCloseTo(5, 1);
    expect((body.compressionRatio as Json).ratio as number).toBeCloseTo(cond.bubbleKpa / evap.dewKpa, 6);
    expect(body.evaporatorTd).toBeNull();
    expect((body.cautions as string[]).some((c) => c.includes('certified'))).toBe(true);
  });

  it('a temperature difference in °F is 1.8 × K, with no 32 added (TR §2)', async () => {
    const evap = reference('R-404A', -20, 'pseudo-pure');
    const body = await ok('readings', `refrigerant=R-404A&pressureUnit=kPaAbs&temperatureUnit=F&suctionPressure=${evap.dewKpa}&suctionLineTemp=14`);
    expect((body.superheat as Json).value as number).toBeCloseTo(18, 1); // −20 °C = −4 °F; 14 − (−4) = 18 °F
  });

  it('needs a pressure and a matching temperature → 422', async () => {
    expect((await unprocessable('readings', 'refrigerant=R-404A&pressureUnit=psig&temperatureUnit=F&suctionPressure=20')).issues[0]).toMatchObject({ path: 'suctionPressure' });
  });
});

describe('GET /api/calc/pressure-control', () => {
  it('low side: cut-out = cut-in − differential (TR §4: 30/20 → 10 psig; 50/35 → 15 psig)', async () => {
    const a = await ok('pressure-control', 'type=low&refrigerant=R-404A&unit=psig&cutIn=30&differential=20&temperatureUnit=F');
    expect(a).toMatchObject({ type: 'low', cutIn: 30, cutOut: 10 });
    expect(a.cutInSaturation).toMatchObject({ dew: expect.any(Number), bubble: expect.any(Number) });
    const b = await ok('pressure-control', 'type=low&refrigerant=R-404A&unit=psig&cutIn=50&differential=35');
    expect(b).toMatchObject({ cutOut: 15 });
    expect((b.cautions as string[]).some((c) => c.includes('jumper'))).toBe(true);
  });

  it('high side: cut-in = cut-out − differential (TR §4); above the nameplate design pressure warns', async () => {
    const body = await ok('pressure-control', 'type=high&refrigerant=R-404A&unit=psig&cutOut=400&differential=100&designPressure=385');
    expect(body).toMatchObject({ type: 'high', cutOut: 400, cutIn: 300 });
    expect((body.warnings as { code: string }[]).map((w) => w.code)).toContain('above_design_pressure');
  });

  it('a missing or unknown type → 422', async () => {
    expect((await unprocessable('pressure-control', 'refrigerant=R-404A&unit=psig&cutIn=30&differential=20')).issues[0]).toMatchObject({ path: 'type' });
    expect((await unprocessable('pressure-control', 'type=medium&refrigerant=R-404A&unit=psig&cutIn=30&differential=20')).issues[0]).toMatchObject({ path: 'type' });
  });
});

describe('electrical', () => {
  it('voltage unbalance by NEMA MG 1 (TR §5.1: 460/467/450 → 1.96 %, derate ≈ 0.95; 462/463/455 → 1.09 %)', async () => {
    const a = await ok('voltage-unbalance', 'v1=460&v2=467&v3=450');
    expect(a.unbalancePct as number).toBeCloseTo(1.96, 2);
    expect(a.deratingFactor as number).toBeCloseTo(0.95, 2);
    expect((a.cautions as string[])[0]).toMatch(/energised/);
    const b = await ok('voltage-unbalance', 'v1=462&v2=463&v3=455');
    expect(b.unbalancePct as number).toBeCloseTo(1.09, 2);
    expect((await unprocessable('voltage-unbalance', 'v1=460&v2=467')).issues[0]).toMatchObject({ path: 'v3' });
  });

  it('supply voltage against ANSI C84.1 (TR §5.2: 480 V system, Range B utilization min 424 V, Range A 440 V)', async () => {
    const body = await ok('supply-voltage', 'measuredV=430&nameplateV=460');
    expect(body).toMatchObject({ verdict: 'range_b', direction: 'low' });
    expect((await unprocessable('supply-voltage', 'measuredV=430&nameplateV=455')).issues[0]).toMatchObject({ path: 'nameplateV' });
  });

  it('control voltage: 22 V on 24 V is marginal (low) in words; out below 85 % / above 110 % (IEC 60947-4-1, from memory; TR §5.3)', async () => {
    const body = await ok('control-voltage', 'measuredV=22');
    expect(body).toMatchObject({ status: 'marginal', direction: 'low', level: 'watch', minV: 20.4 });
    expect(body.maxV as number).toBeCloseTo(26.4, 9);
    expect(body.message).toMatch(/^22 V on a 24 V circuit: marginal \(low\)/);
    expect((body.notes as string[]).join(' ')).toMatch(/under load/);
    expect(await ok('control-voltage', 'measuredV=20')).toMatchObject({ status: 'out', direction: 'low', level: 'abnormal' });
    expect(await ok('control-voltage', 'measuredV=24.4')).toMatchObject({ status: 'ok', direction: null });
  });

  it('supply voltage on three lines: each against ANSI C84.1, the worst decides (TR §5.2, from memory)', async () => {
    const body = await ok('supply-voltage', 'v1=470&v2=465&v3=430&nameplateV=460');
    expect(body).toMatchObject({ verdict: 'range_b', direction: 'low', worstLine: 2, level: 'watch' });
    expect((body.lines as Json[]).map((l) => l.verdict)).toEqual(['range_a', 'range_a', 'range_b']);
    expect(body.message).toMatch(/^Line 3 decides: 430 V/);
    expect((await unprocessable('supply-voltage', 'v1=470&v2=465&nameplateV=460')).issues[0]).toMatchObject({ path: 'v3' });
    expect((await unprocessable('supply-voltage', 'nameplateV=460')).issues[0]).toMatchObject({ path: 'measuredV' });
  });
});

describe('GET /api/calc/leak-rate', () => {
  it('annualizing method (TR §6.1: 10 lb of 100 lb after 180 days → 20.28 %) over the 20 % commercial threshold (TR §6.3)', async () => {
    const body = await ok('leak-rate', validQueries['leak-rate']!);
    expect(body.ratePct as number).toBeCloseTo(20.28, 2);
    expect(body).toMatchObject({ thresholdPct: 20, exceedsThreshold: true, daysUsed: 180 });
    expect((body.cautions as string[]).join(' ')).toMatch(/State and local rules/);
    expect(body.cautions).toContain(REFERENCE_CAUTION);
  });

  it('3 lb of 50 lb after 60 days → 36.5 % (TR §6.1)', async () => {
    const body = await ok('leak-rate', 'refrigerant=R-22&application=comfort_cooling&fullCharge=50&added=3&massUnit=lb&additionDate=2025-03-02&previousAdditionDate=2025-01-01');
    expect(body.ratePct as number).toBeCloseTo(36.5, 1);
  });

  it('rejects a bad date or application → 422', async () => {
    expect((await unprocessable('leak-rate', 'refrigerant=R-404A&application=commercial_refrigeration&fullCharge=100&added=10&massUnit=lb&additionDate=31/03/2026')).issues[0]).toMatchObject({ path: 'additionDate' });
    expect((await unprocessable('leak-rate', 'refrigerant=R-404A&application=bakery&fullCharge=100&added=10&massUnit=lb&additionDate=2026-03-31')).issues[0]).toMatchObject({ path: 'application' });
  });
});

describe('GET /api/calc/service-life', () => {
  it('reciprocating compressors have a 20-year median (TR §7, ASHRAE / Akalin 1978): 15 years old → 5 left, monitor', async () => {
    const body = await ok('service-life', validQueries['service-life']!);
    expect(body).toMatchObject({ medianYears: 20, outlook: 'monitor' });
    expect(body.ageYears as number).toBeCloseTo(15, 2);
    expect(body.cautions).toEqual([body.caution]);
  });

  it('an install date after the as-of date → 422 on installedOn', async () => {
    expect((await unprocessable('service-life', 'equipmentType=compressor&installedOn=2026-01-01&asOf=2025-01-01')).issues[0]).toMatchObject({ path: 'installedOn' });
  });
});

describe('GET /api/calc/readings: levels, bands and suggestions (issue 14)', () => {
  it('R-404A freezer not cooling (TR §1.4 saturation; §3/§8 bands, common practice): each value has its level and band; suggestions are a ranked guide', async () => {
    const body = await ok(
      'readings',
      'refrigerant=R-404A&pressureUnit=psig&temperatureUnit=F&designBoxTemp=-10&suctionPressure=14.6&suctionLineTemp=4&headPressure=250.6&liquidLineTemp=103&boxTemp=20&ambientTemp=85',
    );
    const sh = body.superheat as Json;
    expect(sh).toMatchObject({ level: 'abnormal', direction: 'high', reference: 'dew' });
    expect((sh.band as Json).text).toBe('usual 4–6 °F for a freezer evaporator (TXV)');
    expect((sh.band as Json).source).toMatch(/common practice/);
    expect((body.evaporatorTd as Json).level).toBe('abnormal');
    expect((body.subcooling as Json)).toMatchObject({ level: 'watch', pressureSource: 'head' });
    const suggestions = body.suggestions as Json[];
    expect(suggestions[0]).toMatchObject({ code: 'undercharge_or_liquid_restriction', rank: 1, guide: true });
    expect(suggestions[0]!.basis).toMatch(/not a verdict/);
    expect(body).toMatchObject({ boxClass: 'freezer', boxClassFrom: 'design_box_temperature', barometerSource: 'standard' });
  });

  it('a transcritical R-744 head keeps the suction-side values and puts its error on its own field (TR §1.2: critical 7377.3 kPa)', async () => {
    const body = await ok('readings', 'refrigerant=R-744&pressureUnit=kPaAbs&temperatureUnit=C&suctionPressure=1969.63&suctionLineTemp=-14&headPressure=9000&liquidLineTemp=30');
    expect((body.superheat as Json).valueK as number).toBeCloseTo(6, 1);
    expect(body.subcooling).toBeNull();
    expect((body.errors as Json).subcooling).toMatchObject({ field: 'headPressure', code: 'out_of_range' });
  });

  it('electrical readings ride along: 22 V on 24 V gives the transformer suggestion; three lines give unbalance and supply levels', async () => {
    const body = await ok('readings', 'refrigerant=R-404A&pressureUnit=psig&temperatureUnit=F&controlVolts=22&v1=460&v2=467&v3=450&nameplateV=460');
    expect(body.controlVoltage).toMatchObject({ status: 'marginal', level: 'watch' });
    expect(body.voltageUnbalance).toMatchObject({ level: 'watch' }); // 1.96 % (TR §5.1): above 1 %, within the common 2 %
    expect(body.supplyVoltage).toMatchObject({ verdict: 'range_a', level: 'normal' });
    expect((body.suggestions as Json[]).map((x) => x.code)).toContain('control_transformer_or_connection');
    expect((await unprocessable('readings', 'refrigerant=R-404A&pressureUnit=psig&temperatureUnit=F&v1=460&v2=467')).issues.map((i) => i.path)).toContain('v3');
  });
});

describe('temperatureUnit on every endpoint; an imperial user reads °F and psig', () => {
  const withF: Record<string, string> = {
    saturation: 'refrigerant=R-404A&pressure=30&unit=psig&temperatureUnit=F',
    'pt-table': 'refrigerant=R-404A&from=-40&to=40&step=10&temperatureUnit=F&pressureUnit=psig',
    refrigerants: 'temperatureUnit=F',
    readings: 'refrigerant=R-404A&pressureUnit=psig&temperatureUnit=F&suctionPressure=20&suctionLineTemp=30',
    'pressure-control': 'type=low&refrigerant=R-404A&unit=psig&cutIn=30&differential=20&temperatureUnit=F',
    'voltage-unbalance': 'v1=460&v2=467&v3=450&temperatureUnit=F',
    'supply-voltage': 'measuredV=430&nameplateV=460&temperatureUnit=F',
    'control-voltage': 'measuredV=22&temperatureUnit=F',
    'leak-rate': `${validQueries['leak-rate']}&temperatureUnit=F`,
    'service-life': `${validQueries['service-life']}&temperatureUnit=F`,
  };
  for (const name of Object.keys(routes)) {
    it(`GET /api/calc/${name} takes temperatureUnit=F and answers in it; a bad unit → 422`, async () => {
      const body = await ok(name, withF[name]!);
      expect(body.temperatureUnit).toBe('F');
      expect((await unprocessable(name, `${withF[name]!.replace('temperatureUnit=F', 'temperatureUnit=K')}`)).issues.map((i) => i.path)).toContain('temperatureUnit');
    });
  }

  it('pressure-control warnings in °F and psig: cut-in above a 35 °F box, R-404A (TR §4 pump-down example range)', async () => {
    const body = await ok('pressure-control', 'type=low&refrigerant=R-404A&unit=psig&cutIn=80&differential=60&designBoxTemp=35&temperatureUnit=F');
    const warnings = body.warnings as { code: string; message: string }[];
    const w = warnings.find((x) => x.code === 'cut_in_above_box')!;
    expect(w.message).toMatch(/°F/);
    expect(w.message).not.toMatch(/°C/);
    const high = await ok('pressure-control', 'type=high&refrigerant=R-404A&unit=psig&cutOut=250&differential=60&temperatureUnit=F');
    const trip = (high.warnings as { code: string; message: string }[]).find((x) => x.code === 'cut_out_below_condensing')!;
    expect(trip.message).toMatch(/250 psig/);
    expect(trip.message).toMatch(/°F/);
  });

  it('a range error on a pressure look-up quotes psig and °F', async () => {
    const error = await unprocessable('saturation', 'refrigerant=R-404A&pressure=700&unit=psig&temperatureUnit=F');
    expect(error.message).toMatch(/psig/);
    expect(error.message).not.toMatch(/°C|kPa/);
  });

  it('the saturation look-up at 1610 m names its barometer and offers the sea-level value (ISO 2533; TR §1.4: 14.6 psig ↔ −30 °C dew)', async () => {
    const body = await ok('saturation', 'refrigerant=R-404A&pressure=14.6&unit=psig&temperatureUnit=F&elevationM=1610');
    expect(body.barometricKpa as number).toBeCloseTo(101.325 * Math.pow(1 - 2.25577e-5 * 1610, 5.25588), 6);
    expect(((body.seaLevel as Json).dew as number)).toBeCloseTo(-22, 0);
    expect(body.dew as number).toBeLessThan(((body.seaLevel as Json).dew as number) - 3);
  });
});

describe('no raw float in any message of the calculation API (property test)', () => {
  const RAW_FLOAT = /\d\.\d{3,}/;
  const strings = (v: unknown, out: string[] = []): string[] => {
    if (typeof v === 'string') out.push(v);
    else if (Array.isArray(v)) v.forEach((x) => strings(x, out));
    else if (v && typeof v === 'object') Object.values(v).forEach((x) => strings(x, out));
    return out;
  };
  const num = (min: number, max: number) => fc.double({ min, max, noNaN: true, noDefaultInfinity: true });
  const refrigerant = fc.constantFrom('R-404A', 'R-134a', 'R-744', 'R-407C', 'R-448A', 'R-290', 'R-22');
  const unit = fc.constantFrom('C', 'F');
  const queries: fc.Arbitrary<[string, string]> = fc.oneof(
    fc.tuple(refrigerant, unit, num(-20, 600), num(-40, 80), num(-20, 2500), num(-40, 160), num(-40, 60), num(-20, 120)).map(([r, u, sp, sl, hp, ll, box, amb]) => [
      'readings',
      `refrigerant=${r}&pressureUnit=psig&temperatureUnit=${u}&suctionPressure=${sp}&suctionLineTemp=${sl}&headPressure=${hp}&liquidLineTemp=${ll}&boxTemp=${box}&ambientTemp=${amb}&controlVolts=${Math.abs(sl) + 1}`,
    ] as [string, string]),
    fc.tuple(refrigerant, unit, num(-10, 2000), num(0.5, 300)).map(([r, u, set, diff]) => [
      'pressure-control',
      `type=${diff > 150 ? 'high' : 'low'}&refrigerant=${r}&unit=psig&${diff > 150 ? 'cutOut' : 'cutIn'}=${set}&differential=${diff}&temperatureUnit=${u}&designBoxTemp=${set / 10}`,
    ] as [string, string]),
    fc.tuple(refrigerant, unit, num(-20, 1500)).map(([r, u, p]) => ['saturation', `refrigerant=${r}&pressure=${p}&unit=psig&temperatureUnit=${u}&elevationM=1610`] as [string, string]),
    fc.tuple(num(50, 600), num(50, 600), num(50, 600), fc.constantFrom(208, 230, 460)).map(([a, b, c, n]) => ['supply-voltage', `v1=${a}&v2=${b}&v3=${c}&nameplateV=${n}`] as [string, string]),
    fc.tuple(num(1, 40)).map(([v]) => ['control-voltage', `measuredV=${v}`] as [string, string]),
    fc.tuple(num(50, 600), num(50, 600), num(50, 600)).map(([a, b, c]) => ['voltage-unbalance', `v1=${a}&v2=${b}&v3=${c}`] as [string, string]),
  );

  it('over random queries, every string in the answer (or its 422 error) has at most two decimals', async () => {
    await fc.assert(
      fc.asyncProperty(queries, async ([name, query]) => {
        const res = await get(name, query);
        expect([200, 422], JSON.stringify(res.body)).toContain(res.status);
        // Section numbers of cited rules ("29 CFR 1910.147") are citations, not measured values.
        for (const text of strings(res.body)) expect(text.replace(/\b\d+ CFR \d+\.\d+/g, 'CFR §'), `${name}?${query}`).not.toMatch(RAW_FLOAT);
      }),
      { numRuns: 150 },
    );
  });
});
