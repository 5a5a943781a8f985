// Low- and high-pressure switch settings and what they mean for the refrigerant.
// Relation (both types): low event = high event − differential; the differential adjustment moves
// only the low event (trade training material, common practice).
import { resolveBarometricKpa } from '@/lib/calc/atmosphere';
import { CalcInputError, isCalcError, requireFinite, requirePositive } from '@/lib/calc/errors';
import { controlWarningMessage, type ControlWarning, type ControlWarningCode, type ControlWarningData } from '@/lib/calc/control-warnings';
import { formatPressure, formatPressureDifference } from '@/lib/calc/format';
import { getRefrigerant, type Refrigerant, type RefrigerantId } from '@/lib/calc/refrigerants';
import { saturationTemperatureC, type MessageUnits } from '@/lib/calc/saturation';
import {
  fromCelsius,
  inHgVacuumToKpaAbs,
  pressureDifferenceToKpa,
  STANDARD_ATMOSPHERE_KPA,
  toCelsius,
  toKpaAbs,
  KPA_PER_PSI,
  type PressureUnit,
  type TemperatureUnit,
} from '@/lib/calc/units';

export type { ControlWarning, ControlWarningCode, ControlWarningData } from '@/lib/calc/control-warnings';

/** Common practice: a low-pressure control's low event not below 27 inHg vacuum (≈1.435 psia). */
export const LP_FLOOR_KPA_ABS = inHgVacuumToKpaAbs(27, STANDARD_ATMOSPHERE_KPA);
/** Common practice: a high-pressure control's low event (reset) not below 50 psig. */
export const HP_LOW_EVENT_FLOOR_PSIG = 50;
/**
 * Common practice: an air-cooled condenser runs at entering air + 15–30 °F, so at a 95 °F design
 * ambient it reaches about 125 °F (51.7 °C). A high-pressure cut-out whose saturation temperature
 * is below that trips on an ordinary hot day (nuisance trips).
 */
export const HP_USUAL_MAX_CONDENSING_C = (125 - 32) / 1.8;
const FLOOR_SOURCE = 'common practice (refrigeration service training texts; no standard sets this floor)';

const RELATION_BASIS =
  'Low event = high event − differential; the differential adjustment moves only the low event (trade training material, common practice).';

export interface SettingSaturation {
  bubble: number | null;
  dew: number | null;
  /** Why a value is null: the pressure lies outside the refrigerant's saturation range. */
  note: string | null;
}

function saturationOf(r: Refrigerant, pKpaAbs: number, tu: TemperatureUnit, units?: MessageUnits): SettingSaturation {
  const one = (curve: 'bubble' | 'dew'): { value: number | null; note: string | null } => {
    try {
      return { value: fromCelsius(saturationTemperatureC(r, pKpaAbs, curve, units), tu), note: null };
    } catch (error) {
      if (isCalcError(error)) return { value: null, note: error.message };
      throw error;
    }
  };
  const bubble = one('bubble');
  const dew = one('dew');
  return { bubble: bubble.value, dew: dew.value, note: dew.note ?? bubble.note };
}

export interface LowPressureControlInput {
  refrigerant: string;
  unit: PressureUnit;
  cutIn: number;
  /** In the step of `unit` (psi for psig/psia, bar for bar/barG, kPa for kPa units). */
  differential: number;
  temperatureUnit?: TemperatureUnit | undefined;
  barometricKpa?: number | undefined;
  elevationM?: number | undefined;
  /** Design box temperature, in temperatureUnit. */
  designBoxTemp?: number | undefined;
  /** Systems designed to run in a vacuum (rare in commercial refrigeration) skip the vacuum warning. */
  vacuumAllowed?: boolean | undefined;
}

export interface LowPressureControlResult {
  refrigerant: RefrigerantId;
  unit: PressureUnit;
  temperatureUnit: TemperatureUnit;
  cutIn: number;
  cutOut: number;
  differential: number;
  cutInKpaAbs: number;
  cutOutKpaAbs: number;
  /** The low side is judged on the dew curve (saturated vapour in the evaporator outlet). */
  cutInSaturation: SettingSaturation;
  cutOutSaturation: SettingSaturation;
  warnings: ControlWarning[];
  basis: string;
}

