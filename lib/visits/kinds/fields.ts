import { z } from 'zod';

// Entry values are SI: kPa gauge, °C, K, V, A. Ranges cover every plausible field value (deep
// vacuum to CO2 high side; −70 °C freezers to 150 °C discharge lines) and refuse typos beyond them.
export const kpaG = (label: string) =>
  z.number({ message: `${label} must be a number.` }).min(-101, `${label} is below a full vacuum.`).max(14_000, `${label} is above any system's pressure.`);
export const kpaDiff = (label: string) => z.number({ message: `${label} must be a number.` }).min(0, `${label} cannot be negative.`).max(7000, `${label} is above 7000 kPa.`);
export const tempC = (label: string) => z.number({ message: `${label} must be a number.` }).min(-70, `${label} is below −70 °C.`).max(150, `${label} is above 150 °C.`);
export const tempDiffK = (label: string) => z.number({ message: `${label} must be a number.` }).min(0, `${label} cannot be negative.`).max(30, `${label} is above 30 K.`);
export const volts = (label: string) => z.number({ message: `${label} must be a number.` }).min(0, `${label} cannot be negative.`).max(1000, `${label} is above 1000 V.`);
export const amps = (label: string) => z.number({ message: `${label} must be a number.` }).min(0, `${label} cannot be negative.`).max(2000, `${label} is above 2000 A.`);
