import { expect, test, type Page } from '@playwright/test';
import { fillFields, shot, signIn } from './helpers';

// The equipment registry from the office's side: a new system at a demo site, its equipment with
// nameplate data in imperial units, relations read from both ends, and the table's serial search.
// Demo makes and models are invented.

async function pellStreetId(page: Page): Promise<string> {
  const res = await page.request.get('/api/sites?q=Pell%20Street');
  const body = (await res.json()) as { items: { id: string; name: string }[] };
  return body.items.find((s) => s.name === 'Pell Street Kitchen')!.id;
}

/** Opens the register form from the system page, picks the type, fills the rest, saves; returns the new id. */
async function register(page: Page, systemUrl: string, type: string, name: string, fill: (page: Page) => Promise<void>): Promise<string> {
  await page.goto(systemUrl);
  await page.getByRole('link', { name: 'Register equipment' }).click();
  await page.getByRole('radio', { name: type, exact: true }).check();
  await page.getByLabel('Name', { exact: true }).fill(name);
  await fill(page);
  await page.getByRole('button', { name: 'Register equipment' }).click();
  await expect(page.getByRole('heading', { level: 1, name })).toBeVisible();
  return page.url().split('/equipment/')[1]!;
}

async function relate(page: Page, fromId: string, way: 'controls' | 'serves', otherId: string): Promise<void> {
  await page.goto(`/equipment/${fromId}`);
  // The connection editor opens only when asked for.
  await page.getByText('Change connections').click();
  await page.getByLabel('This equipment').selectOption(`${way}:from`);
  const other = page.getByLabel('Other equipment on this site');
  await expect(other).toBeEnabled();
  await other.selectOption(otherId);
  await page.getByRole('button', { name: 'Add connection' }).click();
}

/** Edit and Delete sit in a disclosure below the history, so they are never tapped by accident. */
async function openMore(page: Page): Promise<void> {
  await page.getByText(/^More for this unit/).click();
}

function relation(page: Page, phrase: string, name: string) {
  return page.getByRole('list', { name: 'Connected equipment' }).getByRole('listitem').filter({ hasText: `${phrase}: ${name}` });
}