/** Low-pressure control (opens on falling pressure): cut-out = cut-in − differential. Basis: common practice. */
export function lowPressureControl(input: LowPressureControlInput): LowPressureControlResult {
  const r = getRefrigerant(input.refrigerant);
  const tu = input.temperatureUnit ?? 'C';
  const barometricKpa = resolveBarometricKpa(input);
  requireFinite(input.cutIn, 'cut-in');
  requirePositive(input.differential, 'differential');
  const cutInKpaAbs = toKpaAbs(input.cutIn, input.unit, barometricKpa);
  const cutOutKpaAbs = cutInKpaAbs - pressureDifferenceToKpa(input.differential, input.unit);
  if (cutOutKpaAbs <= 0) {
    throw new CalcInputError(
      `a differential of ${formatPressureDifference(input.differential, input.unit)} from a cut-in of ${formatPressure(input.cutIn, input.unit)} puts the cut-out below a perfect vacuum`,
      'differential',
    );
  }
  const cutOut = input.cutIn - input.differential;
  const cutInSaturation = saturationOf(r, cutInKpaAbs, tu, { pressureUnit: input.unit, temperatureUnit: tu, barometricKpa });
  const cutOutSaturation = saturationOf(r, cutOutKpaAbs, tu, { pressureUnit: input.unit, temperatureUnit: tu, barometricKpa });
  const warnings: ControlWarning[] = [];

  const units = { pressureUnit: input.unit, temperatureUnit: tu };
  const warn = (code: ControlWarningCode, data: Omit<ControlWarningData, 'barometricKpa' | 'refrigerant'>, basis: string) => {
    const full = { ...data, barometricKpa, refrigerant: r.id };
    warnings.push({ code, message: controlWarningMessage(code, full, units), basis, data: full });
  };
  if (!input.vacuumAllowed && cutOutKpaAbs < barometricKpa) {
    warn('vacuum_cut_out', { settingKpaAbs: cutOutKpaAbs, limitKpaAbs: barometricKpa }, 'Common practice: keep low-side cut-outs above 0 psig on systems not designed for vacuum operation.');
  }
  if (cutOutKpaAbs < LP_FLOOR_KPA_ABS) {
    warn('below_vacuum_floor', { settingKpaAbs: cutOutKpaAbs, limitKpaAbs: LP_FLOOR_KPA_ABS }, `Low-pressure control low event not below 27 inHg vacuum: ${FLOOR_SOURCE}.`);
  }
  if (r.triplePoint && cutOutKpaAbs < r.triplePoint.pKpaAbs) {
    warn(
      'below_triple_point',
      { settingKpaAbs: cutOutKpaAbs, limitKpaAbs: r.triplePoint.pKpaAbs, limitC: r.triplePoint.tC },
      `${r.id} triple-point pressure 517.96 kPa abs (Span & Wagner 1996, CoolProp 8.0.0; tests/fixtures/reference/fluids.csv).`,
    );
  }
  if (input.designBoxTemp !== undefined) {
    const boxC = toCelsius(input.designBoxTemp, tu);
    const cutInDew = cutInSaturation.dew;
    if (cutInDew !== null && toCelsius(cutInDew, tu) > boxC) {
      warn(
        'cut_in_above_box',
        { settingKpaAbs: cutInKpaAbs, saturationC: toCelsius(cutInDew, tu), limitC: boxC },
        'Common practice: set the cut-in below the saturation pressure at box temperature so the unit restarts when the box warms.',
      );
    }
  }
  return {
    refrigerant: r.id,
    unit: input.unit,
    temperatureUnit: tu,
    cutIn: input.cutIn,
    cutOut,
    differential: input.differential,
    cutInKpaAbs,
    cutOutKpaAbs,
    cutInSaturation,
    cutOutSaturation,
    warnings,
    basis: RELATION_BASIS,
  };
}

export interface HighPressureControlInput {
  refrigerant: string;
  unit: PressureUnit;
  cutOut: number;
  differential: number;
  temperatureUnit?: TemperatureUnit | undefined;
  barometricKpa?: number | undefined;
  elevationM?: number | undefined;
  /** Nameplate high-side design (maximum working) pressure, in `unit`. */
  designPressure?: number | undefined;
}

