// Owner view: summaries and attention from real records, report contents against the data,
// service requests reaching the office's inbox, and every owner route scoped to the owner's sites.
import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { execFileSync } from 'node:child_process';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { needsAttention } from '@/lib/attention/service';
import { deliverDueMail } from '@/lib/mail/outbox';
import { chartData, siteSummaries } from '@/lib/overview/service';
import { medianServiceLife, type EquipmentType } from '@/lib/calc/service-life';
import { createRequest, listRequests } from '@/lib/requests/service';
import { refrigerantReport, reportFile, siteEquipmentReport } from '@/lib/reports/service';
import { closeVisit } from '@/lib/visits/close';
import { addEntry } from '@/lib/visits/entries';
import { startVisit } from '@/lib/visits/service';
import type { Actor } from '@/lib/auth/actor';
import { actorFor, createTestDb, demoEmails } from '@/tests/helpers/db';
import { clearMail, waitForMail } from '@/tests/helpers/mail';
import { demoWithCircuit, type CoolerCircuit } from '@/tests/helpers/registry';
import { call, mockAuthModule, session } from '@/tests/helpers/session';

vi.mock('@/lib/auth', () => mockAuthModule());

const db = createTestDb();
let tech: Actor;
let office: Actor;
let owner: Actor;
let stranger: Actor;
let circuit: CoolerCircuit;
const lb = 0.45359237;
const entry = <T extends object>(equipmentId: string, body: T) => ({ equipmentId, clientEntryId: randomUUID(), ...body });

beforeAll(async () => {
  ({ tech, office, owner, circuit } = await demoWithCircuit(db));
  stranger = await actorFor(db, demoEmails.clientTwo);
  await db.updateTable('equipment').set({ installed_on: '2001-05-01', condition: 2 }).where('id', '=', circuit.condensingUnitId).execute();
  const visit = await startVisit(tech, { siteId: circuit.siteId, reason: 'no_cooling', startedAt: new Date(Date.now() - 20 * 86_400_000).toISOString() });
  await addEntry(tech, visit.id, entry(circuit.condensingUnitId, { kind: 'refrigerant' as const, recordedAt: new Date(Date.now() - 20 * 86_400_000).toISOString(), data: { direction: 'added' as const, amountKg: 2 * lb, refrigerant: 'R-404A' as const, cylinderId: 'CYL-0007', technicianCert: 'UNIV-5531' } }));
  await addEntry(tech, visit.id, entry(circuit.evaporatorId, { kind: 'finding' as const, data: { text: 'Heater wire exposed at drain line', severity: 'safety' as const, raiseFollowUp: true } }));
  await addEntry(tech, visit.id, entry(circuit.evaporatorId, { kind: 'condition' as const, data: { rating: 4 } }));
  await closeVisit(tech, visit.id, { summary: 'Added charge, found heater wire.', confirmBypassRemoved: false });
  const second = await startVisit(tech, { siteId: circuit.siteId, reason: 'no_cooling', startedAt: new Date(Date.now() - 2 * 86_400_000).toISOString() });
  // 30 lb into a 100 lb charge 18 days after the last addition: far over the 20 % threshold.
  await addEntry(tech, second.id, entry(circuit.condensingUnitId, { kind: 'refrigerant' as const, recordedAt: new Date(Date.now() - 2 * 86_400_000).toISOString(), data: { direction: 'added' as const, amountKg: 30 * lb, refrigerant: 'R-404A' as const } }));
  await addEntry(tech, second.id, entry(circuit.evaporatorId, { kind: 'condition' as const, data: { rating: 2 } }));
  await closeVisit(tech, second.id, { summary: 'Leak search booked.', confirmBypassRemoved: false });
});
afterAll(async () => {
  await db.destroy();
});

