import type { ErrorIssue } from '@/lib/errors';
import type { CreateEntryInput } from '@/lib/visits/schemas';

// Entries not yet confirmed by the server, kept in the phone's localStorage per visit so a dropped
// connection, a closed tab or a dead battery loses nothing. Each carries the clientEntryId made when
// the form was submitted; the server answers a repeat with the first save, so a retry never
// duplicates. Browser-only; every function is a no-op on the server.

export type PendingState = 'waiting' | 'sending' | 'refused';

export interface PendingEntry {
  input: CreateEntryInput;
  state: PendingState;
  /** When the technician saved it on the phone (also its recordedAt). */
  savedAt: string;
  attempts: number;
  /** For a refusal: the server's message and field issues, so the technician can redo it. */
  error?: string;
  issues?: ErrorIssue[];
}

const PREFIX = 'rimeline:pending-entries:';
const CHANGE_EVENT = 'rimeline:pending-entries';
const storageKey = (visitId: string) => `${PREFIX}${visitId}`;

function storage(): Storage | null {
  try {
    return typeof window === 'undefined' ? null : window.localStorage;
  } catch {
    return null;
  }
}

function readRaw(visitId: string): string {
  return storage()?.getItem(storageKey(visitId)) ?? '[]';
}

export function readPending(visitId: string): PendingEntry[] {
  try {
    const parsed: unknown = JSON.parse(readRaw(visitId));
    return Array.isArray(parsed) ? (parsed as PendingEntry[]) : [];
  } catch {
    return [];
  }
}

function write(visitId: string, list: PendingEntry[]): void {
  const s = storage();
  if (!s) return;
  if (list.length === 0) s.removeItem(storageKey(visitId));
  else s.setItem(storageKey(visitId), JSON.stringify(list));
  window.dispatchEvent(new CustomEvent(CHANGE_EVENT, { detail: visitId }));
}

/** Adds an entry before the first attempt to send it, so it survives whatever happens next. */
export function addPending(visitId: string, input: CreateEntryInput): PendingEntry {
  const entry: PendingEntry = { input, state: 'sending', savedAt: input.recordedAt ?? new Date().toISOString(), attempts: 0 };
  write(visitId, [...readPending(visitId).filter((p) => p.input.clientEntryId !== input.clientEntryId), entry]);
  return entry;
}

export function updatePending(visitId: string, clientEntryId: string, patch: Partial<PendingEntry>): void {
  write(
    visitId,
    readPending(visitId).map((p) => (p.input.clientEntryId === clientEntryId ? { ...p, ...patch } : p)),
  );
}

export function removePending(visitId: string, clientEntryId: string): void {
  const list = readPending(visitId);
  if (!list.some((p) => p.input.clientEntryId === clientEntryId)) return;
  write(
    visitId,
    list.filter((p) => p.input.clientEntryId !== clientEntryId),
  );
}

/** Subscribes to changes from this tab (custom event) and from other tabs (storage event). */
export function subscribePending(visitId: string, onChange: () => void): () => void {
  if (typeof window === 'undefined') return () => undefined;
  const own = (e: Event) => {
    if ((e as CustomEvent<string>).detail === visitId) onChange();
  };
  const other = (e: StorageEvent) => {
    if (e.key === storageKey(visitId)) onChange();
  };
  window.addEventListener(CHANGE_EVENT, own);
  window.addEventListener('storage', other);
  return () => {
    window.removeEventListener(CHANGE_EVENT, own);
    window.removeEventListener('storage', other);
  };
}

/** The raw stored text: a stable snapshot for useSyncExternalStore. */
export function pendingSnapshot(visitId: string): string {
  return readRaw(visitId);
}

/** A v4 uuid; crypto.randomUUID exists only in secure contexts, getRandomValues everywhere. */
export function newClientEntryId(): string {
  const c = globalThis.crypto;
  if (typeof c.randomUUID === 'function') return c.randomUUID();
  const b = c.getRandomValues(new Uint8Array(16));
  b[6] = (b[6]! & 0x0f) | 0x40;
  b[8] = (b[8]! & 0x3f) | 0x80;
  const h = [...b].map((x) => x.toString(16).padStart(2, '0')).join('');
  return `${h.slice(0, 8)}-${h.slice(8, 12)}-${h.slice(12, 16)}-${h.slice(16, 20)}-${h.slice(20)}`;
}
