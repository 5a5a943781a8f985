// The photo flow on a phone: a chosen photo is stored with no further tap; leaving with a photo
// not yet sent asks first (a link within the app, the visit form's "Done", a reload or tab
// close), and after "Stay" the failed upload is retried; a nameplate photo from the unit's header
// in at most three taps.
import { writeFile } from 'node:fs/promises';
import { expect, test, type Page, type Route } from '@playwright/test';
import type { PhotoListDto } from '../../lib/photos/dto';
import type { VisitDetailDto } from '../../lib/visits/dto';
import { cameraImage, nameplateImage } from '../helpers/photo-images';
import { siteLike } from '../helpers/sites';
import { shot, signIn } from './helpers';

/** Signed in as the technician, on a new unit's page scrolled to its photos, with a camera image written to `file`. */
async function unitWithCameraPhoto(page: Page, file: string, unitName: string): Promise<{ id: string; file: string }> {
  await signIn(page, 'tech@rimeline.test');
  const id = await newEquipment(page, 'Pell Street Kitchen', `${unitName} ${Date.now() % 100000}`);
  await writeFile(file, await cameraImage());
  await page.goto(`/equipment/${id}`);
  // The photos load as they come near the screen (a unit's page on a phone, issue 17): scroll to them.
  await page.getByTestId('unit-photos').scrollIntoViewIfNeeded();
  return { id, file };
}

async function siteId(page: Page, name: string): Promise<string> {
  const sites = await (await page.request.get(`/api/sites?q=${encodeURIComponent(name)}`)).json();
  return (sites.items as { id: string; name: string }[]).find((s) => s.name === name)!.id;
}

async function newEquipment(page: Page, site: string, name: string): Promise<string> {
  const res = await page.request.post('/api/equipment', { data: { siteId: await siteId(page, site), type: 'condensing_unit', name, make: 'Kelvrin', model: 'KCU-300' } });
  expect(res.status()).toBe(201);
  return (await res.json()).id as string;
}

async function storedPhotos(page: Page, equipmentId: string): Promise<PhotoListDto> {
  const res = await page.request.get(`/api/equipment/${equipmentId}/photos`);
  expect(res.status()).toBe(200);
  return (await res.json()) as PhotoListDto;
}

/**
 * Holds every photo upload to this unit until the test lets it go, then drops its connection:
 * an upload that is "on its way" for as long as the test needs, then failed. Later uploads pass.
 */
async function holdThenDropUploads(page: Page, equipmentId: string): Promise<{ release: () => void; held: () => number; passThrough: () => void }> {
  let release!: () => void;
  const released = new Promise<void>((r) => (release = r));
  let held = 0;
  let pass = false;
  await page.route(`**/api/equipment/${equipmentId}/photos`, async (route: Route) => {
    if (route.request().method() !== 'POST' || pass) return route.continue();
    held++;
    await released;
    await route.abort('connectionreset');
  });
  return { release, held: () => held, passThrough: () => (pass = true) };
}

test('a chosen photo is stored with no further tap, and a caption is added after @phone', async ({ page }, info) => {
  const { id, file } = await unitWithCameraPhoto(page, info.outputPath('coil.jpg'), 'Prep cooler condensing unit');
  expect((await storedPhotos(page, id)).total).toBe(0);

  await page.getByLabel('Kind for new photos').selectOption('damage');
  await page.getByTestId('photo-file-input').setInputFiles(file);
  const row = page.getByTestId('upload-row');
  await expect(row).toHaveAttribute('data-status', 'done', { timeout: 30_000 });
  // No button was pressed after choosing: the row is in the API.
  const afterUpload = await storedPhotos(page, id);
  expect(afterUpload.items.map((p) => [p.kind, p.originalName])).toEqual([['damage', 'coil.jpg']]);
  await expect(page.getByRole('button', { name: /^Upload/ })).toHaveCount(0);

  await page.getByLabel('Caption for coil.jpg').fill('Dent on the east panel');
  await page.getByRole('button', { name: 'Save kind and caption' }).click();
  await expect(row.getByRole('status')).toHaveText('Saved');
  expect((await storedPhotos(page, id)).items[0]!.caption).toBe('Dent on the east panel');
  await shot(page, `photo-flow-stored-${info.project.name}`);
});