export interface HighPressureControlResult {
  refrigerant: RefrigerantId;
  unit: PressureUnit;
  temperatureUnit: TemperatureUnit;
  cutOut: number;
  cutIn: number;
  differential: number;
  cutOutKpaAbs: number;
  cutInKpaAbs: number;
  /** Condensing temperatures: bubble (liquid leaving) and dew (vapour entering); equal for pure fluids. */
  cutOutSaturation: SettingSaturation;
  cutInSaturation: SettingSaturation;
  warnings: ControlWarning[];
  basis: string;
}

/** High-pressure control (opens on rising pressure): cut-in (reset) = cut-out − differential. Basis: trade training material. */
export function highPressureControl(input: HighPressureControlInput): HighPressureControlResult {
  const r = getRefrigerant(input.refrigerant);
  const tu = input.temperatureUnit ?? 'C';
  const barometricKpa = resolveBarometricKpa(input);
  requireFinite(input.cutOut, 'cut-out');
  requirePositive(input.differential, 'differential');
  const cutOutKpaAbs = toKpaAbs(input.cutOut, input.unit, barometricKpa);
  const cutInKpaAbs = cutOutKpaAbs - pressureDifferenceToKpa(input.differential, input.unit);
  if (cutInKpaAbs <= 0) {
    throw new CalcInputError(
      `a differential of ${formatPressureDifference(input.differential, input.unit)} from a cut-out of ${formatPressure(input.cutOut, input.unit)} puts the cut-in below a perfect vacuum`,
      'differential',
    );
  }
  const cutIn = input.cutOut - input.differential;
  const warnings: ControlWarning[] = [];

  const units = { pressureUnit: input.unit, temperatureUnit: tu };
  const warn = (code: ControlWarningCode, data: Omit<ControlWarningData, 'barometricKpa' | 'refrigerant'>, basis: string) => {
    const full = { ...data, barometricKpa, refrigerant: r.id };
    warnings.push({ code, message: controlWarningMessage(code, full, units), basis, data: full });
  };
  if (input.designPressure !== undefined) {
    const designKpaAbs = toKpaAbs(input.designPressure, input.unit, barometricKpa);
    if (cutOutKpaAbs > designKpaAbs) {
      warn('above_design_pressure', { settingKpaAbs: cutOutKpaAbs, limitKpaAbs: designKpaAbs }, 'The equipment nameplate governs: the high-pressure control must open below the design pressure.');
    }
  }
  const floorKpaAbs = HP_LOW_EVENT_FLOOR_PSIG * KPA_PER_PSI + barometricKpa;
  if (cutInKpaAbs < floorKpaAbs) {
    warn('high_low_event_below_floor', { settingKpaAbs: cutInKpaAbs, limitKpaAbs: floorKpaAbs }, `High-pressure control low event not below 50 psig: ${FLOOR_SOURCE}.`);
  }
  const cutOutSaturation = saturationOf(r, cutOutKpaAbs, tu, { pressureUnit: input.unit, temperatureUnit: tu, barometricKpa });
  const cutOutDewC = cutOutSaturation.dew === null ? null : toCelsius(cutOutSaturation.dew, tu);
  if (r.id !== 'R-744' && cutOutDewC !== null && cutOutDewC < HP_USUAL_MAX_CONDENSING_C) {
    warn(
      'cut_out_below_condensing',
      { settingKpaAbs: cutOutKpaAbs, saturationC: cutOutDewC, limitC: HP_USUAL_MAX_CONDENSING_C },
      'Common practice: air-cooled condensing runs 15–30 °F above entering air, about 125 °F at a 95 °F design ambient; typical cut-outs sit near 130–145 °F saturation.',
    );
  }
  return {
    refrigerant: r.id,
    unit: input.unit,
    temperatureUnit: tu,
    cutOut: input.cutOut,
    cutIn,
    differential: input.differential,
    cutOutKpaAbs,
    cutInKpaAbs,
    cutOutSaturation,
    cutInSaturation: saturationOf(r, cutInKpaAbs, tu, { pressureUnit: input.unit, temperatureUnit: tu, barometricKpa }),
    warnings,
    basis: RELATION_BASIS,
  };
}
