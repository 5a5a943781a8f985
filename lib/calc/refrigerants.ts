// Over 300 lines on purpose: one table of 16 refrigerants with a source per field reads best whole.
// The refrigerants Rimeline knows, as data. Sources are given per field: ASHRAE Standard 34 (designations, compositions, safety classes),
// IPCC AR4/AR5 (GWP), CoolProp 8.0.0 (tests/fixtures/reference/fluids.csv).
// Designations, compositions and safety classes: ASHRAE Standard 34 (as copied in the reference
// data's source files). GWP: IPCC AR4 and AR5 100-year values; blend GWP = Σ mass fraction × component
// GWP. Critical points and normal boiling points: CoolProp 8.0.0 reference EOS
// (tests/fixtures/reference/fluids.csv).
import { CalcInputError } from '@/lib/calc/errors';

export const REFRIGERANT_IDS = [
  'R-22',
  'R-134a',
  'R-404A',
  'R-407A',
  'R-407C',
  'R-410A',
  'R-448A',
  'R-449A',
  'R-507A',
  'R-32',
  'R-290',
  'R-744',
  'R-717',
  'R-1234yf',
  'R-454C',
  'R-455A',
] as const;
export type RefrigerantId = (typeof REFRIGERANT_IDS)[number];

export type SafetyClass = 'A1' | 'A2L' | 'A3' | 'B2L';
export type RefrigerantFamily = 'HCFC' | 'HFC' | 'HFC blend' | 'HFC/HFO blend' | 'HFO' | 'hydrocarbon' | 'inorganic';
/** ASHRAE 34: 400-series blends are zeotropic (some only nearly azeotropic); 500-series azeotropic. */
export type BlendType = 'pure' | 'azeotrope' | 'near-azeotrope' | 'zeotrope';

export interface Component {
  readonly designation: string;
  readonly massPct: number;
}

export interface ValidRange {
  readonly minC: number;
  readonly maxC: number;
  readonly minBasis: string;
  readonly maxBasis: string;
}

export interface Refrigerant {
  readonly id: RefrigerantId;
  readonly chemicalName: string;
  readonly family: RefrigerantFamily;
  readonly blendType: BlendType;
  /** Bubble and dew differ: superheat uses dew, subcooling bubble. */
  readonly zeotropic: boolean;
  readonly components: readonly Component[];
  readonly molarMassGPerMol: number;
  readonly safetyClass: SafetyClass;
  readonly safetyClassNote?: string;
  /**
   * IPCC AR4 (2007) 100-year GWP, Table 2.14; for blends the mass-weighted sum of the components.
   * Null where AR4 lists the substance (or a blend component) not at all: HFOs, propane, ammonia.
   */
  readonly gwpAr4: number | null;
  /** IPCC AR5 (2013) 100-year GWP, WG1 Table 8.A.1 (HFOs "<1" counted as 1 alone, 0 in blends); null where not listed. */
  readonly gwpAr5: number | null;
  /**
   * GWP as EU Regulation 517/2014 Annex IV counts it: AR4 for the HFCs (Annex I), the regulation's
   * own Annex II/IV values for the rest (R-1234yf 4, R-1234ze(E) 7, propane 3, ammonia 0; from memory).
   * Used for t CO2e where a rule is written on that basis.
   */
  readonly gwpEu517: number;
  readonly gwpNote?: string;
  /** Ozone depletion potential (Montreal Protocol); from memory for R-22. */
  readonly odp: number;
  /** Class I/II substance under 40 CFR 82 Subpart F. */
  readonly containsOds: boolean;
  /** Contains a hydrofluorocarbon regulated under the AIM Act (40 CFR 84). */
  readonly containsHfc: boolean;
  /** Null where the app does not report one (HFO blends, R-407A: only low-confidence values exist). */
  readonly critical: { readonly tC: number; readonly pKpaAbs: number; readonly kind: 'true' | 'pseudo' } | null;
  /** Normal boiling point (saturation at 101.325 kPa); null for R-744 (triple point above 1 atm). */
  readonly nbp: { readonly bubbleC: number; readonly dewC: number } | null;
  readonly triplePoint?: { readonly tC: number; readonly pKpaAbs: number };
  readonly range: ValidRange;
  /**
   * Where the P-T chart stops when the fitted curve is known to drift before range.maxC (R-407C:
   * checked to 50 °C, about 1.1 % off the reference EOS above it); the note says why, for the page.
   */
  readonly chart?: { readonly maxC: number; readonly note: string };
  /** The equation of state behind the reference data the saturation curves were fitted to. */
  readonly dataSource: string;
}

