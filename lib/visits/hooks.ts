'use client';

import { useInfiniteQuery, useMutation, useQuery, useQueryClient, type QueryClient } from '@tanstack/react-query';
import { useCallback, useEffect, useMemo, useState, useSyncExternalStore } from 'react';
import { ApiError, apiFetch } from '@/lib/api/client';
import type { Page } from '@/lib/api/cursor';
import type { EntryDto, VisitDetailDto, VisitDto } from '@/lib/visits/dto';
import {
  addPending,
  pendingSnapshot,
  readPending,
  removePending,
  subscribePending,
  updatePending,
  type PendingEntry,
} from '@/lib/visits/pending';
import { HISTORY_PAGE_SIZE, type CloseVisitInput, type CreateEntryInput, type EntryKind, type StartVisitInput } from '@/lib/visits/schemas';

export const visitKeys = {
  all: ['visits'] as const,
  detail: (id: string) => ['visits', 'detail', id] as const,
  histories: () => ['visits', 'history'] as const,
  history: (scope: HistoryScope, id: string, kinds: readonly EntryKind[]) => ['visits', 'history', scope, id, kinds] as const,
  readings: (equipmentId: string, key: string) => ['visits', 'readings', equipmentId, key] as const,
};

export function useVisit(id: string, initial?: VisitDetailDto) {
  return useQuery({
    queryKey: visitKeys.detail(id),
    queryFn: ({ signal }) => apiFetch<VisitDetailDto>(`/api/visits/${id}`, { signal }),
    ...(initial ? { initialData: initial } : {}),
  });
}

export function useStartVisit() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: StartVisitInput) => apiFetch<VisitDto>('/api/visits', { method: 'POST', json: input }),
    onSuccess: () => qc.invalidateQueries({ queryKey: visitKeys.all }),
  });
}

export function useCloseVisit(id: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: CloseVisitInput) => apiFetch<VisitDto>(`/api/visits/${id}/close`, { method: 'POST', json: input }),
    onSuccess: () => qc.invalidateQueries({ queryKey: visitKeys.all }),
  });
}

export function useVisitCommand(id: string, command: 'reopen' | 'review') {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: () => apiFetch<VisitDto>(`/api/visits/${id}/${command}`, { method: 'POST' }),
    onSuccess: () => qc.invalidateQueries({ queryKey: visitKeys.all }),
  });
}

export function useVoidEntry(visitId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ entryId, reason }: { entryId: string; reason: string }) => apiFetch<EntryDto>(`/api/entries/${entryId}/void`, { method: 'POST', json: { reason } }),
    onSuccess: () => qc.invalidateQueries({ queryKey: visitKeys.detail(visitId) }),
  });
}

// ---------------------------------------------------------------------------------------------
// Entries saved as they are made, kept on the phone until the server has them.

export type SaveOutcome = { outcome: 'saved'; entry: EntryDto } | { outcome: 'waiting' } | { outcome: 'refused'; error: ApiError };

/** A refusal is final (fix and resubmit); anything that smells of a bad connection is retried. */
function isTransient(error: unknown): boolean {
  if (!(error instanceof ApiError)) return true;
  return error.code === 'network' || error.status === 0 || error.status === 401 || error.status === 408 || error.status === 429 || error.status >= 500;
}

const inFlight = new Set<string>();
const SEND_TIMEOUT_MS = 12_000;

async function sendPending(visitId: string, clientEntryId: string, qc: QueryClient): Promise<SaveOutcome | null> {
  if (inFlight.has(clientEntryId)) return null;
  const pending = readPending(visitId).find((p) => p.input.clientEntryId === clientEntryId);
  if (!pending) return null;
  inFlight.add(clientEntryId);
  updatePending(visitId, clientEntryId, { state: 'sending', attempts: pending.attempts + 1 });
  try {
    // A weak link can hang a request for minutes: give up after a while and keep it for the retry.
    const entry = await apiFetch<EntryDto>(`/api/visits/${visitId}/entries`, { method: 'POST', json: pending.input, signal: AbortSignal.timeout(SEND_TIMEOUT_MS) });
    removePending(visitId, clientEntryId);
    qc.setQueryData<VisitDetailDto>(visitKeys.detail(visitId), (old) =>
      old ? { ...old, entries: [...old.entries.filter((e) => e.id !== entry.id), entry] } : old,
    );
    // The server also works out bypasses, follow-ups and settings from the entry.
    void qc.invalidateQueries({ queryKey: visitKeys.detail(visitId) });
    void qc.invalidateQueries({ queryKey: visitKeys.histories() });
    return { outcome: 'saved', entry };
  } catch (error) {
    if (isTransient(error)) {
      const signedOut = error instanceof ApiError && error.status === 401;
      updatePending(visitId, clientEntryId, { state: 'waiting', error: signedOut ? 'Signed out: sign in again to send it.' : undefined });
      return { outcome: 'waiting' };
    }
    const apiError = error as ApiError;
    updatePending(visitId, clientEntryId, { state: 'refused', error: apiError.message, issues: apiError.issues });
    return { outcome: 'refused', error: apiError };
  } finally {
    inFlight.delete(clientEntryId);
  }
}

