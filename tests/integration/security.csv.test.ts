// Finding 2: every CSV the product writes neutralises cells a spreadsheet would run as a formula,
// and the import reads its own escape back, so export → import keeps every value exactly.
// The list of dangerous first characters is OWASP's "CSV Injection" page (=, +, -, @, tab, CR).
import Papa from 'papaparse';
import { describe, expect, it } from 'vitest';
import { unescapeCell } from '@/lib/equipment/csv-cells';
import { equipmentToCsv, parseEquipmentCsv } from '@/lib/equipment/csv';
import type { EquipmentDto } from '@/lib/equipment/dto';
import { reportFile } from '@/lib/reports/service';

const hostile = ['=HYPERLINK("http://example.test","x")', '+1+cmd', '-2+3', '@SUM(A1)', "'=already quoted", "''+two", 'plain name'];

function unit(name: string, i: number): EquipmentDto {
  return {
    id: `00000000-0000-4000-8000-00000000000${i}`,
    type: 'condensing_unit',
    name,
    areaName: null,
    systemName: null,
    systemId: null,
    make: '=cmd|calc',
    model: '-x',
    serial: `@S${i}`,
    manufacturedOn: null,
    installedOn: null,
    condition: 4,
    conditionNote: i === 0 ? '\tTabbed note' : null,
    status: 'in_service',
    nameplate: {},
  } as unknown as EquipmentDto;
}

describe('equipment CSV', () => {
  const items = hostile.map(unit);
  const csv = equipmentToCsv(items, new Map());
  const cells = Papa.parse<string[]>(csv, { skipEmptyLines: true }).data.slice(1);

  it('writes no cell that starts like a formula', () => {
    for (const row of cells) for (const cell of row) expect(cell).not.toMatch(/^[=+\-@\t\r]/);
    expect(cells[0]![1]).toBe(`'=HYPERLINK("http://example.test","x")`);
    expect(cells[4]![1]).toBe(`''=already quoted`);
  });

  it('imports its own export back to the same values', () => {
    const parsed = parseEquipmentCsv(csv, '00000000-0000-4000-8000-0000000000aa');
    expect(parsed.problems, JSON.stringify(parsed.problems)).toEqual([]);
    expect(parsed.rows.map((r) => r.equipment?.name)).toEqual(hostile);
    expect(parsed.rows.map((r) => [r.equipment?.make, r.equipment?.model, r.equipment?.serial])).toEqual(hostile.map((_, i) => ['=cmd|calc', '-x', `@S${i}`]));
  });
});

describe('report CSV (site equipment, refrigerant)', () => {
  it('neutralises formula cells in rows and facts, keeps plain negative numbers', async () => {
    const file = await reportFile(
      { title: 't', facts: [['Site', '=evil()']], columns: [{ label: 'Unit', width: 1 }, { label: 'Change kg', width: 1 }], rows: [['+cmd', '-2.5'], ['@x', '3']], notes: [] },
      'csv',
      'r',
    );
    const body = String(file.body);
    expect(body).toContain(`"'=evil()"`);
    expect(body).toContain(`"'+cmd",-2.5`);
    expect(body).toContain(`"'@x",3`);
    expect(body).not.toMatch(/(^|,|\n)"?[=+@]/);
  });
});

describe('unescapeCell removes exactly the one apostrophe the export added', () => {
  it.each([
    ["'=1", '=1'],
    ["''=1", "'=1"],
    ["'plain", "'plain"],
    ["'-4.5", "'-4.5"],
  ])('%s → %s', (cell, value) => {
    expect(unescapeCell(cell)).toBe(value);
  });
});
