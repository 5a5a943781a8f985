// Photos in the browser: two chosen at once upload by themselves, each with a progress bar, a
// caption added once stored, both thumbnails; a refused file and a dropped connection each said
// plainly, the second retried alone; the full-screen viewer (zoom by keyboard, Escape), the kind
// filter and the comparison.
import { DeleteObjectCommand, S3Client } from '@aws-sdk/client-s3';
import { writeFile } from 'node:fs/promises';
import path from 'node:path';
import { expect, test, type Page } from '@playwright/test';
import sharp from 'sharp';
import { createTestDb } from '../helpers/db';
import { cameraImage, nameplateImage } from '../helpers/photo-images';
import { screenshotDir, shot, signIn } from './helpers';

/** Dialogs are fixed to the viewport, so they are photographed as the screen shows them. */
const screen = (page: Page, name: string) => page.screenshot({ path: path.join(screenshotDir, `${name}.png`) });

async function newEquipment(page: Page, name: string): Promise<string> {
  const sites = await (await page.request.get(`/api/sites?q=${encodeURIComponent('Pell Street Kitchen')}`)).json();
  const site = (sites.items as { id: string; name: string }[]).find((s) => s.name === 'Pell Street Kitchen')!;
  const res = await page.request.post('/api/equipment', { data: { siteId: site.id, type: 'condensing_unit', name, make: 'Kelvrin', model: 'KCU-300' } });
  expect(res.status()).toBe(201);
  return (await res.json()).id as string;
}

/** Records every value each upload progress bar shows, however briefly. */
async function watchProgress(page: Page): Promise<void> {
  await page.evaluate(() => {
    const seen: Record<string, number[]> = {};
    (window as unknown as { progressSeen: Record<string, number[]> }).progressSeen = seen;
    const record = (el: Element) => {
      const name = el.getAttribute('aria-label') ?? '?';
      const value = Number(el.getAttribute('aria-valuenow'));
      (seen[name] ??= []).push(value);
    };
    new MutationObserver((records) => {
      for (const r of records) {
        if (r.type === 'attributes' && r.target instanceof Element && r.target.getAttribute('role') === 'progressbar') record(r.target);
        for (const n of r.addedNodes) if (n instanceof Element) n.querySelectorAll('[role=progressbar]').forEach(record);
      }
    }).observe(document.body, { subtree: true, childList: true, attributes: true, attributeFilter: ['aria-valuenow'] });
  });
}

/** Slows uploads to about 1 MB/s, so each file's progress bar moves through visible steps. */
async function slowUploads(page: Page): Promise<void> {
  const cdp = await page.context().newCDPSession(page);
  await cdp.send('Network.enable');
  await cdp.send('Network.emulateNetworkConditions', { offline: false, latency: 20, downloadThroughput: -1, uploadThroughput: 1024 * 1024 });
}

