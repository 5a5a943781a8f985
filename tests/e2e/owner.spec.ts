import { expect, test } from '@playwright/test';
import { execFile } from 'node:child_process';
import { randomUUID } from 'node:crypto';
import { mkdtemp, readdir, rm } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { promisify } from 'node:util';
import sharp from 'sharp';
import { lifeLine } from '../../lib/equipment/life-line';
import { clearMail, waitForMail } from '../helpers/mail';
import { cameraImage } from '../helpers/photo-images';
import { siteLike } from '../helpers/sites';
import { apiAs, shot, signIn } from './helpers';

const base = process.env.APP_URL ?? 'http://localhost:3100';

test('an owner opens a site and a unit’s history, downloads the refrigerant report and asks for service with a photo; the office sees it @phone', async ({ page }, info) => {
  const office = await apiAs(test.info().project.use.baseURL ?? base, 'office@rimeline.test');
  const tech = await apiAs(test.info().project.use.baseURL ?? base, 'tech@rimeline.test');
  // A site of its own for client one: a visit left open at a demo site by another spec never blocks this one's.
  const site = await siteLike(office, 'Orchard Row Bistro', `${info.project.name} ${Date.now()}`);
  const siteId = site.id;
  const system = (await (await office.post('/api/systems', { data: { siteId, name: `Bar cooler circuit ${info.project.name}`, refrigerant: 'R-134a', fullChargeKg: 2.5, application: 'commercial_refrigeration', designBoxTempC: 3 } })).json()) as { id: string };
  const unit = (await (await office.post('/api/equipment', { data: { siteId, systemId: system.id, type: 'condensing_unit', name: `Bar condensing unit ${info.project.name}`, installedOn: '2004-06-01', condition: 2 } })).json()) as { id: string };
  const visit = (await (await tech.post('/api/visits', { data: { siteId, reason: 'no_cooling' } })).json()) as { id: string };
  const saved = await tech.post(`/api/visits/${visit.id}/entries`, { data: { kind: 'refrigerant', equipmentId: unit.id, clientEntryId: randomUUID(), data: { direction: 'added', amountKg: 0.6, refrigerant: 'R-134a', cylinderId: 'CYL-0101' } } });
  expect(saved.status()).toBe(201);
  expect((await tech.post(`/api/visits/${visit.id}/close`, { data: { summary: 'Topped up after a flare leak was repaired.' } })).ok()).toBe(true);

  await clearMail();
  await signIn(page, 'owner@client-one.test');
  await expect(page.getByRole('heading', { name: 'Needs attention', level: 2 })).toBeVisible();
  await shot(page, `owner-home-${info.project.name}`);
  await page.getByRole('link', { name: site.name }).first().click();
  await expect(page.getByRole('heading', { name: site.name })).toBeVisible();
  // The site page: each unit's age against its expected life, and the recent visits.
  await expect(page.getByRole('link', { name: new RegExp(`Bar condensing unit ${info.project.name}`) }).getByText(lifeLine({ type: 'condensing_unit', installedOn: '2004-06-01' }, new Date()))).toBeVisible();
  await expect(page.getByRole('heading', { name: 'Recent visits' })).toBeVisible();
  await expect(page.getByText('Topped up after a flare leak was repaired.').first()).toBeVisible();
  await expect(page.getByRole('heading', { name: 'Recent photos' })).toBeVisible();
  await page.getByRole('link', { name: `Bar condensing unit ${info.project.name}` }).first().click();
  await expect(page.getByRole('heading', { name: `Bar condensing unit ${info.project.name}` })).toBeVisible();
  await expect(page.getByText('CYL-0101').first()).toBeVisible();

  await page.goto('/reports');
  await page.getByLabel('System', { exact: true }).selectOption({ label: `Bar cooler circuit ${info.project.name} — ${site.name} (R-134a)` });
  await page.getByLabel('Year', { exact: true }).fill(String(new Date().getFullYear()));
  const download = page.waitForEvent('download');
  await page.getByRole('link', { name: 'CSV' }).last().click();
  const file = await download;
  const csv = await (await import('node:fs/promises')).readFile((await file.path())!, 'utf8');
  expect(csv).toContain('CYL-0101');
  expect(csv).toMatch(/added/i);

  // The owner scans the unit's tag (its QR link) and asks for service from where it lands.
  const run = (await (await office.post('/api/print-runs', { data: { kind: 'equipment', equipmentIds: [unit.id], layoutId: 'thermal-2x1' } })).json()) as { id: string };
  const code = ((await (await office.get(`/api/print-runs/${run.id}`)).json()) as { tags: { code: string }[] }).tags[0]!.code;
  await page.goto(`/T/${code}`);
  await expect(page).toHaveURL(new RegExp(`/equipment/${unit.id}$`));
  await page.getByRole('link', { name: 'Ask for service' }).click();
  await expect(page.getByLabel('Which unit (if you know)')).toHaveValue(unit.id);
  await page.getByLabel('What is wrong').fill('Bar cooler reads 47 °F and the fan is loud');
  await page.getByLabel('Emergency — product at risk now').check();
  await page.getByLabel('Photo (optional)').setInputFiles({ name: 'bar-cooler.jpg', mimeType: 'image/jpeg', buffer: await cameraImage() });
  await expect(page.getByRole('img', { name: 'The photo to send' })).toBeVisible();
  await shot(page, `owner-request-photo-${info.project.name}`);
  await page.getByRole('button', { name: 'Send the request' }).click();
  await expect(page.getByText('Request sent. The office has been e-mailed.')).toBeVisible();
  await expect(page.getByRole('img', { name: 'Photo sent with the request' })).toBeVisible();
  await expect.poll(() => page.getByRole('img', { name: 'Photo sent with the request' }).evaluate((img: HTMLImageElement) => img.naturalWidth)).toBeGreaterThan(0);
  const mail = await waitForMail('office@rimeline.test');
  expect(mail.subject).toContain('EMERGENCY');

  expect(mail.text).toContain('A photo came with it');
  const officeView = (await (await office.get('/api/requests?status=new')).json()) as { items: { description: string; photoId: string | null }[] };
  const sent = officeView.items.find((r) => r.description === 'Bar cooler reads 47 °F and the fan is loud');
  expect(sent?.photoId).toBeTruthy();
  expect((await office.get(`/api/photos/${sent!.photoId}/thumb`)).status()).toBe(200);
  await office.dispose();
  await tech.dispose();
});

