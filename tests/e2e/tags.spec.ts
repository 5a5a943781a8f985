// QR tags in the browser: the office prints blank tags, a technician claims one by opening its URL,
// the print run counts it; another company's tag and an unknown code show the same not-found page;
// signed out, a tag says only that the unit is registered and sign-in comes back to it; the Scan
// page checks a typed code as it is typed; and (@camera) a label scanned through Chromium's fake
// camera lands on the equipment.
import { expect, test, type APIRequestContext } from '@playwright/test';
import { formatCode, generateCode } from '../../lib/tags/code';
import { createTestDb } from '../helpers/db';
import { fakeCameraFile } from '../playwright.config';
import { writeFakeCameraFromLabel } from './camera';
import { apiAs, DEMO_PASSWORD, shot, signIn } from './helpers';

async function siteId(api: APIRequestContext, name: string): Promise<string> {
  const body = (await (await api.get(`/api/sites?q=${encodeURIComponent(name)}`)).json()) as { items: { id: string; name: string }[] };
  return body.items.find((s) => s.name === name)!.id;
}

async function newUnit(api: APIRequestContext, site: string, name: string): Promise<string> {
  const res = await api.post('/api/equipment', { data: { siteId: site, type: 'condensing_unit', name, nameplate: {} } });
  expect(res.status()).toBe(201);
  return ((await res.json()) as { id: string }).id;
}

test('the office prints blank tags; a technician claims one on site; the run counts it', async ({ page, browser, baseURL }, info) => {
  const unitName = `Claim test condensing unit ${info.project.name}`;
  await signIn(page, 'office@rimeline.test', DEMO_PASSWORD, '/tags');
  await page.getByRole('link', { name: 'New print run' }).click();
  await page.getByLabel('Blank tags for a site').check();
  await page.getByLabel('Site', { exact: true }).selectOption({ label: 'Pell Street Kitchen (Marrowgate Eatery Group)' });
  await page.getByLabel('How many blank tags').fill('3');
  await page.getByLabel('Label layout').selectOption('letter-30');
  await page.getByLabel('Start at label').fill('7');
  await page.getByRole('button', { name: 'Print blank tags' }).click();
  await expect(page.getByTestId('claimed-count')).toHaveText('0 of 3');
  const runUrl = page.url();
  const pdf = await page.request.get(`${runUrl.replace('/tags/runs/', '/api/print-runs/')}/pdf`);
  expect(pdf.headers()['content-type']).toBe('application/pdf');
  expect((await pdf.body()).subarray(0, 5).toString()).toBe('%PDF-');
  const code = (await page.locator('tbody tr td').first().innerText()).replace(/-/g, '');
  await newUnit(page.request, await siteId(page.request, 'Pell Street Kitchen'), unitName);
  await shot(page, 'tags-print-run');

  const techContext = await browser.newContext({ baseURL });
  const tech = await techContext.newPage();
  await signIn(tech, 'tech@rimeline.test');
  // What the QR symbol holds: the upper-case URL.
  await tech.goto(`/T/${code}`);
  await expect(tech).toHaveURL(new RegExp(`/scan/${code}$`));
  await expect(tech.getByRole('heading', { name: `Attach tag ${formatCode(code)}` })).toBeVisible();
  await tech.getByLabel('Find equipment').fill('claim test');
  await tech.getByRole('radio', { name: new RegExp(unitName) }).check();
  await shot(tech, 'tags-claim-flow');
  await tech.getByRole('button', { name: `Attach tag to ${unitName}` }).click();
  await expect(tech.getByRole('heading', { name: unitName })).toBeVisible();
  await expect(tech.getByTestId('current-tag-code')).toHaveText(formatCode(code));
  // The same tag now opens the equipment straight away, and that scan is the unit's last.
  await tech.goto(`/T/${code}`);
  await expect(tech.getByRole('heading', { name: unitName })).toBeVisible();
  await expect(tech.getByTestId('last-scanned')).toContainText('by Tomas Rivane (phone camera link');
  await shot(tech, 'tags-equipment-panel');
  await techContext.close();

  await page.goto(runUrl);
  await expect(page.getByTestId('claimed-count')).toHaveText('1 of 3');
});

