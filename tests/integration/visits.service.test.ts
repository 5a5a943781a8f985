// Visits through their services: computed values equal the calculations module's, leak-rate
// warning and deadline, follow-up lifecycle, history order and pages, bypass confirmation,
// one open visit per technician per site, idempotent saves, and the report by e-mail and PDF.
import { randomUUID } from 'node:crypto';
import { sql } from 'kysely';
import { describe, expect, it } from 'vitest';
import { computeReadings } from '@/lib/calc/readings';
import { lowPressureControl } from '@/lib/calc/pressure-controls';
import { voltageUnbalance } from '@/lib/calc/electrical';
import { getEquipment } from '@/lib/equipment/service';
import { listFollowUps, updateFollowUp } from '@/lib/follow-ups/service';
import { deliverDueMail } from '@/lib/mail/outbox';
import type { Actor } from '@/lib/auth/actor';
import { closeVisit, ensureVisitReport } from '@/lib/visits/close';
import { addEntry, voidEntry } from '@/lib/visits/entries';
import { equipmentHistory, systemHistory } from '@/lib/visits/history';
import { getVisit, reopenVisit, startVisit } from '@/lib/visits/service';
import { KPA_PER_PSI, fahrenheitToCelsius } from '@/lib/calc/units';
import { getObjectBytes, ensureBucket } from '@/storage/objects';
import { actorFor, createTestDb, demoEmails } from '@/tests/helpers/db';
import { clearMail, firstLink, waitForMail } from '@/tests/helpers/mail';
import { resetDemoWithCircuitEach, type CoolerCircuit } from '@/tests/helpers/registry';

const db = createTestDb();
let tech: Actor, office: Actor, circuit: CoolerCircuit;
resetDemoWithCircuitEach(db, (demo) => ({ tech, office, circuit } = demo));

const psig = (v: number) => v * KPA_PER_PSI;
const entry = <T extends object>(equipmentId: string, body: T) => ({ equipmentId, clientEntryId: randomUUID(), ...body });

