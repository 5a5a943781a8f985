// A visit recorded without signal at 360 px: the technician opens the visit with signal (which
// keeps its site on the phone), loses the connection, types the tag code of a unit never opened
// before, records readings, a setting change, a finding with a follow-up and a photo, closes the
// visit, opens the visit page again still offline, and comes back online with the first answer
// lost on the way. Afterwards the server holds each record exactly once and the visit is closed.
// Sites, makes and people are invented.
import { expect, test, type APIRequestContext, type Page } from '@playwright/test';
import sharp from 'sharp';
import type { VisitDetailDto } from '../../lib/visits/dto';
import { nameplateImage } from '../helpers/photo-images';
import { api } from '../helpers/visits';
import { asOffice, shot, signIn } from './helpers';
import { keepSiteOnPhone, loseFirstAnswer } from './field';

// The phone's service worker is what answers without signal.
test.use({ serviceWorkers: 'allow' });

async function offlineSite(request: APIRequestContext, label: string) {
  const clients = await api<{ items: { id: string }[] }>(request, 'GET', '/api/clients?limit=50');
  const site = await api<{ id: string }>(request, 'POST', '/api/sites', { clientId: clients.items[0]!.id, name: `Cellar market ${label}`, timeZone: 'America/Chicago', elevationM: 180 });
  const system = await api<{ id: string }>(request, 'POST', '/api/systems', { siteId: site.id, name: 'Dairy case circuit', refrigerant: 'R-404A', fullChargeKg: 6.8, application: 'commercial_refrigeration', designBoxTempC: 2 });
  const unit = (type: string, name: string, nameplate: Record<string, unknown> = {}) => api<{ id: string; name: string }>(request, 'POST', '/api/equipment', { siteId: site.id, systemId: system.id, type, name, make: 'Kelvrin', nameplate });
  const cu = await unit('condensing_unit', `Dairy condensing unit ${label}`, { voltage: 208, phase: '3' });
  const control = await unit('pressure_control', `Dairy low-pressure control ${label}`, { controlKind: 'low', lowCutInKpa: 172.4, lowDifferentialKpa: 68.95 });
  const evaporator = await unit('evaporator', `Dairy case coil ${label}`);
  const created = await request.post('/api/print-runs', { data: { kind: 'equipment', equipmentIds: [cu.id], layoutId: 'thermal-2x1' } });
  expect(created.status()).toBe(201);
  const run = await api<{ tags: { code: string; equipmentId: string | null }[] }>(request, 'GET', `/api/print-runs/${((await created.json()) as { id: string }).id}`);
  return { siteId: site.id, cu: { ...cu, code: run.tags.find((t) => t.equipmentId === cu.id)!.code }, control, evaporator };
}

async function visitDetail(request: APIRequestContext, id: string): Promise<VisitDetailDto> {
  return api<VisitDetailDto>(request, 'GET', `/api/visits/${id}`);
}

async function changeUnit(page: Page, search: string, name: string) {
  await page.getByRole('button', { name: 'Change unit' }).click();
  await page.getByRole('searchbox', { name: /Find a unit/ }).fill(search);
  await page.getByRole('list', { name: 'Units found' }).getByRole('button', { name: new RegExp(name) }).click();
  await expect(page.getByRole('heading', { level: 2, name })).toBeVisible();
}

/** Without signal, from the condensing unit: readings, a setting change on the control, a finding with a follow-up on the coil; each waits on the phone. */
async function recordWithoutSignal(page: Page, control: string, evaporator: string, finding: string) {
  await page.getByRole('button', { name: 'Readings', exact: true }).click();
  await page.getByLabel('Suction pressure (psig)', { exact: true }).fill('22');
  await page.getByLabel('Discharge pressure (psig)', { exact: true }).fill('230');
  await page.getByLabel('Suction-line temperature (°F)', { exact: true }).fill('40');
  await page.getByRole('button', { name: 'Save readings' }).click();
  await expect(page.getByTestId('just-saved').getByText('Waiting for signal — kept on this phone')).toBeVisible();

  await changeUnit(page, 'low-pressure', control);
  await page.getByRole('button', { name: 'Setting change' }).click();
  await page.getByRole('button', { name: /^Same as recorded/ }).click();
  await page.getByLabel('Cut-in as left (psig)', { exact: true }).fill('28');
  await page.getByLabel('Differential as left (psi)', { exact: true }).fill('12');
  await page.getByRole('button', { name: 'Save setting change' }).click();
  await expect(page.getByTestId('just-saved')).toContainText('Waiting for signal');

  await changeUnit(page, 'coil', evaporator);
  await page.getByRole('button', { name: 'Finding', exact: true }).click();
  await page.getByLabel('What was found').fill(`${finding}`);
  await page.getByRole('radio', { name: /^Degraded/ }).check();
  await page.getByRole('checkbox', { name: /Raise a follow-up/ }).check();
  await page.getByRole('button', { name: 'Save finding' }).click();
  await expect(page.getByTestId('just-saved')).toContainText('Waiting for signal');
}

