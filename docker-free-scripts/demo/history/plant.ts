// The demo's refrigeration plant: every system on every demo site and the components it is built
// from. Makes, models and serials are invented. Control settings are worked out from the
// refrigerant's saturation curve at the site's elevation, so they read as a technician would set
// them (cut-in a few kelvin below the box, cut-out well under the design pressure).
import { barometricPressureKpa } from '@/lib/calc/atmosphere';
import type { RefrigerantId } from '@/lib/calc/refrigerants';
import { dewPressureKpa } from '@/lib/calc/saturation';
import { KG_PER_LB, KPA_PER_PSI } from '@/lib/calc/units';
import type { EquipmentType } from '@/lib/equipment/types';

export const psig = (v: number) => Math.round(v * KPA_PER_PSI * 10) / 10;
export const fToC = (f: number) => Math.round(((f - 32) / 1.8) * 100) / 100;
export const lb = (v: number) => Math.round(v * KG_PER_LB * 1000) / 1000;

/** Where the condensing unit breathes: its air sets the condensing temperature. */
export type MachineAir = 'outdoor' | 'machine_room' | 'kitchen';

export interface OperatingProfile {
  /** Evaporator TD: box temperature minus evaporating (dew) temperature. */
  tdK: number;
  superheatK: number;
  subcoolK: number;
  /** Condensing (bubble) temperature above the air onto the condenser. */
  liftK: number;
  /** Head-pressure control keeps condensing at least this warm in cold weather. */
  minCondensingC: number;
  air: MachineAir;
  /** Compressor current as a share of the nameplate RLA. */
  loadFraction: number;
}

export interface EquipmentSpec {
  key: string;
  type: EquipmentType;
  name: string;
  area: string;
  make: string;
  model: string;
  serial: string;
  installedOn: string;
  condition: number | null;
  nameplate: Record<string, string | number | boolean>;
}

export interface SystemSpec {
  key: string;
  site: string;
  name: string;
  area: string;
  refrigerant: RefrigerantId;
  fullChargeKg: number;
  designBoxTempC: number;
  maintenanceIntervalDays: number;
  notes: string | null;
  profile: OperatingProfile;
  /** Three-phase supply voltage at the condensing unit, or single-phase for small units. */
  supply: { volts: number; phase: '1' | '3' };
  rlaA: number;
  equipment: EquipmentSpec[];
  relations: [from: string, kind: 'controls' | 'serves', to: string][];
}

interface CondensingUnitSpec {
  make: string;
  model: string;
  serial: string;
  volts: number;
  phase: '1' | '3';
  rla: number;
  lra: number;
  mca: number;
  mop: number;
  designHighPsig: number;
  designLowPsig: number;
  compressor: 'reciprocating' | 'scroll' | 'rotary';
  chargeLb?: number;
}

interface EvaporatorSpec {
  name: string;
  /** Its expansion valve, when a circuit has several evaporators. */
  valveName?: string;
  make?: string;
  area?: string;
  model: string;
  serial: string;
  fans: number;
  installedOn?: string;
  condition?: number;
}

interface BoxInput {
  key: string;
  site: string;
  elevationM: number;
  label: string;
  name: string;
  area: string;
  machineArea: string;
  refrigerant: RefrigerantId;
  chargeLb: number;
  boxF: number;
  intervalDays: number;
  installedOn: string;
  cuCondition: number;
  evapCondition: number;
  cu: CondensingUnitSpec;
  evaporators: EvaporatorSpec[];
  defrost: 'off_cycle' | 'electric' | 'hot_gas';
  serialBase: string;
  profile: OperatingProfile;
  notes?: string;
  /** Controls, valves, contactor and fan motor were replaced since (they wear out before the unit). */
  componentsInstalledOn?: string;
  /** Settings found on the controls when they differ from what a technician would set. */
  lowCutInPsig?: [cutIn: number, differential: number];
  highCutOutPsig?: number;
}

function roundPsig(kpaG: number): number {
  return psig(Math.round(kpaG / KPA_PER_PSI));
}

