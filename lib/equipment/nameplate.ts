import { z } from 'zod';
import { REFRIGERANT_IDS } from '@/lib/calc/refrigerants';
import type { EquipmentType } from '@/lib/equipment/types';
import type { Quantity } from '@/lib/units/quantities';

// Type-specific nameplate fields as data: the form renders them, the zod schemas are built from
// them, and CSV columns follow them. Values are stored in SI (kPa gauge, °C, K, kg); fixed units
// (V, A, W, Hz) need no conversion. Every field is optional: a nameplate may be unreadable.

interface Base {
  key: string;
  label: string;
  hint?: string;
}
export interface NumberField extends Base {
  kind: 'number';
  /** A convertible quantity, or a fixed unit label. */
  quantity?: Quantity;
  unit?: string;
  min: number;
  max: number;
  integer?: boolean;
}
export interface EnumField extends Base {
  kind: 'enum';
  options: readonly (readonly [string, string])[];
}
export interface TextField extends Base {
  kind: 'text';
  max: number;
}
export interface BoolField extends Base {
  kind: 'bool';
}
export type NameplateField = NumberField | EnumField | TextField | BoolField;

const volts = (key: string, label: string): NumberField => ({ key, label, kind: 'number', unit: 'V', min: 12, max: 600 });
const amps = (key: string, label: string): NumberField => ({ key, label, kind: 'number', unit: 'A', min: 0, max: 2000 });
const phase: EnumField = { key: 'phase', label: 'Phase', kind: 'enum', options: [['1', 'Single phase'], ['3', 'Three phase']] };
const frequency: EnumField = { key: 'frequencyHz', label: 'Frequency', kind: 'enum', options: [['60', '60 Hz'], ['50', '50 Hz']] };
const refrigerant: EnumField = { key: 'refrigerant', label: 'Refrigerant', kind: 'enum', options: REFRIGERANT_IDS.map((r) => [r, r] as const) };
const compressorKind: EnumField = {
  key: 'compressorKind',
  label: 'Compressor kind',
  kind: 'enum',
  options: [['reciprocating', 'Reciprocating'], ['scroll', 'Scroll'], ['rotary', 'Rotary'], ['screw', 'Screw']],
};
const fanCount: NumberField = { key: 'fanCount', label: 'Fans', kind: 'number', min: 0, max: 20, integer: true };
// Gauge settings span a deep vacuum (≈ −100 kPa) to high-side design pressures of CO2 systems.
const gauge = (key: string, label: string, hint?: string): NumberField => ({ key, label, kind: 'number', quantity: 'pressureGauge', min: -101, max: 14_000, hint });
const pressureDiff = (key: string, label: string): NumberField => ({ key, label, kind: 'number', quantity: 'pressureDiff', min: 0, max: 7_000 });
const temperature = (key: string, label: string): NumberField => ({ key, label, kind: 'number', quantity: 'temperature', min: -60, max: 80 });

