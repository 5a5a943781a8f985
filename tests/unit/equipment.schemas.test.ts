// Valid and invalid samples for every equipment type's schema (the one shared by form, API and CSV).
import { describe, expect, it } from 'vitest';
import { nameplateFields } from '@/lib/equipment/nameplate';
import { createEquipmentSchema, updateEquipmentSchema } from '@/lib/equipment/schemas';
import { EQUIPMENT_TYPES, type EquipmentType } from '@/lib/equipment/types';

const siteId = '8d3f0c52-6a43-4d0e-9d64-2f8b7c9f0e11';

// A plausible, invented nameplate per type (SI values: kPa gauge, °C, K, kg).
const validNameplates: Record<EquipmentType, Record<string, unknown>> = {
  condensing_unit: { voltage: 230, phase: '3', frequencyHz: '60', rlaA: 14.1, lraA: 91, mcaA: 19, mopA: 30, refrigerant: 'R-448A', factoryChargeKg: 4.5, designPressureHighKpa: 2861, designPressureLowKpa: 1034, compressorKind: 'scroll' },
  compressor: { voltage: 460, phase: '3', rlaA: 7.2, lraA: 52, refrigerant: 'R-404A', compressorKind: 'reciprocating' },
  evaporator: { fanCount: 3, fanMotorVolts: 115, fanMotorAmps: 0.8, defrostType: 'electric', heaterWatts: 1800, refrigerant: 'R-404A' },
  condenser: { fanCount: 2, fanMotorVolts: 230, fanMotorAmps: 1.6 },
  pressure_control: { controlKind: 'dual', rangeMinKpa: -50, rangeMaxKpa: 3000, differentialAdjustable: true, reset: 'manual', lowCutInKpa: 345, lowDifferentialKpa: 241, highCutOutKpa: 2586, highDifferentialKpa: 689 },
  thermostat: { rangeMinC: -30, rangeMaxC: 20, setpointC: 2, differentialK: 2, contacts: 'close_on_rise', controlVoltage: 24 },
  solenoid_valve: { coilVoltage: 24, connectionSize: '3/8 in ODF', normally: 'closed', line: 'liquid' },
  expansion_valve: { valveKind: 'thermostatic', capacityKw: 3.5, equalizer: 'external', refrigerant: 'R-404A' },
  defrost_control: { controlKind: 'time_clock', defrostsPerDay: 4, failSafeMinutes: 45, terminationC: 12 },
  contactor: { coilVoltage: 24, poles: 3, fullLoadAmps: 30 },
  fan_motor: { voltage: 115, amps: 1.1, horsepower: 0.25, rpm: 1550, motorKind: 'ecm' },
  other: { description: 'Door heater wire' },
};

// One wrong value per type, and the field it must be reported on.
const invalidNameplates: Record<EquipmentType, [Record<string, unknown>, string]> = {
  condensing_unit: [{ phase: '2' }, 'nameplate.phase'],
  compressor: [{ compressorKind: 'piston-ish' }, 'nameplate.compressorKind'],
  evaporator: [{ defrostType: 'hair dryer' }, 'nameplate.defrostType'],
  condenser: [{ fanCount: 2.5 }, 'nameplate.fanCount'],
  pressure_control: [{ controlKind: 'triple' }, 'nameplate.controlKind'],
  thermostat: [{ setpointC: 400 }, 'nameplate.setpointC'],
  solenoid_valve: [{ coilVoltage: 5 }, 'nameplate.coilVoltage'],
  expansion_valve: [{ capacityKw: -1 }, 'nameplate.capacityKw'],
  defrost_control: [{ defrostsPerDay: 30 }, 'nameplate.defrostsPerDay'],
  contactor: [{ poles: 9 }, 'nameplate.poles'],
  fan_motor: [{ rpm: 'fast' }, 'nameplate.rpm'],
  other: [{ description: 'x'.repeat(501) }, 'nameplate.description'],
};

describe('equipment schema, per type', () => {
  for (const type of EQUIPMENT_TYPES) {
    it(`${type}: a complete nameplate is accepted as given`, () => {
      const r = createEquipmentSchema.safeParse({ siteId, type, name: `Test ${type}`, nameplate: validNameplates[type] });
      expect(r.success, JSON.stringify(r.error?.issues)).toBe(true);
      expect(r.data?.nameplate).toEqual(validNameplates[type]);
    });

    it(`${type}: every field the form shows is covered by the sample`, () => {
      expect(Object.keys(validNameplates[type]).sort()).toEqual(nameplateFields[type].map((f) => f.key).sort());
    });

    it(`${type}: a wrong value is reported on its field`, () => {
      const [nameplate, path] = invalidNameplates[type];
      const r = createEquipmentSchema.safeParse({ siteId, type, name: 'X', nameplate });
      expect(r.success).toBe(false);
      expect(r.error!.issues.map((i) => i.path.join('.'))).toContain(path);
    });

    it(`${type}: a field of another type is refused`, () => {
      const foreign = type === 'other' ? { voltage: 230 } : { description: 'not here' };
      const r = createEquipmentSchema.safeParse({ siteId, type, name: 'X', nameplate: foreign });
      expect(r.success).toBe(false);
    });
  }

  it('an unknown type is refused with a plain message', () => {
    const r = createEquipmentSchema.safeParse({ siteId, type: 'ice_machine', name: 'X' });
    expect(r.success).toBe(false);
    expect(r.error!.issues[0]!.message).toBe('Choose an equipment type from the list.');
  });

  it('common fields: name required, condition 1–5, real dates in order and not in the future', () => {
    const bad = createEquipmentSchema.safeParse({
      siteId,
      type: 'contactor',
      name: ' ',
      condition: 6,
      manufacturedOn: '2023-02-30',
      installedOn: '2999-01-01',
    });
    expect(bad.success).toBe(false);
    const byPath = Object.fromEntries(bad.error!.issues.map((i) => [i.path.join('.'), i.message]));
    expect(byPath.name).toBe('Name is required.');
    expect(byPath.condition).toBe('Rate the condition from 1 (failing) to 5 (like new).');
    expect(byPath.manufacturedOn).toBe('This date does not exist.');
    const order = createEquipmentSchema.safeParse({ siteId, type: 'contactor', name: 'C', manufacturedOn: '2020-05-01', installedOn: '2019-01-01' });
    expect(order.error!.issues.map((i) => i.message)).toContain('The install date is before the manufacture date.');
    const future = createEquipmentSchema.safeParse({ siteId, type: 'contactor', name: 'C', installedOn: '2999-01-01' });
    expect(future.error!.issues.map((i) => i.message)).toContain('The install date is in the future.');
  });

  it('updates accept partial input and still check dates', () => {
    expect(updateEquipmentSchema.safeParse({ condition: 3 }).success).toBe(true);
    expect(updateEquipmentSchema.safeParse({ manufacturedOn: '2021-01-01', installedOn: '2020-01-01' }).success).toBe(false);
  });
});
