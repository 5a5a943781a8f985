// Barometric pressure from elevation, for gauge ↔ absolute conversion at a site.
import { CalcRangeError, fmt, requireFinite } from '@/lib/calc/errors';
import { STANDARD_ATMOSPHERE_KPA } from '@/lib/calc/units';

/** The troposphere formula holds up to the tropopause (11 km); below −500 m nobody services walk-ins. */
export const MIN_ELEVATION_M = -500;
export const MAX_ELEVATION_M = 11_000;

/**
 * Standard-atmosphere pressure at an elevation above mean sea level, in kPa absolute.
 * Basis: ICAO / ISO 2533 standard atmosphere, troposphere:
 * p = 101.325 · (1 − 2.25577e-5 · h)^5.25588, h in metres.
 * Real barometers vary a few kPa with the weather; this is the default, not a measurement.
 */
export function barometricPressureKpa(elevationM: number): number {
  requireFinite(elevationM, 'elevation');
  if (elevationM < MIN_ELEVATION_M || elevationM > MAX_ELEVATION_M) {
    throw new CalcRangeError(
      `elevation ${fmt(elevationM, 0)} m is outside the standard-atmosphere range covered (${MIN_ELEVATION_M} to ${MAX_ELEVATION_M} m)`,
      'elevationM',
    );
  }
  return STANDARD_ATMOSPHERE_KPA * Math.pow(1 - 2.25577e-5 * elevationM, 5.25588);
}

/** Barometric pressure to use: an explicit reading wins, then elevation, then the standard atmosphere. */
export function resolveBarometricKpa(options: { barometricKpa?: number | undefined; elevationM?: number | undefined } = {}): number {
  if (options.barometricKpa !== undefined) {
    requireFinite(options.barometricKpa, 'barometric pressure');
    if (options.barometricKpa < 20 || options.barometricKpa > 110) {
      throw new CalcRangeError(
        `barometric pressure ${fmt(options.barometricKpa, 2)} kPa is outside the plausible range 20–110 kPa`,
        'barometricKpa',
      );
    }
    return options.barometricKpa;
  }
  if (options.elevationM !== undefined) return barometricPressureKpa(options.elevationM);
  return STANDARD_ATMOSPHERE_KPA;
}