/** A walk-in or case line: remote condensing unit, evaporators with their valves, and the controls in between. */
function walkIn(b: BoxInput): SystemSpec {
  const boxC = fToC(b.boxF);
  const baro = barometricPressureKpa(b.elevationM);
  const freezer = boxC < -5;
  const cutIn = b.lowCutInPsig ? psig(b.lowCutInPsig[0]) : roundPsig(dewPressureKpa(b.refrigerant, boxC - 4) - baro);
  // Keep the cut-out above 2 psig: a pump-down control that pulls into a vacuum draws in air.
  const lowDiff = b.lowCutInPsig ? psig(b.lowCutInPsig[1]) : Math.min(psig(freezer ? 8 : 15), cutIn - psig(2));
  const highCutOut = psig(b.highCutOutPsig ?? b.cu.designHighPsig - 50);
  const componentDate = b.componentsInstalledOn ?? b.installedOn;
  const componentCondition = b.componentsInstalledOn ? 4 : b.evapCondition;
  const serial = (n: number) => `${b.serialBase}-${String(n).padStart(3, '0')}`;
  const e = (key: string, type: EquipmentType, name: string, area: string, make: string, model: string, n: number, nameplate: EquipmentSpec['nameplate'], condition: number | null = componentCondition, installedOn = componentDate): EquipmentSpec => ({
    key,
    type,
    name,
    area,
    make,
    model,
    serial: serial(n),
    installedOn,
    condition,
    nameplate,
  });
  const equipment: EquipmentSpec[] = [
    {
      key: 'cu',
      type: 'condensing_unit',
      name: `${b.label} condensing unit`,
      area: b.machineArea,
      make: b.cu.make,
      model: b.cu.model,
      serial: b.cu.serial,
      installedOn: b.installedOn,
      condition: b.cuCondition,
      nameplate: {
        voltage: b.cu.volts,
        phase: b.cu.phase,
        frequencyHz: '60',
        rlaA: b.cu.rla,
        lraA: b.cu.lra,
        mcaA: b.cu.mca,
        mopA: b.cu.mop,
        refrigerant: b.refrigerant,
        ...(b.cu.chargeLb ? { factoryChargeKg: lb(b.cu.chargeLb) } : {}),
        designPressureHighKpa: psig(b.cu.designHighPsig),
        designPressureLowKpa: psig(b.cu.designLowPsig),
        compressorKind: b.cu.compressor,
      },
    },
  ];
  const relations: SystemSpec['relations'] = [];
  b.evaporators.forEach((ev, i) => {
    const suffix = b.evaporators.length > 1 ? String(i + 1) : '';
    const evapKey = `evap${suffix}`;
    const txvKey = `txv${suffix}`;
    equipment.push(
      {
        key: evapKey,
        type: 'evaporator',
        name: ev.name,
        area: ev.area ?? b.area,
        make: ev.make ?? 'Frostwell',
        model: ev.model,
        serial: ev.serial,
        installedOn: ev.installedOn ?? b.installedOn,
        condition: ev.condition ?? b.evapCondition,
        nameplate: {
          fanCount: ev.fans,
          fanMotorVolts: 208,
          fanMotorAmps: 0.9,
          defrostType: b.defrost,
          ...(b.defrost === 'electric' ? { heaterWatts: 1200 * ev.fans } : {}),
          refrigerant: b.refrigerant,
        },
      },
      e(txvKey, 'expansion_valve', ev.valveName ?? `${b.label} expansion valve`, ev.area ?? b.area, 'Tamsel', freezer ? 'TX-F2' : 'TX-C2', 10 + i, {
        valveKind: 'thermostatic',
        capacityKw: freezer ? 2.1 : 2.8,
        equalizer: 'external',
        refrigerant: b.refrigerant,
      }),
    );
    relations.push(['cu', 'serves', evapKey], [txvKey, 'serves', evapKey]);
    if (b.defrost === 'electric') relations.push(['defrost', 'controls', evapKey]);
  });
  equipment.push(
    e('sol', 'solenoid_valve', `${b.label} liquid-line solenoid`, b.area, 'Tamsel', 'TS-38', 20, { coilVoltage: 208, connectionSize: '3/8 in ODF', normally: 'closed', line: 'liquid' }),
    e('lp', 'pressure_control', `${b.label} low-pressure control`, b.machineArea, 'Polarwick', 'PWC-L40', 21, {
      controlKind: 'low',
      rangeMinKpa: psig(-10),
      rangeMaxKpa: psig(100),
      differentialAdjustable: true,
      reset: 'automatic',
      lowCutInKpa: cutIn,
      lowDifferentialKpa: lowDiff,
    }),
    e('hp', 'pressure_control', `${b.label} high-pressure control`, b.machineArea, 'Polarwick', 'PWC-H45', 22, {
      controlKind: 'high',
      rangeMinKpa: psig(100),
      rangeMaxKpa: psig(500),
      differentialAdjustable: false,
      reset: 'manual',
      highCutOutKpa: highCutOut,
      highDifferentialKpa: psig(100),
    }),
    e('tstat', 'thermostat', `${b.label} thermostat`, b.area, 'Quillmark', 'QT-300', 23, {
      rangeMinC: -34,
      rangeMaxC: 15,
      setpointC: boxC,
      differentialK: 2.2,
      contacts: 'close_on_rise',
      controlVoltage: 24,
    }),
    e('cont', 'contactor', `${b.label} compressor contactor`, b.machineArea, 'Hollin Electric', 'HC-330', 24, { coilVoltage: 24, poles: 3, fullLoadAmps: 30 }),
    e('cfan', 'fan_motor', `${b.label} condenser fan motor`, b.machineArea, 'Hollin Electric', 'HM-1075', 25, {
      voltage: b.cu.phase === '3' ? 208 : b.cu.volts,
      amps: 1.4,
      horsepower: 0.25,
      rpm: 1075,
      motorKind: 'psc',
    }),
  );
  relations.push(['tstat', 'controls', 'sol'], ['lp', 'controls', 'cont'], ['hp', 'controls', 'cont'], ['cont', 'controls', 'cu'], ['cfan', 'serves', 'cu']);
  if (b.defrost === 'electric') {
    equipment.push(e('defrost', 'defrost_control', `${b.label} defrost timer`, b.machineArea, 'Quillmark', 'QD-24', 26, { controlKind: 'time_clock', defrostsPerDay: 4, failSafeMinutes: 30, terminationC: 13 }));
  }
  return {
    key: b.key,
    site: b.site,
    name: b.name,
    area: b.area,
    refrigerant: b.refrigerant,
    fullChargeKg: lb(b.chargeLb),
    designBoxTempC: boxC,
    maintenanceIntervalDays: b.intervalDays,
    notes: b.notes ?? null,
    profile: b.profile,
    supply: { volts: b.cu.volts, phase: b.cu.phase },
    rlaA: b.cu.rla,
    equipment,
    relations,
  };
}

