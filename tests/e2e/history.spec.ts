import { randomUUID } from 'node:crypto';
import { expect, test, type APIRequestContext, type Locator } from '@playwright/test';
import { api, createCircuit } from '../helpers/visits';
import { asOffice, shot, signIn } from './helpers';

// A unit's history: newest first, grouped by visit, filtered by kind, more pages loaded as the
// list scrolls (or with the button, by keyboard); the system page merges its equipment.

const minute = 60_000;

async function visitWith(request: APIRequestContext, siteId: string, startedAt: Date, entries: { equipmentId: string; kind: string; data: unknown; at: Date }[]) {
  const visit = await api<{ id: string }>(request, 'POST', '/api/visits', { siteId, reason: 'maintenance', startedAt: startedAt.toISOString() });
  for (const e of entries) {
    await api(request, 'POST', `/api/visits/${visit.id}/entries`, { equipmentId: e.equipmentId, clientEntryId: randomUUID(), recordedAt: e.at.toISOString(), kind: e.kind, data: e.data });
  }
  await api(request, 'POST', `/api/visits/${visit.id}/close`, { summary: 'Maintenance done.' });
  return visit.id;
}

async function recordedTimes(list: Locator): Promise<string[]> {
  return list.locator('[data-entry-kind] time').evaluateAll((els) => els.map((e) => e.getAttribute('datetime') ?? ''));
}

test('history is newest first, grouped by visit, filtered by kind, and loads older pages on scroll', async ({ page }, info) => {
  test.setTimeout(240_000);
  const label = `H${String(Date.now()).slice(-5)}`;
  const circuit = await asOffice(info.project.use.baseURL, (office) => createCircuit(office, 'Quarry Road Market', label));

  await signIn(page, 'tech@rimeline.test');
  const cu = circuit.condensingUnit.id;
  const a0 = new Date(Date.now() - 3 * 24 * 60 * minute);
  const b0 = new Date(Date.now() - 24 * 60 * minute);
  const older = await visitWith(
    page.request,
    circuit.site.id,
    a0,
    Array.from({ length: 20 }, (_, i) => ({ equipmentId: cu, kind: 'note', data: { text: `Older visit note ${String(i + 1).padStart(2, '0')}` }, at: new Date(a0.getTime() + (i + 1) * minute) })),
  );
  const reading = (suction: number) => ({ suctionKpaG: suction, dischargeKpaG: 1700, suctionLineC: 2, liquidLineC: 35, boxC: 3 });
  const newer = await visitWith(page.request, circuit.site.id, b0, [
    ...Array.from({ length: 10 }, (_, i) => ({ equipmentId: cu, kind: 'note', data: { text: `Newer visit note ${String(i + 1).padStart(2, '0')}` }, at: new Date(b0.getTime() + (i + 1) * minute) })),
    { equipmentId: cu, kind: 'reading', data: reading(250), at: new Date(b0.getTime() + 11 * minute) },
    { equipmentId: cu, kind: 'reading', data: reading(260), at: new Date(b0.getTime() + 12 * minute) },
    { equipmentId: circuit.evaporator.id, kind: 'note', data: { text: `Evaporator coil cleaned ${label}` }, at: new Date(b0.getTime() + 13 * minute) },
  ]);

  await page.goto(`/equipment/${cu}`);
  const list = page.getByRole('list', { name: 'History, newest first' });
  const entries = list.locator('[data-entry-kind]');
  await expect(entries).toHaveCount(25);
  // Newest first: the later visit's group leads, its last reading on top; the evaporator's note is not here.
  const groups = list.locator('[data-visit-group]');
  await expect(groups.first()).toHaveAttribute('data-visit-group', newer);
  await expect(entries.first()).toHaveAttribute('data-entry-kind', 'reading');
  await expect(list.getByText(`Evaporator coil cleaned ${label}`)).toHaveCount(0);
  // The first frame waits for the newest entry: a render-blocking link in the head names it.
  await expect(page.locator('head link[rel="expect"][blocking="render"]')).toHaveAttribute('href', '#newest-entry');
  await expect(entries.first()).toHaveAttribute('id', 'newest-entry');
  const firstPage = await recordedTimes(list);
  expect(firstPage).toEqual([...firstPage].sort().reverse());
  await shot(page, `history-first-page-${info.project.name}`);

  // Scrolling to the end loads the rest: the older visit's first notes, then the start.
  await entries.last().scrollIntoViewIfNeeded();
  await page.mouse.wheel(0, 4000);
  await expect(entries).toHaveCount(32);
  await expect(page.getByText('Start of the history.')).toBeVisible();
  await expect(groups.last()).toHaveAttribute('data-visit-group', older);
  await expect(entries.last()).toContainText('Older visit note 01');
  const all = await recordedTimes(list);
  expect(all).toEqual([...all].sort().reverse());
  expect(new Set(all).size).toBe(32);
  // The list the browser now shows (all pages) never repeats the newest entry's id.
  expect(await page.locator('#newest-entry').count()).toBeLessThanOrEqual(1);

  // Filter by kind: only the two readings.
  await page.getByRole('button', { name: 'Readings' }).click();
  await expect(page.getByRole('button', { name: 'Readings' })).toHaveAttribute('aria-pressed', 'true');
  await expect(entries).toHaveCount(2);
  expect(await entries.evaluateAll((els) => els.map((e) => e.getAttribute('data-entry-kind')))).toEqual(['reading', 'reading']);

  // The same readings plotted over time.
  await page.getByText('Show the values as a table').click();
  await expect(page.getByTestId('reading-chart')).toBeVisible();
  await expect(page.getByRole('table').locator('tbody tr')).toHaveCount(2);

  // Without IntersectionObserver the button alone loads more, by keyboard.
  await page.addInitScript(() => {
    // @ts-expect-error -- removed on purpose for this check
    delete window.IntersectionObserver;
  });
  await page.reload();
  await page.getByRole('button', { name: 'Note', exact: true }).click();
  await expect(entries).toHaveCount(25);
  await entries.last().scrollIntoViewIfNeeded();
  await expect(entries).toHaveCount(25);
  const more = page.getByRole('button', { name: 'Load older entries' });
  await more.focus();
  await page.keyboard.press('Enter');
  await expect(entries).toHaveCount(30);
  await expect(page.getByText('Start of the history.')).toBeVisible();

  // The system's page merges the history of its equipment, naming the unit of each entry.
  await page.goto(`/systems/${circuit.systemId}`);
  const merged = page.getByRole('list', { name: 'History, newest first' });
  await expect(merged.locator('[data-entry-kind]').first()).toContainText(`Evaporator coil cleaned ${label}`);
  await expect(merged.locator('[data-entry-kind]').first().getByRole('link', { name: circuit.evaporator.name })).toBeVisible();
  await expect(merged.locator('[data-entry-kind]').nth(1).getByRole('link', { name: circuit.condensingUnit.name })).toBeVisible();
});