test('another company’s tag shows the same not-found page as an unknown code', async ({ page }) => {
  const db = createTestDb();
  let theirs: string;
  try {
    const company = await db.insertInto('companies').values({ name: 'Elsewhere Cooling Co' }).returning('id').executeTakeFirstOrThrow();
    theirs = generateCode();
    await db.insertInto('tags').values({ company_id: company.id, code: theirs, state: 'blank' }).execute();
  } finally {
    await db.destroy();
  }
  let unknown = generateCode();
  while (unknown === theirs) unknown = generateCode();
  await signIn(page, 'office@rimeline.test');
  const texts: string[] = [];
  for (const code of [theirs, unknown]) {
    const res = await page.goto(`/T/${code}`);
    expect(res?.status()).toBe(404);
    await expect(page.getByRole('heading', { name: 'Not found' })).toBeVisible();
    texts.push(await page.locator('main').innerText());
  }
  expect(texts[0]).toBe(texts[1]);
  expect(texts[0]).not.toContain('Elsewhere');
});

test('signed out, a tag only says the unit is registered; sign-in returns to it', async ({ page, baseURL }) => {
  const office = await apiAs(baseURL!, 'office@rimeline.test');
  const unitName = 'Signed-out test evaporator';
  const unit = await newUnit(office, await siteId(office, 'Orchard Row Bistro'), unitName);
  const created = await office.post('/api/print-runs', { data: { kind: 'equipment', equipmentIds: [unit], layoutId: 'thermal-2x1' } });
  expect(created.status()).toBe(201);
  const runBody = (await (await office.get(`/api/print-runs/${((await created.json()) as { id: string }).id}`)).json()) as { tags: { code: string }[] };
  const code = runBody.tags[0]!.code;
  await office.dispose();

  await page.goto(`/T/${code}`);
  await expect(page.getByRole('heading', { name: 'This unit is registered' })).toBeVisible();
  await expect(page.getByText(unitName)).toHaveCount(0);
  await expect(page.getByText('Orchard Row')).toHaveCount(0);
  await shot(page, 'tags-signed-out');
  await page.getByRole('link', { name: 'Sign in to open it' }).click();
  await page.getByLabel('E-mail').fill('owner@client-one.test');
  await page.getByLabel('Password').fill(DEMO_PASSWORD);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect(page).toHaveURL(new RegExp(`/equipment/${unit}$`));
  await expect(page.getByRole('heading', { name: unitName })).toBeVisible();
});

