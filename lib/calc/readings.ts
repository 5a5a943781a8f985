// Readings a technician derives from gauge pressures and line temperatures.
// Definitions: trade training material (TRADE-REFERENCE §3): superheat against the dew point,
// subcooling against the bubble point; the glide mid-point for TDs is common practice.
import { resolveBarometricKpa } from '@/lib/calc/atmosphere';
import { CalcInputError, requireFinite, requirePositive } from '@/lib/calc/errors';
import { getRefrigerant, type RefrigerantId } from '@/lib/calc/refrigerants';
import { saturationAtPressure, saturationTemperatureC, type RefrigerantInput } from '@/lib/calc/saturation';
import {
  fromCelsius,
  temperatureDifferenceFromKelvin,
  toCelsius,
  toKpaAbs,
  type PressureUnit,
  type TemperatureUnit,
} from '@/lib/calc/units';

/** Which saturation temperature a TD is measured from. Identical for pure fluids. */
export type SaturationReference = 'midpoint' | 'dew' | 'bubble';

export interface SuperheatResult {
  superheatK: number;
  dewC: number;
  notes: string[];
  basis: string;
}

/** Superheat = T_suction_line − T_dew(P_suction). Basis: trade training material (dew point for blends). */
export function superheat(input: { refrigerant: RefrigerantInput; suctionPressureKpaAbs: number; suctionLineTempC: number }): SuperheatResult {
  requireFinite(input.suctionLineTempC, 'suction line temperature');
  const dewC = saturationTemperatureC(input.refrigerant, input.suctionPressureKpaAbs, 'dew');
  const superheatK = input.suctionLineTempC - dewC;
  const notes: string[] = [];
  if (superheatK < 0) notes.push('Negative superheat: liquid reaching the sensor point, or a reading error. Re-check before acting.');
  return {
    superheatK,
    dewC,
    notes,
    basis: 'Superheat = suction line temperature − dew (saturated vapour) temperature at suction pressure (trade training material).',
  };
}

export interface SubcoolingResult {
  subcoolingK: number;
  bubbleC: number;
  notes: string[];
  basis: string;
}

/** Subcooling = T_bubble(P_liquid) − T_liquid_line. Basis: trade training material (bubble point for blends). */
export function subcooling(input: { refrigerant: RefrigerantInput; liquidPressureKpaAbs: number; liquidLineTempC: number }): SubcoolingResult {
  requireFinite(input.liquidLineTempC, 'liquid line temperature');
  const bubbleC = saturationTemperatureC(input.refrigerant, input.liquidPressureKpaAbs, 'bubble');
  const subcoolingK = bubbleC - input.liquidLineTempC;
  const notes: string[] = [];
  if (subcoolingK < 0) notes.push('Negative subcooling: the liquid line is not fully liquid (flash gas), or a reading error.');
  return {
    subcoolingK,
    bubbleC,
    notes,
    basis: 'Subcooling = bubble (saturated liquid) temperature at liquid pressure − liquid line temperature (trade training material).',
  };
}

function referenceTemperature(refrigerant: RefrigerantInput, pKpaAbs: number, reference: SaturationReference): number {
  const sat = saturationAtPressure(refrigerant, pKpaAbs);
  return reference === 'midpoint' ? sat.midpointC : reference === 'dew' ? sat.dewC : sat.bubbleC;
}

const REFERENCE_WORDS: Record<SaturationReference, string> = {
  midpoint: 'the glide mid-point (bubble + dew)/2',
  dew: 'the dew point',
  bubble: 'the bubble point',
};

export interface EvaporatorTdResult {
  tdK: number;
  evaporatingC: number;
  reference: SaturationReference;
  basis: string;
}

/**
 * Evaporator TD = box (return-air) temperature − evaporating saturation temperature.
 * Basis: common practice; for glide blends the mid-point is the usual evaporating temperature.
 */
export function evaporatorTd(input: {
  refrigerant: RefrigerantInput;
  suctionPressureKpaAbs: number;
  boxTempC: number;
  reference?: SaturationReference;
}): EvaporatorTdResult {
  requireFinite(input.boxTempC, 'box temperature');
  const reference = input.reference ?? 'midpoint';
  const evaporatingC = referenceTemperature(input.refrigerant, input.suctionPressureKpaAbs, reference);
  return {
    tdK: input.boxTempC - evaporatingC,
    evaporatingC,
    reference,
    basis: `Evaporator TD = box air temperature − evaporating temperature, taken at ${REFERENCE_WORDS[reference]} (common practice; the mid-point is usual for glide blends).`,
  };
}

export interface CondenserSplitResult {
  splitK: number;
  condensingC: number;
  reference: SaturationReference;
  basis: string;
}

/** Condenser split = condensing saturation temperature − ambient (entering air). Basis: common practice. */
export function condenserSplit(input: {
  refrigerant: RefrigerantInput;
  headPressureKpaAbs: number;
  ambientC: number;
  reference?: SaturationReference;
}): CondenserSplitResult {
  requireFinite(input.ambientC, 'ambient temperature');
  const reference = input.reference ?? 'midpoint';
  const condensingC = referenceTemperature(input.refrigerant, input.headPressureKpaAbs, reference);
  return {
    splitK: condensingC - input.ambientC,
    condensingC,
    reference,
    basis: `Condenser split = condensing temperature at ${REFERENCE_WORDS[reference]} − air temperature entering the condenser (common practice).`,
  };
}