test('uploads two photos with progress, shows both thumbnails, views, filters and compares them @phone', async ({ page }, info) => {
  // Two slowed uploads, a caption, the viewer at full resolution and the comparison: a long walk on two shared cores.
  test.setTimeout(120_000);
  await signIn(page, 'tech@rimeline.test');
  const id = await newEquipment(page, `Roof condensing unit ${Date.now() % 100000}`);
  const plate = info.outputPath('nameplate.jpg');
  const coil = info.outputPath('coil-corrosion.jpg');
  await writeFile(plate, await nameplateImage('KELVRIN COLDWORKS'));
  // About 2 MB, so the upload takes long enough to watch.
  await writeFile(coil, await cameraImage({ width: 2400, height: 1800, grain: 30, quality: 90, takenAt: '2023:05:02 10:15:00' }));

  await page.goto(`/equipment/${id}`);
  // The photos load as they come near the screen (a unit's page on a phone, issue 17): scroll to them.
  await page.getByTestId('unit-photos').scrollIntoViewIfNeeded();
  await expect(page.getByRole('heading', { name: 'Photos' })).toBeVisible();
  await expect(page.getByText('No photos yet.')).toBeVisible();
  await page.getByLabel('Kind for new photos').selectOption('nameplate');
  // Choosing the files is the last tap: both start at once, each with its own bar.
  await watchProgress(page);
  await slowUploads(page);
  await page.getByTestId('photo-file-input').setInputFiles([plate, coil]);
  const rows = page.getByTestId('upload-row');
  await expect(rows).toHaveCount(2);
  await expect(page.getByRole('progressbar', { name: 'Upload of coil-corrosion.jpg' })).toBeVisible();
  await shot(page, `photos-uploading-${info.project.name}`);
  await expect(rows.filter({ hasText: 'Uploaded' })).toHaveCount(2, { timeout: 30_000 });
  const seen = await page.evaluate(() => (window as unknown as { progressSeen: Record<string, number[]> }).progressSeen);
  expect(Object.keys(seen).sort()).toEqual(['Upload of coil-corrosion.jpg', 'Upload of nameplate.jpg']);
  // The larger file's bar showed intermediate steps on its way to 100.
  expect(seen['Upload of coil-corrosion.jpg']!.some((v) => v > 0 && v < 100)).toBe(true);
  expect(Math.max(...seen['Upload of coil-corrosion.jpg']!)).toBe(100);

  // Kind and caption corrected once stored.
  await page.getByLabel('Kind of coil-corrosion.jpg').selectOption('corrosion');
  await page.getByLabel('Caption for coil-corrosion.jpg').fill('East coil fins');
  await page.getByRole('button', { name: 'Save kind and caption' }).click();
  await expect(rows.filter({ hasText: 'coil-corrosion.jpg' }).getByRole('status')).toHaveText('Saved');

  const gallery = page.getByRole('list', { name: 'Photos' });
  const thumbs = gallery.getByTestId('photo-thumb');
  await expect(thumbs).toHaveCount(2);
  for (const thumb of await thumbs.all()) {
    await expect(thumb).toBeVisible();
    await expect.poll(() => thumb.evaluate((img: HTMLImageElement) => img.complete && img.naturalWidth)).toBe(400);
  }
  await expect(page.getByRole('button', { name: 'Corrosion (1)' })).toBeVisible();
  await shot(page, `photos-gallery-${info.project.name}`);

  // Viewer: opens on the tile, zooms by keyboard, closes with Escape and gives focus back.
  const tile = page.getByRole('button', { name: /Open corrosion photo from May 2, 2023: East coil fins/ });
  await tile.click();
  const viewer = page.getByRole('dialog');
  await expect(viewer).toBeVisible();
  await expect(viewer.getByRole('heading')).toContainText('Corrosion');
  await expect(viewer.locator('[data-photo-stage]')).toBeFocused();
  // Tab stays inside the viewer, and each control shows where focus is.
  for (let i = 0; i < 14; i++) {
    await page.keyboard.press('Tab');
    expect(await page.evaluate(() => Boolean(document.activeElement?.closest('[role=dialog]')))).toBe(true);
  }
  expect(await page.evaluate(() => getComputedStyle(document.activeElement!).outlineStyle)).toBe('solid');
  await viewer.locator('[data-photo-stage]').focus();
  for (let i = 0; i < 4; i++) await page.keyboard.press('+');
  await expect(viewer.getByText('244%')).toBeVisible();
  await page.keyboard.press('ArrowLeft');
  await expect(viewer.getByText('Loading full resolution…').or(viewer.getByText('Full resolution'))).toBeVisible();
  await expect(viewer.getByText('Full resolution', { exact: true })).toBeVisible({ timeout: 15_000 });
  await screen(page, `photos-viewer-${info.project.name}`);
  await page.keyboard.press('0');
  await expect(viewer.getByText('100%')).toBeVisible();
  await page.keyboard.press('Escape');
  await expect(viewer).toBeHidden();
  await expect(tile).toBeFocused();

  // Filter by kind.
  await page.getByRole('button', { name: 'Nameplate (1)' }).click();
  await expect(thumbs).toHaveCount(1);
  await expect(page.getByRole('button', { name: 'Nameplate (1)' })).toHaveAttribute('aria-pressed', 'true');
  await page.getByRole('button', { name: 'All (2)' }).click();
  await expect(thumbs).toHaveCount(2);

  // Comparison: earlier photo (taken 2023) on the left, today's on the right.
  await page.getByRole('button', { name: 'Compare two' }).click();
  const compare = page.getByRole('dialog');
  await expect(compare.getByRole('heading', { name: /Compare photos · \d+ years?/ })).toBeVisible();
  await expect(compare.getByLabel('Choose the left photo')).toHaveValue(/.+/);
  await expect(compare.getByRole('region', { name: 'Left photo' })).toContainText('May 2, 2023');
  await screen(page, `photos-compare-${info.project.name}`);
  await page.keyboard.press('Escape');
  await expect(compare).toBeHidden();
});

