import type { Nameplate } from '@/lib/equipment/nameplate';
import type { EquipmentType } from '@/lib/equipment/types';
import { formatQuantity, type UnitPrefs } from '@/lib/units/quantities';

// A control's current settings as the unit page's header reads them, from the nameplate's stored
// SI values, in the viewer's units. The derived ends follow the trade's relation (common practice,
// as in lib/calc/pressure-controls): low side cut-out = cut-in − differential; high side
// cut-in = cut-out − differential. A gauge difference is the same in gauge and absolute terms.

export interface SettingLine {
  /** "Low side", "High side" or "Thermostat". */
  side: string;
  values: { label: string; text: string }[];
}

function num(v: Nameplate[string]): number | null {
  return typeof v === 'number' && Number.isFinite(v) ? v : null;
}

export function currentSettings(type: EquipmentType, nameplate: Nameplate, prefs: UnitPrefs): SettingLine[] {
  const lines: SettingLine[] = [];
  if (type === 'pressure_control') {
    const lowIn = num(nameplate.lowCutInKpa);
    const lowDiff = num(nameplate.lowDifferentialKpa);
    if (lowIn !== null || lowDiff !== null) {
      const values = [];
      if (lowIn !== null) values.push({ label: 'cut-in', text: formatQuantity(lowIn, 'pressureGauge', prefs) });
      if (lowIn !== null && lowDiff !== null) values.push({ label: 'cut-out', text: formatQuantity(lowIn - lowDiff, 'pressureGauge', prefs) });
      if (lowDiff !== null) values.push({ label: 'differential', text: formatQuantity(lowDiff, 'pressureDiff', prefs) });
      lines.push({ side: 'Low side', values });
    }
    const highOut = num(nameplate.highCutOutKpa);
    const highDiff = num(nameplate.highDifferentialKpa);
    if (highOut !== null || highDiff !== null) {
      const values = [];
      if (highOut !== null) values.push({ label: 'cut-out', text: formatQuantity(highOut, 'pressureGauge', prefs) });
      if (highOut !== null && highDiff !== null) values.push({ label: 'cut-in', text: formatQuantity(highOut - highDiff, 'pressureGauge', prefs) });
      if (highDiff !== null) values.push({ label: 'differential', text: formatQuantity(highDiff, 'pressureDiff', prefs) });
      lines.push({ side: 'High side', values });
    }
  }
  if (type === 'thermostat') {
    const setpoint = num(nameplate.setpointC);
    const diff = num(nameplate.differentialK);
    const values = [];
    if (setpoint !== null) values.push({ label: 'setpoint', text: formatQuantity(setpoint, 'temperature', prefs) });
    if (diff !== null) values.push({ label: 'differential', text: formatQuantity(diff, 'temperatureDiff', prefs) });
    if (values.length) lines.push({ side: 'Thermostat', values });
  }
  return lines;
}
