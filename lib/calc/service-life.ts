// Expected service life per Rimeline equipment type, and a replacement outlook.
// Source of the medians: ASHRAE Handbook—HVAC Applications, chapter "Owning and Operating Costs",
// table "Comparison of Service Life Estimates" (median years from Akalin 1978).
// Most published service lives come from opinion surveys, not survival studies (Hiller, ASHRAE
// Journal 2000), so every result here is guidance, not a prediction.
import { toUtcDay, type DateInput } from '@/lib/calc/dates';
import { CalcInputError } from '@/lib/calc/errors';

export const EQUIPMENT_TYPES = [
  'condensing_unit',
  'compressor',
  'evaporator',
  'condenser',
  'pressure_control',
  'thermostat',
  'solenoid_valve',
  'expansion_valve',
  'defrost_control',
  'contactor',
  'fan_motor',
  'other',
] as const;
export type EquipmentType = (typeof EQUIPMENT_TYPES)[number];

export const SERVICE_LIFE_SOURCE =
  'ASHRAE Handbook—HVAC Applications, "Owning and Operating Costs", table "Comparison of Service Life Estimates" (medians from Akalin 1978)';

export interface ServiceLifeEntry {
  /** The row of the ASHRAE table used. */
  tableRow: string;
  medianYears: number;
  /** 'V' read in a reproduction of the table; 'M' from memory. */
  howKnown: 'V' | 'M';
  /** Why this row was chosen for the Rimeline type. */
  mapping: string;
}

export const SERVICE_LIFE: Readonly<Record<EquipmentType, ServiceLifeEntry | null>> = {
  condensing_unit: {
    tableRow: 'Compressors, reciprocating',
    medianYears: 20,
    howKnown: 'V',
    mapping: 'The compressor usually ends a condensing unit’s life; the air-cooled condenser row gives the same 20 years.',
  },
  compressor: {
    tableRow: 'Compressors, reciprocating',
    medianYears: 20,
    howKnown: 'V',
    mapping: 'Scroll compressors are not in the table; the reciprocating row is used for all types.',
  },
  evaporator: {
    tableRow: 'Coils, DX/water/steam',
    medianYears: 20,
    howKnown: 'V',
    mapping: 'A unit-cooler evaporator is a DX coil with fans.',
  },
  condenser: { tableRow: 'Condensers, air-cooled', medianYears: 20, howKnown: 'V', mapping: 'Direct match.' },
  pressure_control: {
    tableRow: 'Controls, electric',
    medianYears: 16,
    howKnown: 'M',
    mapping: 'A pressure switch is an electromechanical control.',
  },
  thermostat: {
    tableRow: 'Controls, electronic',
    medianYears: 15,
    howKnown: 'M',
    mapping: 'Walk-in thermostats are mostly electronic now; a mechanical one would take the electric row (16).',
  },
  solenoid_valve: {
    tableRow: 'Controls, electric',
    medianYears: 16,
    howKnown: 'M',
    mapping: 'The table has no refrigerant-valve row; a solenoid valve is an electrically operated control.',
  },
  expansion_valve: {
    tableRow: 'Valve actuators, self-contained',
    medianYears: 10,
    howKnown: 'M',
    mapping:
      'A thermostatic expansion valve is a self-contained (self-actuated) valve: its bulb and diaphragm drive it with no outside power. The table has no refrigerant-valve row; the row and its 10 years are from memory.',
  },
  defrost_control: {
    tableRow: 'Controls, electric',
    medianYears: 16,
    howKnown: 'M',
    mapping: 'Defrost timers and termination switches are electromechanical controls.',
  },
  contactor: { tableRow: 'Motor starters', medianYears: 17, howKnown: 'V', mapping: 'A contactor is the switching part of a motor starter.' },
  fan_motor: { tableRow: 'Electric motors', medianYears: 18, howKnown: 'V', mapping: 'Direct match.' },
  other: null,
};

