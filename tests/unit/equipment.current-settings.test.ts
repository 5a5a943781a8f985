import { describe, expect, it } from 'vitest';
import { currentSettings } from '@/lib/equipment/current-settings';

// 1 psi = 6.894757 kPa (NIST SP 811, appendix B.8); °F = °C × 9/5 + 32, a kelvin step is 1.8 °F
// (NIST SP 811, B.8). Low side cut-out = cut-in − differential, high side cut-in = cut-out −
// differential (common practice; the same relation as lib/calc/pressure-controls).
const PSI = 6.894757;
const imperial = { units: 'imperial', metricPressure: 'kPa' } as const;
const metric = { units: 'metric', metricPressure: 'bar' } as const;

describe('currentSettings', () => {
  it('reads a dual pressure control in psig, deriving the other end of each side', () => {
    const lines = currentSettings('pressure_control', { lowCutInKpa: 20 * PSI, lowDifferentialKpa: 15 * PSI, highCutOutKpa: 400 * PSI, highDifferentialKpa: 100 * PSI }, imperial);
    expect(lines).toEqual([
      { side: 'Low side', values: [{ label: 'cut-in', text: '20 psig' }, { label: 'cut-out', text: '5 psig' }, { label: 'differential', text: '15 psi' }] },
      { side: 'High side', values: [{ label: 'cut-out', text: '400 psig' }, { label: 'cut-in', text: '300 psig' }, { label: 'differential', text: '100 psi' }] },
    ]);
  });

  it('rounds stored conversion noise to the unit’s usual precision', () => {
    // 21.0015 psig stored as kPa reads back as 21 psig, never as a raw float.
    const [low] = currentSettings('pressure_control', { lowCutInKpa: 21.0015 * PSI }, imperial);
    expect(low!.values).toEqual([{ label: 'cut-in', text: '21 psig' }]);
  });

  it('shows bar when the user prefers it', () => {
    const [low] = currentSettings('pressure_control', { lowCutInKpa: 150, lowDifferentialKpa: 100 }, metric);
    expect(low!.values.map((v) => v.text)).toEqual(['1.5 barg', '0.5 barg', '1 bar']);
  });

  it('reads a thermostat setpoint and differential in °F', () => {
    expect(currentSettings('thermostat', { setpointC: -20, differentialK: 2 }, imperial)).toEqual([
      { side: 'Thermostat', values: [{ label: 'setpoint', text: '-4 °F' }, { label: 'differential', text: '3.6 °F' }] },
    ]);
  });

  it('says nothing for units without settings or without recorded values', () => {
    expect(currentSettings('condensing_unit', { voltage: 208 }, imperial)).toEqual([]);
    expect(currentSettings('pressure_control', { controlKind: 'low' }, imperial)).toEqual([]);
  });
});
