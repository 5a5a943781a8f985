import { expect, test, type Locator, type Page } from '@playwright/test';
import { saturationRows } from '../helpers/reference-data';
import { shot, signIn } from './helpers';

const KPA_PER_PSI = 6.894757293168361; // NIST SP 811 (TRADE-REFERENCE §2)

/** CoolProp 8.0.0 reference row (tests/fixtures/reference/saturation.csv), Lemmon 2003 model for R-404A. */
function coolProp(tC: number): { bubbleKpa: number; dewKpa: number } {
  const row = saturationRows().find((r) => r.id === 'R-404A' && r.model === 'pseudo-pure' && r.tC === tC);
  if (!row) throw new Error(`no reference row at ${tC} °C`);
  return row;
}

const numberIn = async (l: Locator): Promise<number> => Number.parseFloat((await l.innerText()).replace(/,/g, ''));

function chartRow(page: Page, temperature: string): Locator {
  return page.locator('tbody tr').filter({ has: page.getByRole('rowheader', { name: temperature, exact: true }) });
}

test('a technician reads R-404A from the P-T chart and uses the converter @phone', async ({ page }, info) => {
  await signIn(page, 'tech@rimeline.test');
  const nav = page.getByRole('navigation', { name: 'Main' });
  // On a phone the less-used places sit behind "More".
  const more = nav.getByRole('button', { name: 'More' });
  if (await more.isVisible()) await more.click();
  await nav.getByRole('link', { name: 'P-T chart' }).click();
  await expect(page.getByRole('heading', { name: 'Pressure–temperature chart', level: 1 })).toBeVisible();

  // A flammable refrigerant shows its class in words with a handling caution.
  const refrigerant = page.getByLabel('Refrigerant (ASHRAE designation)');
  await refrigerant.selectOption('R-32');
  await expect(page.getByText('Safety class A2L')).toBeVisible();
  await expect(page.getByText(/R-32 is class A2L \(mildly flammable\)/)).toBeVisible();
  await expect(page.getByRole('columnheader', { name: /Pressure \(psig\)/ })).toBeVisible();

  await refrigerant.selectOption('R-404A');
  await expect(page).toHaveURL(/refrigerant=R-404A/);
  await expect(page.getByRole('columnheader', { name: /Bubble/ })).toBeVisible();
  await expect(page.getByRole('columnheader', { name: /Dew/ })).toBeVisible();

  // The technician's preference is imperial: °F and psig. 50 °F = 10 °C.
  const ref10 = coolProp(10);
  const row50 = chartRow(page, '50');
  const bubble50 = await numberIn(row50.getByRole('cell').nth(0));
  const dew50 = await numberIn(row50.getByRole('cell').nth(1));
  // ±0.3 % in absolute pressure (TRADE-REFERENCE suggested tolerance) ≈ 0.36 psi here, plus display rounding.
  expect(Math.abs(bubble50 - (ref10.bubbleKpa - 101.325) / KPA_PER_PSI)).toBeLessThan(0.4);
  expect(Math.abs(dew50 - (ref10.dewKpa - 101.325) / KPA_PER_PSI)).toBeLessThan(0.4);

  // Switch the page to °C and kPa absolute; the range resets to the metric defaults.
  await page.getByLabel('°C', { exact: true }).check();
  await page.getByLabel('Pressure unit').selectOption('kPaAbs');
  const ref20 = coolProp(-20);
  const row20 = chartRow(page, '-20');
  expect(Math.abs((await numberIn(row20.getByRole('cell').nth(0))) - ref20.bubbleKpa) / ref20.bubbleKpa).toBeLessThan(0.003);
  expect(Math.abs((await numberIn(row20.getByRole('cell').nth(1))) - ref20.dewKpa) / ref20.dewKpa).toBeLessThan(0.003);

  // Converter, both ways.
  const toPressure = page.getByRole('region', { name: 'Temperature to pressure' });
  await page.getByLabel('Temperature (°C)', { exact: true }).fill('-20');
  await expect(toPressure.getByRole('definition')).toHaveCount(2);
  expect(Math.abs((await numberIn(toPressure.getByRole('definition').nth(0))) - ref20.bubbleKpa) / ref20.bubbleKpa).toBeLessThan(0.003);
  expect(Math.abs((await numberIn(toPressure.getByRole('definition').nth(1))) - ref20.dewKpa) / ref20.dewKpa).toBeLessThan(0.003);

  const toTemperature = page.getByRole('region', { name: 'Pressure to temperature' });
  await page.getByLabel('Pressure (kPa abs)', { exact: true }).fill(String(ref20.bubbleKpa));
  await expect(toTemperature.getByRole('definition')).toHaveCount(3);
  expect(Math.abs((await numberIn(toTemperature.getByRole('definition').nth(0))) + 20)).toBeLessThanOrEqual(0.1);
  await expect(toTemperature.getByText('Glide')).toBeVisible();

  // Out of range is said in words, in the user's units.
  await page.getByLabel('Temperature (°C)', { exact: true }).fill('90');
  await expect(toPressure.getByText(/above its pseudo-critical temperature 72\.1 °C/)).toBeVisible();
  await page.getByLabel('Temperature (°C)', { exact: true }).fill('-20');

  // A unit switch converts what was typed: 307.103 kPa abs is 29.846 psig at sea level (TRADE-REFERENCE §2).
  await page.getByLabel('Pressure unit').selectOption('psig');
  await expect(page.getByLabel('Pressure (psig)', { exact: true })).toHaveValue('29.846');
  expect(Math.abs((await numberIn(toTemperature.getByRole('definition').nth(0))) + 20)).toBeLessThanOrEqual(0.1);

  // Gauge pressure against a site's elevation.
  const seaLevel = await numberIn(chartRow(page, '-20').getByRole('cell').nth(0));
  await page.getByLabel('Elevation (ft)').fill('5280');
  await expect(page.locator('#pt-barometer')).toContainText('5,280 ft');
  expect(await numberIn(chartRow(page, '-20').getByRole('cell').nth(0))).toBeGreaterThan(seaLevel + 2);
  // The converter names the barometer and offers what a sea-level pocket chart reads (issue 14).
  await expect(page.getByText(/corrected for the site’s elevation/)).toBeVisible();
  const local = await numberIn(toTemperature.getByRole('definition').nth(1));
  const seaDew = await numberIn(toTemperature.getByText('Sea-level chart (dew)').locator('xpath=following-sibling::dd'));
  expect(seaDew).toBeGreaterThan(local + 1);
  await expect(page.getByText(/CoolProp 8\.0\.0 reference equation-of-state data/)).toBeVisible();
  await expect(page.getByText("local codes and licensed practice govern")).toBeVisible();

  // Back to °F: −20 °C typed in the converter becomes −4 °F.
  await page.getByLabel('°F', { exact: true }).check();
  await expect(page.getByLabel('Temperature (°F)', { exact: true })).toHaveValue('-4');

  await page.evaluate(() => window.scrollTo(0, 0));
  await shot(page, `pt-chart-${info.project.name}`);
});

test('R-407C: the chart stops at 50 °C (122 °F), where its fitted curve stops being checked, and says so @phone', async ({ page }) => {
  await signIn(page, 'tech@rimeline.test');
  await page.goto('/tools/pt-chart?refrigerant=R-407C');
  await expect(page.getByText(/The chart stops at 50 °C \(122 °F\)/)).toBeVisible();
  await page.getByLabel('To (°F)', { exact: true }).fill('190');
  await expect(chartRow(page, '120')).toHaveCount(1);
  await expect(chartRow(page, '125')).toHaveCount(0);
  await expect(page.getByText(/Rows outside R-407C’s chart range/)).toBeVisible();
});