interface ReachInInput {
  key: string;
  site: string;
  label: string;
  name: string;
  area: string;
  refrigerant: RefrigerantId;
  chargeKg: number;
  boxF: number;
  intervalDays: number;
  installedOn: string;
  condition: number;
  make: string;
  model: string;
  serial: string;
  volts: number;
  rla: number;
  designHighPsig: number;
}

/** A self-contained reach-in: compressor, condenser and coil in one cabinet on a capillary tube. */
function reachIn(r: ReachInInput): SystemSpec {
  const boxC = fToC(r.boxF);
  return {
    key: r.key,
    site: r.site,
    name: r.name,
    area: r.area,
    refrigerant: r.refrigerant,
    fullChargeKg: r.chargeKg,
    designBoxTempC: boxC,
    maintenanceIntervalDays: r.intervalDays,
    notes: 'Self-contained cabinet; condenser at the bottom front, behind the kick plate.',
    profile: { tdK: 11, superheatK: 9, subcoolK: 4, liftK: 14, minCondensingC: 35, air: 'kitchen', loadFraction: 0.8 },
    supply: { volts: r.volts, phase: '1' },
    rlaA: r.rla,
    equipment: [
      {
        key: 'cu',
        type: 'condensing_unit',
        name: `${r.label} condensing unit`,
        area: r.area,
        make: r.make,
        model: r.model,
        serial: r.serial,
        installedOn: r.installedOn,
        condition: r.condition,
        nameplate: { voltage: r.volts, phase: '1', frequencyHz: '60', rlaA: r.rla, lraA: r.rla * 5, refrigerant: r.refrigerant, factoryChargeKg: r.chargeKg, designPressureHighKpa: psig(r.designHighPsig), compressorKind: 'reciprocating' },
      },
      {
        key: 'evap',
        type: 'evaporator',
        name: `${r.label} evaporator`,
        area: r.area,
        make: r.make,
        model: `${r.model}-E`,
        serial: `${r.serial}-E`,
        installedOn: r.installedOn,
        condition: r.condition,
        nameplate: { fanCount: 1, fanMotorVolts: r.volts, fanMotorAmps: 0.5, defrostType: 'off_cycle', refrigerant: r.refrigerant },
      },
      {
        key: 'tstat',
        type: 'thermostat',
        name: `${r.label} thermostat`,
        area: r.area,
        make: 'Quillmark',
        model: 'QT-110',
        serial: `${r.serial}-T`,
        installedOn: r.installedOn,
        condition: r.condition,
        nameplate: { rangeMinC: -5, rangeMaxC: 12, setpointC: boxC, differentialK: 2.8, contacts: 'close_on_rise', controlVoltage: r.volts },
      },
    ],
    relations: [
      ['tstat', 'controls', 'cu'],
      ['cu', 'serves', 'evap'],
    ],
  };
}

