// Tags through their services and route handlers: print runs (blank and bound), the stored PDF,
// claiming, replacing, retiring, the scan log, and scoping (another company's tag reads as unknown).
import { afterAll, beforeAll, beforeEach, describe, expect, it, vi } from 'vitest';
import type { Actor } from '@/lib/auth/actor';
import { isValidCode } from '@/lib/tags/code';
import { actorFor, createOtherCompany, createTestDb, demoActors, resetToDemo } from '@/tests/helpers/db';
import { call, mockAuthModule, session } from '@/tests/helpers/session';

vi.mock('@/lib/auth', () => mockAuthModule());

const { ensureBucket } = await import('@/storage/objects');
const service = { ...(await import('@/lib/tags/service')), ...(await import('@/lib/tags/print-runs')) };
const { createEquipment } = await import('@/lib/equipment/service');
const { createEquipmentSchema } = await import('@/lib/equipment/schemas');

const db = createTestDb();
let office: Actor;
let tech: Actor;
let owner: Actor;
let ownerTwo: Actor;
let siteId: string;

beforeAll(async () => {
  await ensureBucket();
});
beforeEach(async () => {
  await resetToDemo(db);
  ({ office, technician: tech, client: owner, clientTwo: ownerTwo } = await demoActors(db));
  siteId = (await db.selectFrom('sites').select('id').where('name', '=', 'Pell Street Kitchen').executeTakeFirstOrThrow()).id;
  session.actor = null;
});
afterAll(async () => {
  await db.destroy();
});

async function unit(name: string, site = siteId) {
  return createEquipment(office, createEquipmentSchema.parse({ siteId: site, type: 'condensing_unit', name, nameplate: {} }));
}

async function blankRun(count = 5, site = siteId) {
  const run = await service.createPrintRun(office, { kind: 'blank', siteId: site, count, layoutId: 'letter-30', startPosition: 1 });
  const detail = await service.getPrintRun(office, run.id);
  return { run, codes: detail.tags.map((t) => t.code) };
}

describe('print runs', () => {
  it('prints N blank tags for a site: unique valid codes, a stored PDF, nothing claimed yet', async () => {
    const { run, codes } = await blankRun(12);
    expect(run.labelCount).toBe(12);
    expect(run.claimedCount).toBe(0);
    expect(run.siteName).toBe('Pell Street Kitchen');
    expect(new Set(codes).size).toBe(12);
    for (const c of codes) expect(isValidCode(c)).toBe(true);
    const pdf = await service.getPrintRunPdf(office, run.id);
    expect(Buffer.from(pdf.bytes.slice(0, 5)).toString()).toBe('%PDF-');
    expect(pdf.bytes.byteLength).toBe(run.pdfBytes);
    const states = await db.selectFrom('tags').select('state').where('print_run_id', '=', run.id).execute();
    expect(states.every((s) => s.state === 'blank')).toBe(true);
  });

  it('binds tags to chosen equipment at print time, skips tagged units, and can print replacements', async () => {
    const a = await unit('Cooler condensing unit');
    const b = await unit('Freezer condensing unit');
    const first = await service.createPrintRun(office, { kind: 'equipment', equipmentIds: [a.id], alreadyTagged: 'skip', layoutId: 'a4-24', startPosition: 3 });
    expect(first.claimedCount).toBe(1);
    const second = await service.createPrintRun(office, { kind: 'equipment', equipmentIds: [a.id, b.id], alreadyTagged: 'skip', layoutId: 'thermal-2x1', startPosition: 1 });
    expect(second.labelCount).toBe(1);
    await expect(service.createPrintRun(office, { kind: 'equipment', equipmentIds: [a.id, b.id], alreadyTagged: 'skip', layoutId: 'letter-30', startPosition: 1 })).rejects.toMatchObject({
      code: 'validation_failed',
    });
    const oldCode = (await service.getEquipmentTagInfo(office, a.id)).current!.code;
    const third = await service.createPrintRun(office, { kind: 'equipment', equipmentIds: [a.id], alreadyTagged: 'replace', layoutId: 'letter-30', startPosition: 1 });
    const info = await service.getEquipmentTagInfo(office, a.id);
    expect(info.current!.printRunId).toBe(third.id);
    expect(info.previous.map((t) => [t.code, t.state, t.retiredReason, t.replacedByCode])).toEqual([[oldCode, 'retired', 'replaced', info.current!.code]]);
  });

  it('refuses a start position past the sheet and an unknown layout, and lets only the office print', async () => {
    await expect(service.createPrintRun(office, { kind: 'blank', siteId, count: 2, layoutId: 'letter-30', startPosition: 31 })).rejects.toMatchObject({ code: 'validation_failed' });
    await expect(service.createPrintRun(office, { kind: 'blank', siteId, count: 2, layoutId: 'no-such-layout', startPosition: 1 })).rejects.toMatchObject({ code: 'validation_failed' });
    await expect(service.createPrintRun(tech, { kind: 'blank', siteId, count: 2, layoutId: 'letter-30', startPosition: 1 })).rejects.toMatchObject({ code: 'forbidden' });
    expect(await db.selectFrom('tags').select('id').execute()).toHaveLength(0);
  });
});

