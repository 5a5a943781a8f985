// Planned visits, as the office, a technician and an owner use them: the office plans a visit
// from the due list and moves it, the technician starts it from their home, the owner sees it on
// the site page, and the client's contact gets the e-mails through the outbox.
import { expect, test, type Page } from '@playwright/test';
import { waitForMail } from '../helpers/mail';
import { siteLike } from '../helpers/sites';
import { apiAs, fillFields, shot, signIn } from './helpers';

const base = process.env.APP_URL ?? 'http://localhost:3100';
const ownerEmail = 'owner@client-one.test';

async function switchUser(page: Page, email: string): Promise<void> {
  await page.context().clearCookies();
  await signIn(page, email);
}

test('the office plans a visit from the due list and moves it; the technician starts it from home; the owner sees it on the site page; the contact is e-mailed @phone', async ({ page }, info) => {
  // Four people's pages and two e-mails in one journey: a busy machine needs more than the default minute.
  test.setTimeout(240_000);
  const office = await apiAs(test.info().project.use.baseURL ?? base, 'office@rimeline.test');
  const admin = await apiAs(test.info().project.use.baseURL ?? base, 'admin@rimeline.test');
  const tech = await apiAs(test.info().project.use.baseURL ?? base, 'tech@rimeline.test');
  // A site of its own for client one (so its contact is e-mailed and its owner sees it): the visit
  // this test starts and leaves open never blocks another spec's visit at a demo site.
  const site = await siteLike(office, 'Pell Street Kitchen', `${info.project.name} ${Date.now()}`);
  const siteName = site.name;
  // A new system with a 10-day interval: its first maintenance is due within the due list's 30 days.
  const systemName = `Plan cooler circuit ${info.project.name} ${Date.now()}`;
  const system = (await (await office.post('/api/systems', { data: { siteId: site.id, name: systemName, refrigerant: 'R-404A', application: 'commercial_refrigeration', maintenanceIntervalDays: 10 } })).json()) as { id: string };
  expect((await admin.patch('/api/company', { data: { mailVisitPlans: true } })).ok()).toBe(true);

  // The office: the due list offers to plan it.
  await signIn(page, 'office@rimeline.test');
  const dueRow = page.locator(`[data-due="${system.id}-maintenance"]`);
  await expect(dueRow).toContainText(systemName);
  await dueRow.getByRole('link', { name: 'Plan a visit' }).click();
  await expect(page.getByRole('heading', { name: 'Plan a visit', level: 1 })).toBeVisible();
  await expect(page.getByLabel('Reason')).toHaveValue('maintenance');
  await expect(page.getByRole('checkbox', { name: systemName })).toBeChecked();
  await page.getByLabel('Technician', { exact: true }).selectOption({ label: 'Tomas Rivane' });
  // The window the wrong way round is refused in words, and nothing is planned.
  await fillFields(page, { 'From (site time)': '11:00', 'To (site time)': '09:00' });
  await page.getByRole('button', { name: 'Plan this visit' }).click();
  await expect(page.getByText('The window must end after it starts.')).toBeVisible();
  await fillFields(page, { 'From (site time)': '08:00', 'To (site time)': '10:00' });
  await shot(page, `plans-new-${info.project.name}`);
  await page.getByRole('button', { name: 'Plan this visit' }).click();
  await page.waitForURL(/\/plans\?week=/);
  await expect(page.getByRole('status').filter({ hasText: 'Visit planned' })).toBeVisible();
  const planId = new URL(page.url()).searchParams.get('planned')!;
  const card = page.locator(`[data-plan="${planId}"]`);
  await expect(card).toContainText('8:00 AM – 10:00 AM');
  await expect(card).toContainText(siteName);
  await expect(card).toContainText('Planned');

  // The client's contact hears of it.
  const planned = await waitForMail(ownerEmail, 30_000, (m) => m.subject.startsWith('Visit planned:') && m.subject.includes(siteName) && (m.text ?? '').includes(systemName));
  expect(planned.text).toContain('Technician: Tomas Rivane');
  expect(planned.text).toContain('8:00 AM – 10:00 AM (site time)');

  // Moved to a later window, the same day: the card and a second e-mail say so.
  await card.getByRole('button', { name: 'Move' }).click();
  await card.getByLabel('To (site time)').fill('11:30');
  await card.getByRole('button', { name: 'Save the move' }).click();
  await expect(card).toContainText('8:00 AM – 11:30 AM');
  await shot(page, `plans-week-${info.project.name}`);
  const moved = await waitForMail(ownerEmail, 30_000, (m) => m.subject.startsWith('Planned visit moved:') && (m.text ?? '').includes(systemName));
  expect(moved.text).toMatch(/When: .*8:00 AM – 11:30 AM \(site time\)/);
  expect(moved.text).toMatch(/Was: .*8:00 AM – 10:00 AM \(site time\)/);

  // The due list now counts it as planned, not as due, and offers no second plan.
  await page.goto('/');
  await expect(dueRow).toContainText('Visit planned:');
  await expect(dueRow.getByRole('link', { name: 'Plan a visit' })).toHaveCount(0);
  await expect(page.getByRole('list', { name: 'Planned' }).locator(`[data-due="${system.id}-maintenance"]`)).toHaveCount(1);
  await shot(page, `plans-office-home-${info.project.name}`);

  // The technician: today's plan on the home, started from there.
  await switchUser(page, 'tech@rimeline.test');
  const mine = page.locator(`[data-plan="${planId}"]`);
  await expect(page.getByRole('heading', { name: 'Planned for you' })).toBeVisible();
  await expect(mine).toContainText('Today');
  await expect(mine).toContainText(siteName);
  await shot(page, `plans-tech-home-${info.project.name}`);
  await mine.getByRole('button', { name: 'Start this visit' }).click();
  await page.waitForURL(/\/visits\/[0-9a-f-]{36}/);
  const visitId = page.url().match(/\/visits\/([0-9a-f-]{36})/)![1];
  const plan = (await (await office.get(`/api/plans/${planId}`)).json()) as { status: string; visitId: string };
  expect(plan).toMatchObject({ status: 'started', visitId });
  await page.goto('/');
  await expect(page.locator(`[data-plan="${planId}"]`)).toHaveCount(0);

  // The owner: the site page shows the planned visit and its state.
  await switchUser(page, ownerEmail);
  await page.goto(`/sites/${site.id}`);
  const ownerCard = page.getByRole('region', { name: 'Planned visits' }).locator(`[data-plan="${planId}"]`);
  await expect(ownerCard).toContainText('8:00 AM – 11:30 AM');
  await expect(ownerCard).toContainText('Started');
  await expect(ownerCard).toContainText('Maintenance');
  await shot(page, `plans-owner-site-${info.project.name}`);

  expect((await admin.patch('/api/company', { data: { mailVisitPlans: false } })).ok()).toBe(true);
  await Promise.all([office.dispose(), admin.dispose(), tech.dispose()]);
});
