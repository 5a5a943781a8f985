// The cause patterns behind suggestCauses (diagnosis.ts), as data. Every rule is common practice
// from refrigeration service training texts (the classic superheat/subcooling/TD/split patterns),
// not a standard.
import type { Level } from '@/lib/calc/reading-bands';

export interface LevelOf {
  level: Level;
  direction: 'low' | 'high' | null;
}

/** What the suggestions look at; every field optional, so a partial reading still gets a guide. */
export interface DiagnosisInput {
  superheat?: LevelOf | null | undefined;
  subcooling?: LevelOf | null | undefined;
  evaporatorTd?: LevelOf | null | undefined;
  condenserSplit?: LevelOf | null | undefined;
  compressionRatio?: LevelOf | null | undefined;
  controlVoltage?: LevelOf | null | undefined;
  voltageUnbalance?: LevelOf | null | undefined;
  supplyVoltage?: LevelOf | null | undefined;
  meteringDevice?: 'txv' | 'fixed' | null | undefined;
}

export type SuggestionCode =
  | 'undercharge_or_liquid_restriction'
  | 'metering_device_starving'
  | 'evaporator_starving'
  | 'overfeeding_or_flooding'
  | 'low_evaporator_airflow'
  | 'condenser_airflow_or_noncondensables'
  | 'overcharge'
  | 'low_load_or_inefficient_compressor'
  | 'control_transformer_or_connection'
  | 'control_voltage_high'
  | 'supply_unbalance'
  | 'supply_voltage';

export type Key = keyof Omit<DiagnosisInput, 'meteringDevice'>;

export const off = (v: LevelOf | null | undefined, direction: 'low' | 'high'): number =>
  v && v.level !== 'normal' && v.direction === direction ? (v.level === 'abnormal' ? 2 : 1) : 0;

export interface Rule {
  code: SuggestionCode;
  title: string;
  reasoning: string;
  checks: string[];
  /** Each condition scores 0 (not met), 1 (watch) or 2 (abnormal); all must score > 0. */
  when: { key: Key; direction: 'low' | 'high' }[];
  /** Conditions that add weight but are not required. */
  alsoWhen?: { key: Key; direction: 'low' | 'high' }[];
  /** Readings that argue against it: each subtracts its weight (watch 1, abnormal 2). */
  against?: { key: Key; direction: 'low' | 'high' }[];
  /** Evaluated only when the metering device is (or may be) this. */
  metering?: 'txv' | 'fixed';
  /** Tie-breaker among equal scores: more specific patterns first. */
  priority: number;
}

