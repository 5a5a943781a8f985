'use client';

import { useInfiniteQuery, useQuery, useQueryClient, type QueryClient } from '@tanstack/react-query';
import { useCallback, useEffect, useState } from 'react';
import { ApiError, apiFetch } from '@/lib/api/client';
import { saveRecord, useChange } from '@/lib/mutations';
import type { Page } from '@/lib/api/cursor';
import type { EntryDto, VisitDetailDto, VisitDto } from '@/lib/visits/dto';
import type { PhotoKind } from '@/lib/photos/schemas';
import { adoptLegacyEntries, nextSeq, outboxItems, patchItem, putItem, removeItem, subscribeOutbox, type OutboxItem } from '@/lib/visits/outbox';
import { drainOutbox, sendItem, type SendResult } from '@/lib/visits/outbox-sender';
import { offlineUser } from '@/lib/offline/user';
import { visitKeys, type HistoryScope } from '@/lib/visits/keys';
import { HISTORY_PAGE_SIZE, type CloseVisitInput, type CreateEntryInput, type EntryKind, type StartVisitInput } from '@/lib/visits/schemas';

export { visitKeys, type HistoryScope } from '@/lib/visits/keys';
export { useReadingSeries, type ReadingPoint } from '@/lib/visits/reading-series';

/** `fromServer: false`: a visit shown from the phone's copy, not to be fetched (it may not exist there yet). */
export function useVisit(id: string, initial?: VisitDetailDto, opts: { fromServer?: boolean } = {}) {
  return useQuery({
    queryKey: visitKeys.detail(id),
    queryFn: ({ signal }) => apiFetch<VisitDetailDto>(`/api/visits/${id}`, { signal }),
    enabled: opts.fromServer ?? true,
    ...(initial ? { initialData: initial } : {}),
  });
}

export function useStartVisit() {
  return useChange((input: StartVisitInput) => saveRecord<VisitDto>('/api/visits', undefined, input), visitKeys.all);
}

export function useVisitCommand(id: string, command: 'reopen' | 'review') {
  return useChange<void, VisitDto>(() => apiFetch<VisitDto>(`/api/visits/${id}/${command}`, { method: 'POST' }), visitKeys.all);
}

export function useVoidEntry(visitId: string) {
  return useChange(
    ({ entryId, reason }: { entryId: string; reason: string }) => apiFetch<EntryDto>(`/api/entries/${entryId}/void`, { method: 'POST', json: { reason } }),
    visitKeys.detail(visitId),
  );
}

// ---------------------------------------------------------------------------------------------
// The visit's work saved as it is made and kept on the phone (lib/visits/outbox.ts) until the
// server has it.

export type SaveOutcome = { outcome: 'saved'; entry: EntryDto } | { outcome: 'waiting' } | { outcome: 'refused'; error: ApiError };

const RETRY_CHECK_MS = 5_000;

/** What the server's answer to an outbox item changes in the cached visit. */
function applySent(qc: QueryClient, visitId: string, result: SendResult): void {
  if (result.result !== 'sent') return;
  if (result.entry) {
    const entry = result.entry;
    qc.setQueryData<VisitDetailDto>(visitKeys.detail(visitId), (old) => (old ? { ...old, entries: [...old.entries.filter((e) => e.id !== entry.id), entry] } : old));
  }
  // The server also works out bypasses, follow-ups and settings from the entry.
  void qc.invalidateQueries({ queryKey: visitKeys.detail(visitId) });
  void qc.invalidateQueries({ queryKey: visitKeys.histories() });
}

/**
 * The visit's outbox and how to add to it. Use once per visit page: it sends on load, when the
 * browser says the connection is back, and on a timer while anything waits (navigator.onLine is
 * not always told about a dead mobile link), each item after its back-off.
 */
