import 'server-only';
import { sql } from 'kysely';
import { db as defaultDb } from '@/db';
import type { Db } from '@/db/types';
import { assertCan } from '@/lib/auth/access';
import type { Actor } from '@/lib/auth/actor';
import { AppError } from '@/lib/errors';
import { getSite } from '@/lib/sites/service';
import type { EntryContext, ServerEntryContext } from '@/lib/visits/kinds/types';

// What an entry's numbers are computed against: the system's refrigerant and record, the site's
// elevation and the nameplate's voltages and design pressure.


async function contextRows(trx: Db, scope: { equipmentId: string } | { siteId: string }): Promise<Map<string, ServerEntryContext>> {
  let q = trx
    .selectFrom('equipment')
    .innerJoin('sites', 'sites.id', 'equipment.site_id')
    .leftJoin('systems', 'systems.id', 'equipment.system_id')
    .select((eb) => [
      'equipment.id',
      'equipment.system_id',
      'equipment.nameplate',
      'sites.elevation_m',
      'systems.refrigerant',
      'systems.application',
      'systems.full_charge_kg',
      'systems.design_box_temp_c',
      eb
        .selectFrom('equipment as cu')
        .whereRef('cu.system_id', '=', 'equipment.system_id')
        .where('cu.type', '=', 'condensing_unit')
        .where('cu.deleted_at', 'is', null)
        .select(sql<number | null>`(cu.nameplate->>'designPressureHighKpa')::float8`.as('p'))
        .limit(1)
        .as('design_high'),
    ]);
  q = 'equipmentId' in scope ? q.where('equipment.id', '=', scope.equipmentId) : q.where('equipment.site_id', '=', scope.siteId).where('equipment.deleted_at', 'is', null);
  const out = new Map<string, ServerEntryContext>();
  for (const row of await q.execute()) {
    const plate = (row.nameplate ?? {}) as Record<string, unknown>;
    const num = (v: unknown) => (typeof v === 'number' ? v : null);
    out.set(row.id, {
      systemId: row.system_id,
      application: row.application,
      fullChargeKg: row.full_charge_kg === null ? null : Number(row.full_charge_kg),
      refrigerant: row.refrigerant ?? (typeof plate.refrigerant === 'string' ? plate.refrigerant : null),
      elevationM: Number(row.elevation_m),
      designBoxTempC: row.design_box_temp_c === null ? null : Number(row.design_box_temp_c),
      nameplateVoltage: num(plate.voltage),
      controlVoltageNominal: num(plate.controlVoltage),
      designPressureHighKpaG: num(plate.designPressureHighKpa) ?? (row.design_high === null ? null : Number(row.design_high)),
    });
  }
  return out;
}

export async function entryContext(trx: Db, equipmentId: string): Promise<ServerEntryContext> {
  const ctx = (await contextRows(trx, { equipmentId })).get(equipmentId);
  if (!ctx) throw new AppError('not_found', 'Equipment not found.');
  return ctx;
}

/**
 * The calculation context of every piece of equipment on a site, keyed by equipment id: the same
 * values addEntry computes with, so the form's live values equal the stored ones.
 */
export async function siteEntryContexts(actor: Actor, siteId: string, db: Db = defaultDb): Promise<Record<string, EntryContext>> {
  assertCan(actor, 'entries.write');
  // The site check and the rows at once: the rows are only returned when the check passes.
  const [, rows] = await Promise.all([getSite(actor, siteId, db), contextRows(db, { siteId })]);
  return Object.fromEntries(
    [...rows].map(([id, c]) => [
      id,
      {
        refrigerant: c.refrigerant,
        elevationM: c.elevationM,
        designBoxTempC: c.designBoxTempC,
        nameplateVoltage: c.nameplateVoltage,
        controlVoltageNominal: c.controlVoltageNominal,
        designPressureHighKpaG: c.designPressureHighKpaG,
      } satisfies EntryContext,
    ]),
  );
}