describe('visits', () => {
  it('stores exactly the values the calculations module computes', async () => {
    const visit = await startVisit(tech, { siteId: circuit.siteId, reason: 'no_cooling' });
    const data = {
      suctionKpaG: psig(20),
      dischargeKpaG: psig(250),
      suctionLineC: fahrenheitToCelsius(30),
      liquidLineC: fahrenheitToCelsius(95),
      boxC: fahrenheitToCelsius(41),
      ambientC: fahrenheitToCelsius(90),
      voltsL1L2: 460,
      voltsL2L3: 467,
      voltsL1L3: 450,
      controlVolts: 23.8,
    };
    const saved = await addEntry(tech, visit.id, entry(circuit.condensingUnitId, { kind: 'reading' as const, data }));
    const site = await db.selectFrom('sites').select('elevation_m').where('id', '=', circuit.siteId).executeTakeFirstOrThrow();
    const direct = computeReadings({
      refrigerant: 'R-404A',
      pressureUnit: 'kPaG',
      temperatureUnit: 'C',
      elevationM: Number(site.elevation_m),
      suctionPressure: data.suctionKpaG,
      headPressure: data.dischargeKpaG,
      suctionLineTemp: data.suctionLineC,
      liquidLineTemp: data.liquidLineC,
      boxTemp: data.boxC,
      ambientTemp: data.ambientC,
    });
    const c = saved.computed as Record<string, number | null>;
    expect(c.superheatK).toBe(direct.superheat!.valueK);
    expect(c.subcoolingK).toBe(direct.subcooling!.valueK);
    expect(c.evaporatorTdK).toBe(direct.evaporatorTd!.valueK);
    expect(c.condenserSplitK).toBe(direct.condenserSplit!.valueK);
    expect(c.compressionRatio).toBe(direct.compressionRatio!.ratio);
    // NEMA MG 1 worked example (TRADE-REFERENCE §5.1): 460/467/450 V → 1.96 %, derating ≈ 0.95.
    expect(c.unbalancePct).toBe(voltageUnbalance([460, 467, 450]).unbalancePct);
    expect(c.unbalancePct).toBeCloseTo(1.96, 2);
    expect(c.deratingFactor).toBeCloseTo(0.95, 2);
  });

  it('a setting change computes the cut-out and moves the control’s current settings to the as-left values', async () => {
    const visit = await startVisit(tech, { siteId: circuit.siteId, reason: 'maintenance' });
    // Worked example (TRADE-REFERENCE §4, common practice): cut-in 30 psig, differential 20 psi → cut-out 10 psig.
    const asLeft = { cutInKpaG: psig(30), differentialKpa: 20 * KPA_PER_PSI };
    const saved = await addEntry(tech, visit.id, entry(circuit.lowControlId, { kind: 'setting_change' as const, data: { control: 'low' as const, asFound: { cutInKpaG: psig(35), differentialKpa: 20 * KPA_PER_PSI }, asLeft } }));
    const c = saved.computed as { asLeftOtherKpaG: number; asLeftSaturation: { setting: number; other: number } };
    expect(c.asLeftOtherKpaG / KPA_PER_PSI).toBeCloseTo(10, 6);
    const site = await db.selectFrom('sites').select('elevation_m').where('id', '=', circuit.siteId).executeTakeFirstOrThrow();
    const direct = lowPressureControl({ refrigerant: 'R-404A', unit: 'kPaG', temperatureUnit: 'C', elevationM: Number(site.elevation_m), cutIn: asLeft.cutInKpaG, differential: asLeft.differentialKpa, designBoxTemp: 1.67 });
    expect(c.asLeftSaturation.other).toBe(direct.cutOutSaturation!.dew);
    const control = await getEquipment(tech, circuit.lowControlId);
    expect(control.nameplate.lowCutInKpa).toBe(asLeft.cutInKpaG);
    expect(control.nameplate.lowDifferentialKpa).toBe(asLeft.differentialKpa);
  });

  it('warns with the repair deadline when an addition exceeds the leak-rate threshold', async () => {
    const visit = await startVisit(tech, { siteId: circuit.siteId, reason: 'leak_check' });
    const lb = 0.45359237;
    await addEntry(tech, visit.id, entry(circuit.condensingUnitId, { kind: 'refrigerant' as const, recordedAt: '2026-04-03T15:00:00Z', data: { direction: 'added' as const, amountKg: 2 * lb, refrigerant: 'R-404A' as const, cylinderId: 'CYL-0042' } }));
    // 40 CFR 82.152 annualizing method (TRADE-REFERENCE §6.1): 10 lb into 100 lb, 180 days after the last addition → 20.28 % > 20 %.
    const second = await addEntry(tech, visit.id, entry(circuit.condensingUnitId, { kind: 'refrigerant' as const, recordedAt: '2026-09-30T15:00:00Z', data: { direction: 'added' as const, amountKg: 10 * lb, refrigerant: 'R-404A' as const } }));
    const leak = (second.computed as { leak: { ratePct: number; thresholdPct: number; exceedsThreshold: boolean; repairDueDate: string } }).leak;
    expect(leak.ratePct).toBeCloseTo(20.28, 2);
    expect(leak.thresholdPct).toBe(20);
    expect(leak.exceedsThreshold).toBe(true);
    expect(leak.repairDueDate).toBe('2026-10-30');
    await expect(
      addEntry(tech, visit.id, entry(circuit.condensingUnitId, { kind: 'refrigerant' as const, data: { direction: 'added' as const, amountKg: 1, refrigerant: 'R-448A' as const } })),
    ).rejects.toMatchObject({ code: 'validation_failed' });
  });

  it('runs a follow-up from a finding through scheduled to resolved by a later visit', async () => {
    const first = await startVisit(tech, { siteId: circuit.siteId, reason: 'inspection' });
    await addEntry(tech, first.id, entry(circuit.evaporatorId, { kind: 'finding' as const, data: { text: 'Fan blade cracked', severity: 'degraded' as const, raiseFollowUp: true } }));
    let [f] = (await listFollowUps(office, { limit: 10, siteId: circuit.siteId })).items;
    expect(f).toMatchObject({ title: 'Fan blade cracked', severity: 'degraded', status: 'open', raisedVisitId: first.id, equipmentName: 'Cooler evaporator' });
    f = await updateFollowUp(office, f!.id, { status: 'scheduled', scheduledFor: '2026-12-10' });
    expect(f.status).toBe('scheduled');
    await closeVisit(tech, first.id, { summary: 'Inspected', confirmBypassRemoved: false });
    const second = await startVisit(tech, { siteId: circuit.siteId, reason: 'follow_up' });
    f = await updateFollowUp(tech, f.id, { status: 'resolved', resolution: 'Blade replaced', visitId: second.id });
    expect(f).toMatchObject({ status: 'resolved', closedVisitId: second.id, closedByName: 'Tomas Rivane', resolution: 'Blade replaced' });
    await expect(updateFollowUp(office, f.id, { status: 'open' })).rejects.toMatchObject({ code: 'conflict' });
    expect((await listFollowUps(office, { limit: 10 })).items).toHaveLength(0);
    expect((await listFollowUps(office, { limit: 10, status: ['resolved'] })).items).toHaveLength(1);
  });

  it('keeps one open visit per technician per site, and a retried save is stored once', async () => {
    const visit = await startVisit(tech, { siteId: circuit.siteId, reason: 'maintenance' });
    await expect(startVisit(tech, { siteId: circuit.siteId, reason: 'inspection' })).rejects.toMatchObject({ code: 'conflict' });
    const body = entry(circuit.evaporatorId, { kind: 'note' as const, data: { text: 'Door gasket torn at hinge side' } });
    const a = await addEntry(tech, visit.id, body);
    const b = await addEntry(tech, visit.id, body);
    expect(b.id).toBe(a.id);
    expect((await getVisit(tech, visit.id)).entries).toHaveLength(1);
  });

  it('cannot close while a bypassed control is not confirmed removed; the confirmation is recorded', async () => {
    const visit = await startVisit(tech, { siteId: circuit.siteId, reason: 'no_cooling' });
    await addEntry(tech, visit.id, entry(circuit.lowControlId, { kind: 'action' as const, data: { text: 'Jumpered low-pressure control to run compressor for diagnosis', bypassedControl: true, bypassDescription: 'low-pressure control jumpered' } }));
    await expect(closeVisit(tech, visit.id, { summary: 'Done', confirmBypassRemoved: false })).rejects.toMatchObject({ code: 'conflict' });
    expect((await getVisit(tech, visit.id)).status).toBe('open');
    const closed = await closeVisit(tech, visit.id, { summary: 'Done', confirmBypassRemoved: true });
    expect(closed.status).toBe('closed');
    const detail = await getVisit(office, visit.id);
    expect(detail.openBypasses).toEqual([]);
    expect(detail.entries.map((e) => e.data.text)).toContain('Bypass removed and control back in service: low-pressure control jumpered');
    // Closed means closed: no more entries until the office reopens it.
    await expect(addEntry(tech, visit.id, entry(circuit.evaporatorId, { kind: 'note' as const, data: { text: 'late' } }))).rejects.toMatchObject({ code: 'conflict' });
    await reopenVisit(office, visit.id);
    await addEntry(tech, visit.id, entry(circuit.evaporatorId, { kind: 'note' as const, data: { text: 'late' } }));
  });

  it('gives history newest first in keyset pages, filters by kind, merges a system, hides voided nothing', async () => {
    const visit = await startVisit(tech, { siteId: circuit.siteId, reason: 'maintenance' });
    const base = Date.parse('2026-11-01T12:00:00Z');
    for (let i = 0; i < 30; i++) {
      const kind = i % 3 === 0 ? ('condition' as const) : ('note' as const);
      const data = kind === 'condition' ? { rating: 1 + (i % 5) } : { text: `Note ${i}` };
      await addEntry(tech, visit.id, entry(circuit.condensingUnitId, { kind, recordedAt: new Date(base + i * 60_000).toISOString(), data } as never));
    }
    const seen: string[] = [];
    let cursor: string | undefined;
    let pages = 0;
    do {
      const page = await equipmentHistory(tech, circuit.condensingUnitId, { limit: 12, cursor });
      seen.push(...page.items.map((e) => e.recordedAt));
      cursor = page.nextCursor ?? undefined;
      pages++;
    } while (cursor);
    expect(pages).toBe(3);
    expect(seen).toHaveLength(30);
    expect([...seen].sort().reverse()).toEqual(seen);
    const conditions = await equipmentHistory(tech, circuit.condensingUnitId, { limit: 50, kind: ['condition'] });
    expect(conditions.items).toHaveLength(10);
    expect((await getEquipment(tech, circuit.condensingUnitId)).condition).toBe(1 + (27 % 5));
    const merged = await systemHistory(tech, circuit.systemId, { limit: 100 });
    expect(merged.items).toHaveLength(30);
    const voided = await voidEntry(tech, merged.items[0]!.id, 'Typed on the wrong unit');
    expect(voided.voidedAt).not.toBeNull();
    expect((await equipmentHistory(tech, circuit.condensingUnitId, { limit: 50 })).items).toHaveLength(30);
  });

  it('history pages keep entries apart that lie within one millisecond (rows written by SQL keep microseconds)', async () => {
    const visit = await startVisit(tech, { siteId: circuit.siteId, reason: 'maintenance' });
    for (let i = 0; i < 4; i++) await addEntry(tech, visit.id, entry(circuit.condensingUnitId, { kind: 'note' as const, data: { text: `Same millisecond ${i}` } }));
    const ids = (await db.selectFrom('entries').select('id').where('visit_id', '=', visit.id).execute()).map((r) => r.id);
    // Two pairs of entries at one instant each, the pairs 250 µs apart, inside one millisecond.
    await sql`update entries set recorded_at = timestamptz '2026-11-02 09:30:00.000500+00' where id in (${ids[0]}, ${ids[1]})`.execute(db);
    await sql`update entries set recorded_at = timestamptz '2026-11-02 09:30:00.000250+00' where id in (${ids[2]}, ${ids[3]})`.execute(db);
    const seen: string[] = [];
    let cursor: string | undefined;
    do {
      const page = await equipmentHistory(tech, circuit.condensingUnitId, { limit: 1, cursor });
      seen.push(...page.items.map((e) => e.id));
      cursor = page.nextCursor ?? undefined;
    } while (cursor && seen.length < 10);
    // Each entry once, newest first: a cursor rounded to the millisecond ended the history after
    // the first entry.
    expect(seen).toHaveLength(4);
    expect(new Set(seen)).toEqual(new Set(ids));
    expect(seen.slice(0, 2).sort()).toEqual([ids[0], ids[1]].sort());
  });

  it('an owner sees closed visits of their sites only', async () => {
    const owner = await actorFor(db, demoEmails.client);
    const stranger = await actorFor(db, demoEmails.clientTwo);
    const visit = await startVisit(tech, { siteId: circuit.siteId, reason: 'maintenance' });
    await addEntry(tech, visit.id, entry(circuit.evaporatorId, { kind: 'note' as const, data: { text: 'Coil cleaned' } }));
    await expect(getVisit(owner, visit.id)).rejects.toMatchObject({ code: 'not_found' });
    expect((await equipmentHistory(owner, circuit.evaporatorId, { limit: 10 })).items).toHaveLength(0);
    await closeVisit(tech, visit.id, { summary: 'Routine maintenance', confirmBypassRemoved: false });
    expect((await getVisit(owner, visit.id)).entries).toHaveLength(1);
    await expect(getVisit(stranger, visit.id)).rejects.toMatchObject({ code: 'not_found' });
  });

  it('a unit’s history is not found for a viewer who may not see the unit, entries or not', async () => {
    const stranger = await actorFor(db, demoEmails.clientTwo);
    const visit = await startVisit(tech, { siteId: circuit.siteId, reason: 'maintenance' });
    await addEntry(tech, visit.id, entry(circuit.evaporatorId, { kind: 'note' as const, data: { text: 'Coil cleaned' } }));
    await closeVisit(tech, visit.id, { summary: 'Routine maintenance', confirmBypassRemoved: false });
    await expect(equipmentHistory(stranger, circuit.evaporatorId, { limit: 10 })).rejects.toMatchObject({ code: 'not_found' });
    expect((await equipmentHistory(tech, circuit.evaporatorId, { limit: 10 })).items).toHaveLength(1);
    // A deleted unit still has entries its viewers' scope admits; the unit's own check refuses them.
    await db.updateTable('equipment').set({ deleted_at: new Date() }).where('id', '=', circuit.evaporatorId).execute();
    await expect(equipmentHistory(tech, circuit.evaporatorId, { limit: 10 })).rejects.toMatchObject({ code: 'not_found' });
  });

  it('e-mails the report to the client’s contacts and keeps the PDF in the object store', async () => {
    await clearMail();
    await ensureBucket();
    const visit = await startVisit(tech, { siteId: circuit.siteId, reason: 'no_cooling' });
    await addEntry(tech, visit.id, entry(circuit.condensingUnitId, { kind: 'finding' as const, data: { text: 'Condenser coil plugged with grease', severity: 'down' as const, raiseFollowUp: false } }));
    await closeVisit(tech, visit.id, { summary: 'Cleaned condenser coil; box back to 36 °F.', confirmBypassRemoved: false });
    await deliverDueMail();
    const mail = await waitForMail('owner@client-one.test', 15_000, (m) => (m.text ?? '').includes(`/visits/${visit.id}`));
    expect(mail.subject).toContain('Service visit report — Pell Street Kitchen');
    expect(mail.text).toContain('Reason: No-cooling call');
    expect(mail.text).toContain('Finding (Down): Condenser coil plugged with grease');
    expect(mail.text).toContain('Summary: Cleaned condenser coil; box back to 36 °F.');
    expect(firstLink(mail.text ?? '', `/visits/${visit.id}`)).toMatch(/^http:\/\/localhost:\d+\/visits\//);
    expect(mail.html).toContain(`/api/visits/${visit.id}/report`);
    const key = await ensureVisitReport(office, visit.id);
    expect(await ensureVisitReport(office, visit.id)).toBe(key);
    const pdf = Buffer.from(await getObjectBytes(key));
    expect(pdf.subarray(0, 5).toString()).toBe('%PDF-');
  });
});

describe('visit entries that touch other records', () => {
  it('a replaced component keeps its history on the old record; the new record takes the tag and relations', async () => {
    const { generateCode } = await import('@/lib/tags/code');
    const code = generateCode();
    await db
      .insertInto('tags')
      .values({ company_id: circuit.companyId, code, state: 'attached', site_id: circuit.siteId, equipment_id: circuit.evaporatorId, attached_at: new Date() })
      .execute();
    await db.insertInto('equipment_relations').values({ company_id: circuit.companyId, from_equipment_id: circuit.condensingUnitId, to_equipment_id: circuit.evaporatorId, kind: 'serves' }).execute();
    const visit = await startVisit(tech, { siteId: circuit.siteId, reason: 'no_cooling' });
    await addEntry(tech, visit.id, entry(circuit.evaporatorId, { kind: 'part' as const, data: { part: 'Unit cooler', quantity: 1, newSerial: 'UC-88120', replacesEquipment: true } }));
    const old = await db.selectFrom('equipment').select(['status', 'removed_at', 'replaced_by_id']).where('id', '=', circuit.evaporatorId).executeTakeFirstOrThrow();
    expect(old.status).toBe('removed');
    const replacement = await db.selectFrom('equipment').select(['id', 'serial']).where('serial', '=', 'UC-88120').executeTakeFirstOrThrow();
    // The removed record says when it left and what took its place.
    expect(old.removed_at).not.toBeNull();
    expect(old.replaced_by_id).toBe(replacement.id);
    const tag = await db.selectFrom('tags').select(['equipment_id', 'state']).where('code', '=', code).executeTakeFirstOrThrow();
    expect(tag).toEqual({ equipment_id: replacement.id, state: 'attached' });
    const unit = await getEquipment(tech, circuit.condensingUnitId);
    expect(unit.relations.map((r) => r.other.id)).toEqual([replacement.id]);
    expect((await equipmentHistory(tech, circuit.evaporatorId, { limit: 10 })).items.map((e) => e.kind)).toEqual(['part']);
  });

  it('a photo entry must name a photo of that equipment', async () => {
    const visit = await startVisit(tech, { siteId: circuit.siteId, reason: 'inspection' });
    await expect(
      addEntry(tech, visit.id, entry(circuit.evaporatorId, { kind: 'photo' as const, data: { photoId: randomUUID() } })),
    ).rejects.toMatchObject({ code: 'validation_failed' });
    expect((await getVisit(tech, visit.id)).entries).toHaveLength(0);
  });
});