export function useVisitOutbox(visitId: string) {
  const qc = useQueryClient();
  const [items, setItems] = useState<OutboxItem[]>([]);
  const [online, setOnline] = useState(true);
  const reload = useCallback(async () => setItems(await outboxItems(visitId)), [visitId]);
  const onSent = useCallback((item: OutboxItem, result: SendResult) => applySent(qc, item.visitId, result), [qc]);
  const retryAll = useCallback(async () => {
    // A refused start is tried again on request (e.g. once another open visit at the site is closed).
    for (const i of await outboxItems(visitId)) if (i.type === 'start' && i.state === 'refused') await patchItem(i.id, { state: 'waiting', nextTryAt: 0 });
    await drainOutbox({ visitId, userId: await offlineUser(), force: true, onSent });
  }, [visitId, onSent]);

  useEffect(() => {
    setOnline(navigator.onLine);
    const unsubscribe = subscribeOutbox(() => void reload());
    void (async () => {
      await adoptLegacyEntries();
      // A 'sending' left by a page that was closed mid-request is really waiting.
      for (const i of await outboxItems(visitId)) if (i.state === 'sending') await patchItem(i.id, { state: 'waiting' });
      await reload();
      await drainOutbox({ visitId, userId: await offlineUser(), force: true, onSent });
    })();
    const up = () => {
      setOnline(true);
      void retryAll();
    };
    const down = () => setOnline(false);
    window.addEventListener('online', up);
    window.addEventListener('offline', down);
    return () => {
      unsubscribe();
      window.removeEventListener('online', up);
      window.removeEventListener('offline', down);
    };
  }, [visitId, reload, retryAll, onSent]);

  const waitingCount = items.filter((i) => i.state !== 'refused').length;
  useEffect(() => {
    if (waitingCount === 0) return;
    const timer = window.setInterval(() => void offlineUser().then((userId) => drainOutbox({ visitId, userId, onSent })), RETRY_CHECK_MS);
    return () => window.clearInterval(timer);
  }, [waitingCount, visitId, onSent]);

  /** Keeps the entry on the phone first, then sends it. A refusal on the first try is handed back to the form. */
  const save = useCallback(
    async (input: CreateEntryInput): Promise<SaveOutcome> => {
      const userId = await offlineUser();
      const item: OutboxItem = { type: 'entry', id: input.clientEntryId, visitId, userId, seq: nextSeq(), state: 'sending', attempts: 0, savedAt: input.recordedAt ?? new Date().toISOString(), nextTryAt: 0, input };
      await putItem(item);
      // A visit started without signal holds everything behind its start, refused or not.
      const earlier = (await outboxItems(visitId)).some((i) => i.seq < item.seq && (i.state !== 'refused' || i.type === 'start'));
      // Behind older work still waiting, it keeps its place in the queue.
      if (earlier) {
        await patchItem(item.id, { state: 'waiting' });
        void drainOutbox({ visitId, userId, force: true, onSent });
        return { outcome: 'waiting' };
      }
      const sent = await sendItem(item);
      if (sent) onSent(item, sent);
      if (sent?.result === 'refused') {
        await removeItem(item.id);
        return { outcome: 'refused', error: sent.error };
      }
      return sent?.result === 'sent' && sent.entry ? { outcome: 'saved', entry: sent.entry } : { outcome: 'waiting' };
    },
    [visitId, onSent],
  );

  /** A photo taken without signal: kept as a blob, uploaded and linked to the visit when it can be. */
  const savePhoto = useCallback(
    async (photo: { equipmentId: string; file: Blob; fileName: string; kind: PhotoKind; caption: string | null; uploadKey: string; clientEntryId: string }) => {
      const userId = await offlineUser();
      await putItem({ type: 'photo', id: photo.clientEntryId, visitId, userId, seq: nextSeq(), state: 'waiting', attempts: 0, savedAt: new Date().toISOString(), nextTryAt: 0, equipmentId: photo.equipmentId, file: photo.file, fileName: photo.fileName, photoKind: photo.kind, caption: photo.caption, uploadKey: photo.uploadKey });
      void drainOutbox({ visitId, userId, force: true, onSent });
    },
    [visitId, onSent],
  );

  /** The close goes into the outbox behind everything made before it, and is sent after them. */
  const queueClose = useCallback(
    async (input: CloseVisitInput & { clientCloseId: string }) => {
      const userId = await offlineUser();
      await putItem({ type: 'close', id: input.clientCloseId, visitId, userId, seq: nextSeq(), state: 'waiting', attempts: 0, savedAt: new Date().toISOString(), nextTryAt: 0, input });
      await drainOutbox({ visitId, userId, force: true, onSent });
      return (await outboxItems(visitId)).find((i) => i.id === input.clientCloseId) ?? null;
    },
    [visitId, onSent],
  );

  const discard = useCallback((id: string) => void removeItem(id), []);

  return { items, waitingCount, online, save, savePhoto, queueClose, retryAll, discard };
}

// ---------------------------------------------------------------------------------------------
// History and charts.


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

