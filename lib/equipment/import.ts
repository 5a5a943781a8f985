import 'server-only';
import type { Kysely } from 'kysely';
import { db as defaultDb } from '@/db';
import type { DB } from '@/db/schema.gen';
import { assertCan } from '@/lib/auth/access';
import type { Actor } from '@/lib/auth/actor';
import { recordAudit } from '@/lib/audit/service';
import { equipmentToCsv, parseEquipmentCsv, systemInputProblems, type CsvProblem } from '@/lib/equipment/csv';
import type { SystemDto } from '@/lib/systems/dto';
import type { ListEquipmentQuery } from '@/lib/equipment/schemas';
import { insertEquipment, listEquipment } from '@/lib/equipment/service';
import { AppError } from '@/lib/errors';
import { getSite } from '@/lib/sites/service';
import { listSystems } from '@/lib/systems/service';

export interface ImportPreview {
  rowCount: number;
  problems: CsvProblem[];
  newAreas: string[];
  newSystems: string[];
  sample: { line: number; type: string; name: string; area: string | null; system: string | null; serial: string | null }[];
  imported: number;
}

const EXPORT_LIMIT = 100_000;

export async function exportEquipmentCsv(actor: Actor, query: Omit<ListEquipmentQuery, 'cursor' | 'limit'>, db = defaultDb): Promise<string> {
  assertCan(actor, 'equipment.read');
  const items = [];
  let cursor: string | undefined;
  do {
    const page = await listEquipment(actor, { ...query, cursor, limit: 200 }, db);
    items.push(...page.items);
    cursor = page.nextCursor ?? undefined;
  } while (cursor && items.length < EXPORT_LIMIT);
  const systemIds = new Set(items.map((i) => i.systemId).filter(Boolean));
  const systems = new Map<string, SystemDto>();
  if (systemIds.size) {
    for (const s of await listSystems(actor, { limit: 200, archived: 'include' }, db)) if (systemIds.has(s.id)) systems.set(s.id, s);
  }
  return equipmentToCsv(items, systems);
}

/**
 * Checks a CSV for one site and, only when every row is valid and `commit` is set, imports it in
 * one transaction: missing areas and systems named in the file are created with it.
 */
export async function importEquipmentCsv(actor: Actor, siteId: string, csv: string, commit: boolean, db: Kysely<DB> = defaultDb): Promise<ImportPreview> {
  assertCan(actor, 'equipment.import');
  const site = await getSite(actor, siteId, db);
  if (site.archivedAt) throw new AppError('validation_failed', 'This site is archived; restore it before importing.');
  const parsed = parseEquipmentCsv(csv, siteId);

  const areas = await db.selectFrom('areas').select(['id', 'name']).where('site_id', '=', siteId).where('archived_at', 'is', null).execute();
  const systems = await db.selectFrom('systems').select(['id', 'name']).where('site_id', '=', siteId).where('archived_at', 'is', null).execute();
  const areaByName = new Map(areas.map((a) => [a.name.toLowerCase(), a.id]));
  const systemByName = new Map(systems.map((s) => [s.name.toLowerCase(), s.id]));

  const problems = [...parsed.problems];
  const newAreas = new Map<string, string>();
  const newSystems = new Map<string, (typeof parsed.rows)[number]>();
  for (const row of parsed.rows) {
    if (row.area && !areaByName.has(row.area.toLowerCase())) newAreas.set(row.area.toLowerCase(), row.area);
    if (row.system && !systemByName.has(row.system.name.toLowerCase()) && !newSystems.has(row.system.name.toLowerCase())) {
      newSystems.set(row.system.name.toLowerCase(), row);
      problems.push(...systemInputProblems(row, siteId));
    }
  }
  problems.sort((a, b) => a.line - b.line);

  const preview: ImportPreview = {
    rowCount: parsed.rows.length,
    problems,
    newAreas: [...newAreas.values()],
    newSystems: [...newSystems.values()].map((r) => r.system!.name),
    sample: parsed.rows.slice(0, 50).map((r) => ({
      line: r.line,
      type: r.equipment?.type ?? '',
      name: r.equipment?.name ?? '',
      area: r.area,
      system: r.system?.name ?? null,
      serial: r.equipment?.serial ?? null,
    })),
    imported: 0,
  };
  if (!commit || problems.length > 0) return preview;

  const imported = await db.transaction().execute(async (trx) => {
    for (const [key, name] of newAreas) {
      const area = await trx.insertInto('areas').values({ company_id: actor.companyId, site_id: siteId, name, kind: 'other' }).returning('id').executeTakeFirstOrThrow();
      areaByName.set(key, area.id);
      await recordAudit(trx, actor, { action: 'create', entityType: 'area', entityId: area.id, after: { name, source: 'csv import' } });
    }
    for (const [key, row] of newSystems) {
      const s = row.system!;
      const system = await trx
        .insertInto('systems')
        .values({
          company_id: actor.companyId,
          site_id: siteId,
          name: s.name,
          refrigerant: s.refrigerant!,
          application: s.application!,
          full_charge_kg: s.fullChargeKg,
          design_box_temp_c: s.designBoxTempC,
        })
        .returning('id')
        .executeTakeFirstOrThrow();
      systemByName.set(key, system.id);
      await recordAudit(trx, actor, { action: 'create', entityType: 'system', entityId: system.id, after: { ...s, source: 'csv import' } });
    }
    let count = 0;
    for (const row of parsed.rows) {
      const input = row.equipment!;
      const id = await insertEquipment(
        actor,
        {
          ...input,
          areaId: row.area ? (areaByName.get(row.area.toLowerCase()) ?? null) : null,
          systemId: row.system ? (systemByName.get(row.system.name.toLowerCase()) ?? null) : null,
        },
        trx,
      );
      await recordAudit(trx, actor, { action: 'create', entityType: 'equipment', entityId: id, after: { ...input, source: 'csv import' } });
      count++;
    }
    return count;
  });
  return { ...preview, imported };
}