test('the Scan page checks a typed code as it is typed and opens the unit; a damaged tag is replaced @phone', async ({ page, baseURL }) => {
  const office = await apiAs(baseURL!, 'office@rimeline.test');
  const unitName = `Typed code test unit ${Date.now() % 100000}`;
  const unit = await newUnit(office, await siteId(office, 'Commissary'), unitName);
  const created = await office.post('/api/print-runs', { data: { kind: 'equipment', equipmentIds: [unit], layoutId: 'letter-30' } });
  const runId = ((await created.json()) as { id: string }).id;
  const code = ((await (await office.get(`/api/print-runs/${runId}`)).json()) as { tags: { code: string }[] }).tags[0]!.code;
  const blankRun = await office.post('/api/print-runs', { data: { kind: 'blank', siteId: await siteId(office, 'Commissary'), count: 1, layoutId: 'thermal-2x1' } });
  const spare = ((await (await office.get(`/api/print-runs/${((await blankRun.json()) as { id: string }).id}`)).json()) as { tags: { code: string }[] }).tags[0]!.code;
  await office.dispose();

  await signIn(page, 'tech@rimeline.test', DEMO_PASSWORD, '/scan');
  const input = page.getByLabel('Tag code');
  const open = page.getByRole('button', { name: 'Open' });
  // Two neighbours swapped: caught by the check character, nothing looked up.
  const swapped = code[1]! !== code[2]! ? code[0]! + code[2]! + code[1]! + code.slice(3) : code.slice(0, 8) + (code[8] === '0' ? '1' : '0');
  await input.fill(swapped.toLowerCase());
  await expect(page.getByText('This code does not add up')).toBeVisible();
  await expect(open).toBeDisabled();
  await input.fill(code.slice(0, 5));
  await expect(page.getByText('4 more characters to go.')).toBeVisible();
  await input.fill(formatCode(code).toLowerCase());
  await expect(page.getByText('Code checks out.')).toBeVisible();
  const box = await open.boundingBox();
  expect(box!.height).toBeGreaterThanOrEqual(48);
  await shot(page, 'tags-scan-typed');
  await open.click();
  await expect(page.getByRole('heading', { name: unitName })).toBeVisible();
  await expect(page.getByTestId('last-scanned')).toContainText('typed code');

  // The tag is damaged: put the spare on and type its code; the old one is retired but still leads here.
  await page.getByRole('button', { name: 'Replace tag' }).click();
  await page.getByLabel('New tag code').fill(spare);
  await page.getByRole('button', { name: 'Replace', exact: true }).click();
  await expect(page.getByTestId('current-tag-code')).toHaveText(formatCode(spare));
  await page.goto(`/T/${code}`);
  await expect(page.getByText('This tag was retired')).toBeVisible();
  await shot(page, `tags-retired-${test.info().project.name}`);
  await page.getByRole('link', { name: `Open ${unitName}` }).click();
  await expect(page.getByRole('heading', { name: unitName })).toBeVisible();
});

test.describe('fake camera', () => {
  let unitName: string;
  let unitId: string;

  // The .y4m is written before the browser of this worker starts, from a label of a real print run.
  test.beforeAll(async () => {
    const baseURL = test.info().project.use.baseURL ?? 'http://localhost:3100';
    const office = await apiAs(baseURL, 'office@rimeline.test');
    unitName = `Camera test condensing unit ${Date.now() % 100000}`;
    unitId = await newUnit(office, await siteId(office, 'Pell Street Kitchen'), unitName);
    const created = await office.post('/api/print-runs', { data: { kind: 'equipment', equipmentIds: [unitId], layoutId: 'thermal-2x1' } });
    const id = ((await created.json()) as { id: string }).id;
    const pdf = await (await office.get(`/api/print-runs/${id}/pdf`)).body();
    await office.dispose();

    await writeFakeCameraFromLabel(pdf, fakeCameraFile);
  });

  test('scanning a label through the fake camera lands on the equipment @camera', async ({ page }) => {
    // Signed in straight onto the Scan page, which starts the rear camera by itself.
    await page.goto(`/sign-in?callbackUrl=${encodeURIComponent('/scan')}`);
    await page.getByLabel('E-mail').fill('tech@rimeline.test');
    await page.getByLabel('Password').fill(DEMO_PASSWORD);
    await page.getByRole('button', { name: 'Sign in' }).click();
    // The fake camera repeats one still frame; if the decoder misses it, a fresh start of the
    // Scan page (as a person would re-aim) gets a new go. Two tries at most within the limit.
    await page.waitForURL(/\/scan$|\/equipment\//);
    let attempt = 0;
    await expect(async () => {
      if (attempt++ > 0 && !/\/equipment\//.test(page.url())) await page.goto('/scan');
      await expect(page).toHaveURL(new RegExp(`/equipment/${unitId}$`), { timeout: 15_000 });
    }).toPass({ timeout: 45_000 });
    await expect(page.getByRole('heading', { name: unitName })).toBeVisible();
    await expect(page.getByTestId('last-scanned')).toContainText('Scan page');
  });
});
