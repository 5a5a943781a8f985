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

/**
 * One side of a pressure control: the end it is set by, the other end (set − differential) and
 * the differential; none when the nameplate holds neither value.
 */
function pressureSide(side: string, ends: { set: string; derived: string }, set: number | null, diff: number | null, prefs: UnitPrefs): SettingLine[] {
  if (set === null && diff === null) return [];
  const values = [];
  if (set !== null) values.push({ label: ends.set, text: formatQuantity(set, 'pressureGauge', prefs) });
  if (set !== null && diff !== null) values.push({ label: ends.derived, text: formatQuantity(set - diff, 'pressureGauge', prefs) });
  if (diff !== null) values.push({ label: 'differential', text: formatQuantity(diff, 'pressureDiff', prefs) });
  return [{ side, values }];
}

export function currentSettings(type: EquipmentType, nameplate: Nameplate, prefs: UnitPrefs): SettingLine[] {
  const lines: SettingLine[] = [];
  if (type === 'pressure_control') {
    lines.push(...pressureSide('Low side', { set: 'cut-in', derived: 'cut-out' }, num(nameplate.lowCutInKpa), num(nameplate.lowDifferentialKpa), prefs));
    lines.push(...pressureSide('High side', { set: 'cut-out', derived: 'cut-in' }, num(nameplate.highCutOutKpa), num(nameplate.highDifferentialKpa), prefs));
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