export const RULES: readonly Rule[] = [
  {
    code: 'undercharge_or_liquid_restriction',
    title: 'Low charge, or a restriction before the metering device',
    reasoning:
      'High superheat with low subcooling: too little liquid reaches the metering device, so the evaporator starves and the condenser holds little liquid to subcool.',
    checks: [
      'Look for bubbles in the sight glass and check the receiver level.',
      'Measure the temperature drop across the filter-drier and liquid solenoid (a drop of more than a few degrees points to a restriction).',
      'If the charge is low, search for the leak before adding refrigerant.',
    ],
    when: [
      { key: 'superheat', direction: 'high' },
      { key: 'subcooling', direction: 'low' },
    ],
    alsoWhen: [
      { key: 'condenserSplit', direction: 'low' },
      { key: 'evaporatorTd', direction: 'high' },
    ],
    priority: 10,
  },
  {
    code: 'metering_device_starving',
    title: 'Metering device starving the evaporator',
    reasoning:
      'High superheat with high subcooling: liquid is backing up on the high side while the evaporator starves, so the restriction is at the metering device itself.',
    checks: [
      'Check the TXV sensing bulb: mounted tight on the suction line, insulated, and not lost its charge.',
      'Check the valve inlet strainer and for ice or wax in the orifice.',
      'Check the superheat adjustment and the external equalizer line.',
    ],
    when: [
      { key: 'superheat', direction: 'high' },
      { key: 'subcooling', direction: 'high' },
    ],
    priority: 10,
  },
  {
    code: 'evaporator_starving',
    title: 'Evaporator short of refrigerant (check charge and metering device)',
    reasoning:
      'High superheat: the refrigerant boils off early in the coil, so the evaporator is starved. Subcooling tells which: low points to charge or a restriction before the valve, high to the valve itself.',
    checks: [
      'Measure subcooling at the liquid line (with a liquid-line pressure if there is a port).',
      'Check the sight glass, the filter-drier temperature drop and the TXV bulb.',
      'Make sure the box is not simply in pull-down from a warm start (a warm box raises superheat and TD together).',
    ],
    when: [{ key: 'superheat', direction: 'high' }],
    alsoWhen: [{ key: 'evaporatorTd', direction: 'high' }],
    priority: 7,
  },
  {
    code: 'low_evaporator_airflow',
    title: 'Low airflow over the evaporator: iced or dirty coil, or a fan failure',
    reasoning:
      'A large evaporator TD means the coil is not taking heat from the box air; with low superheat the refrigerant is not picking up heat either, which points to the air side.',
    checks: [
      'Look at the coil for ice or dirt and check that defrost runs and terminates.',
      'Check that every evaporator fan runs, in the right direction, with blades intact.',
      'Check for blocked air paths (product stacked against the coil).',
    ],
    when: [{ key: 'evaporatorTd', direction: 'high' }],
    alsoWhen: [{ key: 'superheat', direction: 'low' }],
    // A starved coil also shows a large TD, but with high superheat rather than low.
    against: [{ key: 'superheat', direction: 'high' }],
    priority: 8,
  },
  {
    code: 'overfeeding_or_flooding',
    title: 'Overfeeding or flooding the evaporator',
    reasoning: 'Low superheat: more liquid enters the evaporator than it can boil off, so liquid may reach the compressor.',
    checks: [
      'Check the TXV sensing bulb position and contact (a loose or warm bulb opens the valve).',
      'Check for a valve stuck open or oversized, and for overcharge on a fixed metering device.',
      'Feel or measure the compressor suction for floodback (frost on the compressor body, low return-gas superheat).',
    ],
    when: [{ key: 'superheat', direction: 'low' }],
    alsoWhen: [{ key: 'subcooling', direction: 'high' }],
    priority: 6,
  },
  {
    code: 'condenser_airflow_or_noncondensables',
    title: 'Dirty condenser, poor condenser airflow, or non-condensables',
    reasoning: 'A high condenser split means the condenser is rejecting heat poorly, which drives the head pressure up.',
    checks: [
      'Clean the condenser coil and check that every condenser fan runs, in the right direction.',
      'Check for hot air recirculating from the discharge back to the inlet.',
      'With the unit off and the fans run until temperatures settle, compare the standing pressure with the saturation pressure at ambient: a higher pressure points to air (non-condensables).',
    ],
    when: [{ key: 'condenserSplit', direction: 'high' }],
    alsoWhen: [{ key: 'compressionRatio', direction: 'high' }],
    priority: 7,
  },
  {
    code: 'overcharge',
    title: 'Overcharge',
    reasoning: 'High subcooling with a high condenser split: extra liquid backs up in the condenser, leaving less surface to condense.',
    checks: [
      'Compare with the charge on the nameplate or the charging chart.',
      'Check the receiver level (an overfull receiver floods the condenser).',
      'Rule out non-condensables first: they also raise head pressure.',
    ],
    when: [
      { key: 'subcooling', direction: 'high' },
      { key: 'condenserSplit', direction: 'high' },
    ],
    priority: 9,
  },
  {
    code: 'low_load_or_inefficient_compressor',
    title: 'Inefficient compressor or light load',
    reasoning: 'A low compression ratio with a low condenser split: the compressor is moving little refrigerant (worn valves, leaking reeds) or the load is light.',
    checks: [
      'Measure the compressor amps against its rating.',
      'Check whether suction pressure rises quickly when the compressor stops (leaking valves).',
    ],
    when: [
      { key: 'compressionRatio', direction: 'low' },
      { key: 'condenserSplit', direction: 'low' },
    ],
    priority: 5,
  },
  {
    code: 'control_transformer_or_connection',
    title: 'Control transformer or a loose connection',
    reasoning: 'Low control voltage: the transformer is overloaded or on the wrong primary tap, or a connection is dropping voltage; contactors may chatter or fail to pull in.',
    checks: [
      'Measure the control voltage under load (contactor pulled in).',
      'Check the transformer primary tap against the supply (use the 208 V tap on a 208 V supply) and its VA rating against the load.',
      'Check terminals and splices in the control circuit for heat or looseness.',
    ],
    when: [{ key: 'controlVoltage', direction: 'low' }],
    priority: 9,
  },
  {
    code: 'control_voltage_high',
    title: 'High control voltage: light load or the wrong transformer tap',
    reasoning: 'A high control voltage often reads on an open or lightly loaded secondary, or where the primary tap is lower than the supply.',
    checks: ['Re-measure with the circuit loaded.', 'Check the primary tap against the measured supply voltage.'],
    when: [{ key: 'controlVoltage', direction: 'high' }],
    priority: 4,
  },
  {
    code: 'supply_unbalance',
    title: 'Unbalanced supply or a poor connection on one phase',
    reasoning: 'Voltage unbalance drives a much larger current unbalance and heats the motor windings.',
    checks: [
      'Measure line voltages at the disconnect and at the motor terminals to see where the unbalance starts.',
      'Check contactor contacts and lugs on each phase for pitting or heat.',
      'Rotate the leads one position: if the high current follows the supply line, the supply is at fault.',
    ],
    when: [{ key: 'voltageUnbalance', direction: 'high' }],
    priority: 8,
  },
  {
    code: 'supply_voltage',
    title: 'Supply voltage outside its usual range',
    reasoning: 'A line voltage outside ANSI C84.1 Range A stresses motors and controls; low voltage raises motor current.',
    checks: ['Measure at the service and at the equipment to separate utility supply from voltage drop in the wiring.', 'Check the wire size and connections on the branch circuit.'],
    when: [{ key: 'supplyVoltage', direction: 'low' }],
    alsoWhen: [{ key: 'controlVoltage', direction: 'low' }],
    priority: 7,
  },
  {
    code: 'supply_voltage',
    title: 'Supply voltage outside its usual range',
    reasoning: 'A line voltage above ANSI C84.1 Range A stresses motor insulation and controls.',
    checks: ['Measure at the service entrance; a high utility voltage is for the utility to correct.'],
    when: [{ key: 'supplyVoltage', direction: 'high' }],
    priority: 5,
  },
];