test('the office registers a system with related equipment and finds the unit by part of its serial', async ({ page }) => {
  test.setTimeout(180_000);
  const run = String(Date.now() % 1000).padStart(3, '0');
  const serial = `CU-7Q4-88${run}`;
  await signIn(page, 'office@rimeline.test');

  // Site → new system.
  await page.getByRole('link', { name: 'Sites', exact: true }).click();
  await page.getByRole('link', { name: /Pell Street Kitchen/ }).click();
  await page.getByRole('link', { name: 'New system' }).click();
  await page.getByLabel('System name').fill(`Walk-in cooler circuit ${run}`);
  await page.getByLabel('Refrigerant').selectOption('R-404A');
  await page.getByLabel('Application').selectOption('commercial_refrigeration');
  await page.getByLabel('Full charge (lb)').fill('14.5');
  await page.getByLabel('Design box temperature (°F)').fill('36');
  await page.getByLabel('Area it serves').selectOption({ label: 'Walk-in cooler' });
  await page.getByRole('button', { name: 'Create system' }).click();
  await expect(page.getByRole('heading', { name: `Walk-in cooler circuit ${run}` })).toBeVisible();
  await expect(page.getByText('14.5 lb')).toBeVisible();
  await expect(page.getByText('36 °F')).toBeVisible();
  const systemUrl = new URL(page.url()).pathname;

  const cu = await register(page, systemUrl, 'Condensing unit', 'Condensing unit', async (p) => {
    await p.getByLabel('Area', { exact: true }).selectOption({ label: 'Roof' });
    await p.getByLabel('Make').fill('Kelvrin');
    await p.getByLabel('Model').fill('KCU-300');
    await p.getByLabel('Serial number').fill(serial);
    await p.getByRole('radio', { name: /^4\s*Good$/ }).check();
    await p.getByLabel('Voltage (V)').fill('208');
    await p.getByLabel('Phase').selectOption('3');
    await p.getByLabel('RLA (rated load amps) (A)').fill('11.4');
    await p.getByLabel('Refrigerant').selectOption('R-404A');
  });
  await expect(page.getByText(serial)).toBeVisible();
  const evap1 = await register(page, systemUrl, 'Evaporator / unit cooler', 'Evaporator 1', async (p) => {
    await fillFields(p, { Make: 'Frostwell', Fans: '2' });
    await p.getByLabel('Defrost', { exact: true }).selectOption('off_cycle');
  });
  const evap2 = await register(page, systemUrl, 'Evaporator / unit cooler', 'Evaporator 2', async (p) => {
    await fillFields(p, { Make: 'Frostwell', Fans: '2' });
  });
  const control = await register(page, systemUrl, 'Pressure control', 'Dual pressure control', async (p) => {
    await p.getByLabel('Kind').selectOption('dual');
    await fillFields(p, {
      'Low side: cut-in (current setting) (psig)': '22',
      'Low side: differential (psi)': '15',
      'High side: cut-out (current setting) (psig)': '400',
      'High side: differential (psi)': '100',
    });
  });
  // In the header's current settings and in the nameplate.
  await expect(page.getByText('22 psig').first()).toBeVisible();
  await expect(page.getByTestId('current-settings').getByRole('row').filter({ hasText: 'Low side' }).getByRole('cell')).toHaveText(['22 psig', '7 psig', '15 psi']);
  const thermostat = await register(page, systemUrl, 'Thermostat / temperature control', 'Box thermostat', async (p) => {
    await fillFields(p, { 'Setpoint (current setting) (°F)': '36', 'Differential (°F)': '4' });
  });
  const solenoid = await register(page, systemUrl, 'Solenoid valve', 'Liquid-line solenoid', async (p) => {
    await p.getByLabel('Coil voltage (V)').fill('24');
    await p.getByLabel('Line').selectOption('liquid');
    await p.getByLabel('Normally').selectOption('closed');
  });

  await relate(page, thermostat, 'controls', solenoid);
  await expect(relation(page, 'Wired to', 'Liquid-line solenoid')).toBeVisible();
  await relate(page, cu, 'serves', evap1);
  await expect(relation(page, 'Feeds', 'Evaporator 1')).toBeVisible();
  await page.getByLabel('Other equipment on this site').selectOption(evap2);
  await page.getByRole('button', { name: 'Add connection' }).click();
  await expect(relation(page, 'Feeds', 'Evaporator 2')).toBeVisible();
  await relate(page, control, 'controls', cu);
  await expect(relation(page, 'Wired to', 'Condensing unit')).toBeVisible();

  // The other ends.
  await page.goto(`/equipment/${solenoid}`);
  await expect(relation(page, 'Switched by', 'Box thermostat')).toBeVisible();
  await page.goto(`/equipment/${evap2}`);
  await expect(relation(page, 'Fed by', 'Condensing unit')).toBeVisible();
  await page.goto(`/equipment/${cu}`);
  await expect(relation(page, 'Switched by', 'Dual pressure control')).toBeVisible();
  await expect(relation(page, 'Feeds', 'Evaporator 1')).toBeVisible();
  await expect(relation(page, 'Feeds', 'Evaporator 2')).toBeVisible();
  await expect(page.getByText(serial)).toBeVisible();
  // A new unit has no history yet, and the page says so rather than showing an empty box.
  await expect(page.getByRole('heading', { name: 'History', exact: true })).toBeVisible();
  await expect(page.getByText('No history yet.')).toBeVisible();
  await shot(page, 'registry-equipment-page-desktop');

  // The system lists its members and names its condensing unit.
  await page.goto(systemUrl);
  await expect(page.getByRole('heading', { name: 'Equipment in this system (6)' })).toBeVisible();
  await expect(page.getByRole('link', { name: 'Condensing unit' }).first()).toBeVisible();

  // The table: part of the serial finds it, and the URL carries the search.
  await page.getByRole('link', { name: 'Equipment', exact: true }).click();
  await page.getByLabel('Search equipment').fill('7Q4-88');
  await expect(page).toHaveURL(/q=7Q4-88/);
  const row = page.getByRole('row').filter({ hasText: serial });
  await expect(row).toBeVisible();
  await expect(page.getByRole('columnheader', { name: 'Name' })).toHaveAttribute('aria-sort', 'ascending');
  await page.getByRole('button', { name: 'Serial' }).click();
  await expect(page.getByRole('columnheader', { name: 'Serial' })).toHaveAttribute('aria-sort', 'ascending');
  await expect(page).toHaveURL(/sort=serial/);
  await shot(page, 'registry-table-desktop');
  await row.getByRole('link', { name: 'Condensing unit' }).click();
  await expect(page.getByRole('heading', { level: 1, name: 'Condensing unit' })).toBeVisible();
  await expect(page.getByText(serial)).toBeVisible();
});