test('leaving with a photo not yet sent asks first; after Stay the failed upload is retried @phone', async ({ page }, info) => {
  const { id, file } = await unitWithCameraPhoto(page, info.outputPath('wiring.jpg'), 'Bar cooler condensing unit');
  const here = page.url();
  const uploads = await holdThenDropUploads(page, id);

  await page.getByLabel('Kind for new photos').selectOption('wiring');
  await page.getByTestId('photo-file-input').setInputFiles(file);
  const row = page.getByTestId('upload-row');
  await expect(row).toHaveAttribute('data-status', /uploading|processing/);
  await expect.poll(uploads.held).toBe(1);

  // A link within the app, while the photo is on its way.
  await page.getByRole('main').getByRole('link', { name: 'Pell Street Kitchen' }).first().click();
  const ask = page.getByRole('dialog', { name: '1 photo is not sent yet. Leave anyway?' });
  await expect(ask).toBeVisible();
  await expect(ask.getByRole('button', { name: 'Stay' })).toBeFocused();
  await shot(page, `photo-flow-leave-asks-${info.project.name}`);
  await ask.getByRole('button', { name: 'Stay' }).click();
  await expect(ask).toBeHidden();
  expect(page.url()).toBe(here);

  // The connection drops: the photo waits with Retry, kept in memory, and still counts as not sent.
  uploads.release();
  await expect(row).toHaveAttribute('data-status', 'failed');
  await expect(row.getByRole('alert')).toContainText('The connection dropped before the photo arrived');
  expect((await storedPhotos(page, id)).total).toBe(0);
  await page.getByRole('main').getByRole('link', { name: 'Pell Street Kitchen' }).first().click();
  await expect(ask).toBeVisible();
  await ask.getByRole('button', { name: 'Stay' }).click();
  await expect(ask).toBeHidden();

  // A reload or tab close gets the browser's own question.
  const asked = page.waitForEvent('dialog');
  await page.close({ runBeforeUnload: true });
  const unload = await asked;
  expect(unload.type()).toBe('beforeunload');
  await unload.dismiss();
  expect(page.isClosed()).toBe(false);

  uploads.passThrough();
  await row.getByRole('button', { name: 'Retry' }).click();
  await expect(row).toHaveAttribute('data-status', 'done', { timeout: 30_000 });
  expect((await storedPhotos(page, id)).items.map((p) => p.kind)).toEqual(['wiring']);
  await expect(page.getByRole('list', { name: 'Photos' }).getByTestId('photo-thumb')).toHaveCount(1);

  // Nothing left to send: the link is followed without a question.
  await page.getByRole('main').getByRole('link', { name: 'Pell Street Kitchen' }).first().click();
  await page.waitForURL(/\/sites\/[0-9a-f-]{36}$/);
  await expect(ask).toHaveCount(0);
});

