import { describe, expect, it } from 'vitest';
import { formatBytes, formatChartPressure, formatFixed, formatLeakRate, formatPercent } from '@/lib/format/numbers';

describe('plain numbers', () => {
  it('keeps a fixed span of decimals and never shows a negative zero', () => {
    expect(formatFixed(-40, 1)).toBe('-40.0');
    expect(formatFixed(-0.04, 1)).toBe('0.0');
    expect(formatFixed(-0.0001, 2)).toBe('0.00');
    expect(formatFixed(1234.5678, 0, 2)).toBe('1,234.57');
    expect(formatFixed(2, 0, 2)).toBe('2');
  });

  it('gives chart pressures about 0.1 psi of resolution in every unit', () => {
    expect(formatChartPressure(72.449, 'psig')).toBe('72.4');
    expect(formatChartPressure(499.55, 'kPaG')).toBe('499.6');
    expect(formatChartPressure(4.99549, 'barG')).toBe('5.00');
    expect(formatChartPressure(1.234, 'bar')).toBe('1.23');
  });

  it('says percentages, leak rates and sizes with their units', () => {
    expect(formatPercent(2.25)).toMatch(/^2\.[23] %$/);
    expect(formatLeakRate(30)).toBe('30.0 % per year');
    expect(formatBytes(512)).toBe('512 B');
    expect(formatBytes(169 * 1024)).toBe('169 KB');
    expect(formatBytes(1.6 * 1024 * 1024)).toBe('1.6 MB');
  });
});
