import { isCalcError } from '@/lib/calc/errors';
import { controlCircuitVoltage, supplyVoltageCheck, voltageUnbalance } from '@/lib/calc/electrical';
import { highPressureControl, lowPressureControl } from '@/lib/calc/pressure-controls';
import { computeReadings } from '@/lib/calc/readings';
import type { ReadingData, SettingChangeData } from '@/lib/visits/schemas';

// What an entry's numbers mean for its equipment, computed with lib/calc only. The visit form
// calls the same functions as the server, so what the technician sees is what gets stored.

export interface EntryContext {
  /** The system's refrigerant (else the nameplate's); null when none is on record. */
  refrigerant: string | null;
  elevationM: number;
  designBoxTempC: number | null;
  /** Nameplate supply voltage of the equipment (for the C84.1 check). */
  nameplateVoltage: number | null;
  /** Nominal control-circuit voltage; 24 VAC when the nameplate says nothing. */
  controlVoltageNominal: number | null;
  /** Nameplate high-side design pressure of the system's condensing unit, kPa gauge. */
  designPressureHighKpaG: number | null;
}

const orUndefined = (v: number | null | undefined) => (v === null || v === undefined ? undefined : v);

function attempt<T>(problems: string[], fn: () => T): T | null {
  try {
    return fn();
  } catch (error) {
    if (isCalcError(error)) {
      problems.push(error.message);
      return null;
    }
    throw error;
  }
}

export interface ReadingComputed {
  refrigerant: string | null;
  evaporatingC: number | null;
  condensingC: number | null;
  superheatK: number | null;
  subcoolingK: number | null;
  evaporatorTdK: number | null;
  condenserSplitK: number | null;
  compressionRatio: number | null;
  unbalancePct: number | null;
  deratingFactor: number | null;
  unbalanceStatus: string | null;
  doNotOperate: boolean;
  supplyVerdict: string | null;
  supplyMessage: string | null;
  controlVoltageStatus: string | null;
  controlVoltageNotes: string[];
  bases: string[];
  problems: string[];
}

export function computeReading(data: ReadingData, ctx: EntryContext): ReadingComputed {
  const problems: string[] = [];
  const bases = new Set<string>();
  const out: ReadingComputed = {
    refrigerant: ctx.refrigerant,
    evaporatingC: null,
    condensingC: null,
    superheatK: null,
    subcoolingK: null,
    evaporatorTdK: null,
    condenserSplitK: null,
    compressionRatio: null,
    unbalancePct: null,
    deratingFactor: null,
    unbalanceStatus: null,
    doNotOperate: false,
    supplyVerdict: null,
    supplyMessage: null,
    controlVoltageStatus: null,
    controlVoltageNotes: [],
    bases: [],
    problems,
  };
  const hasPressure = data.suctionKpaG != null || data.dischargeKpaG != null;
  if (hasPressure && !ctx.refrigerant) problems.push('No refrigerant is on record for this equipment’s system, so pressures cannot be turned into temperatures.');
  if (hasPressure && ctx.refrigerant) {
    // The discharge (head) pressure stands in for the liquid-line pressure when no liquid port is read.
    const r = attempt(problems, () =>
      computeReadings({
        refrigerant: ctx.refrigerant!,
        pressureUnit: 'kPaG',
        temperatureUnit: 'C',
        elevationM: ctx.elevationM,
        suctionPressure: orUndefined(data.suctionKpaG),
        headPressure: orUndefined(data.dischargeKpaG),
        suctionLineTemp: orUndefined(data.suctionLineC),
        liquidLineTemp: orUndefined(data.liquidLineC),
        boxTemp: orUndefined(data.boxC),
        ambientTemp: orUndefined(data.ambientC),
      }),
    );
    if (r) {
      out.superheatK = r.superheat?.valueK ?? null;
      out.subcoolingK = r.subcooling?.valueK ?? null;
      out.evaporatorTdK = r.evaporatorTd?.valueK ?? null;
      out.condenserSplitK = r.condenserSplit?.valueK ?? null;
      out.evaporatingC = r.superheat?.saturation ?? r.evaporatorTd?.saturation ?? null;
      out.condensingC = r.subcooling?.saturation ?? r.condenserSplit?.saturation ?? null;
      out.compressionRatio = r.compressionRatio?.ratio ?? null;
      for (const part of [r.superheat, r.subcooling, r.evaporatorTd, r.condenserSplit, r.compressionRatio]) if (part) bases.add(part.basis);
    }
  }
  const lines = [data.voltsL1L2, data.voltsL2L3, data.voltsL1L3];
  if (lines.every((v) => v != null && v > 0)) {
    const u = attempt(problems, () => voltageUnbalance(lines as number[]));
    if (u) {
      out.unbalancePct = u.unbalancePct;
      out.deratingFactor = u.deratingFactor;
      out.unbalanceStatus = u.status;
      out.doNotOperate = u.doNotOperate;
      bases.add(u.basis);
    }
    if (ctx.nameplateVoltage) {
      const average = (lines as number[]).reduce((a, b) => a + b, 0) / 3;
      const s = attempt(problems, () => supplyVoltageCheck({ measuredV: average, nameplateV: ctx.nameplateVoltage!, point: 'utilization' }));
      if (s) {
        out.supplyVerdict = s.verdict;
        out.supplyMessage = s.message;
        bases.add(s.basis);
      }
    }
  }
  if (data.controlVolts != null) {
    const c = attempt(problems, () => controlCircuitVoltage({ measuredV: data.controlVolts!, nominalV: ctx.controlVoltageNominal ?? 24 }));
    if (c) {
      out.controlVoltageStatus = c.status;
      out.controlVoltageNotes = c.notes;
      bases.add(c.basis);
    }
  }
  out.bases = [...bases];
  return out;
}