/** Without signal: one photo kept on the phone, then the close queued with the client's summary. */
async function photoAndCloseWithoutSignal(page: Page, file: string, nameplate: string, missing: string, summary: string): Promise<void> {
  await page.getByRole('button', { name: 'Photo', exact: true }).click();
  await page.getByTestId('offline-photo-input').setInputFiles({ name: file, mimeType: 'image/jpeg', buffer: await sharp(await nameplateImage(nameplate)).jpeg().toBuffer() });
  await expect(page.getByText('1 photo kept on this phone for this visit.')).toBeVisible();
  await page.getByRole('button', { name: 'Done with photos' }).click();

  await page.getByTestId('visit-bar').getByRole('button', { name: 'Close visit' }).click();
  await expect(page.getByTestId('close-missing')).toContainText(missing);
  await page.getByLabel('Summary for the client').fill(summary);
  await page.getByRole('button', { name: 'Close visit', exact: true }).last().click();
  await expect(page.getByTestId('close-queued')).toBeVisible();
}

test('a visit recorded and closed without signal reaches the server once, after a reload and a lost answer @phone', async ({ page, context }, info) => {
  test.setTimeout(240_000);
  const label = String(Date.now()).slice(-5);
  const { siteId, cu, control, evaporator } = await asOffice(info.project.use.baseURL, (office) => offlineSite(office, label));

  await signIn(page, 'tech@rimeline.test');
  const visit = await api<{ id: string }>(page.request, 'POST', '/api/visits', { siteId, reason: 'no_cooling' });
  // With signal: the visit page keeps its site on the phone, and the worker keeps the page.
  await page.goto(`/visits/${visit.id}`);
  await page.evaluate(async () => {
    await navigator.serviceWorker.ready;
  });
  await expect(page.getByTestId('site-kept')).toHaveText('This site is kept on the phone: ready without signal.', { timeout: 30_000 });
  await page.goto(`/visits/${visit.id}`);
  await expect(page.getByRole('heading', { name: 'Which unit?' })).toBeVisible();

  await context.setOffline(true);

  // A unit never opened before, by typing its tag code in the visit's scanner.
  await page.getByRole('button', { name: 'Scan' }).click();
  // The unit picker's search is labelled "… name, type or tag code" too: type only once the scan
  // step has replaced it, into the field labelled exactly "Tag code".
  await expect(page.getByRole('heading', { name: 'Scan the unit’s tag' })).toBeVisible();
  await page.getByLabel('Tag code', { exact: true }).fill(cu.code);
  await page.getByRole('button', { name: 'Open' }).click();
  await expect(page.getByRole('heading', { level: 2, name: cu.name })).toBeVisible();

  await recordWithoutSignal(page, control.name, evaporator.name, `Drain pan heater open circuit (${label})`);

  await photoAndCloseWithoutSignal(page, 'coil.jpg', 'FROSTWELL DC-20', '3 entries and 1 photo not yet sent', 'Low-pressure control reset; drain pan heater to replace.');
  await shot(page, 'offline-visit-close-queued');

  // Still without signal, the visit page opens again from the phone with everything waiting.
  await page.goto(`/visits/${visit.id}`);
  await expect(page.getByTestId('visit-bar')).toContainText('Closing when there is signal');
  await expect(page.getByRole('alert').filter({ hasText: 'No signal' })).toContainText('3 entries, 1 photo and the close waiting');

  // Signal back, but the answer to the first send is lost on the way: the retry gets the first save.
  const lost = await loseFirstAnswer(context, `**/api/visits/${visit.id}/entries`);
  await context.setOffline(false);
  await expect(async () => {
    const detail = await visitDetail(page.request, visit.id);
    expect(detail.status).toBe('closed');
  }).toPass({ timeout: 90_000 });
  await context.unroute(`**/api/visits/${visit.id}/entries`);
  // The first answer really was lost (context.route sees the requests the worker makes).
  expect(lost()).toBe(1);

  const detail = await visitDetail(page.request, visit.id);
  const kinds = detail.entries.filter((e) => !e.voidedAt).map((e) => e.kind).sort();
  expect(kinds).toEqual(['finding', 'photo', 'reading', 'setting_change']);
  const followUps = await api<{ items: { title: string }[] }>(page.request, 'GET', `/api/follow-ups?siteId=${siteId}`);
  expect(followUps.items.filter((f) => f.title.includes(label))).toHaveLength(1);
  const photos = await api<{ items: unknown[] }>(page.request, 'GET', `/api/equipment/${evaporator.id}/photos`);
  expect(photos.items).toHaveLength(1);
  expect(detail.summary).toBe('Low-pressure control reset; drain pan heater to replace.');
});

