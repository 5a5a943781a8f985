// The phone's outbox (IndexedDB through fake-indexeddb, fetch stubbed): a visit's work goes in the
// order it was made; no signal stops the round and backs off; a refusal is kept for its fix and
// never dropped; the close waits until everything before it has reached the server.
import 'fake-indexeddb/auto';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { nextSeq, outboxItems, phoneVisit, phoneVisitsAt, putItem, removeItem, startOnPhone, outboxTitle, waitingWords, type OutboxItem } from '@/lib/visits/outbox';
import { backoffMs, drainOutbox } from '@/lib/visits/outbox-sender';

const visitId = '11111111-1111-4111-8111-111111111111';
const unit = '22222222-2222-4222-8222-222222222222';

function entry(id: string, text: string): OutboxItem {
  return {
    type: 'entry',
    id,
    visitId,
    seq: nextSeq(),
    state: 'waiting',
    attempts: 0,
    savedAt: new Date().toISOString(),
    nextTryAt: 0,
    input: { equipmentId: unit, clientEntryId: id, kind: 'note', data: { text } },
  };
}

function close(id: string): OutboxItem {
  return { type: 'close', id, visitId, seq: nextSeq(), state: 'waiting', attempts: 0, savedAt: new Date().toISOString(), nextTryAt: 0, input: { summary: 'Done', confirmBypassRemoved: false, clientCloseId: id } };
}

const ids = ['aaaaaaaa-0000-4000-8000-000000000001', 'aaaaaaaa-0000-4000-8000-000000000002', 'aaaaaaaa-0000-4000-8000-000000000003', 'aaaaaaaa-0000-4000-8000-000000000004'];
let sent: { url: string; body: unknown }[];

function answer(status: number, body: unknown): Response {
  return new Response(JSON.stringify(body), { status, headers: { 'Content-Type': 'application/json' } });
}

beforeEach(async () => {
  sent = [];
  for (const i of await outboxItems()) await removeItem(i.id);
});
afterEach(() => vi.unstubAllGlobals());

