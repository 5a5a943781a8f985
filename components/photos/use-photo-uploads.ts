'use client';

import { useCallback, useEffect, useRef, useState } from 'react';
import { ApiError } from '@/lib/api/client';
import type { PhotoDto } from '@/lib/photos/dto';
import { photoKeys, uploadPhotoFile } from '@/lib/photos/hooks';
import { invalidateQueries } from '@/lib/query/invalidate';
import { photoFileProblem, type PhotoKind } from '@/lib/photos/terms';

// The upload queue behind every photo picker: a chosen file starts at once (two at a time), each
// with its own progress; a failure keeps the file in memory and waits for Retry; nothing is
// dropped without the person removing it.

export type UploadStatus = 'queued' | 'uploading' | 'processing' | 'done' | 'failed';

export interface UploadItem {
  id: string;
  file: File;
  preview: string;
  kind: PhotoKind;
  caption: string;
  status: UploadStatus;
  percent: number;
  error?: string;
  /** False when sending the same file again cannot help (too large, not an image). */
  retryable: boolean;
  /** The stored photo, once done; replaced when its kind or caption is changed. */
  photo?: PhotoDto;
}

/** Up to two uploads at a time: faster on a good line, still gentle on a weak one. */
const PARALLEL = 2;

export function newUploadId(): string {
  return typeof crypto !== 'undefined' && 'randomUUID' in crypto
    ? crypto.randomUUID()
    : '10000000-1000-4000-8000-100000000000'.replace(/[018]/g, (c) => (Number(c) ^ (Math.random() * 16) >> (Number(c) / 4)).toString(16));
}

/** Items that still need the person: waiting, on their way, or failed but worth a retry. */
export function unsentCount(items: UploadItem[]): number {
  return items.filter((i) => i.status === 'queued' || i.status === 'uploading' || i.status === 'processing' || (i.status === 'failed' && i.retryable)).length;
}

/** "1 photo is not sent yet." / "3 photos are not sent yet." */
export function unsentMessage(count: number): string {
  return count === 1 ? '1 photo is not sent yet.' : `${count} photos are not sent yet.`;
}

export function usePhotoUploads(equipmentId: string, { onUploaded }: { onUploaded?: (photo: PhotoDto) => void } = {}) {
  // The list lives in a ref so the queue reads it synchronously; state mirrors it for rendering.
  const store = useRef<UploadItem[]>([]);
  const [items, setItems] = useState<UploadItem[]>([]);
  const uploadKeys = useRef(new Map<string, string>());
  const running = useRef(new Map<string, AbortController>());
  const mounted = useRef(false);
  const uploadedRef = useRef(onUploaded);
  uploadedRef.current = onUploaded;
  const equipmentRef = useRef(equipmentId);
  equipmentRef.current = equipmentId;

  const update = useCallback((fn: (all: UploadItem[]) => UploadItem[]) => {
    store.current = fn(store.current);
    setItems(store.current);
  }, []);
  const patch = useCallback((id: string, change: Partial<UploadItem>) => update((all) => all.map((i) => (i.id === id ? { ...i, ...change } : i))), [update]);

  const pump = useCallback(() => {
    while (mounted.current && running.current.size < PARALLEL) {
      const next = store.current.find((i) => i.status === 'queued');
      if (!next) return;
      void send(next);
    }
    // send and pump call each other; both read only refs and stable setters.
  }, []);

  useEffect(() => {
    mounted.current = true;
    // A photo chosen between the first paint and this effect (a quick tap, or a test) waited
    // queued with nothing to start it: start what is queued now.
    pump();
    const controllers = running.current;
    return () => {
      mounted.current = false;
      // Leaving was confirmed (or nothing was pending): stop what is on the wire, free the memory.
      controllers.forEach((c) => c.abort());
      store.current.forEach((i) => URL.revokeObjectURL(i.preview));
    };
  }, [pump]);

  async function send(item: UploadItem): Promise<void> {
    let key = uploadKeys.current.get(item.id);
    if (!key) {
      key = newUploadId();
      uploadKeys.current.set(item.id, key);
    }
    const controller = new AbortController();
    running.current.set(item.id, controller);
    patch(item.id, { status: 'uploading', percent: 0, error: undefined });
    try {
      const photo = await uploadPhotoFile(
        equipmentRef.current,
        item.file,
        { kind: item.kind, caption: item.caption, uploadKey: key },
        ({ sent, total }) => {
          const percent = total > 0 ? Math.min(100, Math.round((sent / total) * 100)) : 0;
          patch(item.id, percent >= 100 ? { percent: 100, status: 'processing' } : { percent });
        },
        controller.signal,
      );
      if (!mounted.current) return;
      patch(item.id, { status: 'done', percent: 100, photo, caption: photo.caption ?? '', kind: photo.kind });
      uploadedRef.current?.(photo);
      // The registry, not useQueryClient: a unit's page has no query provider (DEVELOPERS.md, "Phone pages").
      void invalidateQueries(photoKeys.lists());
    } catch (error) {
      if (!mounted.current) return;
      const message = error instanceof ApiError ? error.message : 'The upload failed. Nothing was saved; press Retry.';
      const retryable = !(error instanceof ApiError) || ![413, 415, 422].includes(error.status);
      patch(item.id, { status: 'failed', error: message, retryable });
    } finally {
      running.current.delete(item.id);
      pump();
    }
  }

  /** Queues the chosen files with `kind` and starts sending them. */
  const add = useCallback(
    (list: FileList | File[] | null, kind: PhotoKind) => {
      if (!list || list.length === 0) return;
      const added: UploadItem[] = [...list].map((file) => {
        const problem = photoFileProblem(file);
        return {
          id: newUploadId(),
          file,
          preview: URL.createObjectURL(file),
          kind,
          caption: '',
          status: problem ? 'failed' : 'queued',
          percent: 0,
          error: problem,
          retryable: !problem,
        };
      });
      update((all) => [...all, ...added]);
      pump();
    },
    [update, pump],
  );

  const retry = useCallback(
    (id: string) => {
      patch(id, { status: 'queued', error: undefined, percent: 0 });
      pump();
    },
    [patch, pump],
  );

  const remove = useCallback(
    (id: string) => {
      const item = store.current.find((i) => i.id === id);
      if (item) URL.revokeObjectURL(item.preview);
      running.current.get(id)?.abort();
      uploadKeys.current.delete(id);
      update((all) => all.filter((i) => i.id !== id));
    },
    [update],
  );

  const clearDone = useCallback(() => {
    store.current.filter((i) => i.status === 'done').forEach((i) => remove(i.id));
  }, [remove]);

  return { items, add, retry, remove, clearDone, patch, unsent: unsentCount(items) };
}
