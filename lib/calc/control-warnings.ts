// The warnings a pressure-control setting can raise, kept in SI so a stored warning can be worded
// again in any reader's units.
import { formatPressure, formatTemperature } from '@/lib/calc/format';
import type { RefrigerantId } from '@/lib/calc/refrigerants';
import { fromCelsius, fromKpaAbs, type PressureUnit, type TemperatureUnit } from '@/lib/calc/units';

export type ControlWarningCode =
  | 'vacuum_cut_out'
  | 'below_vacuum_floor'
  | 'cut_in_above_box'
  | 'above_design_pressure'
  | 'high_low_event_below_floor'
  | 'below_triple_point'
  | 'cut_out_below_condensing';

/**
 * What a warning is about, in SI (kPa abs, °C) with the barometer gauge values were read against,
 * so a stored warning can be worded again in any reader's units (controlWarningMessage).
 */
export interface ControlWarningData {
  barometricKpa: number;
  refrigerant: RefrigerantId;
  /** The setting the warning is about (kPa abs). */
  settingKpaAbs?: number;
  /** The limit it is compared with (kPa abs). */
  limitKpaAbs?: number;
  /** A saturation temperature of the setting (°C). */
  saturationC?: number;
  /** The temperature it is compared with (°C). */
  limitC?: number;
}

export interface ControlWarning {
  code: ControlWarningCode;
  /** Worded in the units the control was entered in and the temperatureUnit asked for. */
  message: string;
  basis: string;
  data: ControlWarningData;
}

/** The words of a warning in any units: the same text the calculation gave, re-worded from its SI data. */
export function controlWarningMessage(code: ControlWarningCode, d: ControlWarningData, units: { pressureUnit: PressureUnit; temperatureUnit: TemperatureUnit }): string {
  const pu = units.pressureUnit;
  const tu = units.temperatureUnit;
  const p = (kpaAbs: number | undefined) => formatPressure(fromKpaAbs(kpaAbs ?? Number.NaN, pu, d.barometricKpa), pu);
  const t = (c: number | undefined) => formatTemperature(fromCelsius(c ?? Number.NaN, tu), tu);
  switch (code) {
    case 'vacuum_cut_out':
      return `The cut-out (${p(d.settingKpaAbs)}) is below atmospheric pressure: the low side would run in a vacuum and draw air and moisture in at any leak.`;
    case 'below_vacuum_floor':
      return `The cut-out (${p(d.settingKpaAbs)}) is below 27 inHg vacuum (${p(d.limitKpaAbs)}), the lowest setting commonly allowed.`;
    case 'below_triple_point':
      return (
        `The cut-out (${p(d.settingKpaAbs)}) is below the ${d.refrigerant} triple point (${p(d.limitKpaAbs)}, ${t(d.limitC)}): ` +
        'dry ice can form in the evaporator and block it. Set the cut-out above the triple-point pressure.'
      );
    case 'cut_in_above_box':
      return (
        `The cut-in's saturation temperature (${t(d.saturationC)}) is above the design box temperature (${t(d.limitC)}): ` +
        'the evaporator pressure will not reach the cut-in while the box is at temperature, so the control cannot hold the box.'
      );
    case 'above_design_pressure':
      return `The cut-out (${p(d.settingKpaAbs)}) is above the nameplate high-side design pressure (${p(d.limitKpaAbs)}).`;
    case 'high_low_event_below_floor':
      return `The cut-in (${p(d.settingKpaAbs)}) is below 50 psig (${p(d.limitKpaAbs)}), the lowest reset commonly allowed for a high-pressure control.`;
    case 'cut_out_below_condensing':
      return (
        `The cut-out (${p(d.settingKpaAbs)}) saturates at ${t(d.saturationC)}, below the ${t(d.limitC)} an air-cooled condenser ` +
        'reaches on a hot day: expect nuisance trips. The nameplate governs.'
      );
  }
}
