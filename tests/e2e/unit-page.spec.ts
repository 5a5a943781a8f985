// The unit page a scanned tag opens, phone first: the first 740 px hold the header, the role's
// main action and the history's newest entry; removed units are shown apart, with their removal
// date and what replaced them, and are never offered for new things. Names are invented.
import { randomUUID } from 'node:crypto';
import { expect, test, type APIRequestContext, type Page } from '@playwright/test';
import { createTestDb } from '../helpers/db';
import { siteLike } from '../helpers/sites';
import path from 'node:path';
import { apiAs, ok, screenshotDir, shot, signIn } from './helpers';

const PSI = 6.894757; // kPa per psi (NIST SP 811, B.8)
const FIRST_SCREEN = 740;

async function siteNamed(api: APIRequestContext, name: string): Promise<{ id: string; timeZone: string }> {
  const body = await ok<{ items: { id: string; name: string; timeZone: string }[] }>(api.get(`/api/sites?q=${encodeURIComponent(name)}`));
  return body.items.find((s) => s.name === name)!;
}

async function tagFor(office: APIRequestContext, equipmentId: string): Promise<string> {
  const run = await ok<{ id: string }>(office.post('/api/print-runs', { data: { kind: 'equipment', equipmentIds: [equipmentId], layoutId: 'thermal-2x1' } }));
  return (await ok<{ tags: { code: string }[] }>(office.get(`/api/print-runs/${run.id}`))).tags[0]!.code;
}

/** A dual pressure control with its settings on the nameplate and two closed visits of history. */
async function unitWithHistory(baseURL: string, label: string) {
  const office = await apiAs(baseURL, 'office@rimeline.test');
  const tech = await apiAs(baseURL, 'tech@rimeline.test');
  // Its own site: the visits made here never meet one another spec left open at a demo site.
  const site = (await siteLike(office, 'Pell Street Kitchen', label)).id;
  const unit = await ok<{ id: string; name: string }>(
    office.post('/api/equipment', {
      data: {
        siteId: site,
        type: 'pressure_control',
        name: `Freezer dual pressure control ${label}`,
        make: 'Kelvrin',
        condition: 3,
        nameplate: { controlKind: 'dual', lowCutInKpa: 20 * PSI, lowDifferentialKpa: 15 * PSI, highCutOutKpa: 400 * PSI, highDifferentialKpa: 100 * PSI },
      },
    }),
  );
  const day = 24 * 3600_000;
  for (const [i, text] of [`Older check ${label}`, `Newest check ${label}`].entries()) {
    const startedAt = new Date(Date.now() - (2 - i) * day);
    const visit = await ok<{ id: string }>(tech.post('/api/visits', { data: { siteId: site, reason: 'maintenance', startedAt: startedAt.toISOString() } }));
    for (let n = 0; n < 3; n++) {
      await ok(tech.post(`/api/visits/${visit.id}/entries`, { data: { kind: 'note', equipmentId: unit.id, clientEntryId: randomUUID(), recordedAt: new Date(startedAt.getTime() + n * 60_000).toISOString(), data: { text: `Note ${n + 1} of ${text}` } } }));
    }
    if (i === 1) {
      await ok(
        tech.post(`/api/visits/${visit.id}/entries`, {
          data: { kind: 'finding', equipmentId: unit.id, clientEntryId: randomUUID(), recordedAt: new Date(startedAt.getTime() + 5 * 60_000).toISOString(), data: { text: text, severity: 'minor', raiseFollowUp: true, followUpTitle: `Recheck ${label}` } },
        }),
      );
    }
    await ok(tech.post(`/api/visits/${visit.id}/close`, { data: { summary: `Maintenance ${label}.` } }));
  }
  const code = await tagFor(office, unit.id);
  return { office, tech, site, unit, code };
}

/** The History section and its newest entry, which must end within the first screen. */
async function expectNewestEntryOnFirstScreen(page: Page, newestText: string) {
  const history = page.getByRole('region', { name: 'History', exact: true });
  await expect(history.getByRole('heading', { name: 'History', exact: true })).toBeVisible();
  const newest = history.locator('article').first();
  await expect(newest).toContainText(newestText);
  // Read where it sits before anything scrolls: the page is at its top after the scan's redirect.
  expect(await page.evaluate(() => window.scrollY)).toBe(0);
  const box = await newest.boundingBox();
  expect(box).not.toBeNull();
  expect(box!.y + box!.height).toBeLessThanOrEqual(FIRST_SCREEN);
}

