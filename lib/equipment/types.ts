import { EQUIPMENT_TYPES, type EquipmentType } from '@/lib/calc/service-life';
import { labelled } from '@/lib/labelled';

export { EQUIPMENT_TYPES, type EquipmentType };

export const equipmentTypeLabels: Record<EquipmentType, string> = {
  condensing_unit: 'Condensing unit',
  compressor: 'Compressor',
  evaporator: 'Evaporator / unit cooler',
  condenser: 'Condenser',
  pressure_control: 'Pressure control',
  thermostat: 'Thermostat / temperature control',
  solenoid_valve: 'Solenoid valve',
  expansion_valve: 'Expansion valve',
  defrost_control: 'Defrost control',
  contactor: 'Contactor',
  fan_motor: 'Fan motor',
  other: 'Other',
};

export const { values: EQUIPMENT_STATUSES, labels: statusLabels } = labelled({ in_service: 'In service', out_of_service: 'Out of service', removed: 'Removed' });
export type EquipmentStatus = (typeof EQUIPMENT_STATUSES)[number];

// Condition is rated 1–5 by the technician; 5 is best. Words go with every number on screen.
export const CONDITIONS = [5, 4, 3, 2, 1] as const;
export type Condition = (typeof CONDITIONS)[number];
export const conditionLabels: Record<Condition, string> = {
  5: 'Like new',
  4: 'Good',
  3: 'Fair',
  2: 'Poor',
  1: 'Failing',
};

export const RELATION_KINDS = ['controls', 'serves'] as const;
export type RelationKind = (typeof RELATION_KINDS)[number];
/**
 * How a relation reads from each end, in the words a technician uses: a control is wired to what
 * it switches (which is switched by it); a condensing unit feeds its evaporators (fed by it).
 * The stored kinds keep their names.
 */
export const relationPhrases: Record<RelationKind, { forward: string; backward: string }> = {
  controls: { forward: 'Wired to', backward: 'Switched by' },
  serves: { forward: 'Feeds', backward: 'Fed by' },
};

export const { values: APPLICATIONS, labels: applicationLabels } = labelled({
  commercial_refrigeration: 'Commercial refrigeration',
  industrial_process: 'Industrial process refrigeration',
  comfort_cooling: 'Comfort cooling',
});
export type Application = (typeof APPLICATIONS)[number];