describe('scanning, claiming and replacing', () => {
  it('a blank tag opens the claim flow; claiming attaches it and counts it on the print run', async () => {
    const { run, codes } = await blankRun(3);
    const cu = await unit('Walk-in cooler condensing unit');
    const before = await service.resolveTag(tech, codes[0]!, 'camera');
    expect(before).toMatchObject({ state: 'blank', canClaim: true, target: `/scan/${codes[0]}` });
    const result = await service.attachTag(tech, codes[0]!, { equipmentId: cu.id });
    expect(result).toMatchObject({ equipmentId: cu.id, replaced: null, tag: { state: 'attached', attachedByName: 'Tomas Rivane' } });
    expect(await service.resolveTag(tech, codes[0]!, 'link')).toMatchObject({ state: 'attached', target: `/equipment/${cu.id}` });
    expect((await service.getPrintRun(office, run.id)).claimedCount).toBe(1);
    await expect(service.attachTag(tech, codes[0]!, { equipmentId: cu.id })).rejects.toMatchObject({ code: 'conflict' });
  });

  it('claims a blank tag for equipment registered on the spot, on the tag’s site', async () => {
    const { codes } = await blankRun(1);
    const area = await db.selectFrom('areas').select('id').where('site_id', '=', siteId).where('name', '=', 'Roof').executeTakeFirstOrThrow();
    const result = await service.attachTag(tech, codes[0]!, { newEquipment: { type: 'condenser', name: 'Roof condenser', areaId: area.id, serial: 'RC-1' } });
    const row = await db.selectFrom('equipment').select(['site_id', 'area_id', 'name', 'serial']).where('id', '=', result.equipmentId).executeTakeFirstOrThrow();
    expect(row).toEqual({ site_id: siteId, area_id: area.id, name: 'Roof condenser', serial: 'RC-1' });
    await expect(service.attachTag(tech, (await blankRun(1)).codes[0]!, { newEquipment: { type: 'not-a-type', name: 'x' } })).rejects.toMatchObject({ code: 'validation_failed' });
  });

  it('replacing a damaged tag retires the old one, whose scans still lead to the equipment', async () => {
    const { codes } = await blankRun(2);
    const cu = await unit('Cooler condensing unit');
    await service.attachTag(tech, codes[0]!, { equipmentId: cu.id });
    const replaced = await service.attachTag(tech, codes[1]!, { equipmentId: cu.id });
    expect(replaced.replaced).toMatchObject({ code: codes[0], state: 'retired', retiredReason: 'replaced', replacedByCode: codes[1] });
    const old = await service.resolveTag(tech, codes[0]!, 'link');
    expect(old).toMatchObject({ state: 'retired', equipment: { id: cu.id }, currentCode: codes[1] });
    const scans = await db.selectFrom('tag_scans').select(['equipment_id', 'via']).execute();
    expect(scans).toEqual([{ equipment_id: cu.id, via: 'link' }]);
    await expect(service.attachTag(tech, codes[0]!, { equipmentId: cu.id })).rejects.toMatchObject({ code: 'conflict' });
  });

  it('retires a lost tag; a blank tag can be voided as never used, an attached one cannot', async () => {
    const { codes } = await blankRun(2);
    const cu = await unit('Cooler condensing unit');
    await service.attachTag(tech, codes[0]!, { equipmentId: cu.id });
    await expect(service.retireTag(tech, codes[0]!, { reason: 'unused' })).rejects.toMatchObject({ code: 'validation_failed' });
    expect(await service.retireTag(tech, codes[0]!, { reason: 'lost', note: 'Gone after coil cleaning' })).toMatchObject({ state: 'retired', retiredReason: 'lost' });
    expect((await service.getEquipmentTagInfo(tech, cu.id)).current).toBeNull();
    expect(await service.retireTag(office, codes[1]!, { reason: 'unused' })).toMatchObject({ state: 'retired', equipmentId: null });
    expect(await service.resolveTag(tech, codes[1]!)).toMatchObject({ state: 'retired', equipment: null });
  });

  it('logs who scanned which tag and when; the equipment shows its last scan', async () => {
    const { codes } = await blankRun(1);
    const cu = await unit('Cooler condensing unit');
    await service.attachTag(tech, codes[0]!, { equipmentId: cu.id });
    expect((await service.getEquipmentTagInfo(office, cu.id)).lastScan).toBeNull();
    await service.resolveTag(office, codes[0]!, 'typed');
    await new Promise((r) => setTimeout(r, 5));
    await service.resolveTag(tech, codes[0]!, 'camera');
    await service.resolveTag(tech, codes[0]!); // looking up without scanning is not logged
    const info = await service.getEquipmentTagInfo(owner, cu.id);
    expect(info.scanCount).toBe(2);
    expect(info.lastScan).toMatchObject({ byName: 'Tomas Rivane', code: codes[0], via: 'camera' });
    const rows = await db.selectFrom('tag_scans').select(['user_id', 'tag_id', 'scanned_at']).orderBy('scanned_at').execute();
    expect(rows.map((r) => r.user_id)).toEqual([office.id, tech.id]);
  });
});