const DATA_MIN = 'the lowest reference data point (-50 °C)';
const NBP_MIN = 'just below the normal boiling point, so 0 psig stays in range';
const CRIT_MAX = 'the critical temperature';
const PSEUDO_CRIT_MAX = 'the pseudo-critical temperature (Lemmon 2003 pseudo-pure model)';
const BLEND_MAX = '60 °C: above it the published critical points and blend data for this blend are low-confidence';
const HEOS = 'CoolProp 8.0.0 multi-fluid mixture model (Kunz–Wagner form), nominal ASHRAE 34 composition';

const pure = (designation: string): readonly Component[] => [{ designation, massPct: 100 }];

export const REFRIGERANTS: readonly Refrigerant[] = [
  {
    id: 'R-22',
    chemicalName: 'chlorodifluoromethane',
    family: 'HCFC',
    blendType: 'pure',
    zeotropic: false,
    components: pure('R-22'),
    molarMassGPerMol: 86.468,
    safetyClass: 'A1',
    gwpAr4: 1810,
    gwpAr5: 1760,
    gwpEu517: 1810,
    gwpNote: 'AR5 from memory',
    odp: 0.055,
    containsOds: true,
    containsHfc: false,
    critical: { tC: 96.145, pKpaAbs: 4990, kind: 'true' },
    nbp: { bubbleC: -40.81, dewC: -40.81 },
    range: { minC: -50, maxC: 96.145, minBasis: DATA_MIN, maxBasis: CRIT_MAX },
    dataSource: 'Kamei et al., IJT 1995 (CoolProp 8.0.0)',
  },
  {
    id: 'R-134a',
    chemicalName: '1,1,1,2-tetrafluoroethane',
    family: 'HFC',
    blendType: 'pure',
    zeotropic: false,
    components: pure('R-134a'),
    molarMassGPerMol: 102.032,
    safetyClass: 'A1',
    gwpAr4: 1430,
    gwpAr5: 1300,
    gwpEu517: 1430,
    gwpNote: 'AR5 from memory',
    odp: 0,
    containsOds: false,
    containsHfc: true,
    critical: { tC: 101.062, pKpaAbs: 4059.276, kind: 'true' },
    nbp: { bubbleC: -26.074, dewC: -26.074 },
    range: { minC: -50, maxC: 101.062, minBasis: DATA_MIN, maxBasis: CRIT_MAX },
    dataSource: 'Tillner-Roth & Baehr, JPCRD 1994 (CoolProp 8.0.0)',
  },
  {
    id: 'R-404A',
    chemicalName: 'R-125/143a/134a (44/52/4)',
    family: 'HFC blend',
    blendType: 'near-azeotrope',
    zeotropic: true,
    components: [
      { designation: 'R-125', massPct: 44 },
      { designation: 'R-143a', massPct: 52 },
      { designation: 'R-134a', massPct: 4 },
    ],
    molarMassGPerMol: 97.604,
    safetyClass: 'A1',
    gwpAr4: 3922,
    gwpAr5: 3943,
    gwpEu517: 3922,
    odp: 0,
    containsOds: false,
    containsHfc: true,
    critical: { tC: 72.12, pKpaAbs: 3734.8, kind: 'pseudo' },
    nbp: { bubbleC: -46.222, dewC: -45.471 },
    range: { minC: -50, maxC: 72.12, minBasis: DATA_MIN, maxBasis: PSEUDO_CRIT_MAX },
    dataSource: HEOS,
  },
  {
    id: 'R-407A',
    chemicalName: 'R-32/125/134a (20/40/40)',
    family: 'HFC blend',
    blendType: 'zeotrope',
    zeotropic: true,
    components: [
      { designation: 'R-32', massPct: 20 },
      { designation: 'R-125', massPct: 40 },
      { designation: 'R-134a', massPct: 40 },
    ],
    molarMassGPerMol: 90.11,
    safetyClass: 'A1',
    gwpAr4: 2107,
    gwpAr5: 1923,
    gwpEu517: 2107,
    odp: 0,
    containsOds: false,
    containsHfc: true,
    critical: null,
    nbp: { bubbleC: -45.007, dewC: -38.593 },
    range: { minC: -50, maxC: 60, minBasis: DATA_MIN, maxBasis: BLEND_MAX },
    dataSource: HEOS,
  },
  {
    id: 'R-407C',
    chemicalName: 'R-32/125/134a (23/25/52)',
    family: 'HFC blend',
    blendType: 'zeotrope',
    zeotropic: true,
    components: [
      { designation: 'R-32', massPct: 23 },
      { designation: 'R-125', massPct: 25 },
      { designation: 'R-134a', massPct: 52 },
    ],
    molarMassGPerMol: 86.204,
    safetyClass: 'A1',
    gwpAr4: 1774,
    gwpAr5: 1624,
    gwpEu517: 1774,
    odp: 0,
    containsOds: false,
    containsHfc: true,
    critical: { tC: 86.195, pKpaAbs: 4631.7, kind: 'pseudo' },
    nbp: { bubbleC: -43.627, dewC: -36.629 },
    range: { minC: -50, maxC: 86.195, minBasis: DATA_MIN, maxBasis: PSEUDO_CRIT_MAX },
    chart: {
      maxC: 50,
      note: 'The chart stops at 50 °C (122 °F): the fitted R-407C curve is checked against the reference data up to 50 °C and drifts by up to about 1.1 % in pressure above it.',
    },
    dataSource: HEOS,
  },
  {
    id: 'R-410A',
    chemicalName: 'R-32/125 (50/50)',
    family: 'HFC blend',
    blendType: 'near-azeotrope',
    zeotropic: true,
    components: [
      { designation: 'R-32', massPct: 50 },
      { designation: 'R-125', massPct: 50 },
    ],
    molarMassGPerMol: 72.585,
    safetyClass: 'A1',
    gwpAr4: 2088,
    gwpAr5: 1924,
    gwpEu517: 2088,
    odp: 0,
    containsOds: false,
    containsHfc: true,
    critical: { tC: 71.344, pKpaAbs: 4901.2, kind: 'pseudo' },
    nbp: { bubbleC: -51.443, dewC: -51.364 },
    range: { minC: -52, maxC: 71.344, minBasis: NBP_MIN, maxBasis: PSEUDO_CRIT_MAX },
    dataSource: HEOS,
  },
  {
    id: 'R-448A',
    chemicalName: 'R-32/125/1234yf/134a/1234ze(E) (26/26/20/21/7)',
    family: 'HFC/HFO blend',
    blendType: 'zeotrope',
    zeotropic: true,
    components: [
      { designation: 'R-32', massPct: 26 },
      { designation: 'R-125', massPct: 26 },
      { designation: 'R-1234yf', massPct: 20 },
      { designation: 'R-134a', massPct: 21 },
      { designation: 'R-1234ze(E)', massPct: 7 },
    ],
    molarMassGPerMol: 86.28,
    safetyClass: 'A1',
    gwpAr4: null,
    gwpAr5: 1273,
    gwpEu517: 1387,
    gwpNote: 'AR4 lists neither R-1234yf nor R-1234ze(E), so no AR4 value; 1387 is the EU 517/2014 figure (HFCs at AR4, HFOs at 4 and 7)',
    odp: 0,
    containsOds: false,
    containsHfc: true,
    critical: null,
    nbp: { bubbleC: -46.182, dewC: -39.667 },
    range: { minC: -50, maxC: 60, minBasis: DATA_MIN, maxBasis: BLEND_MAX },
    dataSource: HEOS,
  },
  {
    id: 'R-449A',
    chemicalName: 'R-32/125/1234yf/134a (24.3/24.7/25.3/25.7)',
    family: 'HFC/HFO blend',
    blendType: 'zeotrope',
    zeotropic: true,
    components: [
      { designation: 'R-32', massPct: 24.3 },
      { designation: 'R-125', massPct: 24.7 },
      { designation: 'R-1234yf', massPct: 25.3 },
      { designation: 'R-134a', massPct: 25.7 },
    ],
    molarMassGPerMol: 87.21,
    safetyClass: 'A1',
    safetyClassNote: 'A1 from memory',
    gwpAr4: null,
    gwpAr5: 1282,
    gwpEu517: 1397,
    gwpNote: 'AR4 does not list R-1234yf, so no AR4 value; 1397 is the EU 517/2014 figure (HFCs at AR4, R-1234yf at 4)',
    odp: 0,
    containsOds: false,
    containsHfc: true,
    critical: null,
    nbp: { bubbleC: -45.875, dewC: -39.826 },
    range: { minC: -50, maxC: 60, minBasis: DATA_MIN, maxBasis: BLEND_MAX },
    dataSource: HEOS,
  },
  {
    id: 'R-507A',
    chemicalName: 'R-125/143a (50/50)',
    family: 'HFC blend',
    blendType: 'azeotrope',
    zeotropic: false,
    components: [
      { designation: 'R-125', massPct: 50 },
      { designation: 'R-143a', massPct: 50 },
    ],
    molarMassGPerMol: 98.859,
    safetyClass: 'A1',
    gwpAr4: 3985,
    gwpAr5: 3985,
    gwpEu517: 3985,
    odp: 0,
    containsOds: false,
    containsHfc: true,
    critical: { tC: 70.615, pKpaAbs: 3704.9, kind: 'pseudo' },
    nbp: { bubbleC: -46.741, dewC: -46.741 },
    range: { minC: -50, maxC: 70.615, minBasis: DATA_MIN, maxBasis: PSEUDO_CRIT_MAX },
    dataSource: HEOS,
  },
  {
    id: 'R-32',
    chemicalName: 'difluoromethane',
    family: 'HFC',
    blendType: 'pure',
    zeotropic: false,
    components: pure('R-32'),
    molarMassGPerMol: 52.024,
    safetyClass: 'A2L',
    safetyClassNote: 'current ASHRAE 34 class (from memory); older data files say A2',
    gwpAr4: 675,
    gwpAr5: 677,
    gwpEu517: 675,
    odp: 0,
    containsOds: false,
    containsHfc: true,
    critical: { tC: 78.105, pKpaAbs: 5782.645, kind: 'true' },
    nbp: { bubbleC: -51.651, dewC: -51.651 },
    range: { minC: -52, maxC: 78.105, minBasis: NBP_MIN, maxBasis: CRIT_MAX },
    dataSource: 'Tillner-Roth & Yokozeki, JPCRD 1997 (CoolProp 8.0.0)',
  },
  {
    id: 'R-290',
    chemicalName: 'propane',
    family: 'hydrocarbon',
    blendType: 'pure',
    zeotropic: false,
    components: pure('R-290'),
    molarMassGPerMol: 44.096,
    safetyClass: 'A3',
    gwpAr4: null,
    gwpAr5: null,
    gwpEu517: 3,
    gwpNote: 'Neither AR4 nor AR5 tabulates propane (from memory); 3 is the EU 517/2014 Annex IV value',
    odp: 0,
    containsOds: false,
    containsHfc: false,
    critical: { tC: 96.74, pKpaAbs: 4251.165, kind: 'true' },
    nbp: { bubbleC: -42.114, dewC: -42.114 },
    range: { minC: -50, maxC: 96.74, minBasis: DATA_MIN, maxBasis: CRIT_MAX },
    dataSource: 'Lemmon et al., JCED 2009 (CoolProp 8.0.0)',
  },
  {
    id: 'R-744',
    chemicalName: 'carbon dioxide',
    family: 'inorganic',
    blendType: 'pure',
    zeotropic: false,
    components: pure('R-744'),
    molarMassGPerMol: 44.01,
    safetyClass: 'A1',
    gwpAr4: 1,
    gwpAr5: 1,
    gwpEu517: 1,
    odp: 0,
    containsOds: false,
    containsHfc: false,
    critical: { tC: 30.978, pKpaAbs: 7377.298, kind: 'true' },
    nbp: null,
    triplePoint: { tC: -56.558, pKpaAbs: 517.964 },
    range: {
      minC: -56.558,
      maxC: 30.978,
      minBasis: 'the triple point (below it CO2 is solid, not liquid)',
      maxBasis: CRIT_MAX,
    },
    dataSource: 'Span & Wagner, JPCRD 1996 (CoolProp 8.0.0)',
  },
  {
    id: 'R-717',
    chemicalName: 'ammonia',
    family: 'inorganic',
    blendType: 'pure',
    zeotropic: false,
    components: pure('R-717'),
    molarMassGPerMol: 17.031,
    safetyClass: 'B2L',
    safetyClassNote: 'current ASHRAE 34 class (from memory); older data files say B2',
    gwpAr4: null,
    gwpAr5: null,
    gwpEu517: 0,
    gwpNote: 'Neither AR4 nor AR5 tabulates ammonia (from memory); 0 is the EU 517/2014 Annex IV value',
    odp: 0,
    containsOds: false,
    containsHfc: false,
    critical: { tC: 132.41, pKpaAbs: 11363.391, kind: 'true' },
    nbp: { bubbleC: -33.316, dewC: -33.316 },
    range: { minC: -50, maxC: 132.41, minBasis: DATA_MIN, maxBasis: CRIT_MAX },
    dataSource: 'Gao et al., JPCRD 2020 (CoolProp 8.0.0)',
  },
  {
    id: 'R-1234yf',
    chemicalName: '2,3,3,3-tetrafluoropropene',
    family: 'HFO',
    blendType: 'pure',
    zeotropic: false,
    components: pure('R-1234yf'),
    molarMassGPerMol: 114.042,
    safetyClass: 'A2L',
    gwpAr4: null,
    gwpAr5: 1,
    gwpEu517: 4,
    gwpNote: 'Not in AR4; 4 is the EU 517/2014 Annex II value (from memory). AR5 gives <1, stored as 1 (upper bound)',
    odp: 0,
    containsOds: false,
    containsHfc: false,
    critical: { tC: 94.7, pKpaAbs: 3384.374, kind: 'true' },
    nbp: { bubbleC: -29.458, dewC: -29.458 },
    range: { minC: -50, maxC: 94.7, minBasis: DATA_MIN, maxBasis: CRIT_MAX },
    dataSource: 'Lemmon & Akasaka, IJT 2022 (CoolProp 8.0.0)',
  },
  {
    id: 'R-454C',
    chemicalName: 'R-32/1234yf (21.5/78.5)',
    family: 'HFC/HFO blend',
    blendType: 'zeotrope',
    zeotropic: true,
    components: [
      { designation: 'R-32', massPct: 21.5 },
      { designation: 'R-1234yf', massPct: 78.5 },
    ],
    molarMassGPerMol: 90.78,
    safetyClass: 'A2L',
    gwpAr4: null,
    gwpAr5: 146,
    gwpEu517: 148,
    gwpNote: 'AR4 does not list R-1234yf, so no AR4 value; 148 is the EU 517/2014 figure (R-32 at AR4, R-1234yf at 4)',
    odp: 0,
    containsOds: false,
    containsHfc: true,
    critical: null,
    nbp: { bubbleC: -45.371, dewC: -37.183 },
    range: { minC: -50, maxC: 60, minBasis: DATA_MIN, maxBasis: BLEND_MAX },
    dataSource: HEOS,
  },
  {
    id: 'R-455A',
    chemicalName: 'R-744/32/1234yf (3/21.5/75.5)',
    family: 'HFC/HFO blend',
    blendType: 'zeotrope',
    zeotropic: true,
    components: [
      { designation: 'R-744', massPct: 3 },
      { designation: 'R-32', massPct: 21.5 },
      { designation: 'R-1234yf', massPct: 75.5 },
    ],
    molarMassGPerMol: 87.45,
    safetyClass: 'A2L',
    gwpAr4: null,
    gwpAr5: 146,
    gwpEu517: 148,
    gwpNote: 'AR4 does not list R-1234yf, so no AR4 value; 148 is the EU 517/2014 figure (R-32 at AR4, R-1234yf at 4, CO2 1)',
    odp: 0,
    containsOds: false,
    containsHfc: true,
    critical: null,
    nbp: { bubbleC: -52.148, dewC: -38.606 },
    range: { minC: -53, maxC: 60, minBasis: NBP_MIN, maxBasis: BLEND_MAX },
    dataSource: HEOS,
  },
];