export const nameplateFields: Record<EquipmentType, readonly NameplateField[]> = {
  condensing_unit: [
    volts('voltage', 'Voltage'),
    phase,
    frequency,
    amps('rlaA', 'RLA (rated load amps)'),
    amps('lraA', 'LRA (locked rotor amps)'),
    amps('mcaA', 'MCA (min. circuit ampacity)'),
    amps('mopA', 'MOP (max. overcurrent protection)'),
    refrigerant,
    { key: 'factoryChargeKg', label: 'Factory charge', kind: 'number', quantity: 'mass', min: 0, max: 5000 },
    gauge('designPressureHighKpa', 'Design pressure, high side'),
    gauge('designPressureLowKpa', 'Design pressure, low side'),
    compressorKind,
  ],
  compressor: [volts('voltage', 'Voltage'), phase, amps('rlaA', 'RLA'), amps('lraA', 'LRA'), refrigerant, compressorKind],
  evaporator: [
    fanCount,
    volts('fanMotorVolts', 'Fan motor voltage'),
    amps('fanMotorAmps', 'Fan motor amps (each)'),
    { key: 'defrostType', label: 'Defrost', kind: 'enum', options: [['off_cycle', 'Off-cycle'], ['electric', 'Electric'], ['hot_gas', 'Hot gas']] },
    { key: 'heaterWatts', label: 'Defrost heaters', kind: 'number', unit: 'W', min: 0, max: 50_000 },
    refrigerant,
  ],
  condenser: [fanCount, volts('fanMotorVolts', 'Fan motor voltage'), amps('fanMotorAmps', 'Fan motor amps (each)')],
  pressure_control: [
    { key: 'controlKind', label: 'Kind', kind: 'enum', options: [['low', 'Low pressure'], ['high', 'High pressure'], ['dual', 'Dual (low and high)']] },
    gauge('rangeMinKpa', 'Range, lowest setting'),
    gauge('rangeMaxKpa', 'Range, highest setting'),
    { key: 'differentialAdjustable', label: 'Differential adjustable', kind: 'bool' },
    { key: 'reset', label: 'Reset', kind: 'enum', options: [['automatic', 'Automatic'], ['manual', 'Manual']] },
    gauge('lowCutInKpa', 'Low side: cut-in (current setting)'),
    pressureDiff('lowDifferentialKpa', 'Low side: differential'),
    gauge('highCutOutKpa', 'High side: cut-out (current setting)'),
    pressureDiff('highDifferentialKpa', 'High side: differential'),
  ],
  thermostat: [
    temperature('rangeMinC', 'Range, lowest'),
    temperature('rangeMaxC', 'Range, highest'),
    temperature('setpointC', 'Setpoint (current setting)'),
    { key: 'differentialK', label: 'Differential', kind: 'number', quantity: 'temperatureDiff', min: 0, max: 30 },
    { key: 'contacts', label: 'Contacts', kind: 'enum', options: [['close_on_rise', 'Close on rise (cooling)'], ['open_on_rise', 'Open on rise'], ['spdt', 'SPDT (both)']] },
    volts('controlVoltage', 'Control voltage'),
  ],
  solenoid_valve: [
    volts('coilVoltage', 'Coil voltage'),
    { key: 'connectionSize', label: 'Connection size', kind: 'text', max: 40, hint: 'As marked, e.g. 3/8 in ODF' },
    { key: 'normally', label: 'Normally', kind: 'enum', options: [['closed', 'Normally closed'], ['open', 'Normally open']] },
    { key: 'line', label: 'Line', kind: 'enum', options: [['liquid', 'Liquid line'], ['suction', 'Suction line'], ['hot_gas', 'Hot gas']] },
  ],
  expansion_valve: [
    { key: 'valveKind', label: 'Kind', kind: 'enum', options: [['thermostatic', 'Thermostatic (TXV)'], ['electronic', 'Electronic (EEV)'], ['automatic', 'Automatic (constant pressure)'], ['capillary', 'Capillary tube']] },
    { key: 'capacityKw', label: 'Capacity', kind: 'number', unit: 'kW', min: 0, max: 2000 },
    { key: 'equalizer', label: 'Equalizer', kind: 'enum', options: [['internal', 'Internal'], ['external', 'External']] },
    refrigerant,
  ],
  defrost_control: [
    { key: 'controlKind', label: 'Kind', kind: 'enum', options: [['time_clock', 'Time clock'], ['electronic', 'Electronic'], ['demand', 'Demand']] },
    { key: 'defrostsPerDay', label: 'Defrosts per day', kind: 'number', min: 0, max: 24, integer: true },
    { key: 'failSafeMinutes', label: 'Fail-safe time', kind: 'number', unit: 'min', min: 0, max: 240, integer: true },
    temperature('terminationC', 'Termination temperature'),
  ],
  contactor: [
    volts('coilVoltage', 'Coil voltage'),
    { key: 'poles', label: 'Poles', kind: 'number', min: 1, max: 4, integer: true },
    amps('fullLoadAmps', 'Full load amps'),
  ],
  fan_motor: [
    volts('voltage', 'Voltage'),
    amps('amps', 'Amps'),
    { key: 'horsepower', label: 'Horsepower', kind: 'number', unit: 'hp', min: 0, max: 100 },
    { key: 'rpm', label: 'Speed', kind: 'number', unit: 'rpm', min: 0, max: 10_000, integer: true },
    { key: 'motorKind', label: 'Motor kind', kind: 'enum', options: [['psc', 'PSC'], ['shaded_pole', 'Shaded pole'], ['ecm', 'ECM'], ['three_phase', 'Three phase']] },
  ],
  other: [{ key: 'description', label: 'Description', kind: 'text', max: 500 }],
};

function fieldSchema(field: NameplateField): z.ZodType {
  switch (field.kind) {
    case 'number': {
      let n = z.number({ message: `${field.label} must be a number.` }).min(field.min, `${field.label} is below what this field allows.`).max(field.max, `${field.label} is above what this field allows.`);
      if (field.integer) n = n.int(`${field.label} must be a whole number.`);
      return n.nullable().optional();
    }
    case 'enum':
      return z
        .enum(field.options.map(([v]) => v) as [string, ...string[]], { message: `Choose a ${field.label.toLowerCase()} from the list.` })
        .nullable()
        .optional();
    case 'text':
      return z.string().trim().max(field.max, `${field.label}: at most ${field.max} characters.`).nullable().optional();
    case 'bool':
      return z.boolean().nullable().optional();
  }
}

export function nameplateSchemaFor(type: EquipmentType) {
  return z.strictObject(Object.fromEntries(nameplateFields[type].map((f) => [f.key, fieldSchema(f)]))).default({});
}

export type Nameplate = Record<string, string | number | boolean | null | undefined>;