test('a visit started without signal at a kept site reaches the server once, even when the answer to its start is lost @phone', async ({ page, context }, info) => {
  test.setTimeout(300_000);
  const label = String(Date.now()).slice(-5);
  const { siteId, cu, control, evaporator } = await asOffice(info.project.use.baseURL, (office) => offlineSite(office, label));

  // With signal: keep the site from its page; the worker keeps the field pages.
  await signIn(page, 'tech@rimeline.test');
  await keepSiteOnPhone(page, siteId);
  await page.goto('/scan');
  await expect.poll(() => page.evaluate(() => Boolean(navigator.serviceWorker.controller))).toBe(true);

  // No signal from here. A unit never opened, by its typed code; the visit starts on the phone.
  await context.setOffline(true);
  await page.reload();
  await page.getByLabel('Tag code', { exact: true }).fill(cu.code);
  await page.getByRole('button', { name: 'Open' }).click();
  await expect(page.getByTestId('offline-unit').getByRole('heading', { level: 1, name: cu.name })).toBeVisible();
  await page.getByRole('link', { name: /Log a visit/ }).click();
  const start = page.getByTestId('offline-start');
  await start.getByRole('radio', { name: 'No-cooling call' }).check();
  await start.getByRole('button', { name: 'Start visit' }).click();
  await expect(page).toHaveURL(/\/offline\/visit\?id=[0-9a-f-]{36}&equipment=/);
  const visitId = new URL(page.url()).searchParams.get('id')!;
  await expect(page.getByTestId('offline-visit-source')).toContainText('Started on this phone without signal.');
  await expect(page.getByRole('heading', { level: 2, name: cu.name })).toBeVisible();
  await shot(page, 'offline-visit-started-on-phone');

  await recordWithoutSignal(page, control.name, evaporator.name, `Fan motor bearing noise (${label})`);

  await photoAndCloseWithoutSignal(page, 'fan.jpg', 'KELVRIN FM-9', 'The visit itself is not on the server yet', 'Fan motor noisy; replacement to be quoted.');

  // A reload without signal: the phone's copy of the visit, everything still waiting.
  await page.reload();
  await expect(page.getByTestId('visit-bar')).toContainText('Closing when there is signal');
  await expect(page.getByRole('alert').filter({ hasText: 'No signal' })).toContainText('3 entries, 1 photo and the close waiting');

  // Signal back; the answer to the start is lost on the way, so the start is sent twice.
  const lost = await loseFirstAnswer(context, '**/api/visits');
  await context.setOffline(false);
  await expect(async () => {
    const detail = await visitDetail(page.request, visitId);
    expect(detail.status).toBe('closed');
  }).toPass({ timeout: 120_000 });
  await context.unroute('**/api/visits');
  expect(lost()).toBe(1);

  const detail = await visitDetail(page.request, visitId);
  expect(detail.reason).toBe('no_cooling');
  expect(detail.entries.filter((e) => !e.voidedAt).map((e) => e.kind).sort()).toEqual(['finding', 'photo', 'reading', 'setting_change']);
  const visits = await api<{ items: { id: string }[] }>(page.request, 'GET', `/api/visits?siteId=${siteId}`);
  expect(visits.items.map((v) => v.id)).toEqual([visitId]);
  const followUps = await api<{ items: { title: string }[] }>(page.request, 'GET', `/api/follow-ups?siteId=${siteId}`);
  expect(followUps.items.filter((f) => f.title.includes(label))).toHaveLength(1);
  expect(detail.summary).toBe('Fan motor noisy; replacement to be quoted.');
  // With signal, the phone's copy gives way to the visit's own page.
  await expect(page).toHaveURL(new RegExp(`/visits/${visitId}`), { timeout: 30_000 });
});