// Lenient lookup key: "R-404A", "R404A", "r 404a" and "404A" all become "R404A".
function lookupKey(name: string): string {
  const compact = name.trim().toUpperCase().replace(/[\s_-]+/g, '');
  return /^\d/.test(compact) ? `R${compact}` : compact;
}

const ALIASES: Readonly<Record<string, RefrigerantId>> = {
  CO2: 'R-744',
  CARBONDIOXIDE: 'R-744',
  NH3: 'R-717',
  AMMONIA: 'R-717',
  PROPANE: 'R-290',
};

const BY_ID = new Map<string, Refrigerant>(REFRIGERANTS.map((r) => [r.id, r]));
const BY_KEY = new Map<string, Refrigerant>(REFRIGERANTS.map((r) => [lookupKey(r.id), r]));
for (const [alias, id] of Object.entries(ALIASES)) {
  const r = BY_ID.get(id);
  if (r) BY_KEY.set(alias, r);
}

export function findRefrigerant(name: string): Refrigerant | undefined {
  if (typeof name !== 'string') return undefined;
  return BY_ID.get(name) ?? BY_KEY.get(lookupKey(name));
}

/** Looks a refrigerant up by any common spelling; throws CalcInputError naming the known ones. */
export function getRefrigerant(name: string): Refrigerant {
  const found = findRefrigerant(name);
  if (!found) {
    throw new CalcInputError(
      `unknown refrigerant "${String(name)}"; known: ${REFRIGERANT_IDS.join(', ')}`,
      'refrigerant',
    );
  }
  return found;
}

export function isRefrigerantId(value: string): value is RefrigerantId {
  return BY_ID.has(value);
}
