// Over 300 lines on purpose: the five derived readings share one input check and one level-and-wording path.
// Readings a technician derives from gauge pressures and line temperatures.
// Definitions: trade training material (refrigeration service texts): superheat against the dew point,
// subcooling against the bubble point; the glide mid-point for TDs is common practice.
import { resolveBarometricKpa } from '@/lib/calc/atmosphere';
import { diagnosisInputFrom, suggestCauses, type Suggestion } from '@/lib/calc/diagnosis';
import { controlCircuitVoltage, voltageUnbalance, type ControlVoltageResult, type VoltageUnbalanceResult } from '@/lib/calc/electrical';
import { CalcInputError, CalcRangeError, isCalcError, requireFinite, requirePositive } from '@/lib/calc/errors';
import { formatFor } from '@/lib/calc/format';
import { describeBand, judge, type BandView } from '@/lib/calc/band-judgement';
import { bandFor, boxClassFor, type BoxClass, type Level, type MeteringDevice } from '@/lib/calc/reading-bands';
import { getRefrigerant, type RefrigerantId } from '@/lib/calc/refrigerants';
import { supplyVoltageLines, type SupplyVoltageLinesResult } from '@/lib/calc/supply-voltage';
import { saturationAtPressure, saturationTemperatureC, type MessageUnits, type RefrigerantInput } from '@/lib/calc/saturation';
import {
  fromCelsius,
  isGaugeUnit,
  STANDARD_ATMOSPHERE_KPA,
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
export function superheat(input: { refrigerant: RefrigerantInput; suctionPressureKpaAbs: number; suctionLineTempC: number; units?: MessageUnits }): SuperheatResult {
  requireFinite(input.suctionLineTempC, 'suction line temperature');
  const dewC = saturationTemperatureC(input.refrigerant, input.suctionPressureKpaAbs, 'dew', input.units);
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
export function subcooling(input: { refrigerant: RefrigerantInput; liquidPressureKpaAbs: number; liquidLineTempC: number; units?: MessageUnits }): SubcoolingResult {
  requireFinite(input.liquidLineTempC, 'liquid line temperature');
  const bubbleC = saturationTemperatureC(input.refrigerant, input.liquidPressureKpaAbs, 'bubble', input.units);
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

function referenceTemperature(refrigerant: RefrigerantInput, pKpaAbs: number, reference: SaturationReference, units?: MessageUnits): number {
  const sat = saturationAtPressure(refrigerant, pKpaAbs, units);
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
  reference?: SaturationReference | undefined;
  units?: MessageUnits | undefined;
}): EvaporatorTdResult {
  requireFinite(input.boxTempC, 'box temperature');
  const reference = input.reference ?? 'midpoint';
  const evaporatingC = referenceTemperature(input.refrigerant, input.suctionPressureKpaAbs, reference, input.units);
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
  reference?: SaturationReference | undefined;
  units?: MessageUnits | undefined;
}): CondenserSplitResult {
  requireFinite(input.ambientC, 'ambient temperature');
  const reference = input.reference ?? 'midpoint';
  const condensingC = referenceTemperature(input.refrigerant, input.headPressureKpaAbs, reference, input.units);
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
  /** Liquid-line pressure; subcooling uses it, and falls back to headPressure only when it is absent. */
  liquidPressure?: number | undefined;
  suctionLineTemp?: number | undefined;
  liquidLineTemp?: number | undefined;
  boxTemp?: number | undefined;
  ambientTemp?: number | undefined;
  evaporatorReference?: SaturationReference | undefined;
  condenserReference?: SaturationReference | undefined;
  /** Design box temperature (temperatureUnit): sets the box class when boxClass is not given. */
  designBoxTemp?: number | undefined;
  boxClass?: BoxClass | undefined;
  meteringDevice?: MeteringDevice | undefined;
  /** Where the suction line temperature was read; the evaporator outlet by default. */
  superheatAt?: 'evaporator_outlet' | 'compressor_inlet' | undefined;
  /** Electrical readings judged alongside (optional). */
  controlVolts?: number | undefined;
  controlNominalV?: number | undefined;
  lineVoltages?: readonly number[] | undefined;
  nameplateV?: number | undefined;
}

/** The same value worked from the standard sea-level barometer (what a pocket P-T chart shows). */
export interface SeaLevelValue {
  barometricKpa: number;
  value: number;
  saturation: number;
}

/** A temperature difference and a saturation temperature, both in the user's temperature unit. */
export interface UserReading {
  value: number;
  valueK: number;
  saturation: number;
  /** Which saturation temperature `saturation` is: dew for superheat, bubble for subcooling. */
  reference: SaturationReference;
  level: Level;
  direction: 'low' | 'high' | null;
  band: BandView;
  /** The barometer the gauge pressure was read against (kPa abs). */
  barometricKpa: number;
  /** With a gauge unit away from the standard barometer: the sea-level figures; else null. */
  seaLevel: SeaLevelValue | null;
  notes: string[];
  basis: string;
}

export interface SubcoolingReading extends UserReading {
  /** Which pressure the bubble point was taken from. */
  pressureSource: 'liquid' | 'head';
}

/** Saturation temperatures at one pressure, in the user's unit, all three references. */
export interface SaturationPoint {
  pressureKpaAbs: number;
  bubble: number;
  dew: number;
  midpoint: number;
  bubbleC: number;
  dewC: number;
  midpointC: number;
  /** The reference the TD (evaporating) or split (condensing) uses, and its value. */
  reference: SaturationReference;
  temperature: number;
  temperatureC: number;
  barometricKpa: number;
  seaLevel: { barometricKpa: number; bubble: number; dew: number; midpoint: number } | null;
}

export type ReadingField = 'superheat' | 'subcooling' | 'evaporatorTd' | 'condenserSplit' | 'compressionRatio' | 'evaporating' | 'condensing' | 'controlVoltage' | 'voltageUnbalance' | 'supplyVoltage';

export interface ReadingError {
  code: 'invalid_input' | 'out_of_range';
  /** The input field at fault, when known. */
  field: string | null;
  message: string;
}

export interface ReadingsResult {
  refrigerant: RefrigerantId;
  temperatureUnit: TemperatureUnit;
  barometricKpa: number;
  /** Where the barometer came from. */
  barometerSource: 'reading' | 'elevation' | 'standard';
  /** Box class used for the bands, and what set it. */
  boxClass: BoxClass | null;
  boxClassFrom: 'given' | 'design_box_temperature' | 'box_temperature' | 'unknown';
  meteringDevice: MeteringDevice | null;
  superheat: UserReading | null;
  subcooling: SubcoolingReading | null;
  evaporatorTd: UserReading | null;
  condenserSplit: UserReading | null;
  compressionRatio: (CompressionRatioResult & { level: Level; direction: 'low' | 'high' | null; band: BandView }) | null;
  /** Evaporating (suction) and condensing (head) saturation, with the reference each TD uses. */
  evaporating: SaturationPoint | null;
  condensing: SaturationPoint | null;
  controlVoltage: ControlVoltageResult | null;
  voltageUnbalance: VoltageUnbalanceResult | null;
  supplyVoltage: SupplyVoltageLinesResult | null;
  /** One entry per value that could not be computed; every other value is kept. */
  errors: Partial<Record<ReadingField, ReadingError>>;
  /** Likely causes from the combination of levels: a guide (common practice), never a verdict. */
  suggestions: Suggestion[];
}

/**
 * Every reading the inputs allow, in the user's units (gauge pressures against the barometer from
 * barometricKpa, elevationM or the standard atmosphere). A reading is null when its inputs are
 * missing; when a value cannot be computed (e.g. a head pressure above the critical point) it is
 * null with its error in `errors`, and every other value is kept. Throws only when the request as a
 * whole is unusable (unknown refrigerant, bad barometer) or when nothing at all could be computed.
 */
export function computeReadings(input: ReadingsInput): ReadingsResult {
  const refrigerant = getRefrigerant(input.refrigerant);
  const barometricKpa = resolveBarometricKpa(input);
  const barometerSource = input.barometricKpa !== undefined ? 'reading' : input.elevationM !== undefined ? 'elevation' : 'standard';
  const tu = input.temperatureUnit;
  const gauge = isGaugeUnit(input.pressureUnit);
  const offStandard = gauge && Math.abs(barometricKpa - STANDARD_ATMOSPHERE_KPA) > 1e-9;
  const units: MessageUnits = { pressureUnit: input.pressureUnit, temperatureUnit: tu, barometricKpa };
  const seaUnits: MessageUnits = { ...units, barometricKpa: STANDARD_ATMOSPHERE_KPA };
  const errors: ReadingsResult['errors'] = {};
  const attempted = new Set<ReadingField>();

  // The input a failing pressure came from, so a form can put the message on the right field.
  const pressureInput: Record<ReadingField, string | null> = {
    superheat: 'suctionPressure',
    evaporatorTd: 'suctionPressure',
    evaporating: 'suctionPressure',
    subcooling: input.liquidPressure !== undefined ? 'liquidPressure' : 'headPressure',
    condenserSplit: 'headPressure',
    condensing: 'headPressure',
    compressionRatio: 'headPressure',
    controlVoltage: 'controlVolts',
    voltageUnbalance: 'lineVoltages',
    supplyVoltage: 'lineVoltages',
  };
  function guard<T>(field: ReadingField, fn: () => T): T | null {
    attempted.add(field);
    try {
      return fn();
    } catch (error) {
      if (isCalcError(error)) {
        const at = error.field === 'pressure' || error.field === 'dischargePressure' || error.field === null || error.field === undefined ? pressureInput[field] : error.field;
        errors[field] = { code: error.code, field: at, message: error.message };
        return null;
      }
      throw error;
    }
  }
  // The sea-level figure is a courtesy: when it falls outside the data, none is offered.
  const orNull = <T,>(fn: () => T): T | null => {
    try {
      return fn();
    } catch (error) {
      if (isCalcError(error)) return null;
      throw error;
    }
  };
  // Temperatures are plain inputs: a non-number is an input error for the whole request.
  const degC = (v: number | undefined, field: string): number | undefined => {
    if (v === undefined) return undefined;
    requireFinite(v, field);
    return toCelsius(v, tu);
  };
  const suctionLine = degC(input.suctionLineTemp, 'suction line temperature');
  const liquidLine = degC(input.liquidLineTemp, 'liquid line temperature');
  const box = degC(input.boxTemp, 'box temperature');
  const ambient = degC(input.ambientTemp, 'ambient temperature');
  const designBox = degC(input.designBoxTemp, 'design box temperature');

  const klass = input.boxClass
    ? { boxClass: input.boxClass, from: 'given' as const }
    : designBox !== undefined
      ? { boxClass: boxClassFor({ boxTempC: designBox }).boxClass, from: 'design_box_temperature' as const }
      : box !== undefined
        ? { boxClass: boxClassFor({ boxTempC: box }).boxClass, from: 'box_temperature' as const }
        : { boxClass: null, from: 'unknown' as const };
  const ctx = { boxClass: klass.boxClass, meteringDevice: input.meteringDevice ?? null, superheatAt: input.superheatAt };

  // A pressure that cannot be converted (below a perfect vacuum) fails every value that needs it.
  const pressures: Record<'suction' | 'head' | 'liquid', { kpa: number; sea: number } | { error: unknown } | undefined> = {
    suction: convert(input.suctionPressure),
    head: convert(input.headPressure),
    liquid: convert(input.liquidPressure),
  };
  function convert(v: number | undefined): { kpa: number; sea: number } | { error: unknown } | undefined {
    if (v === undefined) return undefined;
    let kpa: number;
    try {
      kpa = toKpaAbs(v, input.pressureUnit, barometricKpa);
    } catch (error) {
      return { error };
    }
    // A deep vacuum reading can lie below zero absolute against the sea-level barometer: no sea-level figure then.
    let sea = Number.NaN;
    try {
      sea = toKpaAbs(v, input.pressureUnit, STANDARD_ATMOSPHERE_KPA);
    } catch {
      sea = Number.NaN;
    }
    return { kpa, sea };
  }
  const need = (p: (typeof pressures)['suction']): { kpa: number; sea: number } => {
    if (p === undefined) throw new CalcInputError('pressure missing', 'pressure');
    if ('error' in p) throw p.error;
    return p;
  };

  const judged = (quantity: 'superheat' | 'subcooling' | 'evaporatorTd' | 'condenserSplit', valueK: number) => {
    const band = bandFor(quantity, ctx);
    return { ...judge(valueK, band), band: describeBand(band, tu) };
  };
  const seaLevel = (valueK: number, saturationC: number): SeaLevelValue | null =>
    offStandard
      ? { barometricKpa: STANDARD_ATMOSPHERE_KPA, value: temperatureDifferenceFromKelvin(valueK, tu), saturation: fromCelsius(saturationC, tu) }
      : null;
  const elevationNote = offStandard
    ? [`Gauge pressure read against a barometer of ${formatFor(barometricKpa, 'kpa')} kPa (${barometerSource === 'reading' ? 'as entered' : 'from the site elevation'}); the sea-level figure is given beside it.`]
    : [];

  let sh: UserReading | null = null;
  if (pressures.suction !== undefined && suctionLine !== undefined) {
    sh = guard('superheat', () => {
      const p = need(pressures.suction);
      const r = superheat({ refrigerant, suctionPressureKpaAbs: p.kpa, suctionLineTempC: suctionLine, units });
      const sea = offStandard ? orNull(() => superheat({ refrigerant, suctionPressureKpaAbs: p.sea, suctionLineTempC: suctionLine, units: seaUnits })) : null;
      return {
        value: temperatureDifferenceFromKelvin(r.superheatK, tu),
        valueK: r.superheatK,
        saturation: fromCelsius(r.dewC, tu),
        reference: 'dew' as const,
        ...judged('superheat', r.superheatK),
        barometricKpa,
        seaLevel: sea ? seaLevel(sea.superheatK, sea.dewC) : null,
        notes: [...r.notes, ...elevationNote],
        basis: r.basis,
      };
    });
  }

  let sc: SubcoolingReading | null = null;
  const liquidSource = pressures.liquid !== undefined ? 'liquid' : pressures.head !== undefined ? 'head' : null;
  if (liquidSource !== null && liquidLine !== undefined) {
    sc = guard('subcooling', () => {
      const p = need(liquidSource === 'liquid' ? pressures.liquid : pressures.head);
      const r = subcooling({ refrigerant, liquidPressureKpaAbs: p.kpa, liquidLineTempC: liquidLine, units });
      const sea = offStandard ? orNull(() => subcooling({ refrigerant, liquidPressureKpaAbs: p.sea, liquidLineTempC: liquidLine, units: seaUnits })) : null;
      const notes = [...r.notes, ...elevationNote];
      if (liquidSource === 'head') {
        notes.push('No liquid-line pressure was given, so subcooling uses the head (discharge) pressure; the discharge reads above the liquid line, so this subcooling reads somewhat high.');
      }
      return {
        value: temperatureDifferenceFromKelvin(r.subcoolingK, tu),
        valueK: r.subcoolingK,
        saturation: fromCelsius(r.bubbleC, tu),
        reference: 'bubble' as const,
        ...judged('subcooling', r.subcoolingK),
        barometricKpa,
        seaLevel: sea ? seaLevel(sea.subcoolingK, sea.bubbleC) : null,
        pressureSource: liquidSource,
        notes,
        basis: r.basis,
      };
    });
  }

  const point = (p: { kpa: number; sea: number }, reference: SaturationReference): SaturationPoint => {
    const s = saturationAtPressure(refrigerant, p.kpa, units);
    const sea = offStandard ? orNull(() => saturationAtPressure(refrigerant, p.sea, seaUnits)) : null;
    const at = (x: { bubbleC: number; dewC: number; midpointC: number }) =>
      reference === 'midpoint' ? x.midpointC : reference === 'dew' ? x.dewC : x.bubbleC;
    return {
      pressureKpaAbs: p.kpa,
      bubble: fromCelsius(s.bubbleC, tu),
      dew: fromCelsius(s.dewC, tu),
      midpoint: fromCelsius(s.midpointC, tu),
      bubbleC: s.bubbleC,
      dewC: s.dewC,
      midpointC: s.midpointC,
      reference,
      temperature: fromCelsius(at(s), tu),
      temperatureC: at(s),
      barometricKpa,
      seaLevel: sea
        ? { barometricKpa: STANDARD_ATMOSPHERE_KPA, bubble: fromCelsius(sea.bubbleC, tu), dew: fromCelsius(sea.dewC, tu), midpoint: fromCelsius(sea.midpointC, tu) }
        : null,
    };
  };
  const evapReference = input.evaporatorReference ?? 'midpoint';
  const condReference = input.condenserReference ?? 'midpoint';
  const evaporating = pressures.suction !== undefined ? guard('evaporating', () => point(need(pressures.suction), evapReference)) : null;
  const condensing = pressures.head !== undefined ? guard('condensing', () => point(need(pressures.head), condReference)) : null;

  let td: UserReading | null = null;
  if (pressures.suction !== undefined && box !== undefined) {
    td = guard('evaporatorTd', () => {
      const p = need(pressures.suction);
      const r = evaporatorTd({ refrigerant, suctionPressureKpaAbs: p.kpa, boxTempC: box, reference: evapReference, units });
      const sea = offStandard ? orNull(() => evaporatorTd({ refrigerant, suctionPressureKpaAbs: p.sea, boxTempC: box, reference: evapReference, units: seaUnits })) : null;
      return {
        value: temperatureDifferenceFromKelvin(r.tdK, tu),
        valueK: r.tdK,
        saturation: fromCelsius(r.evaporatingC, tu),
        reference: r.reference,
        ...judged('evaporatorTd', r.tdK),
        barometricKpa,
        seaLevel: sea ? seaLevel(sea.tdK, sea.evaporatingC) : null,
        notes: elevationNote,
        basis: r.basis,
      };
    });
  }
  let split: UserReading | null = null;
  if (pressures.head !== undefined && ambient !== undefined) {
    split = guard('condenserSplit', () => {
      const p = need(pressures.head);
      const r = condenserSplit({ refrigerant, headPressureKpaAbs: p.kpa, ambientC: ambient, reference: condReference, units });
      const sea = offStandard ? orNull(() => condenserSplit({ refrigerant, headPressureKpaAbs: p.sea, ambientC: ambient, reference: condReference, units: seaUnits })) : null;
      return {
        value: temperatureDifferenceFromKelvin(r.splitK, tu),
        valueK: r.splitK,
        saturation: fromCelsius(r.condensingC, tu),
        reference: r.reference,
        ...judged('condenserSplit', r.splitK),
        barometricKpa,
        seaLevel: sea ? seaLevel(sea.splitK, sea.condensingC) : null,
        notes: elevationNote,
        basis: r.basis,
      };
    });
  }
  let ratio: ReadingsResult['compressionRatio'] = null;
  if (pressures.suction !== undefined && pressures.head !== undefined) {
    ratio = guard('compressionRatio', () => {
      const r = compressionRatio({ suctionKpaAbs: need(pressures.suction).kpa, dischargeKpaAbs: need(pressures.head).kpa });
      const band = bandFor('compressionRatio', ctx);
      return { ...r, ...judge(r.ratio, band), band: describeBand(band, tu) };
    });
  }

  const control =
    input.controlVolts !== undefined
      ? guard('controlVoltage', () => controlCircuitVoltage({ measuredV: input.controlVolts!, nominalV: input.controlNominalV }))
      : null;
  const lines = input.lineVoltages;
  const unbalance = lines && lines.length === 3 ? guard('voltageUnbalance', () => voltageUnbalance(lines)) : null;
  const supply =
    lines && lines.length > 0 && input.nameplateV !== undefined
      ? guard('supplyVoltage', () => supplyVoltageLines({ lines, nameplateV: input.nameplateV!, point: 'utilization' }))
      : null;

  // Nothing at all could be computed: the request itself is the problem (an API 422).
  const firstError = Object.values(errors)[0];
  if (firstError && Object.keys(errors).length === attempted.size) {
    const ErrorType = firstError.code === 'out_of_range' ? CalcRangeError : CalcInputError;
    throw new ErrorType(firstError.message, firstError.field ?? undefined);
  }

  const result: Omit<ReadingsResult, 'suggestions'> = {
    refrigerant: refrigerant.id,
    temperatureUnit: tu,
    barometricKpa,
    barometerSource,
    boxClass: klass.boxClass,
    boxClassFrom: klass.from,
    meteringDevice: input.meteringDevice ?? null,
    superheat: sh,
    subcooling: sc,
    evaporatorTd: td,
    condenserSplit: split,
    compressionRatio: ratio,
    evaporating,
    condensing,
    controlVoltage: control,
    voltageUnbalance: unbalance,
    supplyVoltage: supply,
    errors,
  };
  return { ...result, suggestions: suggestCauses(diagnosisInputFrom(result)) };
}