test('the office sees the request in its queue and marks it seen; the owner sees the new status', async ({ page, browser }) => {
  const owner = await apiAs(test.info().project.use.baseURL ?? base, 'owner@client-one.test');
  const sites = (await (await owner.get('/api/sites')).json()) as { items: { id: string; name: string }[] };
  const created = await owner.post('/api/requests', { data: { siteId: sites.items[0]!.id, description: 'Ice on the evaporator coil', urgency: 'soon' } });
  expect(created.status()).toBe(201);
  const { id } = (await created.json()) as { id: string };
  await signIn(page, 'office@rimeline.test');
  await page.goto('/requests');
  await page.getByRole('link', { name: /Ice on the evaporator coil/ }).click();
  await page.getByLabel('Status', { exact: true }).selectOption('acknowledged');
  await page.getByLabel('Note to the owner').fill('Technician booked for tomorrow morning.');
  await page.getByRole('button', { name: 'Save' }).click();
  await expect(page.getByText('Saved. The owner sees the new status.')).toBeVisible();
  const ownerContext = await browser.newContext();
  const ownerPage = await ownerContext.newPage();
  await signIn(ownerPage, 'owner@client-one.test');
  await ownerPage.goto(`/requests/${id}`);
  await expect(ownerPage.getByText('Seen by the office')).toBeVisible();
  await expect(ownerPage.getByText('Technician booked for tomorrow morning.')).toBeVisible();
  await ownerContext.close();
  await owner.dispose();
});

test('the owner home prints: charts within the page, no header or buttons on paper', async ({ page }) => {
  await signIn(page, 'owner@client-one.test');
  await expect(page.getByRole('heading', { name: 'At a glance' })).toBeVisible();
  await page.waitForLoadState('networkidle');
  const dir = await mkdtemp(path.join(tmpdir(), 'rimeline-print-'));
  try {
    const pdf = path.join(dir, 'home.pdf');
    // Letter, no printer margins, so anything wider than the page reaches its right edge: charts
    // drawn at their screen width did (hundreds of inked pixels there); the page's own padding
    // keeps everything else clear of it.
    await page.pdf({ path: pdf, format: 'Letter' });
    const run = promisify(execFile);
    const { stdout: text } = await run('pdftotext', [pdf, '-']);
    expect(text).toContain('Needs attention');
    expect(text).toContain('Visits per month');
    expect(text).not.toContain('Sign out');
    expect(text).not.toContain('Ask for service');
    // Rendered at 50 dpi, the outer 5 px (0.1 in) on the right stay blank on every page.
    await run('pdftoppm', ['-r', '50', '-gray', '-png', pdf, path.join(dir, 'page')]);
    const pages = (await readdir(dir)).filter((f) => f.endsWith('.png'));
    expect(pages.length).toBeGreaterThan(0);
    for (const file of pages) {
      const { data, info } = await sharp(path.join(dir, file)).greyscale().raw().toBuffer({ resolveWithObject: true });
      let inked = 0;
      for (let y = 0; y < info.height; y++) for (let x = info.width - 5; x < info.width; x++) if (data[y * info.width + x]! < 200) inked++;
      expect(inked, file).toBe(0);
    }
  } finally {
    await rm(dir, { recursive: true, force: true });
  }
});