test('a refused file says why; a dropped upload is retried alone @phone', async ({ page }, info) => {
  await signIn(page, 'tech@rimeline.test');
  const id = await newEquipment(page, `Reach-in compressor ${Date.now() % 100000}`);
  const notPhoto = info.outputPath('notes.jpg');
  const damage = info.outputPath('damage.jpg');
  await writeFile(notPhoto, 'these are notes, not a photo');
  await writeFile(damage, await sharp(await cameraImage({ width: 1200, height: 900 })).jpeg().toBuffer());
  await page.goto(`/equipment/${id}`);
  // The photos load as they come near the screen (a unit's page on a phone, issue 17): scroll to them.
  await page.getByTestId('unit-photos').scrollIntoViewIfNeeded();

  // The first try of damage.jpg loses its connection; the second goes through.
  let dropped = 0;
  await page.route(`**/api/equipment/${id}/photos`, async (route) => {
    if (route.request().method() === 'POST' && dropped === 0 && (route.request().postDataBuffer()?.includes(Buffer.from('damage.jpg')) ?? false)) {
      dropped++;
      await route.abort('connectionreset');
      return;
    }
    await route.continue();
  });

  await page.getByTestId('photo-camera-input').setInputFiles([notPhoto, damage]);
  const refused = page.getByTestId('upload-row').filter({ hasText: 'notes.jpg' });
  const retried = page.getByTestId('upload-row').filter({ hasText: 'damage.jpg' });
  await expect(refused.getByRole('alert')).toContainText('Not uploaded: This file is not an image we can read. Upload a JPEG, PNG or WebP photo.');
  // Sending the same bytes again cannot help, so there is no Retry for it.
  await expect(refused.getByRole('button', { name: 'Retry' })).toHaveCount(0);
  await expect(retried.getByRole('alert')).toContainText('The connection dropped before the photo arrived. Nothing was saved; press Retry.');
  await shot(page, `photos-errors-${info.project.name}`);
  await retried.getByRole('button', { name: 'Retry' }).click();
  await expect(retried).toContainText('Uploaded');
  await expect(refused).toHaveAttribute('data-status', 'failed');
  await expect(page.getByRole('list', { name: 'Photos' }).getByTestId('photo-thumb')).toHaveCount(1);
  expect(dropped).toBe(1);
  await shot(page, `photos-after-retry-${info.project.name}`);
  await page.getByRole('button', { name: /Open general photo/ }).click();
  await expect(page.getByRole('dialog')).toBeVisible();
  await screen(page, `photos-viewer-small-${info.project.name}`);
  await page.getByRole('button', { name: 'Close' }).click();
  await expect(page.getByRole('dialog')).toBeHidden();
});

