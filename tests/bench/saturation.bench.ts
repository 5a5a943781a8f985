// Saturation look-ups per second, temperature → pressure and pressure → temperature.
// Run: node_modules/.bin/tsx tests/bench/saturation.bench.ts
// Prints one tab-separated BENCH row per measurement for the bench runner:
//   BENCH <name> <measured> <baseline> <ratio> <goal>
// Baseline: a bare Math.log + Math.exp loop over the same inputs, so the ratio reads
// "how many times the cost of the two transcendental calls a look-up cannot avoid".
import { performance } from 'node:perf_hooks';

import { REFRIGERANTS } from '@/lib/calc/refrigerants';
import {
  saturationPressureKpa,
  saturationRange,
  saturationTemperatureC,
  type SaturationCurve,
} from '@/lib/calc/saturation';

const N = 4096;
const WARMUP_MS = 500;
const MEASURE_MS = 1500;
const GOAL = '>1,000,000/s';

// A spread over every refrigerant, both curves and each one's whole range.
const refs = REFRIGERANTS.map((r) => r);
const refIdx = new Uint8Array(N);
const curves: SaturationCurve[] = [];
const temps = new Float64Array(N);
const pressures = new Float64Array(N);
const ids: string[] = [];
let seed = 12345;
const random = (): number => {
  seed = (seed * 1103515245 + 12345) >>> 0;
  return seed / 4294967296;
};
for (let i = 0; i < N; i++) {
  const k = i % refs.length;
  const r = refs[k];
  if (!r) throw new Error('no refrigerant');
  const { minC, maxC } = saturationRange(r);
  const curve: SaturationCurve = i % 2 === 0 ? 'bubble' : 'dew';
  refIdx[i] = k;
  curves.push(curve);
  ids.push(r.id);
  temps[i] = minC + (maxC - minC) * random();
  pressures[i] = saturationPressureKpa(r, temps[i] ?? 0, curve);
}

let sink = 0;

function measure(run: () => number): number {
  const warmEnd = performance.now() + WARMUP_MS;
  while (performance.now() < warmEnd) sink += run();
  let ops = 0;
  const start = performance.now();
  let elapsed = 0;
  while (elapsed < MEASURE_MS) {
    sink += run();
    ops += N;
    elapsed = performance.now() - start;
  }
  return ops / (elapsed / 1000);
}

function tToP(): number {
  let s = 0;
  for (let i = 0; i < N; i++) s += saturationPressureKpa(refs[refIdx[i] ?? 0] ?? 'R-22', temps[i] ?? 0, curves[i] ?? 'dew');
  return s;
}

function pToT(): number {
  let s = 0;
  for (let i = 0; i < N; i++) s += saturationTemperatureC(refs[refIdx[i] ?? 0] ?? 'R-22', pressures[i] ?? 0, curves[i] ?? 'dew');
  return s;
}

function tToPById(): number {
  let s = 0;
  for (let i = 0; i < N; i++) s += saturationPressureKpa(ids[i] ?? 'R-22', temps[i] ?? 0, curves[i] ?? 'dew');
  return s;
}

function pToTById(): number {
  let s = 0;
  for (let i = 0; i < N; i++) s += saturationTemperatureC(ids[i] ?? 'R-22', pressures[i] ?? 0, curves[i] ?? 'dew');
  return s;
}

function bareMath(): number {
  let s = 0;
  for (let i = 0; i < N; i++) s += Math.exp(Math.log(pressures[i] ?? 1) * 0.5);
  return s;
}

const fmtRate = (r: number): string => `${Math.round(r).toLocaleString('en-US')}/s`;

const baseline = measure(bareMath);
const rows: [string, () => number][] = [
  ['saturation T→P (Refrigerant object)', tToP],
  ['saturation P→T (Refrigerant object)', pToT],
  ['saturation T→P (id string)', tToPById],
  ['saturation P→T (id string)', pToTById],
];
for (const [name, fn] of rows) {
  const rate = measure(fn);
  console.log(
    ['BENCH', name, fmtRate(rate), `Math.log+Math.exp loop ${fmtRate(baseline)}`, `${(baseline / rate).toFixed(1)}x`, GOAL].join('\t'),
  );
}
if (!Number.isFinite(sink)) throw new Error('non-finite result');