const RETRY_EVERY_MS = 15_000;

/**
 * The visit's unsent entries and how to save a new one. Use once per visit page: it retries on
 * load, when the browser says the connection is back, and every 15 s while anything waits
 * (navigator.onLine is not always told about a dead mobile link).
 */
export function usePendingEntries(visitId: string) {
  const qc = useQueryClient();
  const raw = useSyncExternalStore(
    (cb) => subscribePending(visitId, cb),
    () => pendingSnapshot(visitId),
    () => '[]',
  );
  const pending = useMemo(() => {
    try {
      return JSON.parse(raw) as PendingEntry[];
    } catch {
      return [];
    }
  }, [raw]);
  const [online, setOnline] = useState(true);

  const retryAll = useCallback(async () => {
    for (const p of readPending(visitId)) {
      if (p.state === 'refused') continue;
      const result = await sendPending(visitId, p.input.clientEntryId, qc);
      // One failed send means no signal: leave the rest for the next attempt.
      if (result?.outcome === 'waiting') break;
    }
  }, [visitId, qc]);

  useEffect(() => {
    setOnline(navigator.onLine);
    // A 'sending' left by a page that was closed mid-request is really waiting.
    for (const p of readPending(visitId)) if (p.state === 'sending' && !inFlight.has(p.input.clientEntryId)) updatePending(visitId, p.input.clientEntryId, { state: 'waiting' });
    void retryAll();
    const up = () => {
      setOnline(true);
      void retryAll();
    };
    const down = () => setOnline(false);
    window.addEventListener('online', up);
    window.addEventListener('offline', down);
    return () => {
      window.removeEventListener('online', up);
      window.removeEventListener('offline', down);
    };
  }, [visitId, retryAll]);

  const waitingCount = pending.filter((p) => p.state !== 'refused').length;
  useEffect(() => {
    if (waitingCount === 0) return;
    const timer = window.setInterval(() => void retryAll(), RETRY_EVERY_MS);
    return () => window.clearInterval(timer);
  }, [waitingCount, retryAll]);

  /** Keeps the entry on the phone first, then sends it. A refusal on the first try is handed back to the form. */
  const save = useCallback(
    async (input: CreateEntryInput): Promise<SaveOutcome> => {
      addPending(visitId, input);
      const result = await sendPending(visitId, input.clientEntryId, qc);
      if (result?.outcome === 'refused') removePending(visitId, input.clientEntryId);
      return result ?? { outcome: 'waiting' };
    },
    [visitId, qc],
  );

  const discard = useCallback((clientEntryId: string) => removePending(visitId, clientEntryId), [visitId]);

  return { pending, waitingCount, online, save, retryAll, discard };
}

// ---------------------------------------------------------------------------------------------
// History and charts.

export type HistoryScope = 'equipment' | 'system';

export function historyUrl(scope: HistoryScope, id: string, kinds: readonly EntryKind[], cursor?: string, limit = HISTORY_PAGE_SIZE): string {
  const params = new URLSearchParams();
  for (const k of kinds) params.append('kind', k);
  if (cursor) params.set('cursor', cursor);
  params.set('limit', String(limit));
  return `/api/${scope === 'equipment' ? 'equipment' : 'systems'}/${id}/history?${params}`;
}

export function useHistory(scope: HistoryScope, id: string, kinds: readonly EntryKind[], initial?: Page<EntryDto>) {
  return useInfiniteQuery({
    queryKey: visitKeys.history(scope, id, kinds),
    queryFn: ({ pageParam, signal }) => apiFetch<Page<EntryDto>>(historyUrl(scope, id, kinds, pageParam || undefined), { signal }),
    initialPageParam: '' as string,
    getNextPageParam: (last) => last.nextCursor ?? undefined,
    ...(initial && kinds.length === 0 ? { initialData: { pages: [initial], pageParams: [''] } } : {}),
  });
}

export interface ReadingPoint {
  recordedAt: string;
  value: number;
}

export function useReadingSeries(equipmentId: string, key: string) {
  return useQuery({
    queryKey: visitKeys.readings(equipmentId, key),
    queryFn: ({ signal }) => apiFetch<{ key: string; points: ReadingPoint[] }>(`/api/equipment/${equipmentId}/readings?key=${encodeURIComponent(key)}`, { signal }),
  });
}