export interface CompressionRatioResult {
  ratio: number;
  basis: string;
}

/** Compression ratio = discharge ÷ suction, both absolute. Basis: thermodynamic definition. */
export function compressionRatio(input: { suctionKpaAbs: number; dischargeKpaAbs: number }): CompressionRatioResult {
  requirePositive(input.suctionKpaAbs, 'suction pressure (absolute)');
  requirePositive(input.dischargeKpaAbs, 'discharge pressure (absolute)');
  if (input.dischargeKpaAbs < input.suctionKpaAbs) {
    throw new CalcInputError('discharge pressure must not be below suction pressure', 'dischargePressure');
  }
  return {
    ratio: input.dischargeKpaAbs / input.suctionKpaAbs,
    basis: 'Compression ratio = absolute discharge pressure ÷ absolute suction pressure; gauge readings are converted to absolute first.',
  };
}

export interface ReadingsInput {
  refrigerant: string;
  pressureUnit: PressureUnit;
  temperatureUnit: TemperatureUnit;
  barometricKpa?: number | undefined;
  elevationM?: number | undefined;
  suctionPressure?: number | undefined;
  /** High-side pressure (discharge or liquid line service port). */
  headPressure?: number | undefined;
  suctionLineTemp?: number | undefined;
  liquidLineTemp?: number | undefined;
  boxTemp?: number | undefined;
  ambientTemp?: number | undefined;
  evaporatorReference?: SaturationReference | undefined;
  condenserReference?: SaturationReference | undefined;
}

/** A temperature difference and a saturation temperature, both in the user's temperature unit. */
export interface UserReading {
  value: number;
  valueK: number;
  saturation: number;
  notes: string[];
  basis: string;
}

export interface ReadingsResult {
  refrigerant: RefrigerantId;
  temperatureUnit: TemperatureUnit;
  barometricKpa: number;
  superheat: UserReading | null;
  subcooling: UserReading | null;
  evaporatorTd: (UserReading & { reference: SaturationReference }) | null;
  condenserSplit: (UserReading & { reference: SaturationReference }) | null;
  compressionRatio: CompressionRatioResult | null;
}

/**
 * Every reading the inputs allow, in the user's units (gauge pressures against the barometer from
 * barometricKpa, elevationM or the standard atmosphere). A reading is null when its inputs are missing.
 */
export function computeReadings(input: ReadingsInput): ReadingsResult {
  const refrigerant = getRefrigerant(input.refrigerant);
  const barometricKpa = resolveBarometricKpa(input);
  const tu = input.temperatureUnit;
  const kpa = (v: number | undefined): number | undefined =>
    v === undefined ? undefined : toKpaAbs(v, input.pressureUnit, barometricKpa);
  const degC = (v: number | undefined): number | undefined => (v === undefined ? undefined : toCelsius(v, tu));
  const user = (valueK: number, saturationC: number, notes: string[], basis: string): UserReading => ({
    value: temperatureDifferenceFromKelvin(valueK, tu),
    valueK,
    saturation: fromCelsius(saturationC, tu),
    notes,
    basis,
  });

  const suction = kpa(input.suctionPressure);
  const head = kpa(input.headPressure);
  const suctionLine = degC(input.suctionLineTemp);
  const liquidLine = degC(input.liquidLineTemp);
  const box = degC(input.boxTemp);
  const ambient = degC(input.ambientTemp);

  let sh: UserReading | null = null;
  if (suction !== undefined && suctionLine !== undefined) {
    const r = superheat({ refrigerant, suctionPressureKpaAbs: suction, suctionLineTempC: suctionLine });
    sh = user(r.superheatK, r.dewC, r.notes, r.basis);
  }
  let sc: UserReading | null = null;
  if (head !== undefined && liquidLine !== undefined) {
    const r = subcooling({ refrigerant, liquidPressureKpaAbs: head, liquidLineTempC: liquidLine });
    sc = user(r.subcoolingK, r.bubbleC, r.notes, r.basis);
  }
  let td: ReadingsResult['evaporatorTd'] = null;
  if (suction !== undefined && box !== undefined) {
    const r = evaporatorTd({ refrigerant, suctionPressureKpaAbs: suction, boxTempC: box, reference: input.evaporatorReference });
    td = { ...user(r.tdK, r.evaporatingC, [], r.basis), reference: r.reference };
  }
  let split: ReadingsResult['condenserSplit'] = null;
  if (head !== undefined && ambient !== undefined) {
    const r = condenserSplit({ refrigerant, headPressureKpaAbs: head, ambientC: ambient, reference: input.condenserReference });
    split = { ...user(r.splitK, r.condensingC, [], r.basis), reference: r.reference };
  }
  const ratio =
    suction !== undefined && head !== undefined ? compressionRatio({ suctionKpaAbs: suction, dischargeKpaAbs: head }) : null;

  return {
    refrigerant: refrigerant.id,
    temperatureUnit: tu,
    barometricKpa,
    superheat: sh,
    subcooling: sc,
    evaporatorTd: td,
    condenserSplit: split,
    compressionRatio: ratio,
  };
}
