import { readFileSync } from 'node:fs';
import path from 'node:path';

import { describe, expect, it } from 'vitest';

import { fitAll, renderCoefficients, solveLeastSquares } from '@/docker-free-scripts/fit-saturation';
import { readFixture } from '@/tests/helpers/reference-data';

describe('docker-free-scripts/fit-saturation.ts', () => {
  it('the committed lib/calc/saturation-coefficients.ts is exactly what the script fits from the fixtures', () => {
    const fits = fitAll(readFixture('saturation.csv'), readFixture('fluids.csv'));
    const committed = readFileSync(path.resolve(import.meta.dirname, '../../lib/calc/saturation-coefficients.ts'), 'utf8');
    expect(renderCoefficients(fits)).toBe(committed);
    expect(fits).toHaveLength(16);
  });

  it('least-squares solver recovers known coefficients (exact data) and the mean (noisy constant)', () => {
    const xs = [0.1, 0.2, 0.35, 0.5, 0.7, 0.9];
    const a = xs.map((x) => [x, x ** 1.5, x ** 2.5, x ** 5]);
    const truth = [-7.5, 1.6, -2.1, -3.3];
    const b = a.map((row) => row.reduce((s, v, i) => s + v * (truth[i] ?? 0), 0));
    solveLeastSquares(a, b).forEach((c, i) => expect(c).toBeCloseTo(truth[i] ?? NaN, 8));
    expect(solveLeastSquares([[1], [1], [1], [1]], [1, 2, 3, 6])[0]).toBeCloseTo(3, 12);
  });
});