export function medianServiceLife(type: EquipmentType): ServiceLifeEntry | null {
  const entry = SERVICE_LIFE[type];
  if (entry === undefined) {
    throw new CalcInputError(`unknown equipment type "${String(type)}"; known: ${EQUIPMENT_TYPES.join(', ')}`, 'equipmentType');
  }
  return entry;
}

/** Condition 1 (poor) … 5 (good). Our own weighting, not from the ASHRAE table. */
export const CONDITION_LIFE_FACTOR: Readonly<Record<1 | 2 | 3 | 4 | 5, number>> = { 1: 0.5, 2: 0.75, 3: 1, 4: 1.1, 5: 1.2 };

export type ReplacementOutlook = 'replace_now' | 'plan_replacement' | 'monitor' | 'no_action' | 'unknown';

export interface ServiceLifeOutlook {
  equipmentType: EquipmentType;
  entry: ServiceLifeEntry | null;
  ageYears: number;
  medianYears: number | null;
  remainingYears: number | null;
  condition: number | null;
  conditionFactor: number;
  /** Median × condition factor − age. */
  adjustedRemainingYears: number | null;
  outlook: ReplacementOutlook;
  label: string;
  basis: string;
  caution: string;
}

const DAYS_PER_YEAR = 365.2425;

/**
 * Age, remaining median life and a condition-weighted outlook. The medians are ASHRAE's; the
 * condition weighting and the outlook bands (≤ 0, ≤ 2, ≤ 5 years) are Rimeline's own rule.
 */
export function serviceLifeOutlook(input: {
  equipmentType: EquipmentType;
  installedOn: DateInput;
  asOf: DateInput;
  condition?: number | null | undefined;
}): ServiceLifeOutlook {
  const entry = medianServiceLife(input.equipmentType);
  const installed = toUtcDay(input.installedOn, 'installedOn');
  const asOf = toUtcDay(input.asOf, 'asOf');
  if (installed > asOf) throw new CalcInputError('the install date is in the future', 'installedOn');
  const condition = input.condition ?? null;
  if (condition !== null && !(Number.isInteger(condition) && condition >= 1 && condition <= 5)) {
    throw new CalcInputError(`condition must be a whole number from 1 (poor) to 5 (good) (got ${condition})`, 'condition');
  }
  const conditionFactor = condition === null ? 1 : CONDITION_LIFE_FACTOR[condition as 1 | 2 | 3 | 4 | 5];
  const ageYears = (asOf - installed) / DAYS_PER_YEAR;
  const medianYears = entry?.medianYears ?? null;
  const remainingYears = medianYears === null ? null : medianYears - ageYears;
  const adjustedRemainingYears = medianYears === null ? null : medianYears * conditionFactor - ageYears;

  let outlook: ReplacementOutlook;
  let label: string;
  if (adjustedRemainingYears === null) {
    outlook = condition === 1 ? 'plan_replacement' : 'unknown';
    label = condition === 1 ? 'Poor condition: plan a replacement.' : 'No published service life for this type.';
  } else if (adjustedRemainingYears <= 0) {
    outlook = 'replace_now';
    label = 'Past its condition-adjusted expected life: budget the replacement now.';
  } else if (adjustedRemainingYears <= 2 || condition === 1) {
    outlook = 'plan_replacement';
    label = 'Plan a replacement within about two years.';
  } else if (adjustedRemainingYears <= 5) {
    outlook = 'monitor';
    label = 'Monitor: within five years of its condition-adjusted expected life.';
  } else {
    outlook = 'no_action';
    label = 'No replacement expected soon.';
  }
  return {
    equipmentType: input.equipmentType,
    entry,
    ageYears,
    medianYears,
    remainingYears,
    condition,
    conditionFactor,
    adjustedRemainingYears,
    outlook,
    label,
    basis: `${SERVICE_LIFE_SOURCE}. Condition weighting (1 poor → ×0.5 … 5 good → ×1.2) and outlook bands are Rimeline's own rule.`,
    caution: 'Guidance, not a prediction: published service lives are survey medians, and half of all units outlast them.',
  };
}
