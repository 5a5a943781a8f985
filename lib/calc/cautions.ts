// Cautions shown beside calculation results, in the API and on the pages. Pure data, safe on the
// client. The wording is our own; each caution names the public standard or rule behind it.
import type { Refrigerant, SafetyClass } from '@/lib/calc/refrigerants';

/** Every calculation result: the app is a reference, not the authority. */
export const REFERENCE_CAUTION =
  "For service reference; verify against the equipment's documentation; local codes and licensed practice govern.";

/** Readings and switch settings mean gauges on a live refrigerant circuit. */
export const CERTIFIED_WORK_CAUTION =
  'Only technicians certified for the equipment type may open refrigerant circuits, recover or charge (US: 40 CFR 82.161); never vent refrigerant.';

/** Electrical checks are measured on energised equipment (NFPA 70E; 29 CFR 1910.147). */
export const ENERGISED_WORK_CAUTION =
  'Voltage checks are made on energised equipment: measure live only when the task needs it, with the PPE and approach boundaries of NFPA 70E; for any other work, lock out, tag out and test before touch (29 CFR 1910.147).';

/** Pressure switches are safety controls. */
export const SAFETY_CONTROL_CAUTION =
  'Never leave a safety control jumpered or set outside the nameplate limits; a jumper is for momentary diagnosis with the technician present.';

/** Leak searching on flammable refrigerants (EPA SNAP Appendix Y citing UL 60335-2-89 and ASHRAE 15). */
export const FLAMMABLE_LEAK_SEARCH_CAUTION =
  'On A2L and A3 (flammable) refrigerants use a leak detector rated for that refrigerant, ventilate, and keep open flames and other ignition sources away: never use a flame-type leak detector.';

/** Standing pressure tests: common trade practice, not from a standard. */
export const PRESSURE_TEST_CAUTION =
  'Pressure-test with dry nitrogen through a regulator and relief valve, never oxygen or compressed air, and stay within the nameplate test pressures.';

/** ASHRAE 34 safety classes in words, so the class is never a bare code. */
export const SAFETY_CLASS_WORDS: Readonly<Record<SafetyClass, string>> = {
  A1: 'lower toxicity, no flame propagation',
  A2L: 'lower toxicity, mildly flammable',
  A3: 'lower toxicity, highly flammable',
  B2L: 'higher toxicity, mildly flammable',
};

/** Classes that need a handling caution wherever the refrigerant is shown. */
export function needsHandlingCaution(r: Refrigerant): boolean {
  return r.safetyClass !== 'A1' || r.id === 'R-744';
}

/** Handling cautions for one refrigerant: flammability, toxicity, or high pressure. */
export function refrigerantCautions(r: Refrigerant): string[] {
  const flammable =
    'use it only in equipment designed and listed for it, and follow UL 60335-2-89, ASHRAE 15 and the EPA SNAP use conditions: warning labels, spark-proof tools, ventilation and a leak detector rated for the refrigerant.';
  switch (r.safetyClass) {
    case 'A2L':
      return [`${r.id} is class A2L (mildly flammable): ${flammable}`];
    case 'A3':
      return [`${r.id} is class A3 (highly flammable): ${flammable} Observe the charge limits for the equipment.`];
    case 'B2L':
      return [`${r.id} is class B2L (toxic, mildly flammable): work on it needs specific training, PPE and ventilation.`];
    case 'A1':
      return r.id === 'R-744'
        ? [`${r.id} (CO2) runs at high pressure and trapped liquid can rupture lines: work on it needs specific training and PPE.`]
        : [];
  }
}

/** The usual list for a refrigerant-side result: handling cautions first, the reference caution last. */
export function refrigerantResultCautions(r: Refrigerant, ...extra: string[]): string[] {
  return [...refrigerantCautions(r), ...extra, REFERENCE_CAUTION];
}
