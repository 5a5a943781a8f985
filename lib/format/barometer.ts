import { barometricPressureKpa } from '@/lib/calc/atmosphere';
import { STANDARD_ATMOSPHERE_KPA } from '@/lib/calc/units';
import { formatElevation } from '@/lib/units/format';
import { formatAbsolutePressure, type UnitPrefs } from '@/lib/units/quantities';

// What a page says beside a saturation temperature worked from a gauge pressure: which barometer the
// gauge was read against (the ICAO/ISO 2533 standard atmosphere at the site's elevation), in the
// reader's pressure and length units, and whether a sea-level value is offered beside it.

export interface GaugeBasis {
  barometricKpa: number;
  /** True when the barometer differs from the sea-level standard, so a sea-level value is worth showing. */
  corrected: boolean;
  text: string;
}

export function gaugeBasis(elevationM: number, prefs: UnitPrefs): GaugeBasis {
  const barometricKpa = Number.isFinite(elevationM) ? barometricPressureKpa(elevationM) : STANDARD_ATMOSPHERE_KPA;
  const corrected = Math.abs(barometricKpa - STANDARD_ATMOSPHERE_KPA) > 0.05;
  const baro = formatAbsolutePressure(barometricKpa, prefs);
  const text = corrected
    ? `Saturation temperatures are corrected for the site’s elevation (${formatElevation(elevationM, prefs.units)}): gauge pressures are read against a barometer of ${baro}, the standard atmosphere at that elevation. The sea-level value, as a pocket P-T chart gives it, is shown beside each.`
    : `Gauge pressures are read against the sea-level barometer (${baro}, the standard atmosphere); the site is at ${formatElevation(elevationM, prefs.units)}.`;
  return { barometricKpa, corrected, text };
}