describe('owner view', () => {
  it('summarises each site from its records', async () => {
    const summaries = await siteSummaries(owner);
    expect(summaries.map((s) => s.siteName).sort()).toEqual(['Commissary', 'Orchard Row Bistro', 'Pell Street Kitchen']);
    const pell = summaries.find((s) => s.siteName === 'Pell Street Kitchen')!;
    expect(pell.equipmentCount).toBe(4);
    expect(pell.byCondition[2]).toBe(2);
    expect(pell.byCondition.unrated).toBe(2);
    expect(pell.openFollowUps.safety).toBe(1);
    expect(pell.systemsOverLeakThreshold).toBe(1);
    expect(pell.pastExpectedLife).toBe(1);
    expect(pell.lastVisitAt).not.toBeNull();
  });

  it('counts conditions and ranks the oldest units in SQL as the unit rows say', async () => {
    // The charts are aggregated in the database; here the same figures from every unit row.
    const today = new Date('2026-06-15T12:00:00Z');
    const charts = await chartData(owner, null, db, today);
    const units = await db
      .selectFrom('equipment')
      .innerJoin('sites', 'sites.id', 'equipment.site_id')
      .innerJoin('clients', 'clients.id', 'sites.client_id')
      .where('sites.client_id', '=', owner.clientId!)
      .where('equipment.deleted_at', 'is', null)
      .where('equipment.status', '<>', 'removed')
      .select(['equipment.name', 'equipment.type', 'equipment.condition', 'equipment.installed_on'])
      .execute();
    const summed = Object.fromEntries(charts.conditionDistribution.map((c) => [c.rating, c.count]));
    expect(summed['2 poor']).toBe(units.filter((u) => u.condition === 2).length);
    expect(summed['not rated']).toBe(units.filter((u) => !u.condition).length);
    expect(charts.conditionDistribution.reduce((n, c) => n + c.count, 0)).toBe(units.length);
    const expected = units
      .filter((u) => u.installed_on && medianServiceLife(u.type as EquipmentType))
      .map((u) => {
        const age = (today.getTime() - Date.parse(`${u.installed_on}T00:00:00Z`)) / (365.25 * 86_400_000);
        return { name: u.name, ageYears: Math.round(age * 10) / 10, medianYears: medianServiceLife(u.type as EquipmentType)!.medianYears, ratio: age / medianServiceLife(u.type as EquipmentType)!.medianYears };
      })
      .sort((a, b) => b.ratio - a.ratio || a.name.localeCompare(b.name))
      .slice(0, 40)
      .map(({ ratio: _ratio, ...rest }) => rest);
    expect(expected.length).toBeGreaterThan(0);
    // Same units and figures; equal ratios may come in either order (collation), so compare sorted.
    const byName = (a: { name: string; ageYears: number }, b: { name: string; ageYears: number }) => a.name.localeCompare(b.name) || a.ageYears - b.ageYears;
    expect([...charts.ageVsLife].sort(byName)).toEqual([...expected].sort(byName));
    // Oldest for its expected life first (ages are rounded to 0.1 year, hence the allowance).
    for (let i = 1; i < charts.ageVsLife.length; i++) {
      const [a, b] = [charts.ageVsLife[i - 1]!, charts.ageVsLife[i]!];
      expect(a.ageYears / a.medianYears).toBeGreaterThanOrEqual(b.ageYears / b.medianYears - 0.05 / b.medianYears);
    }
  });

  it('ranks the units that need attention with their evidence', async () => {
    const ranked = await needsAttention(owner);
    expect(ranked.map((u) => u.equipmentName)).toEqual(['Cooler evaporator', 'Cooler condensing unit']);
    const evaporator = ranked[0]!;
    expect(evaporator.reasons.map((r) => r.kind)).toEqual(['open_safety_finding', 'repeat_no_cooling', 'condition_worsening']);
    const unit = ranked[1]!;
    expect(unit.reasons.map((r) => r.kind)).toEqual(['leak_over_threshold', 'repeat_no_cooling', 'past_expected_life']);
    expect(unit.reasons[0]!.href).toMatch(/^\/visits\//);
    expect(await needsAttention(stranger)).toEqual([]);
  });

  it('the refrigerant report lists each transaction with its leak rate, and its PDF says the same', async () => {
    const year = new Date(Date.now() - 2 * 86_400_000).getUTCFullYear();
    const report = await refrigerantReport(owner, circuit.systemId, year, { units: 'imperial', metricPressure: 'kPa' });
    const firstYear = new Date(Date.now() - 20 * 86_400_000).getUTCFullYear();
    const expectedRows = firstYear === year ? 2 : 1;
    expect(report.rows).toHaveLength(expectedRows);
    const last = report.rows.at(-1)!;
    expect(last[1]).toBe('Added');
    expect(last[2]).toBe('30 lb');
    expect(last[7]).toMatch(/OVER/);
    expect(report.facts.find(([k]) => k === 'Full charge')![1]).toBe('100 lb');
    const csv = (await reportFile(report, 'csv', 'r')).body as string;
    expect(csv).toContain('# Full charge,100 lb');
    const pdf = (await reportFile(report, 'pdf', 'r')).body as Uint8Array;
    const dir = mkdtempSync(path.join(tmpdir(), 'rl-report-'));
    writeFileSync(path.join(dir, 'r.pdf'), pdf);
    const text = execFileSync('pdftotext', ['-layout', path.join(dir, 'r.pdf'), '-']).toString();
    expect(text).toContain('Refrigerant report');
    expect(text).toContain('30 lb');
  });

  it('the site equipment report holds every unit with age, expected life and condition', async () => {
    const report = await siteEquipmentReport(owner, circuit.siteId, undefined, new Date('2026-12-01T00:00:00Z'));
    expect(report.rows).toHaveLength(4);
    const unit = report.rows.find((r) => r[0] === 'Cooler condensing unit')!;
    // ASHRAE median for reciprocating compressors/condensing units: 20 years; installed 2001-05-01.
    expect(unit[7]).toBe('25.6');
    expect(unit[8]).toBe('20');
    expect(unit[10]).toBe('2 Poor');
    await expect(siteEquipmentReport(stranger, circuit.siteId)).rejects.toMatchObject({ code: 'not_found' });
  });

  it('a service request reaches the office by e-mail and the queue; the owner sees its status', async () => {
    await clearMail();
    const request = await createRequest(owner, { siteId: circuit.siteId, equipmentId: circuit.evaporatorId, description: 'Box reads 48 °F since this morning', urgency: 'emergency' });
    await deliverDueMail();
    const mail = await waitForMail('office@rimeline.test');
    expect(mail.subject).toBe('EMERGENCY — Service request: Cooler evaporator at Pell Street Kitchen');
    expect(mail.text).toContain('Box reads 48 °F since this morning');
    expect((await listRequests(office, { limit: 10 })).map((r) => r.id)).toContain(request.id);
    expect((await listRequests(owner, { limit: 10 })).map((r) => r.status)).toEqual(['new']);
    expect(await listRequests(stranger, { limit: 10 })).toEqual([]);
    await expect(createRequest(stranger, { siteId: circuit.siteId, description: 'x', urgency: 'routine' })).rejects.toMatchObject({ code: 'not_found' });
  });
});

describe('owner routes are scoped', () => {
  it('another client’s owner gets nothing of this site on every owner route', async () => {
    session.actor = stranger;
    const q = `siteId=${circuit.siteId}`;
    const attention = await import('@/app/api/overview/attention/route');
    const charts = await import('@/app/api/overview/charts/route');
    const sites = await import('@/app/api/overview/sites/route');
    const siteReport = await import('@/app/api/reports/site-equipment/route');
    const refrigerant = await import('@/app/api/reports/refrigerant/route');
    const requests = await import('@/app/api/requests/route');
    const due = await import('@/app/api/overview/due/route');
    expect((await call(attention.GET as never, { path: `/api/overview/attention?${q}` })).body).toMatchObject({ items: [] });
    const chartBody = (await call(charts.GET as never, { path: `/api/overview/charts?${q}` })).body as { conditionDistribution: { count: number }[]; refrigerantAddedByYear: unknown[] };
    expect(chartBody.conditionDistribution.every((c) => c.count === 0)).toBe(true);
    expect(chartBody.refrigerantAddedByYear).toEqual([]);
    const siteNames = ((await call(sites.GET as never)).body as { items: { siteName: string }[] }).items.map((s) => s.siteName);
    expect(siteNames.sort()).toEqual(['Linden Avenue Market', 'Quarry Road Market']);
    expect((await call(siteReport.GET as never, { path: `/api/reports/site-equipment?${q}&format=csv` })).status).toBe(404);
    expect((await call(refrigerant.GET as never, { path: `/api/reports/refrigerant?systemId=${circuit.systemId}&year=2026&format=pdf` })).status).toBe(404);
    expect((await call(requests.POST as never, { method: 'POST', json: { siteId: circuit.siteId, description: 'x', urgency: 'soon' } })).status).toBe(404);
    expect((await call(due.GET as never)).status).toBe(403);
  });

  it('the attention API pages through the ranked list', async () => {
    session.actor = owner;
    const route = await import('@/app/api/overview/attention/route');
    const first = (await call(route.GET as never, { path: '/api/overview/attention?limit=1' })).body as { total: number; items: { equipmentName: string }[]; nextCursor: string | null };
    expect(first).toMatchObject({ total: 2, nextCursor: expect.any(String) });
    expect(first.items.map((u) => u.equipmentName)).toEqual(['Cooler evaporator']);
    const second = (await call(route.GET as never, { path: `/api/overview/attention?limit=1&cursor=${first.nextCursor}` })).body as typeof first;
    expect(second).toMatchObject({ total: 2, nextCursor: null });
    expect(second.items.map((u) => u.equipmentName)).toEqual(['Cooler condensing unit']);
    // The pages are the whole list, in its order.
    const whole = (await call(route.GET as never, { path: '/api/overview/attention?limit=10' })).body as typeof first;
    expect(whole.items.map((u) => u.equipmentName)).toEqual(['Cooler evaporator', 'Cooler condensing unit']);
    const bad = await call(route.GET as never, { path: '/api/overview/attention?cursor=-4' });
    expect(bad.status).toBe(400);
  });

  it('the owner gets their own site’s reports as files', async () => {
    session.actor = owner;
    const siteReport = await import('@/app/api/reports/site-equipment/route');
    const res = await call(siteReport.GET as never, { path: `/api/reports/site-equipment?siteId=${circuit.siteId}&format=csv` });
    expect(res.status).toBe(200);
    expect(String(res.body)).toContain('Cooler condensing unit');
  });
});
