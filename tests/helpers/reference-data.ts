// Loads the CoolProp 8.0.0 reference data fixtures (tests/fixtures/reference/) for the calc tests.
import { readFileSync } from 'node:fs';
import path from 'node:path';

const DIR = path.resolve(import.meta.dirname, '../fixtures/reference');

export interface SaturationRow {
  /** Designation as the app writes it, e.g. 'R-404A'. */
  id: string;
  model: 'pure' | 'pseudo-pure' | 'mixture-HEOS';
  tC: number;
  bubbleKpa: number;
  dewKpa: number;
}

export interface FluidRow {
  id: string;
  model: 'pure' | 'pseudo-pure' | 'mixture-HEOS';
  tcritC: number;
  pcritKpa: number;
  nbpBubbleC: number | null;
  nbpDewC: number | null;
  notes: string;
}

function rows(file: string): Record<string, string>[] {
  const lines = readFileSync(path.join(DIR, file), 'utf8')
    .split(/\r?\n/)
    .filter((l) => l.trim() !== '' && !l.startsWith('#'));
  const header = (lines.shift() ?? '').split(',');
  return lines.map((l) => Object.fromEntries(l.split(',').map((v, i) => [header[i] ?? `c${i}`, v])));
}

const designation = (fluid: string | undefined): string => (fluid ?? '').replace(/^R(?=\d)/, 'R-');
const optionalNumber = (v: string | undefined): number | null => (v === undefined || v === '' ? null : Number(v));

export function saturationRows(): SaturationRow[] {
  return rows('saturation.csv').map((r) => ({
    id: designation(r.fluid),
    model: r.model as SaturationRow['model'],
    tC: Number(r.t_c),
    bubbleKpa: Number(r.p_bubble_kpa_abs),
    dewKpa: Number(r.p_dew_kpa_abs),
  }));
}

export function fluidRows(): FluidRow[] {
  return rows('fluids.csv').map((r) => ({
    id: designation(r.fluid),
    model: r.model as FluidRow['model'],
    tcritC: Number(r.tcrit_c),
    pcritKpa: Number(r.pcrit_kpa_abs),
    nbpBubbleC: optionalNumber(r.nbp_bubble_c),
    nbpDewC: optionalNumber(r.nbp_dew_c),
    notes: r.notes ?? '',
  }));
}

export function readFixture(file: string): string {
  return readFileSync(path.join(DIR, file), 'utf8');
}