test('the visit photo form links each photo as it is stored; Done asks while one is not sent @phone', async ({ page }, info) => {
  await signIn(page, 'office@rimeline.test');
  // A site of its own, so no visit left open at a demo site stands in the way of this one.
  const site = await siteLike(page.request, 'Quarry Road Market', `${info.project.name} ${Date.now()}`);
  const made = await page.request.post('/api/equipment', { data: { siteId: site.id, type: 'condensing_unit', name: `Dairy case condensing unit ${Date.now() % 100000}`, make: 'Kelvrin', model: 'KCU-300' } });
  expect(made.status()).toBe(201);
  const id = ((await made.json()) as { id: string }).id;
  const started = await page.request.post('/api/visits', { data: { siteId: site.id, reason: 'maintenance' } });
  expect(started.status()).toBe(201);
  const visitId = ((await started.json()) as { id: string }).id;
  const photoEntries = async () => {
    const visit = (await (await page.request.get(`/api/visits/${visitId}`)).json()) as VisitDetailDto;
    return visit.entries.filter((e) => e.kind === 'photo' && e.equipmentId === id);
  };
  const plate = info.outputPath('plate.jpg');
  const panel = info.outputPath('panel.jpg');
  await writeFile(plate, await nameplateImage('KELVRIN KCU-300'));
  await writeFile(panel, await cameraImage());

  await page.goto(`/visits/${visitId}?equipment=${id}&kind=photo`);
  await page.getByTestId('photo-file-input').setInputFiles(plate);
  await expect(page.getByText('1 photo added to this visit.')).toBeVisible({ timeout: 30_000 });
  await expect.poll(async () => (await photoEntries()).length).toBe(1);

  const uploads = await holdThenDropUploads(page, id);
  await page.getByTestId('photo-file-input').setInputFiles(panel);
  await expect.poll(uploads.held).toBe(1);
  await page.getByRole('button', { name: 'Done with photos' }).click();
  const ask = page.getByRole('dialog', { name: '1 photo is not sent yet. Leave anyway?' });
  await expect(ask).toBeVisible();
  await shot(page, `photo-flow-visit-done-asks-${info.project.name}`);
  await ask.getByRole('button', { name: 'Stay' }).click();
  await expect(page.getByRole('button', { name: 'Done with photos' })).toBeVisible();

  uploads.release();
  const failed = page.getByTestId('upload-row').filter({ hasText: 'panel.jpg' });
  await expect(failed).toHaveAttribute('data-status', 'failed');
  uploads.passThrough();
  await failed.getByRole('button', { name: 'Retry' }).click();
  await expect(page.getByText('2 photos added to this visit.')).toBeVisible({ timeout: 30_000 });
  await expect.poll(async () => (await photoEntries()).length).toBe(2);

  await page.getByRole('button', { name: 'Done with photos' }).click();
  await expect(ask).toHaveCount(0);
  await expect(page.getByRole('button', { name: 'Done with photos' })).toHaveCount(0);
});

test('a nameplate photo from the unit header takes at most three taps @phone', async ({ page }, info) => {
  await signIn(page, 'tech@rimeline.test');
  const id = await newEquipment(page, 'Pell Street Kitchen', `Walk-in freezer condensing unit ${Date.now() % 100000}`);
  const plate = await nameplateImage('KELVRIN KCU-300');
  await page.goto(`/equipment/${id}`);

  let taps = 0;
  const tap = async (action: Promise<void>) => {
    taps++;
    await action;
  };
  const actions = page.locator('[data-slot="unit-actions"]');
  await tap(actions.getByRole('button', { name: 'Add photo' }).click());
  const sheet = page.getByRole('dialog', { name: 'What does the photo show?' });
  await expect(sheet).toBeVisible();
  await shot(page, `photo-flow-quick-sheet-${info.project.name}`);
  const [chooser] = await Promise.all([page.waitForEvent('filechooser'), tap(sheet.getByText('Nameplate', { exact: true }).click())]);
  expect(chooser.isMultiple()).toBe(false);
  // The shutter is the third tap.
  await tap(chooser.setFiles({ name: 'nameplate.jpg', mimeType: 'image/jpeg', buffer: plate }));
  expect(taps).toBeLessThanOrEqual(3);
  console.log(`Nameplate photo from the unit header: ${taps} taps`);

  await expect(sheet).toBeHidden();
  const status = page.getByTestId('quick-upload');
  await expect(status).toHaveAttribute('data-status', 'done', { timeout: 30_000 });
  await expect(status).toContainText('Added to this unit’s photos');
  await shot(page, `photo-flow-quick-done-${info.project.name}`);
  expect((await storedPhotos(page, id)).items.map((p) => p.kind)).toEqual(['nameplate']);
  // The photos load as they come near the screen (a unit's page on a phone, issue 17): scroll to them.
  await page.getByTestId('unit-photos').scrollIntoViewIfNeeded();
  await expect(page.getByRole('button', { name: 'Nameplate (1)' })).toBeVisible();
});