test('a scanned tag opens the unit with its settings, main action and newest history on the first screen, for a technician @phone', async ({ page, baseURL }, info) => {
  test.setTimeout(180_000);
  const label = `U${String(Date.now()).slice(-5)}`;
  const { office, tech, site, unit, code } = await unitWithHistory(baseURL!, label);
  await signIn(page, 'tech@rimeline.test');
  await page.goto(`/T/${code}`);
  await expect(page).toHaveURL(new RegExp(`/equipment/${unit.id}$`));
  await expect(page.getByRole('heading', { level: 1, name: unit.name })).toBeVisible();
  await expectNewestEntryOnFirstScreen(page, `Newest check ${label}`);

  // The header: the settings read in psig, rounded; the tag; one open follow-up; the last visit.
  const settings = page.getByTestId('current-settings');
  await expect(settings.getByRole('columnheader')).toHaveText(['cut-in', 'cut-out', 'differential']);
  await expect(settings.getByRole('row').filter({ hasText: 'Low side' }).getByRole('cell')).toHaveText(['20 psig', '5 psig', '15 psi']);
  await expect(settings.getByRole('row').filter({ hasText: 'High side' }).getByRole('cell')).toHaveText(['300 psig', '400 psig', '100 psi']);
  await expect(page.getByTestId('unit-facts')).toContainText('1 open follow-up');
  await expect(page.getByTestId('unit-facts')).toContainText('Last visit');
  await expect(page.getByTestId('header-tag-code')).toContainText(code.slice(0, 3));
  const actions = page.locator('[data-slot="unit-actions"]');
  const log = actions.getByRole('link', { name: 'Log a visit on this unit' });
  await expect(log).toBeVisible();
  const logBox = await log.boundingBox();
  expect(logBox!.y + logBox!.height).toBeLessThanOrEqual(FIRST_SCREEN);
  expect(logBox!.height).toBeGreaterThanOrEqual(44);
  // Editing tools wait until asked for.
  await expect(page.getByRole('link', { name: 'Edit' })).toBeHidden();
  await expect(page.getByLabel('Other equipment on this site')).toBeHidden();
  await shot(page, `unit-page-technician-${info.project.name}`);
  await page.screenshot({ path: path.join(screenshotDir, `unit-page-technician-first-screen-${info.project.name}.png`) });

  // With a visit open at this site, the same place continues it, on this unit.
  const open = await ok<{ id: string }>(tech.post('/api/visits', { data: { siteId: site, reason: 'no_cooling' } }));
  try {
    await page.reload();
    const cont = actions.getByRole('link', { name: 'Continue visit' });
    await expect(cont).toHaveAttribute('href', `/visits/${open.id}?equipment=${unit.id}`);
    await expect(actions.getByRole('link', { name: /Log a visit/ })).toHaveCount(0);
  } finally {
    await ok(tech.post(`/api/visits/${open.id}/close`, { data: { summary: 'Nothing found.' } }));
  }
  await office.dispose();
  await tech.dispose();
});

test('a scanned tag opens the unit with “Ask for service” and the newest history on the first screen, for an owner @phone', async ({ page, baseURL }, info) => {
  test.setTimeout(180_000);
  const label = `O${String(Date.now()).slice(-5)}`;
  const { office, tech, unit, code } = await unitWithHistory(baseURL!, label);
  await signIn(page, 'owner@client-one.test');
  await page.goto(`/T/${code}`);
  await expect(page).toHaveURL(new RegExp(`/equipment/${unit.id}$`));
  await expectNewestEntryOnFirstScreen(page, `Newest check ${label}`);
  const ask = page.locator('[data-slot="unit-actions"]').getByRole('link', { name: 'Ask for service' });
  await expect(ask).toBeVisible();
  const box = await ask.boundingBox();
  expect(box!.y + box!.height).toBeLessThanOrEqual(FIRST_SCREEN);
  await expect(page.getByRole('link', { name: /Log a visit/ })).toHaveCount(0);
  await expect(page.getByTestId('unit-manage')).toHaveCount(0);
  await shot(page, `unit-page-owner-${info.project.name}`);
  await page.screenshot({ path: path.join(screenshotDir, `unit-page-owner-first-screen-${info.project.name}.png`) });
  await office.dispose();
  await tech.dispose();
});