const cooler: OperatingProfile = { tdK: 6.5, superheatK: 6, subcoolK: 7, liftK: 12, minCondensingC: 29, air: 'outdoor', loadFraction: 0.78 };
const freezer: OperatingProfile = { tdK: 6, superheatK: 5, subcoolK: 6, liftK: 11, minCondensingC: 29, air: 'outdoor', loadFraction: 0.82 };
const indoor = (p: OperatingProfile): OperatingProfile => ({ ...p, air: 'machine_room' });

const PELL = { site: 'Pell Street Kitchen', elevationM: 1610 };
const ORCHARD = { site: 'Orchard Row Bistro', elevationM: 1598 };
const COMMISSARY = { site: 'Commissary', elevationM: 1702 };
const LINDEN = { site: 'Linden Avenue Market', elevationM: 12 };
const QUARRY = { site: 'Quarry Road Market', elevationM: 18 };

export const demoPlant: SystemSpec[] = [
  walkIn({
    ...PELL,
    key: 'pell-cooler',
    label: 'Cooler',
    name: 'Walk-in cooler',
    area: 'Walk-in cooler',
    machineArea: 'Roof',
    refrigerant: 'R-448A',
    chargeLb: 14,
    boxF: 36,
    intervalDays: 90,
    installedOn: '2015-05-12',
    cuCondition: 4,
    evapCondition: 4,
    cu: { make: 'Kelvrin', model: 'KCU-215M', serial: 'KV-15-20771', volts: 208, phase: '3', rla: 9.4, lra: 58, mca: 13.5, mop: 20, designHighPsig: 450, designLowPsig: 250, compressor: 'scroll' },
    evaporators: [{ name: 'Cooler evaporator', model: 'FW-2C40', serial: 'FW-15-88120', fans: 2 }],
    defrost: 'off_cycle',
    serialBase: 'PSK-C',
    profile: cooler,
  }),
  walkIn({
    ...PELL,
    key: 'pell-freezer',
    label: 'Freezer',
    name: 'Walk-in freezer',
    area: 'Walk-in freezer',
    machineArea: 'Roof',
    refrigerant: 'R-404A',
    chargeLb: 18,
    boxF: -10,
    intervalDays: 90,
    installedOn: '2004-06-03',
    cuCondition: 3,
    evapCondition: 3,
    cu: { make: 'Kelvrin', model: 'KCU-330L', serial: 'KV-04-06218', volts: 208, phase: '3', rla: 14.1, lra: 91, mca: 19.8, mop: 30, designHighPsig: 450, designLowPsig: 250, compressor: 'reciprocating' },
    evaporators: [{ name: 'Freezer evaporator', model: 'FW-3F60', serial: 'FW-04-31007', fans: 3 }],
    defrost: 'electric',
    serialBase: 'PSK-F',
    profile: freezer,
    componentsInstalledOn: '2017-03-09',
    lowCutInPsig: [33, 10],
    notes: 'Original 2004 condensing unit; the owner has asked for a replacement quote before the next summer.',
  }),
  reachIn({
    ...PELL,
    key: 'pell-reachin',
    label: 'Cook line reach-in',
    name: 'Cook line reach-in',
    area: 'Cook line reach-ins',
    refrigerant: 'R-290',
    chargeKg: 0.14,
    boxF: 37,
    intervalDays: 180,
    installedOn: '2021-02-10',
    condition: 5,
    make: 'Corvane',
    model: 'CR-2D',
    serial: 'CV-21-10482',
    volts: 115,
    rla: 3.2,
    designHighPsig: 360,
  }),
  reachIn({
    ...ORCHARD,
    key: 'orchard-barback',
    label: 'Bar back reach-in',
    name: 'Bar back reach-in',
    area: 'Bar back',
    refrigerant: 'R-134a',
    chargeKg: 0.2,
    boxF: 36,
    intervalDays: 180,
    installedOn: '2012-08-20',
    condition: 3,
    make: 'Corvane',
    model: 'CR-1B',
    serial: 'CV-12-33190',
    volts: 115,
    rla: 2.6,
    designHighPsig: 300,
  }),
  walkIn({
    ...COMMISSARY,
    key: 'com-f1',
    label: 'Freezer 1',
    name: 'Freezer 1',
    area: 'Walk-in freezer 1',
    machineArea: 'Mechanical room',
    refrigerant: 'R-448A',
    chargeLb: 26,
    boxF: -10,
    intervalDays: 90,
    installedOn: '2011-09-14',
    cuCondition: 4,
    evapCondition: 4,
    cu: { make: 'Brenvale', model: 'BCU-500L', serial: 'BV-11-40933', volts: 208, phase: '3', rla: 12.2, lra: 78, mca: 17.3, mop: 25, designHighPsig: 450, designLowPsig: 250, compressor: 'reciprocating' },
    evaporators: [
      { name: 'Freezer 1 evaporator A', valveName: 'Freezer 1 expansion valve A', model: 'FW-3F60', serial: 'FW-11-52210', fans: 3 },
      { name: 'Freezer 1 evaporator B', valveName: 'Freezer 1 expansion valve B', model: 'FW-3F60', serial: 'FW-11-52211', fans: 3 },
    ],
    defrost: 'electric',
    serialBase: 'COM-F1',
    componentsInstalledOn: '2020-02-18',
    profile: indoor(freezer),
  }),
  walkIn({
    ...COMMISSARY,
    key: 'com-f2',
    label: 'Freezer 2',
    name: 'Freezer 2',
    area: 'Walk-in freezer 2',
    machineArea: 'Mechanical room',
    refrigerant: 'R-404A',
    chargeLb: 22,
    boxF: -5,
    intervalDays: 90,
    installedOn: '2005-10-04',
    cuCondition: 3,
    evapCondition: 3,
    cu: { make: 'Kelvrin', model: 'KCU-330L', serial: 'KV-05-11873', volts: 208, phase: '3', rla: 13.6, lra: 88, mca: 19.0, mop: 30, designHighPsig: 450, designLowPsig: 250, compressor: 'reciprocating' },
    evaporators: [{ name: 'Freezer 2 evaporator', model: 'FW-3F60', serial: 'FW-05-40418', fans: 3 }],
    defrost: 'electric',
    serialBase: 'COM-F2',
    componentsInstalledOn: '2015-08-25',
    profile: indoor(freezer),
  }),
  walkIn({
    ...COMMISSARY,
    key: 'com-prep',
    label: 'Prep cooler',
    name: 'Prep cooler',
    area: 'Prep cooler',
    machineArea: 'Mechanical room',
    refrigerant: 'R-448A',
    chargeLb: 12,
    boxF: 35,
    intervalDays: 90,
    installedOn: '2019-04-30',
    cuCondition: 5,
    evapCondition: 5,
    cu: { make: 'Brenvale', model: 'BCU-180M', serial: 'BV-19-77105', volts: 208, phase: '3', rla: 7.8, lra: 46, mca: 11.2, mop: 15, designHighPsig: 450, designLowPsig: 250, compressor: 'scroll' },
    evaporators: [{ name: 'Prep cooler evaporator', model: 'FW-2C40', serial: 'FW-19-90312', fans: 2 }],
    defrost: 'off_cycle',
    serialBase: 'COM-P',
    profile: indoor(cooler),
  }),
  walkIn({
    ...LINDEN,
    key: 'linden-dairy',
    label: 'Dairy line',
    name: 'Dairy case line',
    area: 'Dairy display cases',
    machineArea: 'Roof',
    refrigerant: 'R-448A',
    chargeLb: 38,
    boxF: 34,
    intervalDays: 60,
    installedOn: '2016-07-19',
    cuCondition: 4,
    evapCondition: 4,
    cu: { make: 'Kelvrin', model: 'KCU-610M', serial: 'KV-16-50391', volts: 230, phase: '3', rla: 18.6, lra: 118, mca: 25.6, mop: 40, designHighPsig: 450, designLowPsig: 250, compressor: 'scroll', chargeLb: 12 },
    evaporators: [
      { name: 'Dairy case 1 coil', valveName: 'Dairy case 1 expansion valve', make: 'Aldercoil', model: 'AC-8M', serial: 'AC-16-7001', fans: 2 },
      { name: 'Dairy case 2 coil', valveName: 'Dairy case 2 expansion valve', make: 'Aldercoil', model: 'AC-8M', serial: 'AC-16-7002', fans: 2 },
      { name: 'Dairy case 3 coil', valveName: 'Dairy case 3 expansion valve', make: 'Aldercoil', model: 'AC-8M', serial: 'AC-16-7003', fans: 2 },
    ],
    defrost: 'off_cycle',
    serialBase: 'LAM-D',
    profile: { ...cooler, liftK: 13 },
    notes: 'Three open dairy cases on one circuit; case 2 sits by the entrance doors.',
  }),
  walkIn({
    ...LINDEN,
    key: 'linden-meat',
    label: 'Meat cooler',
    name: 'Meat cooler',
    area: 'Meat cooler',
    machineArea: 'Roof',
    refrigerant: 'R-448A',
    chargeLb: 16,
    boxF: 33,
    intervalDays: 90,
    installedOn: '2016-07-19',
    cuCondition: 4,
    evapCondition: 4,
    cu: { make: 'Kelvrin', model: 'KCU-215M', serial: 'KV-16-50377', volts: 230, phase: '3', rla: 9.4, lra: 58, mca: 13.5, mop: 20, designHighPsig: 450, designLowPsig: 250, compressor: 'scroll' },
    evaporators: [{ name: 'Meat cooler evaporator', model: 'FW-2C40', serial: 'FW-16-60871', fans: 2 }],
    defrost: 'off_cycle',
    serialBase: 'LAM-M',
    highCutOutPsig: 330,
    profile: cooler,
  }),
  walkIn({
    ...LINDEN,
    key: 'linden-frozen',
    label: 'Frozen storage',
    name: 'Frozen storage',
    area: 'Frozen storage',
    machineArea: 'Roof',
    refrigerant: 'R-404A',
    chargeLb: 24,
    boxF: -10,
    intervalDays: 90,
    installedOn: '2003-11-05',
    cuCondition: 3,
    evapCondition: 3,
    cu: { make: 'Brenvale', model: 'BCU-500L', serial: 'BV-03-10244', volts: 230, phase: '3', rla: 12.8, lra: 82, mca: 18.0, mop: 30, designHighPsig: 450, designLowPsig: 250, compressor: 'reciprocating' },
    evaporators: [{ name: 'Frozen storage evaporator', model: 'FW-3F60', serial: 'FW-03-22950', fans: 3 }],
    defrost: 'electric',
    serialBase: 'LAM-F',
    componentsInstalledOn: '2018-06-12',
    profile: freezer,
  }),
  walkIn({
    ...QUARRY,
    key: 'quarry-produce',
    label: 'Produce cooler',
    name: 'Produce cooler',
    area: 'Produce cooler',
    machineArea: 'Machine room',
    refrigerant: 'R-448A',
    chargeLb: 10,
    boxF: 36,
    intervalDays: 120,
    installedOn: '2020-05-14',
    cuCondition: 5,
    evapCondition: 5,
    cu: { make: 'Brenvale', model: 'BCU-180M', serial: 'BV-20-81402', volts: 230, phase: '3', rla: 7.8, lra: 46, mca: 11.2, mop: 15, designHighPsig: 450, designLowPsig: 250, compressor: 'scroll' },
    evaporators: [{ name: 'Produce cooler evaporator', model: 'FW-2C40', serial: 'FW-20-11563', fans: 2 }],
    defrost: 'off_cycle',
    serialBase: 'QRM-P',
    profile: indoor(cooler),
  }),
  walkIn({
    ...QUARRY,
    key: 'quarry-frozen',
    label: 'Frozen aisle',
    name: 'Frozen aisle cases',
    area: 'Frozen aisle',
    machineArea: 'Machine room',
    refrigerant: 'R-407A',
    chargeLb: 30,
    boxF: -8,
    intervalDays: 120,
    installedOn: '2009-01-20',
    cuCondition: 4,
    evapCondition: 4,
    cu: { make: 'Kelvrin', model: 'KCU-610L', serial: 'KV-09-30518', volts: 230, phase: '3', rla: 17.9, lra: 112, mca: 24.8, mop: 40, designHighPsig: 450, designLowPsig: 250, compressor: 'reciprocating' },
    evaporators: [
      { name: 'Frozen aisle case 1 coil', valveName: 'Frozen aisle case 1 expansion valve', make: 'Aldercoil', model: 'AC-12L', serial: 'AC-09-4410', fans: 3 },
      { name: 'Frozen aisle case 2 coil', valveName: 'Frozen aisle case 2 expansion valve', make: 'Aldercoil', model: 'AC-12L', serial: 'AC-09-4411', fans: 3 },
    ],
    defrost: 'electric',
    serialBase: 'QRM-F',
    componentsInstalledOn: '2019-02-11',
    profile: indoor(freezer),
  }),
];
