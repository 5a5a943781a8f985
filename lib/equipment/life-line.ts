import { serviceLifeOutlook, type EquipmentType } from '@/lib/calc/service-life';

/**
 * One line on a unit's age against its expected service life (the ASHRAE median, see
 * lib/calc/service-life.ts), for lists an owner scans: whole years, plain words.
 */
export function lifeLine(unit: { type: string; installedOn: string | null }, today: Date): string {
  if (!unit.installedOn) return 'Install date not recorded';
  let outlook;
  try {
    outlook = serviceLifeOutlook({ equipmentType: unit.type as EquipmentType, installedOn: unit.installedOn, asOf: today.toISOString().slice(0, 10) });
  } catch {
    return `Installed ${unit.installedOn}`;
  }
  const age = Math.floor(outlook.ageYears);
  const ageText = age < 1 ? 'under a year old' : `${age} ${age === 1 ? 'year' : 'years'} old`;
  if (outlook.remainingYears === null || outlook.medianYears === null) return `${ageText}; no published service life for this type`;
  const left = Math.round(outlook.remainingYears);
  const years = (n: number) => `${n} ${n === 1 ? 'year' : 'years'}`;
  if (left > 0) return `${ageText}; about ${years(left)} of expected life left (of ${outlook.medianYears})`;
  if (left === 0) return `${ageText}; at its expected life of ${outlook.medianYears} years`;
  return `${ageText}; ${years(-left)} past its expected life of ${outlook.medianYears} years`;
}
