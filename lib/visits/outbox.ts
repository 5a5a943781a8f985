import { openDB, type DBSchema, type IDBPDatabase } from 'idb';
import type { ErrorIssue } from '@/lib/errors';
import type { PhotoKind } from '@/lib/photos/schemas';
import type { CloseVisitInput, CreateEntryInput, StartVisitInput } from '@/lib/visits/schemas';
import type { VisitReason } from '@/lib/visits/terms';

// The phone's one outbox for a visit's work: the start (of a visit begun without signal), entries,
// photos (kept as blobs) and the close, in the order they were made, in IndexedDB so a reload, a
// closed tab or a restarted phone loses nothing. Each item carries an id made on the phone (the
// visit's id, clientEntryId, the photo's uploadKey, clientCloseId), so a send repeated after a lost
// answer returns the first result. Items belong to the person who made them and are sent only
// under their session. Browser-only.

export type OutboxState = 'waiting' | 'sending' | 'refused';

interface ItemBase {
  /** The id made on the phone: the visit's id (start), the entry's clientEntryId, or the close's clientCloseId. */
  id: string;
  visitId: string;
  /** Who made it: sent only while they are the one signed in (absent on items of older versions). */
  userId?: string;
  /** Order of making; items of a visit are sent in this order. */
  seq: number;
  state: OutboxState;
  attempts: number;
  /** When the technician made it (also the entry's recordedAt). */
  savedAt: string;
  /** Not before this time (ms since epoch): the back-off after a failed send. */
  nextTryAt: number;
  /** For a refusal: the server's message and field issues, so the technician can fix it. */
  error?: string;
  issues?: ErrorIssue[];
}

export interface EntryItem extends ItemBase {
  type: 'entry';
  input: CreateEntryInput;
}

/** A photo taken without signal: uploaded (idempotent by uploadKey), then linked by a photo entry. */
export interface PhotoItem extends ItemBase {
  type: 'photo';
  equipmentId: string;
  file: Blob;
  fileName: string;
  photoKind: PhotoKind;
  caption: string | null;
  uploadKey: string;
  /** Set once the upload went through, so a retry only links it. */
  photoId?: string;
}

export interface CloseItem extends ItemBase {
  type: 'close';
  input: CloseVisitInput & { clientCloseId: string };
}

/** A visit started without signal: sent first, and everything of the visit waits behind it. */
export interface StartItem extends ItemBase {
  type: 'start';
  input: StartVisitInput & { id: string };
}

export type OutboxItem = StartItem | EntryItem | PhotoItem | CloseItem;

/** What the phone knows of a visit it started without signal, to show it before the server has it. */
export interface PhoneVisit {
  id: string;
  userId: string;
  siteId: string;
  reason: VisitReason;
  startedAt: string;
}

interface OutboxDb extends DBSchema {
  items: { key: string; value: OutboxItem; indexes: { visitId: string } };
  visits: { key: string; value: PhoneVisit; indexes: { siteId: string } };
}

const DB_NAME = 'rimeline-outbox';
const CHANNEL = 'rimeline-outbox';
const LEGACY_PREFIX = 'rimeline:pending-entries:';

let dbPromise: Promise<IDBPDatabase<OutboxDb>> | null = null;
function database(): Promise<IDBPDatabase<OutboxDb>> {
  dbPromise ??= openDB<OutboxDb>(DB_NAME, 2, {
    upgrade(db, oldVersion) {
      if (oldVersion < 1) db.createObjectStore('items', { keyPath: 'id' }).createIndex('visitId', 'visitId');
      if (oldVersion < 2) db.createObjectStore('visits', { keyPath: 'id' }).createIndex('siteId', 'siteId');
    },
  });
  return dbPromise;
}

const listeners = new Set<() => void>();
let channel: BroadcastChannel | null = null;

function changed(): void {
  for (const l of listeners) l();
  channel?.postMessage('changed');
}

/** Calls back on any change, from this tab or another. */
export function subscribeOutbox(onChange: () => void): () => void {
  if (typeof window === 'undefined') return () => undefined;
  if (!channel && typeof BroadcastChannel !== 'undefined') {
    channel = new BroadcastChannel(CHANNEL);
    channel.onmessage = () => {
      for (const l of listeners) l();
    };
  }
  listeners.add(onChange);
  return () => listeners.delete(onChange);
}

let lastSeq = 0;
/** Strictly increasing within this phone, even for two items made in one millisecond. */
export function nextSeq(): number {
  lastSeq = Math.max(lastSeq + 1, Date.now() * 1000);
  return lastSeq;
}

export async function outboxItems(visitId?: string): Promise<OutboxItem[]> {
  const db = await database();
  const items = visitId ? await db.getAllFromIndex('items', 'visitId', visitId) : await db.getAll('items');
  return items.sort((a, b) => a.seq - b.seq);
}

export async function putItem(item: OutboxItem): Promise<void> {
  await (await database()).put('items', item);
  changed();
}

export async function patchItem(id: string, patch: Partial<Pick<OutboxItem, 'state' | 'attempts' | 'nextTryAt' | 'error' | 'issues'>> & { photoId?: string }): Promise<void> {
  const db = await database();
  const tx = db.transaction('items', 'readwrite');
  const item = await tx.store.get(id);
  if (item) await tx.store.put({ ...item, ...patch } as OutboxItem);
  await tx.done;
  changed();
}

