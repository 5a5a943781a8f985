// Low- and high-pressure switch settings and what they mean for the refrigerant.
// Relation (both types): low event = high event − differential; the differential adjustment moves
// only the low event (trade training material, TRADE-REFERENCE §4, common practice).
import { resolveBarometricKpa } from '@/lib/calc/atmosphere';
import { CalcInputError, isCalcError, fmt, requireFinite, requirePositive } from '@/lib/calc/errors';
import { getRefrigerant, type Refrigerant, type RefrigerantId } from '@/lib/calc/refrigerants';
import { saturationTemperatureC } from '@/lib/calc/saturation';
import {
  fromCelsius,
  fromKpaAbs,
  inHgVacuumToKpaAbs,
  pressureDifferenceToKpa,
  pressureUnitLabel,
  STANDARD_ATMOSPHERE_KPA,
  temperatureUnitLabel,
  toCelsius,
  toKpaAbs,
  KPA_PER_PSI,
  type PressureUnit,
  type TemperatureUnit,
} from '@/lib/calc/units';

export interface ControlWarning {
  code:
    | 'vacuum_cut_out'
    | 'below_vacuum_floor'
    | 'cut_in_above_box'
    | 'above_design_pressure'
    | 'high_low_event_below_floor';
  message: string;
  basis: string;
}

/** Common practice: a low-pressure control's low event not below 27 inHg vacuum (≈1.435 psia). */
export const LP_FLOOR_KPA_ABS = inHgVacuumToKpaAbs(27, STANDARD_ATMOSPHERE_KPA);
/** Common practice: a high-pressure control's low event (reset) not below 50 psig. */
export const HP_LOW_EVENT_FLOOR_PSIG = 50;

const RELATION_BASIS =
  'Low event = high event − differential; the differential adjustment moves only the low event (trade training material, common practice).';

export interface SettingSaturation {
  bubble: number | null;
  dew: number | null;
  /** Why a value is null: the pressure lies outside the refrigerant's saturation range. */
  note: string | null;
}

function saturationOf(r: Refrigerant, pKpaAbs: number, tu: TemperatureUnit): SettingSaturation {
  const one = (curve: 'bubble' | 'dew'): { value: number | null; note: string | null } => {
    try {
      return { value: fromCelsius(saturationTemperatureC(r, pKpaAbs, curve), tu), note: null };
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
  const label = pressureUnitLabel(input.unit);
  if (cutOutKpaAbs <= 0) {
    throw new CalcInputError(
      `a differential of ${input.differential} from a cut-in of ${input.cutIn} ${label} puts the cut-out below a perfect vacuum`,
      'differential',
    );
  }
  const cutOut = input.cutIn - input.differential;
  const cutInSaturation = saturationOf(r, cutInKpaAbs, tu);
  const cutOutSaturation = saturationOf(r, cutOutKpaAbs, tu);
  const warnings: ControlWarning[] = [];

  if (!input.vacuumAllowed && cutOutKpaAbs < barometricKpa) {
    warnings.push({
      code: 'vacuum_cut_out',
      message: `The cut-out (${fmt(cutOut, 1)} ${label}) is below atmospheric pressure: the low side would run in a vacuum and draw air and moisture in at any leak.`,
      basis: 'Common practice: keep low-side cut-outs above 0 psig on systems not designed for vacuum operation.',
    });
  }
  if (cutOutKpaAbs < LP_FLOOR_KPA_ABS) {
    warnings.push({
      code: 'below_vacuum_floor',
      message: `The cut-out is below 27 inHg vacuum (${fmt(fromKpaAbs(LP_FLOOR_KPA_ABS, input.unit, barometricKpa), 2)} ${label}), the lowest setting commonly allowed.`,
      basis: 'Common practice: low-pressure control low event not below 27 inHg vacuum.',
    });
  }
  if (input.designBoxTemp !== undefined) {
    const boxC = toCelsius(input.designBoxTemp, tu);
    const cutInDew = cutInSaturation.dew;
    if (cutInDew !== null && toCelsius(cutInDew, tu) > boxC) {
      warnings.push({
        code: 'cut_in_above_box',
        message:
          `The cut-in's saturation temperature (${fmt(cutInDew, 1)} ${temperatureUnitLabel(tu)}) is above the design box temperature ` +
          `(${fmt(input.designBoxTemp, 1)} ${temperatureUnitLabel(tu)}): the evaporator pressure will not reach the cut-in while the box is at temperature, so the control cannot hold the box.`,
        basis: 'Common practice: set the cut-in below the saturation pressure at box temperature so the unit restarts when the box warms.',
      });
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
  const label = pressureUnitLabel(input.unit);
  if (cutInKpaAbs <= 0) {
    throw new CalcInputError(
      `a differential of ${input.differential} from a cut-out of ${input.cutOut} ${label} puts the cut-in below a perfect vacuum`,
      'differential',
    );
  }
  const cutIn = input.cutOut - input.differential;
  const warnings: ControlWarning[] = [];

  if (input.designPressure !== undefined) {
    const designKpaAbs = toKpaAbs(input.designPressure, input.unit, barometricKpa);
    if (cutOutKpaAbs > designKpaAbs) {
      warnings.push({
        code: 'above_design_pressure',
        message: `The cut-out (${fmt(input.cutOut, 1)} ${label}) is above the nameplate high-side design pressure (${fmt(input.designPressure, 1)} ${label}).`,
        basis: 'The equipment nameplate governs: the high-pressure control must open below the design pressure.',
      });
    }
  }
  const floorKpaAbs = HP_LOW_EVENT_FLOOR_PSIG * KPA_PER_PSI + barometricKpa;
  if (cutInKpaAbs < floorKpaAbs) {
    warnings.push({
      code: 'high_low_event_below_floor',
      message: `The cut-in (${fmt(cutIn, 1)} ${label}) is below 50 psig (${fmt(fromKpaAbs(floorKpaAbs, input.unit, barometricKpa), 1)} ${label}), the lowest reset commonly allowed for a high-pressure control.`,
      basis: 'Common practice: high-pressure control low event not below 50 psig.',
    });
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
    cutOutSaturation: saturationOf(r, cutOutKpaAbs, tu),
    cutInSaturation: saturationOf(r, cutInKpaAbs, tu),
    warnings,
    basis: RELATION_BASIS,
  };
}
