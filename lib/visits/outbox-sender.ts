import { ApiError, apiFetch } from '@/lib/api/client';
import type { PhotoDto } from '@/lib/photos/dto';
import { uploadPhotoFile } from '@/lib/photos/hooks';
import type { EntryDto, VisitDto } from '@/lib/visits/dto';
import { forgetPhoneVisit, outboxItems, patchItem, removeItem, type OutboxItem } from '@/lib/visits/outbox';

// Sends the outbox: a visit's items in the order they were made, one at a time. A send that fails
// for want of signal stops the round (the rest would fail too) and backs off; a refusal waits for
// the technician's fix and never blocks the entries after it, only the close, which goes last.
// A visit started without signal goes first; until the server has it, nothing of it is sent.

export type SendResult = { result: 'sent'; entry?: EntryDto; visit?: VisitDto } | { result: 'waiting' } | { result: 'refused'; error: ApiError };

/** A refusal is final (fix and resubmit); anything that smells of a bad connection is retried. */
export function isTransient(error: unknown): boolean {
  if (!(error instanceof ApiError)) return true;
  return error.code === 'network' || error.status === 0 || error.status === 401 || error.status === 408 || error.status === 429 || error.status >= 500;
}

/** After n failed sends: 5 s, 15 s, 30 s, 1 min, 2 min, then every 5 min. */
export function backoffMs(attempts: number): number {
  const steps = [5_000, 15_000, 30_000, 60_000, 120_000];
  return steps[Math.min(attempts, steps.length) - 1] ?? 300_000;
}

const SEND_TIMEOUT_MS = 12_000;
const inFlight = new Set<string>();

async function deliver(item: OutboxItem): Promise<{ entry?: EntryDto; visit?: VisitDto }> {
  const timeout = () => AbortSignal.timeout(SEND_TIMEOUT_MS);
  switch (item.type) {
    case 'start': {
      const visit = await apiFetch<VisitDto>('/api/visits', { method: 'POST', json: item.input, signal: timeout() });
      await forgetPhoneVisit(item.visitId);
      return { visit };
    }
    case 'entry':
      return { entry: await apiFetch<EntryDto>(`/api/visits/${item.visitId}/entries`, { method: 'POST', json: item.input, signal: timeout() }) };
    case 'photo': {
      let photoId = item.photoId;
      if (!photoId) {
        const file = new File([item.file], item.fileName, { type: item.file.type });
        const photo: PhotoDto = await uploadPhotoFile(item.equipmentId, file, { kind: item.photoKind, caption: item.caption ?? '', uploadKey: item.uploadKey }, () => undefined, timeout());
        photoId = photo.id;
        await patchItem(item.id, { photoId });
      }
      const input = { equipmentId: item.equipmentId, clientEntryId: item.id, recordedAt: item.savedAt, kind: 'photo', data: { photoId, caption: item.caption } };
      return { entry: await apiFetch<EntryDto>(`/api/visits/${item.visitId}/entries`, { method: 'POST', json: input, signal: timeout() }) };
    }
    case 'close':
      return { visit: await apiFetch<VisitDto>(`/api/visits/${item.visitId}/close`, { method: 'POST', json: item.input, signal: timeout() }) };
  }
}

/** Sends one item now; its outcome is written back to the outbox. */
export async function sendItem(item: OutboxItem): Promise<SendResult | null> {
  if (inFlight.has(item.id)) return null;
  inFlight.add(item.id);
  await patchItem(item.id, { state: 'sending', attempts: item.attempts + 1 });
  try {
    const done = await deliver(item);
    await removeItem(item.id);
    return { result: 'sent', ...done };
  } catch (error) {
    if (isTransient(error)) {
      const signedOut = error instanceof ApiError && error.status === 401;
      await patchItem(item.id, { state: 'waiting', nextTryAt: Date.now() + backoffMs(item.attempts + 1), error: signedOut ? 'Signed out: sign in again to send it.' : undefined });
      return { result: 'waiting' };
    }
    const apiError = error as ApiError;
    await patchItem(item.id, { state: 'refused', error: apiError.message, issues: apiError.issues });
    return { result: 'refused', error: apiError };
  } finally {
    inFlight.delete(item.id);
  }
}

/**
 * Sends what is due, visit by visit, in order. `force` ignores the back-off (the technician pressed
 * "Try sending now", or the browser says the connection is back).
 */
export async function drainOutbox(opts: { visitId?: string; userId?: string; force?: boolean; onSent?: (item: OutboxItem, result: SendResult) => void } = {}): Promise<void> {
  // The browser knows there is no connection: nothing is tried (and no back-off is earned) until
  // it says the connection is back.
  if (typeof navigator !== 'undefined' && navigator.onLine === false) return;
  // Another person's work waits for them: it is never sent under this session.
  const items = (await outboxItems(opts.visitId)).filter((i) => !opts.userId || !i.userId || i.userId === opts.userId);
  const byVisit = new Map<string, OutboxItem[]>();
  for (const i of items) byVisit.set(i.visitId, [...(byVisit.get(i.visitId) ?? []), i]);
  for (const list of byVisit.values()) {
    let earlierOutstanding = false;
    for (const item of list) {
      if (item.state === 'refused') {
        // A refused start holds the whole visit: its entries have nowhere to go yet.
        if (item.type === 'start') break;
        earlierOutstanding = true;
        continue;
      }
      // The close goes only after everything made before it has reached the server.
      if (item.type === 'close' && earlierOutstanding) break;
      // Still backing off: the items after it keep their place behind it.
      if (!opts.force && item.nextTryAt > Date.now()) break;
      const sent = await sendItem(item);
      // Another round is sending this item: that round keeps the visit's order, this one stops.
      if (!sent) break;
      opts.onSent?.(item, sent);
      // No signal: the rest of the outbox would fail the same way.
      if (sent.result === 'waiting') return;
      if (sent.result === 'refused') {
        if (item.type === 'start') break;
        earlierOutstanding = true;
      }
    }
  }
}