test('an owner sees photos of their equipment but no uploader', async ({ page, browser }) => {
  await signIn(page, 'tech@rimeline.test');
  const id = await newEquipment(page, `Walk-in evaporator ${Date.now() % 100000}`);
  const up = await page.request.post(`/api/equipment/${id}/photos`, { multipart: { kind: 'after', file: { name: 'after.jpg', mimeType: 'image/jpeg', buffer: await cameraImage() } } });
  expect(up.status()).toBe(201);

  const owner = await browser.newPage();
  await signIn(owner, 'owner@client-one.test');
  await owner.goto(`/equipment/${id}`);
  // The photos load as they come near the screen (a unit's page on a phone, issue 17): scroll to them.
  await owner.getByTestId('unit-photos').scrollIntoViewIfNeeded();
  await expect(owner.getByRole('list', { name: 'Photos' }).getByTestId('photo-thumb')).toHaveCount(1);
  await expect(owner.getByRole('button', { name: 'Take photo' })).toHaveCount(0);
  await expect(owner.getByRole('button', { name: 'Add photo' })).toHaveCount(0);
  const other = await browser.newPage();
  await signIn(other, 'owner@client-two.test');
  const photoId = (await up.json()).id as string;
  expect((await other.request.get(`/api/photos/${photoId}/display`)).status()).toBe(404);
  await owner.close();
  await other.close();
});

test('an admin finds a photo whose thumbnail went missing and repairs it @phone', async ({ page: techPage, browser }, info) => {
  await signIn(techPage, 'tech@rimeline.test');
  const unitName = `Freezer evaporator ${Date.now() % 100000}`;
  const id = await newEquipment(techPage, unitName);
  const up = await techPage.request.post(`/api/equipment/${id}/photos`, { multipart: { kind: 'wiring', file: { name: 'wiring.jpg', mimeType: 'image/jpeg', buffer: await cameraImage() } } });
  expect(up.status()).toBe(201);
  const photoId = (await up.json()).id as string;
  // Lose the thumbnail behind the app's back, as a half-finished bucket copy might.
  const db = createTestDb();
  try {
    const row = await db.selectFrom('photos').select('thumb_key').where('id', '=', photoId).executeTakeFirstOrThrow();
    await storeClient().send(new DeleteObjectCommand({ Bucket: process.env.S3_BUCKET, Key: row.thumb_key }));
  } finally {
    await db.destroy();
  }
  expect((await techPage.request.get(`/api/photos/${photoId}/thumb`)).status()).toBe(404);
  // Technicians are not shown the page.
  await techPage.goto('/settings/storage');
  await expect(techPage).toHaveURL(/denied=1/);

  // The admin in a browser of their own (a late response of the technician's page could set its
  // session cookie again after clearing it).
  const page = await (await browser.newContext({ viewport: techPage.viewportSize() ?? undefined })).newPage();
  await signIn(page, 'admin@rimeline.test', undefined, '/settings/storage');
  await expect(page.getByRole('heading', { name: 'Photo storage' })).toBeVisible();
  const problem = page.getByRole('listitem').filter({ hasText: unitName });
  await expect(problem).toContainText('Missing: thumb');
  await expect(problem).toContainText('Make the display copy and thumbnail again from the original');
  await shot(page, `photos-storage-check-${info.project.name}`);
  page.once('dialog', (d) => d.accept());
  await page.getByRole('button', { name: 'Repair' }).click();
  await expect(page.getByRole('status').filter({ hasText: 'Repaired.' })).toContainText(/\d+ photo\(s\) given new small copies/);
  await expect(page.getByText('Photo storage is consistent.')).toBeVisible();
  await shot(page, `photos-storage-repaired-${info.project.name}`);
  expect((await page.request.get(`/api/photos/${photoId}/thumb`)).status()).toBe(200);
  await page.context().close();
});

/** A plain S3 client from the test environment (the app's storage module is server-only). */
function storeClient(): S3Client {
  return new S3Client({
    region: process.env.S3_REGION ?? 'us-east-1',
    endpoint: process.env.S3_ENDPOINT,
    forcePathStyle: true,
    credentials: { accessKeyId: process.env.S3_ACCESS_KEY_ID ?? 'S3RVER', secretAccessKey: process.env.S3_SECRET_ACCESS_KEY ?? 'S3RVER' },
    requestChecksumCalculation: 'WHEN_REQUIRED',
    responseChecksumValidation: 'WHEN_REQUIRED',
  });
}
