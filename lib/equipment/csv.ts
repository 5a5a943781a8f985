import Papa from 'papaparse';
import { escapeFormulae, unescapeCell } from '@/lib/equipment/csv-cells';
import { REFRIGERANT_IDS } from '@/lib/calc/refrigerants';
import type { EquipmentDto } from '@/lib/equipment/dto';
import type { SystemDto } from '@/lib/systems/dto';
import { nameplateFields } from '@/lib/equipment/nameplate';
import { createEquipmentSchema } from '@/lib/equipment/schemas';
import { createSystemSchema } from '@/lib/systems/schemas';
import { APPLICATIONS, EQUIPMENT_TYPES, type EquipmentType } from '@/lib/equipment/types';

// One CSV layout for export and import. Values are SI, and each nameplate column's name carries
// its unit (…Kpa is kPa gauge, …C is °C, …Kg is kg), so a file reads the same in any locale.

export const baseColumns = [
  'type',
  'name',
  'area',
  'system',
  'system_refrigerant',
  'system_application',
  'system_full_charge_kg',
  'system_design_box_temp_c',
  'make',
  'model',
  'serial',
  'manufactured_on',
  'installed_on',
  'condition',
  'condition_note',
  'status',
] as const;

/** Every nameplate key across all types, as `np.<key>` columns. */
export const nameplateColumns: string[] = [...new Set(EQUIPMENT_TYPES.flatMap((t) => nameplateFields[t].map((f) => `np.${f.key}`)))];
export const csvColumns: string[] = [...baseColumns, ...nameplateColumns];

const fieldToColumn: Record<string, string> = {
  type: 'type',
  name: 'name',
  make: 'make',
  model: 'model',
  serial: 'serial',
  manufacturedOn: 'manufactured_on',
  installedOn: 'installed_on',
  condition: 'condition',
  conditionNote: 'condition_note',
  status: 'status',
};

export function equipmentToCsv(items: EquipmentDto[], systems: Map<string, SystemDto>): string {
  const rows = items.map((e) => {
    const system = e.systemId ? systems.get(e.systemId) : undefined;
    const row: Record<string, string | number> = {
      type: e.type,
      name: e.name,
      area: e.areaName ?? '',
      system: e.systemName ?? '',
      system_refrigerant: system?.refrigerant ?? '',
      system_application: system?.application ?? '',
      system_full_charge_kg: system?.fullChargeKg ?? '',
      system_design_box_temp_c: system?.designBoxTempC ?? '',
      make: e.make ?? '',
      model: e.model ?? '',
      serial: e.serial ?? '',
      manufactured_on: e.manufacturedOn ?? '',
      installed_on: e.installedOn ?? '',
      condition: e.condition ?? '',
      condition_note: e.conditionNote ?? '',
      status: e.status,
    };
    for (const [key, value] of Object.entries(e.nameplate)) {
      if (value !== null && value !== undefined) row[`np.${key}`] = typeof value === 'boolean' ? (value ? 'true' : 'false') : value;
    }
    return row;
  });
  return Papa.unparse({ fields: csvColumns, data: rows.map((r) => csvColumns.map((c) => r[c] ?? '')) }, { newline: '\r\n', escapeFormulae });
}

export interface CsvProblem {
  line: number;
  column: string;
  message: string;
}

export interface ParsedRow {
  line: number;
  equipment: ReturnType<typeof createEquipmentSchema.parse> | null;
  area: string | null;
  system: { name: string; refrigerant: string | null; application: string | null; fullChargeKg: number | null; designBoxTempC: number | null } | null;
}

export interface ParsedCsv {
  rows: ParsedRow[];
  problems: CsvProblem[];
}

export const MAX_IMPORT_ROWS = 5000;

function numberOrNull(text: string): number | null | typeof Number.NaN {
  const t = text.trim();
  if (t === '') return null;
  const n = Number(t);
  return Number.isFinite(n) ? n : Number.NaN;
}

function nameplateValue(type: EquipmentType, key: string, text: string): unknown {
  const field = nameplateFields[type].find((f) => f.key === key);
  if (!field) return text;
  if (field.kind === 'number') return numberOrNull(text);
  if (field.kind === 'bool') return text.trim() === '' ? null : ['true', 'yes', '1'].includes(text.trim().toLowerCase()) ? true : ['false', 'no', '0'].includes(text.trim().toLowerCase()) ? false : text;
  return text.trim() === '' ? null : text.trim();
}

/**
 * Parses and validates every row against the same schema as the form and the API. Line numbers
 * count the header as line 1, as a spreadsheet shows them.
 */