describe('visit outbox', () => {
  it('sends a visit’s work in the order it was made, then the close', async () => {
    await putItem(entry(ids[0]!, 'first'));
    await putItem(entry(ids[1]!, 'second'));
    await putItem(close(ids[2]!));
    vi.stubGlobal('fetch', async (url: string, init: RequestInit) => {
      sent.push({ url, body: JSON.parse(String(init.body)) });
      return answer(200, url.endsWith('/close') ? { id: visitId, status: 'closed' } : { id: 'e', clientEntryId: 'x' });
    });
    await drainOutbox({ visitId });
    expect(sent.map((s) => (s.body as { data?: { text: string } }).data?.text ?? 'close')).toEqual(['first', 'second', 'close']);
    expect(sent[2]!.url).toBe(`/api/visits/${visitId}/close`);
    expect(await outboxItems(visitId)).toEqual([]);
  });

  it('stops the round when there is no signal, and backs off', async () => {
    await putItem(entry(ids[0]!, 'first'));
    await putItem(entry(ids[1]!, 'second'));
    vi.stubGlobal('fetch', async (url: string) => {
      sent.push({ url, body: null });
      throw new TypeError('Failed to fetch');
    });
    const before = Date.now();
    await drainOutbox({ visitId });
    expect(sent).toHaveLength(1);
    const [first, second] = await outboxItems(visitId);
    expect(first).toMatchObject({ state: 'waiting', attempts: 1 });
    expect(first!.nextTryAt).toBeGreaterThanOrEqual(before + backoffMs(1));
    expect(second).toMatchObject({ state: 'waiting', attempts: 0 });
    // Within the back-off nothing is tried again, unless forced (the connection came back).
    await drainOutbox({ visitId });
    expect(sent).toHaveLength(1);
    await drainOutbox({ visitId, force: true });
    expect(sent).toHaveLength(2);
    expect(waitingWords(await outboxItems(visitId))).toBe('2 entries waiting');
  });

  it('keeps a refused entry for its fix, sends the entries after it, and holds the close', async () => {
    await putItem(entry(ids[0]!, 'refused one'));
    await putItem(entry(ids[1]!, 'fine one'));
    await putItem(close(ids[2]!));
    vi.stubGlobal('fetch', async (url: string, init: RequestInit) => {
      const body = JSON.parse(String(init.body)) as { data?: { text: string } };
      sent.push({ url, body });
      if (body.data?.text === 'refused one') return answer(422, { error: { code: 'validation_failed', message: 'Note is too long.', issues: [{ path: 'data.text', message: 'Note is too long.' }] } });
      return answer(200, url.endsWith('/close') ? { id: visitId } : { id: 'e' });
    });
    await drainOutbox({ visitId, force: true });
    expect(sent.map((s) => s.url.endsWith('/close'))).toEqual([false, false]);
    const left = await outboxItems(visitId);
    expect(left.map((i) => [i.type, i.state])).toEqual([
      ['entry', 'refused'],
      ['close', 'waiting'],
    ]);
    expect(left[0]!.error).toBe('Note is too long.');
    expect(left[0]!.issues).toEqual([{ path: 'data.text', message: 'Note is too long.' }]);
    // A later round does not drop it either.
    await drainOutbox({ visitId, force: true });
    expect((await outboxItems(visitId)).map((i) => i.state)).toEqual(['refused', 'waiting']);
    // Discarded by the technician: now the close goes.
    await removeItem(ids[0]!);
    await drainOutbox({ visitId, force: true });
    expect(sent.at(-1)!.url).toBe(`/api/visits/${visitId}/close`);
    expect(await outboxItems(visitId)).toEqual([]);
  });

  it('says what waits in words', () => {
    const photo: OutboxItem = { ...entry(ids[3]!, 'p'), type: 'photo', equipmentId: unit, file: new Blob(['x']), fileName: 'plate.jpg', photoKind: 'nameplate', caption: null, uploadKey: ids[3]! } as OutboxItem;
    expect(waitingWords([entry(ids[0]!, 'a'), entry(ids[1]!, 'b'), entry(ids[2]!, 'c'), photo, close(ids[2]!)])).toBe('3 entries, 1 photo and the close waiting');
    expect(waitingWords([])).toBeNull();
  });

  it('titles the banner with what waits, naming a start that waits alone', () => {
    const start = { id: 'aaaaaaaa-0000-4000-8000-000000000005', visitId, type: 'start', state: 'waiting' } as unknown as OutboxItem;
    expect(outboxTitle(false, [start])).toBe('No signal: the visit’s start waiting');
    expect(outboxTitle(false, [start, entry(ids[0]!, 'a')])).toBe('No signal: 1 entry waiting');
    expect(outboxTitle(false, [])).toBe('No signal');
    expect(outboxTitle(true, [entry(ids[0]!, 'a'), entry(ids[1]!, 'b')])).toBe('2 entries waiting to be sent');
    expect(outboxTitle(true, [{ ...start, state: 'refused' } as OutboxItem])).toBe('Work waiting to be sent');
  });

  it('sends a visit started without signal first, and forgets the phone’s record of it once the server has it', async () => {
    const me = '33333333-3333-4333-8333-333333333333';
    const site = '44444444-4444-4444-8444-444444444444';
    await startOnPhone({ id: visitId, userId: me, siteId: site, reason: 'no_cooling', startedAt: '2026-12-04T08:15:00.000Z' });
    await putItem({ ...entry(ids[0]!, 'after the start'), userId: me } as OutboxItem);
    expect((await phoneVisitsAt(me, site)).map((v) => v.id)).toEqual([visitId]);
    // What waits is said without the start: it is not the technician's work.
    expect(waitingWords(await outboxItems(visitId))).toBe('1 entry waiting');
    vi.stubGlobal('fetch', async (url: string, init: RequestInit) => {
      sent.push({ url, body: JSON.parse(String(init.body)) });
      return answer(url === '/api/visits' ? 201 : 200, url === '/api/visits' ? { id: visitId, status: 'open' } : { id: 'e' });
    });
    await drainOutbox({ visitId, userId: me, force: true });
    expect(sent.map((s) => s.url)).toEqual(['/api/visits', `/api/visits/${visitId}/entries`]);
    expect(sent[0]!.body).toEqual({ id: visitId, siteId: site, reason: 'no_cooling', startedAt: '2026-12-04T08:15:00.000Z' });
    expect(await outboxItems(visitId)).toEqual([]);
    expect(await phoneVisit(me, visitId)).toBeNull();
  });

  it('holds everything of a visit whose start the server refused, and keeps it', async () => {
    const me = '33333333-3333-4333-8333-333333333333';
    await startOnPhone({ id: visitId, userId: me, siteId: '44444444-4444-4444-8444-444444444444', reason: 'maintenance', startedAt: '2026-12-04T08:15:00.000Z' });
    await putItem({ ...entry(ids[0]!, 'held'), userId: me } as OutboxItem);
    vi.stubGlobal('fetch', async (url: string, init: RequestInit) => {
      sent.push({ url, body: JSON.parse(String(init.body)) });
      return answer(409, { error: { code: 'conflict', message: 'You already have an open visit at this site.' } });
    });
    await drainOutbox({ visitId, userId: me, force: true });
    await drainOutbox({ visitId, userId: me, force: true });
    expect(sent.map((s) => s.url)).toEqual(['/api/visits']);
    expect((await outboxItems(visitId)).map((i) => [i.type, i.state])).toEqual([
      ['start', 'refused'],
      ['entry', 'waiting'],
    ]);
    expect(await phoneVisit(me, visitId)).toMatchObject({ reason: 'maintenance' });
  });

  it('never sends another person’s work under this session', async () => {
    const me = '33333333-3333-4333-8333-333333333333';
    const someoneElse = '55555555-5555-4555-8555-555555555555';
    await putItem({ ...entry(ids[0]!, 'theirs'), userId: someoneElse } as OutboxItem);
    await putItem({ ...entry(ids[1]!, 'mine'), userId: me } as OutboxItem);
    vi.stubGlobal('fetch', async (url: string, init: RequestInit) => {
      sent.push({ url, body: JSON.parse(String(init.body)) });
      return answer(200, { id: 'e' });
    });
    await drainOutbox({ userId: me, force: true });
    expect(sent.map((s) => (s.body as { data: { text: string } }).data.text)).toEqual(['mine']);
    expect((await outboxItems()).map((i) => i.userId)).toEqual([someoneElse]);
    // The other person's record of a started visit is not theirs to read either.
    await startOnPhone({ id: visitId, userId: someoneElse, siteId: '44444444-4444-4444-8444-444444444444', reason: 'maintenance', startedAt: '2026-12-04T08:15:00.000Z' });
    expect(await phoneVisit(me, visitId)).toBeNull();
  });

  it('a second round never overtakes an item still being sent by the first', async () => {
    const me = '33333333-3333-4333-8333-333333333333';
    await startOnPhone({ id: visitId, userId: me, siteId: '44444444-4444-4444-8444-444444444444', reason: 'maintenance', startedAt: '2026-12-04T08:15:00.000Z' });
    await putItem({ ...entry(ids[0]!, 'after the start'), userId: me } as OutboxItem);
    let releaseStart!: () => void;
    const startAnswered = new Promise<void>((resolve) => (releaseStart = resolve));
    vi.stubGlobal('fetch', async (url: string, init: RequestInit) => {
      sent.push({ url, body: JSON.parse(String(init.body)) });
      if (url === '/api/visits') await startAnswered;
      return answer(url === '/api/visits' ? 201 : 200, url === '/api/visits' ? { id: visitId } : { id: 'e' });
    });
    const first = drainOutbox({ visitId, userId: me, force: true });
    // Let the first round reach its fetch of the start.
    await vi.waitFor(() => expect(sent).toHaveLength(1));
    await drainOutbox({ visitId, userId: me, force: true });
    expect(sent.map((s) => s.url)).toEqual(['/api/visits']);
    releaseStart();
    await first;
    expect(sent.map((s) => s.url)).toEqual(['/api/visits', `/api/visits/${visitId}/entries`]);
  });
});
