import { afterAll, beforeEach } from 'vitest';
import type { Kysely } from 'kysely';
import type { DB } from '@/db/schema.gen';
import type { Actor } from '@/lib/auth/actor';
import { actorFor, demoEmails, resetToDemo } from '@/tests/helpers/db';

/**
 * A walk-in cooler circuit on a demo site, written straight to the database: a system with a
 * full charge of 100 lb (45.359 kg), a condensing unit, an evaporator, a low-pressure control and
 * a thermostat. Invented makes and serials.
 */
export async function createCoolerCircuit(db: Kysely<DB>, siteName = 'Pell Street Kitchen') {
  const site = await db.selectFrom('sites').select(['id', 'company_id']).where('name', '=', siteName).executeTakeFirstOrThrow();
  const system = await db
    .insertInto('systems')
    .values({
      company_id: site.company_id,
      site_id: site.id,
      name: 'Walk-in cooler circuit',
      refrigerant: 'R-404A',
      full_charge_kg: 100 * 0.45359237,
      application: 'commercial_refrigeration',
      design_box_temp_c: 1.67,
    })
    .returning('id')
    .executeTakeFirstOrThrow();
  const add = async (type: string, name: string, nameplate: Record<string, unknown> = {}) =>
    (
      await db
        .insertInto('equipment')
        .values({ company_id: site.company_id, site_id: site.id, system_id: system.id, type, name, nameplate: JSON.stringify(nameplate), serial: `${type.slice(0, 2).toUpperCase()}-${name.length}42` })
        .returning('id')
        .executeTakeFirstOrThrow()
    ).id;
  return {
    siteId: site.id,
    companyId: site.company_id,
    systemId: system.id,
    condensingUnitId: await add('condensing_unit', 'Cooler condensing unit', { voltage: 460, phase: '3', designPressureHighKpa: 2758 }),
    evaporatorId: await add('evaporator', 'Cooler evaporator'),
    lowControlId: await add('pressure_control', 'Low-pressure control', { controlKind: 'low' }),
    thermostatId: await add('thermostat', 'Box thermostat', { controlVoltage: 24 }),
  };
}

export type CoolerCircuit = Awaited<ReturnType<typeof createCoolerCircuit>>;

/** The visit tests' starting point: the demo, its technician and office, and a fresh cooler circuit. */
export async function demoWithCircuit(db: Kysely<DB>): Promise<{ tech: Actor; office: Actor; owner: Actor; circuit: CoolerCircuit }> {
  await resetToDemo(db);
  const [tech, office, owner] = [await actorFor(db, demoEmails.technician), await actorFor(db, demoEmails.office), await actorFor(db, demoEmails.client)];
  return { tech, office, owner, circuit: await createCoolerCircuit(db) };
}

export type CircuitDemo = Awaited<ReturnType<typeof demoWithCircuit>>;

/** A test file's hooks: the demo reset before each test, the pool closed after all. */
export function resetDemoEach(db: Kysely<DB>): void {
  beforeEach(async () => resetToDemo(db));
  afterAll(async () => {
    await db.destroy();
  });
}

/** A test file's hooks: the demo reset with a fresh circuit before each test, the pool closed after all. */
export function resetDemoWithCircuitEach(db: Kysely<DB>, take: (demo: CircuitDemo) => void): void {
  beforeEach(async () => take(await demoWithCircuit(db)));
  afterAll(async () => {
    await db.destroy();
  });
}