test('a setting typed in psig reopens unchanged, and a refused value keeps what was typed', async ({ page }) => {
  await signIn(page, 'office@rimeline.test');
  const siteId = await pellStreetId(page);
  await page.goto(`/equipment/new?siteId=${siteId}`);
  await page.getByRole('radio', { name: 'Pressure control', exact: true }).check();
  await page.getByLabel('Name', { exact: true }).fill('Low-pressure control, freezer');
  await page.getByLabel('Kind').selectOption('low');
  await page.getByLabel('Low side: cut-in (current setting) (psig)').fill('23.7');
  await page.getByLabel('Low side: differential (psi)').fill('11.3');
  // Out of range: the message is in psig and nothing typed is lost.
  await page.getByLabel('High side: cut-out (current setting) (psig)').fill('99999');
  await page.getByRole('button', { name: 'Register equipment' }).click();
  await expect(page.getByText(/High side: cut-out \(current setting\) must be between .* psig and .* psig\./)).toBeVisible();
  await expect(page.getByLabel('Low side: cut-in (current setting) (psig)')).toHaveValue('23.7');
  await page.getByLabel('High side: cut-out (current setting) (psig)').fill('');
  await page.getByRole('button', { name: 'Register equipment' }).click();
  await expect(page.getByRole('heading', { level: 1, name: 'Low-pressure control, freezer' })).toBeVisible();
  await expect(page.getByText('23.7 psig').first()).toBeVisible();

  await openMore(page);
  await page.getByRole('link', { name: 'Edit' }).click();
  await expect(page.getByLabel('Low side: cut-in (current setting) (psig)')).toHaveValue('23.7');
  await expect(page.getByLabel('Low side: differential (psi)')).toHaveValue('11.3');
  // Saving unchanged values keeps them exactly.
  await page.getByRole('button', { name: 'Save changes' }).click();
  await expect(page.getByText('23.7 psig').first()).toBeVisible();
  await openMore(page);
  await page.getByRole('link', { name: 'Edit' }).click();
  await expect(page.getByLabel('Low side: cut-in (current setting) (psig)')).toHaveValue('23.7');
});

test('on a phone the equipment table is a card list with its own sort control @phone', async ({ page }, info) => {
  test.skip(info.project.name !== 'phone', 'The desktop table is covered above.');
  await signIn(page, 'office@rimeline.test');
  const siteId = await pellStreetId(page);
  const serial = `EV-PH-${Date.now() % 100000}`;
  const created = await page.request.post('/api/equipment', {
    data: { siteId, type: 'evaporator', name: 'Reach-in evaporator', make: 'Frostwell', model: 'FU-12', serial, condition: 2, nameplate: { fanCount: 1 } },
  });
  expect(created.status()).toBe(201);

  await page.goto('/equipment');
  await page.getByLabel('Search equipment').fill(serial.slice(3));
  await expect(page).toHaveURL(new RegExp(`q=${serial.slice(3)}`));
  await expect(page.getByText(`1 shown for “${serial.slice(3)}”.`)).toBeVisible();
  const card = page.getByRole('link', { name: /Reach-in evaporator/ }).filter({ hasText: serial });
  await expect(card).toBeVisible();
  await expect(card.getByText('Poor')).toBeVisible();
  await expect(page.getByRole('table')).toBeHidden();
  await expect(page.getByLabel('Sort by')).toBeVisible();
  // Nothing is wider than the screen.
  const overflow = await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);
  expect(overflow).toBeLessThanOrEqual(0);
  await shot(page, `registry-table-${info.project.name}`);
  await card.click();
  await expect(page.getByRole('heading', { level: 1, name: 'Reach-in evaporator' })).toBeVisible();
  await shot(page, `registry-equipment-page-${info.project.name}`);
});

test('an owner reads their equipment but cannot change it', async ({ page }) => {
  await signIn(page, 'office@rimeline.test');
  const siteId = await pellStreetId(page);
  const res = await page.request.post('/api/equipment', {
    data: { siteId, type: 'thermostat', name: 'Freezer thermostat', make: 'Coldmark', condition: 3, nameplate: { setpointC: -20 } },
  });
  const { id } = (await res.json()) as { id: string };
  await page.getByRole('button', { name: 'Sign out' }).click();
  await page.waitForURL(/\/sign-in/);

  await signIn(page, 'owner@client-one.test');
  await page.goto(`/equipment/${id}`);
  await expect(page.getByRole('heading', { level: 1, name: 'Freezer thermostat' })).toBeVisible();
  await expect(page.getByText('-4 °F').first()).toBeVisible();
  await expect(page.getByText('Fair')).toBeVisible();
  await expect(page.getByRole('link', { name: 'Edit' })).toHaveCount(0);
  await expect(page.getByRole('button', { name: 'Delete' })).toHaveCount(0);
  await expect(page.getByRole('button', { name: 'Add connection' })).toHaveCount(0);
  await page.goto(`/sites/${siteId}`);
  await expect(page.getByRole('link', { name: /Freezer thermostat/ })).toBeVisible();
  await expect(page.getByRole('link', { name: 'Register equipment' })).toHaveCount(0);
  await expect(page.getByRole('link', { name: 'New system' })).toHaveCount(0);
  await page.goto('/equipment/new');
  await expect(page.getByText('That page is not available to your role.')).toBeVisible();
});