export function parseEquipmentCsv(text: string, siteId: string): ParsedCsv {
  const parsed = Papa.parse<Record<string, string>>(text.replace(/^\uFEFF/, ''), {
    header: true,
    skipEmptyLines: 'greedy',
    transformHeader: (h) => unescapeCell(h).trim(),
    transform: (value) => unescapeCell(value),
  });
  const problems: CsvProblem[] = [];
  const rows: ParsedRow[] = [];
  const headers = parsed.meta.fields ?? [];
  for (const required of ['type', 'name']) {
    if (!headers.includes(required)) problems.push({ line: 1, column: required, message: `The header has no “${required}” column.` });
  }
  for (const h of headers) {
    if (!csvColumns.includes(h)) problems.push({ line: 1, column: h, message: `Unknown column “${h}”. Use the columns of an exported file.` });
  }
  for (const e of parsed.errors) problems.push({ line: (e.row ?? 0) + 2, column: '', message: e.message });
  if (problems.length) return { rows, problems };
  if (parsed.data.length > MAX_IMPORT_ROWS) {
    return { rows, problems: [{ line: 1, column: '', message: `A file may hold at most ${MAX_IMPORT_ROWS} rows; this one has ${parsed.data.length}.` }] };
  }
  if (parsed.data.length === 0) return { rows, problems: [{ line: 1, column: '', message: 'The file has no rows to import.' }] };

  parsed.data.forEach((raw, index) => {
    const line = index + 2;
    const get = (c: string) => (raw[c] ?? '').trim();
    const type = get('type') as EquipmentType;
    const nameplate: Record<string, unknown> = {};
    if ((EQUIPMENT_TYPES as readonly string[]).includes(type)) {
      for (const col of nameplateColumns) {
        const key = col.slice(3);
        const value = get(col);
        if (value === '') continue;
        if (!nameplateFields[type].some((f) => f.key === key)) {
          problems.push({ line, column: col, message: `A ${type.replace(/_/g, ' ')} has no “${key}” nameplate field; leave it empty.` });
          continue;
        }
        nameplate[key] = nameplateValue(type, key, value);
      }
    }
    const condition = numberOrNull(get('condition'));
    const candidate = {
      siteId,
      type,
      name: get('name'),
      make: get('make'),
      model: get('model'),
      serial: get('serial'),
      manufacturedOn: get('manufactured_on'),
      installedOn: get('installed_on'),
      condition,
      conditionNote: get('condition_note'),
      status: get('status') || 'in_service',
      nameplate,
    };
    const result = createEquipmentSchema.safeParse(candidate);
    if (!result.success) {
      for (const issue of result.error.issues) {
        const [first, second] = issue.path.map(String);
        const column = first === 'nameplate' && second ? `np.${second}` : (fieldToColumn[first ?? ''] ?? first ?? '');
        problems.push({ line, column, message: issue.message });
      }
    }
    let system: ParsedRow['system'] = null;
    const systemName = get('system');
    if (systemName) {
      const refrigerant = get('system_refrigerant') || null;
      const application = get('system_application') || null;
      const fullChargeKg = numberOrNull(get('system_full_charge_kg'));
      const designBoxTempC = numberOrNull(get('system_design_box_temp_c'));
      if (refrigerant && !(REFRIGERANT_IDS as readonly string[]).includes(refrigerant)) {
        problems.push({ line, column: 'system_refrigerant', message: `Unknown refrigerant “${refrigerant}”; use an ASHRAE number such as R-404A.` });
      }
      if (application && !(APPLICATIONS as readonly string[]).includes(application)) {
        problems.push({ line, column: 'system_application', message: `Use one of: ${APPLICATIONS.join(', ')}.` });
      }
      if (Number.isNaN(fullChargeKg)) problems.push({ line, column: 'system_full_charge_kg', message: 'Full charge must be a number (kg).' });
      if (Number.isNaN(designBoxTempC)) problems.push({ line, column: 'system_design_box_temp_c', message: 'Design box temperature must be a number (°C).' });
      system = { name: systemName, refrigerant, application, fullChargeKg: fullChargeKg as number | null, designBoxTempC: designBoxTempC as number | null };
    }
    rows.push({ line, equipment: result.success ? result.data : null, area: get('area') || null, system });
  });
  return { rows, problems };
}

/** A new system named in the file needs what a system always needs. */
export function systemInputProblems(row: ParsedRow, siteId: string): CsvProblem[] {
  if (!row.system) return [];
  const r = createSystemSchema.safeParse({
    siteId,
    name: row.system.name,
    refrigerant: row.system.refrigerant ?? undefined,
    application: row.system.application ?? undefined,
    fullChargeKg: row.system.fullChargeKg,
    designBoxTempC: row.system.designBoxTempC,
  });
  if (r.success) return [];
  return r.error.issues.map((i) => ({
    line: row.line,
    column: i.path[0] === 'refrigerant' ? 'system_refrigerant' : i.path[0] === 'application' ? 'system_application' : `system_${String(i.path[0])}`,
    message: `New system “${row.system!.name}”: ${i.message}`,
  }));
}