describe('what leaks', () => {
  it('another company’s tag and an unknown code answer exactly alike', async () => {
    const other = await createOtherCompany(db);
    const otherAdmin = await actorFor(db, other.adminEmail);
    const otherRun = await service.createPrintRun(otherAdmin, { kind: 'blank', siteId: other.siteId, count: 1, layoutId: 'letter-30', startPosition: 1 });
    const theirCode = (await service.getPrintRun(otherAdmin, otherRun.id)).tags[0]!.code;
    const errors = [];
    for (const code of [theirCode, '000000000']) {
      errors.push(await service.resolveTag(office, code, 'camera').then(() => null, (e: { code: string; message: string }) => ({ code: e.code, message: e.message })));
    }
    expect(errors[0]).toEqual({ code: 'not_found', message: 'Tag not found.' });
    expect(errors[1]).toEqual(errors[0]);
    await expect(service.attachTag(office, theirCode, { equipmentId: (await unit('Mine')).id })).rejects.toMatchObject({ code: 'not_found' });
    await expect(service.getPrintRun(office, otherRun.id)).rejects.toMatchObject({ code: 'not_found' });
    expect(await db.selectFrom('tag_scans').select('id').execute()).toHaveLength(0);
  });

  it('owners see tags of their own sites only and cannot claim', async () => {
    const { codes } = await blankRun(2);
    const cu = await unit('Cooler condensing unit');
    await service.attachTag(tech, codes[0]!, { equipmentId: cu.id });
    expect(await service.resolveTag(owner, codes[0]!, 'link')).toMatchObject({ state: 'attached' });
    expect(await service.resolveTag(owner, codes[1]!)).toMatchObject({ state: 'blank', canClaim: false });
    await expect(service.resolveTag(ownerTwo, codes[0]!, 'link')).rejects.toMatchObject({ code: 'not_found' });
    await expect(service.resolveTag(ownerTwo, codes[1]!)).rejects.toMatchObject({ code: 'not_found' });
    await expect(service.attachTag(owner, codes[1]!, { equipmentId: cu.id })).rejects.toMatchObject({ code: 'forbidden' });
  });
});

describe('route handlers', () => {
  it('POST /api/print-runs (office 201, technician 403), GET its PDF again, claimed counts in the list', async () => {
    const runs = await import('@/app/api/print-runs/route');
    const pdf = await import('@/app/api/print-runs/[id]/pdf/route');
    session.actor = tech;
    expect((await call(runs.POST, { method: 'POST', json: { kind: 'blank', siteId, count: 2, layoutId: 'letter-30' } })).status).toBe(403);
    session.actor = office;
    const created = await call(runs.POST, { method: 'POST', json: { kind: 'blank', siteId, count: 2, layoutId: 'letter-30' } });
    expect(created.status).toBe(201);
    const id = (created.body as { id: string }).id;
    const bad = await call(runs.POST, { method: 'POST', json: { kind: 'blank', siteId, count: 1001, layoutId: 'letter-30' } });
    expect(bad.status).toBe(422);
    const list = await call(runs.GET, { path: '/api/print-runs' });
    expect(list.body).toMatchObject({ items: [{ id, labelCount: 2, claimedCount: 0 }], nextCursor: null });
    const req = (await import('next/server')).NextRequest;
    const res = await pdf.GET(new req(`http://localhost/api/print-runs/${id}/pdf`), { params: Promise.resolve({ id }) });
    expect(res.status).toBe(200);
    expect(res.headers.get('content-type')).toBe('application/pdf');
    expect(Buffer.from(await res.arrayBuffer()).subarray(0, 5).toString()).toBe('%PDF-');
  });

  it('POST /api/scan logs the scan and returns the equipment page data; a mistyped code is 404 before any lookup', async () => {
    const scan = await import('@/app/api/scan/route');
    const tagRoute = await import('@/app/api/tags/[code]/route');
    const attach = await import('@/app/api/tags/[code]/attach/route');
    const { codes } = await blankRun(1);
    const cu = await unit('Cooler condensing unit');
    session.actor = tech;
    expect((await call(attach.POST, { method: 'POST', params: { code: codes[0]!.toLowerCase() }, json: { equipmentId: cu.id } })).status).toBe(200);
    const res = await call(scan.POST, { method: 'POST', json: { code: codes[0], via: 'camera' } });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ resolution: { state: 'attached', equipmentId: cu.id }, equipment: { id: cu.id, name: 'Cooler condensing unit' } });
    const typo = codes[0]!.slice(0, 8) + (codes[0]![8] === '0' ? '1' : '0');
    expect((await call(tagRoute.GET, { params: { code: typo } })).status).toBe(404);
    expect((await call(scan.POST, { method: 'POST', json: { code: typo } })).status).toBe(422);
    session.actor = owner;
    expect((await call(attach.POST, { method: 'POST', params: { code: codes[0]! }, json: { equipmentId: cu.id } })).status).toBe(403);
    expect(await db.selectFrom('tag_scans').select('via').execute()).toEqual([{ via: 'camera' }]);
  });
});
