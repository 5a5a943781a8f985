// Demo history for the refrigerant report: an invented walk-in cooler circuit that lost charge, and
// the leak work that followed (inspection → repair → initial and follow-up verification tests).
// Loaded by `npm run db:seed` with a fresh demo only, so the test scenario (resetToDemo) stays empty
// of equipment. Rows are written as the visit service would write them, leak rate included.
import { randomUUID } from 'node:crypto';
import type { Kysely } from 'kysely';
import type { DB } from '@/db/schema.gen';
import { evaluateLeakEvent } from '@/lib/calc/leak-rate';
import { DEMO_COMPANY } from '@/docker-free-scripts/demo/scenario';

const SITE = 'Orchard Row Bistro';
const SYSTEM = 'Walk-in cooler circuit';
const DAY_MS = 86_400_000;

/** 'YYYY-MM-DD' of an instant in a time zone (the site's calendar day, as the service uses). */
function localDate(at: Date, timeZone: string): string {
  return new Intl.DateTimeFormat('en-CA', { timeZone, year: 'numeric', month: '2-digit', day: '2-digit' }).format(at);
}

/** Adds the history once; false when the demo company is missing or the circuit already exists. */
export async function seedDemoLeakWork(db: Kysely<DB>, now = new Date()): Promise<boolean> {
  const site = await db
    .selectFrom('sites')
    .innerJoin('companies', 'companies.id', 'sites.company_id')
    .select(['sites.id', 'sites.company_id', 'sites.time_zone'])
    .where('companies.name', '=', DEMO_COMPANY)
    .where('sites.name', '=', SITE)
    .executeTakeFirst();
  if (!site) return false;
  const existing = await db.selectFrom('systems').select('id').where('site_id', '=', site.id).where('name', '=', SYSTEM).executeTakeFirst();
  if (existing) return false;
  const tech = await db.selectFrom('users').select('id').where('company_id', '=', site.company_id).where('role', '=', 'technician').orderBy('email').executeTakeFirstOrThrow();
  const area = await db.selectFrom('areas').select('id').where('site_id', '=', site.id).where('name', '=', 'Walk-in cooler').executeTakeFirst();
  const pad = await db.selectFrom('areas').select('id').where('site_id', '=', site.id).where('name', '=', 'Rear pad').executeTakeFirst();

  const lb = 0.45359237;
  // 30 lb of R-404A: covered by 40 CFR 84 Subpart C (≥ 15 lb of an HFC) from 2026. 8 lb added as a
  // first addition (365 days) is 26.7 %, over the 20 % commercial refrigeration threshold.
  const fullChargeKg = 30 * lb;
  const addedKg = 8 * lb;
  const at = (daysAgo: number, hour: number) => new Date(Math.floor(now.getTime() / DAY_MS) * DAY_MS - daysAgo * DAY_MS + hour * 3_600_000);
  const addedAt = at(30, 16);
  const repairAt = at(24, 15);
  const followUpAt = at(12, 17);
  const leak = evaluateLeakEvent({
    refrigerant: 'R-404A',
    application: 'commercial_refrigeration',
    fullCharge: fullChargeKg,
    added: addedKg,
    massUnit: 'kg',
    additionDate: localDate(addedAt, site.time_zone),
    previousAdditionDate: null,
  });

  await db.transaction().execute(async (trx) => {
    const system = await trx
      .insertInto('systems')
      .values({
        company_id: site.company_id,
        site_id: site.id,
        area_id: area?.id ?? null,
        name: SYSTEM,
        refrigerant: 'R-404A',
        full_charge_kg: fullChargeKg,
        application: 'commercial_refrigeration',
        design_box_temp_c: 2,
        maintenance_interval_days: 90,
      })
      .returning('id')
      .executeTakeFirstOrThrow();
    const equipment = async (type: string, name: string, areaId: string | null, make: string, model: string, serial: string, nameplate: Record<string, unknown>) =>
      (
        await trx
          .insertInto('equipment')
          .values({ company_id: site.company_id, site_id: site.id, area_id: areaId, system_id: system.id, type, name, make, model, serial, installed_on: '2017-04-18', condition: 3, nameplate: JSON.stringify(nameplate) })
          .returning('id')
          .executeTakeFirstOrThrow()
      ).id;
    const unitId = await equipment('condensing_unit', 'Cooler condensing unit', pad?.id ?? null, 'Kelvrin', 'KCU-310', 'KV-17-40412', { voltage: 208, phase: '3', designPressureHighKpa: 2758 });
    const evaporatorId = await equipment('evaporator', 'Cooler evaporator', area?.id ?? null, 'Frostwell', 'FW-2E', 'FW-88213', {});

    const visit = async (reason: string, startedAt: Date, summary: string) =>
      (
        await trx
          .insertInto('visits')
          .values({
            company_id: site.company_id,
            site_id: site.id,
            technician_id: tech.id,
            reason,
            status: 'closed',
            started_at: startedAt,
            ended_at: new Date(startedAt.getTime() + 2 * 3_600_000),
            summary,
            closed_by: tech.id,
          })
          .returning('id')
          .executeTakeFirstOrThrow()
      ).id;
    const entry = (visitId: string, equipmentId: string, kind: string, recordedAt: Date, data: object, computed: object | null = null) =>
      trx
        .insertInto('entries')
        .values({
          company_id: site.company_id,
          visit_id: visitId,
          equipment_id: equipmentId,
          system_id: system.id,
          kind,
          data: JSON.stringify(data),
          computed: computed ? JSON.stringify(computed) : null,
          recorded_at: recordedAt,
          created_by: tech.id,
          client_entry_id: randomUUID(),
        })
        .execute();

    const first = await visit('no_cooling', new Date(addedAt.getTime() - 3_600_000), 'Box at 47 °F with a low charge. Added 8 lb of R-404A and found an oily flare at the expansion valve; repair booked.');
    await entry(first, unitId, 'refrigerant', addedAt, { direction: 'added', amountKg: addedKg, refrigerant: 'R-404A', cylinderId: 'CYL-0318', technicianCert: 'UNIV-5531' }, { leak });
    const location = 'flare nut at the expansion valve inlet';
    await entry(first, evaporatorId, 'leak', new Date(addedAt.getTime() + 20 * 60_000), { activity: 'inspection', method: 'electronic_detector', result: 'leak_found', location, note: 'Oil stain on the flare; detector alarms at the nut.' });

    const second = await visit('follow_up', new Date(repairAt.getTime() - 3_600_000), 'Repaired the leaking flare and pressure-tested before the recharge.');
    const repairedOn = localDate(repairAt, site.time_zone);
    const deadline = leak.repairDueDate ? { repairDueDate: leak.repairDueDate, repairedOn, onTime: repairedOn <= leak.repairDueDate } : null;
    await entry(second, evaporatorId, 'leak', repairAt, { activity: 'repair', location, note: 'Flare re-made with a new nut.' }, deadline);
    await entry(second, evaporatorId, 'leak', new Date(repairAt.getTime() + 40 * 60_000), { activity: 'initial_verification', method: 'pressure_test', result: 'passed', location, note: 'Held 150 psig of nitrogen for 30 minutes.' });

    const third = await visit('leak_check', new Date(followUpAt.getTime() - 3_600_000), 'Follow-up verification test at normal operating conditions: no leak.');
    await entry(third, evaporatorId, 'leak', followUpAt, { activity: 'follow_up_verification', method: 'electronic_detector', result: 'passed', location });
  });
  return true;
}