export interface SettingComputed {
  refrigerant: string | null;
  /** Low side: the cut-out; high side: the cut-in (kPa gauge). */
  asFoundOtherKpaG: number | null;
  asLeftOtherKpaG: number | null;
  /** Saturation temperatures (°C) of each as-left setting: dew for the low side, bubble for the high side. */
  asLeftSaturation: { setting: number | null; other: number | null };
  asFoundSaturation: { setting: number | null; other: number | null };
  warnings: { code: string; message: string }[];
  basis: string | null;
  problems: string[];
}

export function computeSettingChange(data: SettingChangeData, ctx: EntryContext): SettingComputed {
  const problems: string[] = [];
  const out: SettingComputed = {
    refrigerant: ctx.refrigerant,
    asFoundOtherKpaG: null,
    asLeftOtherKpaG: null,
    asLeftSaturation: { setting: null, other: null },
    asFoundSaturation: { setting: null, other: null },
    warnings: [],
    basis: null,
    problems,
  };
  if (data.control === 'thermostat') {
    if (ctx.designBoxTempC !== null && data.asLeft.setpointC > ctx.designBoxTempC + 1) {
      out.warnings.push({ code: 'setpoint_above_design', message: 'The setpoint is above the system’s design box temperature.' });
    }
    return out;
  }
  if (!ctx.refrigerant) {
    problems.push('No refrigerant is on record for this system, so settings cannot be turned into temperatures.');
    if (data.control === 'low') {
      out.asFoundOtherKpaG = data.asFound.cutInKpaG - data.asFound.differentialKpa;
      out.asLeftOtherKpaG = data.asLeft.cutInKpaG - data.asLeft.differentialKpa;
    } else {
      out.asFoundOtherKpaG = data.asFound.cutOutKpaG - data.asFound.differentialKpa;
      out.asLeftOtherKpaG = data.asLeft.cutOutKpaG - data.asLeft.differentialKpa;
    }
    return out;
  }
  const common = { refrigerant: ctx.refrigerant, unit: 'kPaG' as const, temperatureUnit: 'C' as const, elevationM: ctx.elevationM };
  if (data.control === 'low') {
    const run = (s: { cutInKpaG: number; differentialKpa: number }) =>
      attempt(problems, () =>
        lowPressureControl({ ...common, cutIn: s.cutInKpaG, differential: s.differentialKpa, designBoxTemp: ctx.designBoxTempC ?? undefined }),
      );
    const found = run(data.asFound);
    const left = run(data.asLeft);
    out.asFoundOtherKpaG = found?.cutOut ?? data.asFound.cutInKpaG - data.asFound.differentialKpa;
    out.asLeftOtherKpaG = left?.cutOut ?? data.asLeft.cutInKpaG - data.asLeft.differentialKpa;
    out.asFoundSaturation = { setting: found?.cutInSaturation?.dew ?? null, other: found?.cutOutSaturation?.dew ?? null };
    out.asLeftSaturation = { setting: left?.cutInSaturation?.dew ?? null, other: left?.cutOutSaturation?.dew ?? null };
    out.warnings = left?.warnings.map((w) => ({ code: w.code, message: w.message })) ?? [];
    out.basis = left?.basis ?? null;
  } else {
    const run = (s: { cutOutKpaG: number; differentialKpa: number }) =>
      attempt(problems, () =>
        highPressureControl({ ...common, cutOut: s.cutOutKpaG, differential: s.differentialKpa, designPressure: ctx.designPressureHighKpaG ?? undefined }),
      );
    const found = run(data.asFound);
    const left = run(data.asLeft);
    out.asFoundOtherKpaG = found?.cutIn ?? data.asFound.cutOutKpaG - data.asFound.differentialKpa;
    out.asLeftOtherKpaG = left?.cutIn ?? data.asLeft.cutOutKpaG - data.asLeft.differentialKpa;
    out.asFoundSaturation = { setting: found?.cutOutSaturation?.bubble ?? null, other: found?.cutInSaturation?.bubble ?? null };
    out.asLeftSaturation = { setting: left?.cutOutSaturation?.bubble ?? null, other: left?.cutInSaturation?.bubble ?? null };
    out.warnings = left?.warnings.map((w) => ({ code: w.code, message: w.message })) ?? [];
    out.basis = left?.basis ?? null;
  }
  return out;
}