export async function removeItem(id: string): Promise<void> {
  await (await database()).delete('items', id);
  changed();
}

/** Keeps a visit started without signal on the phone, with its start at the head of its outbox. */
export async function startOnPhone(visit: PhoneVisit): Promise<void> {
  const db = await database();
  const tx = db.transaction(['visits', 'items'], 'readwrite');
  await tx.objectStore('visits').put(visit);
  await tx.objectStore('items').put({
    type: 'start',
    id: visit.id,
    visitId: visit.id,
    userId: visit.userId,
    seq: nextSeq(),
    state: 'waiting',
    attempts: 0,
    savedAt: visit.startedAt,
    nextTryAt: 0,
    input: { id: visit.id, siteId: visit.siteId, reason: visit.reason, startedAt: visit.startedAt },
  });
  await tx.done;
  changed();
}

/** A visit this person started on the phone (kept until its site's copy knows it). */
export async function phoneVisit(userId: string, visitId: string): Promise<PhoneVisit | null> {
  const v = await (await database()).get('visits', visitId);
  return v && v.userId === userId ? v : null;
}

/** This person's visits started on the phone at a site, newest first. */
export async function phoneVisitsAt(userId: string, siteId: string): Promise<PhoneVisit[]> {
  const all = await (await database()).getAllFromIndex('visits', 'siteId', siteId);
  return all.filter((v) => v.userId === userId).sort((a, b) => b.startedAt.localeCompare(a.startedAt));
}

/** The server has the visit and the phone's work on it: its local record is no longer needed. */
export async function forgetPhoneVisit(visitId: string): Promise<void> {
  await (await database()).delete('visits', visitId);
}

/** Entries kept in localStorage by an earlier version move into the outbox once. */
export async function adoptLegacyEntries(): Promise<void> {
  if (typeof window === 'undefined') return;
  const keys = Object.keys(window.localStorage).filter((k) => k.startsWith(LEGACY_PREFIX));
  for (const key of keys) {
    const visitId = key.slice(LEGACY_PREFIX.length);
    let list: { input: CreateEntryInput; savedAt: string; attempts: number; state: string; error?: string; issues?: ErrorIssue[] }[] = [];
    try {
      list = JSON.parse(window.localStorage.getItem(key) ?? '[]');
    } catch {
      list = [];
    }
    for (const p of list) {
      await putItem({
        type: 'entry',
        id: p.input.clientEntryId,
        visitId,
        seq: nextSeq(),
        state: p.state === 'refused' ? 'refused' : 'waiting',
        attempts: p.attempts ?? 0,
        savedAt: p.savedAt,
        nextTryAt: 0,
        input: p.input,
        error: p.error,
        issues: p.issues,
      });
    }
    window.localStorage.removeItem(key);
  }
}

/** "3 entries and 2 photos waiting" — what the phone still holds, in words. */
export function waitingWords(items: readonly OutboxItem[]): string | null {
  const waiting = items.filter((i) => i.state !== 'refused' && i.type !== 'start');
  const photos = waiting.filter((i) => i.type === 'photo' || (i.type === 'entry' && i.input.kind === 'photo')).length;
  const closes = waiting.filter((i) => i.type === 'close').length;
  const entries = waiting.length - photos - closes;
  const parts = [
    entries > 0 ? `${entries} ${entries === 1 ? 'entry' : 'entries'}` : null,
    photos > 0 ? `${photos} ${photos === 1 ? 'photo' : 'photos'}` : null,
    closes > 0 ? 'the close' : null,
  ].filter(Boolean);
  if (parts.length === 0) return null;
  const list = parts.length > 1 ? `${parts.slice(0, -1).join(', ')} and ${parts.at(-1)}` : parts[0];
  return `${list} waiting`;
}

/**
 * The outbox banner's title: what waits, in words, and whether there is signal. A visit started
 * without signal and nothing recorded yet waits only for its start, which the words leave out,
 * so the title names the start rather than printing nothing.
 */
export function outboxTitle(online: boolean, unsent: readonly OutboxItem[]): string {
  const starting = unsent.some((i) => i.type === 'start' && i.state !== 'refused');
  const what = waitingWords(unsent) ?? (starting ? 'the visit’s start waiting' : null);
  if (!online) return what ? `No signal: ${what}` : 'No signal';
  return what ? `${what.charAt(0).toUpperCase()}${what.slice(1)} to be sent` : 'Work waiting to be sent';
}

/** A v4 uuid; crypto.randomUUID exists only in secure contexts, getRandomValues everywhere. */
export function newClientId(): string {
  const c = globalThis.crypto;
  if (typeof c.randomUUID === 'function') return c.randomUUID();
  const b = c.getRandomValues(new Uint8Array(16));
  b[6] = (b[6]! & 0x0f) | 0x40;
  b[8] = (b[8]! & 0x3f) | 0x80;
  const h = [...b].map((x) => x.toString(16).padStart(2, '0')).join('');
  return `${h.slice(0, 8)}-${h.slice(8, 12)}-${h.slice(12, 16)}-${h.slice(16, 20)}-${h.slice(20)}`;
}