test('a removed unit is shown apart with its removal date and replacement, and is never offered for new things @phone', async ({ page, baseURL }, info) => {
  test.setTimeout(180_000);
  const label = `R${String(Date.now()).slice(-5)}`;
  const name = `Freezer compressor contactor ${label}`;
  const office = await apiAs(baseURL!, 'office@rimeline.test');
  const { id: site, timeZone } = await siteNamed(office, 'Pell Street Kitchen');
  const old = await ok<{ id: string }>(office.post('/api/equipment', { data: { siteId: site, type: 'contactor', name, serial: `OLD-${label}`, nameplate: {} } }));
  const current = await ok<{ id: string }>(office.post('/api/equipment', { data: { siteId: site, type: 'contactor', name, serial: `NEW-${label}`, nameplate: {} } }));
  const removed = await ok<{ removedAt: string | null }>(office.patch(`/api/equipment/${old.id}`, { data: { status: 'removed' } }));
  expect(removed.removedAt).not.toBeNull();
  // What the visit's replace path records beside the status.
  const db = createTestDb();
  try {
    await db.updateTable('equipment').set({ replaced_by_id: current.id }).where('id', '=', old.id).execute();
  } finally {
    await db.destroy();
  }
  const removedOn = new Intl.DateTimeFormat('en-US', { year: 'numeric', month: 'short', day: 'numeric', timeZone }).format(new Date(removed.removedAt!));

  await signIn(page, 'office@rimeline.test');
  // The site page: the current unit among the current ones, the old one only under "Removed".
  await page.goto(`/sites/${site}`);
  const equipmentSection = page.getByRole('region', { name: 'Equipment', exact: true });
  const removedGroup = page.getByTestId('site-removed-equipment');
  await expect(equipmentSection.locator('li').filter({ hasText: `OLD-${label}` })).toHaveCount(1);
  await expect(removedGroup.locator('li').filter({ hasText: `OLD-${label}` })).toHaveCount(1);
  await expect(removedGroup.locator('li').filter({ hasText: `NEW-${label}` })).toHaveCount(0);
  await removedGroup.locator('summary').click();
  const oldRow = removedGroup.locator('li').filter({ hasText: `OLD-${label}` });
  await expect(oldRow.getByTestId('removal-line')).toContainText(`Removed ${removedOn} · replaced by ${name}`);
  await expect(oldRow.getByTestId('removal-line').getByRole('link', { name })).toHaveAttribute('href', `/equipment/${current.id}`);
  await oldRow.scrollIntoViewIfNeeded();
  await shot(page, `unit-removed-site-${info.project.name}`);

  // The removed unit's own page says so first, with a link to what replaced it; no new visit starts there.
  await page.goto(`/equipment/${old.id}`);
  const notice = page.getByTestId('removed-notice');
  await expect(notice).toHaveText(`Removed on ${removedOn}, replaced by ${name}.`);
  const noticeBox = await notice.boundingBox();
  expect(noticeBox!.y).toBeLessThan(300);
  await expect(page.getByRole('link', { name: /Log a visit/ })).toHaveCount(0);
  await expect(page.getByTestId('equipment-tag-panel').getByRole('button')).toHaveCount(0);
  await shot(page, `unit-removed-page-${info.project.name}`);
  await notice.getByRole('link', { name }).click();
  await expect(page).toHaveURL(new RegExp(`/equipment/${current.id}$`));
  await expect(page.getByTestId('removed-notice')).toHaveCount(0);

  // The equipment table: the current unit only, until "Removed" is chosen.
  await page.goto(`/equipment?q=${label}`);
  await expect(page.getByText(`1 shown for “${label}”.`)).toBeVisible();
  await expect(page.getByText(`OLD-${label}`)).toHaveCount(0);
  await page.getByRole('button', { name: 'Removed', exact: true }).click();
  await expect(page).toHaveURL(/removed=only/);
  await expect(page.getByText(`1 shown for “${label}”.`)).toBeVisible();
  await expect(page.getByText(`NEW-${label}`)).toHaveCount(0);
  await expect(page.getByTestId('removal-line').filter({ visible: true })).toContainText(`replaced by ${name}`);
  await shot(page, `unit-removed-table-${info.project.name}`);

  // Pickers for new things: the relation editor and an owner's service request.
  await page.goto(`/equipment/${current.id}`);
  await page.getByText('Change connections').click();
  const other = page.getByLabel('Other equipment on this site');
  await expect(other).toBeEnabled();
  await expect(other.locator(`option[value="${current.id}"]`)).toHaveCount(0);
  await expect(other.locator(`option[value="${old.id}"]`)).toHaveCount(0);
  expect(await other.locator('option').count()).toBeGreaterThan(0);

  const owner = await apiAs(baseURL!, 'owner@client-one.test');
  const choices = await ok<{ items: { id: string }[] }>(owner.get(`/api/equipment?siteId=${site}&limit=200&sort=name`));
  expect(choices.items.map((e) => e.id)).toContain(current.id);
  expect(choices.items.map((e) => e.id)).not.toContain(old.id);
  await owner.dispose();
  await office.dispose();
});
