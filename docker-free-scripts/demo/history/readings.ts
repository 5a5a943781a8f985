// Gauge and thermometer readings for the demo visits, made the way a technician takes them:
// the system runs at an evaporating and a condensing temperature set by its box and the air on
// its condenser, and the gauges show the refrigerant's saturation pressures at those temperatures
// (dew on the suction side, bubble on the liquid side) at the site's barometric pressure, read to
// the nearest psi and °F. What the app then computes from them (superheat, subcooling, TD) comes
// back close to the operating point chosen here.
import { barometricPressureKpa } from '@/lib/calc/atmosphere';
import { bubblePressureKpa, dewPressureKpa } from '@/lib/calc/saturation';
import { KPA_PER_PSI } from '@/lib/calc/units';
import type { ReadingData } from '@/lib/visits/schemas';
import type { SystemSpec } from '@/docker-free-scripts/demo/history/plant';

/** A small seeded generator (mulberry32), so the demo's scatter is the same on every load. */
export function seededRandom(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4_294_967_296;
  };
}

/** How a visit's operating point differs from the system's healthy one. */
export interface Deviation {
  /** Box warmer than design, K. */
  boxK?: number;
  superheatK?: number;
  subcoolK?: number;
  /** Extra condensing lift (dirty coil, failed fan), K. */
  liftK?: number;
  /** Compressor current as a share of RLA. */
  loadFraction?: number;
}

interface Climate {
  meanC: number;
  swingC: number;
}

/** Daytime air by season: cool high plains for the Colorado sites, the Gulf coast for the Texas ones. */
function outdoorAirC(elevationM: number, dayOfYear: number): number {
  const climate: Climate = elevationM > 1000 ? { meanC: 14, swingC: 12 } : { meanC: 24, swingC: 8 };
  // Warmest around 20 July (day 201).
  return climate.meanC + climate.swingC * Math.cos((2 * Math.PI * (dayOfYear - 201)) / 365);
}

const toWholePsig = (kpaG: number) => Math.round(kpaG / KPA_PER_PSI) * KPA_PER_PSI;
const toWholeF = (c: number) => (Math.round(c * 1.8 + 32) - 32) / 1.8;
const round = (v: number, digits: number) => Math.round(v * 10 ** digits) / 10 ** digits;

export function operatingReading(system: SystemSpec, elevationM: number, dayOfYear: number, random: () => number, deviation: Deviation = {}): ReadingData {
  const jitter = (spread: number) => (random() * 2 - 1) * spread;
  const p = system.profile;
  const outdoor = outdoorAirC(elevationM, dayOfYear) + jitter(2);
  const air = p.air === 'outdoor' ? outdoor : p.air === 'machine_room' ? 22 + 0.25 * (outdoor - 15) + jitter(1) : 26 + jitter(1);
  const boxC = system.designBoxTempC + (deviation.boxK ?? 0) + jitter(0.6);
  const evaporatingC = boxC - p.tdK + jitter(0.8);
  const condensingC = Math.max(air + p.liftK + (deviation.liftK ?? 0), p.minCondensingC + (deviation.liftK ?? 0)) + jitter(0.8);
  const superheatK = (deviation.superheatK ?? p.superheatK) + jitter(1);
  const subcoolK = Math.max(0.5, (deviation.subcoolK ?? p.subcoolK) + jitter(0.8));
  const baro = barometricPressureKpa(elevationM);
  const ref = system.refrigerant;
  const nominal = system.supply.volts;
  const volts = () => round(nominal * (1 + jitter(0.006)), 0);
  const data: ReadingData = {
    suctionKpaG: round(toWholePsig(dewPressureKpa(ref, evaporatingC) - baro), 2),
    dischargeKpaG: round(toWholePsig(bubblePressureKpa(ref, condensingC) - baro), 2),
    suctionLineC: round(toWholeF(evaporatingC + superheatK), 2),
    liquidLineC: round(toWholeF(condensingC - subcoolK), 2),
    boxC: round(toWholeF(boxC), 2),
    ambientC: round(toWholeF(air), 2),
    compressorAmps: round(system.rlaA * (deviation.loadFraction ?? p.loadFraction) * (1 + jitter(0.03)), 1),
  };
  if (system.supply.phase === '3') {
    data.voltsL1L2 = volts();
    data.voltsL2L3 = volts();
    data.voltsL1L3 = volts();
    data.controlVolts = round(24.2 + jitter(0.4), 1);
  } else {
    data.voltsL1L2 = volts();
  }
  return data;
}
