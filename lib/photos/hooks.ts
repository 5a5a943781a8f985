'use client';

import { keepPreviousData, useInfiniteQuery, useMutation, useQueryClient } from '@tanstack/react-query';
import { apiFetch, ApiError } from '@/lib/api/client';
import type { ErrorBody } from '@/lib/errors';
import type { PhotoDto, PhotoListDto, StorageRepairDto } from '@/lib/photos/dto';
import type { PhotoKind, UpdatePhotoInput } from '@/lib/photos/schemas';

export const photoKeys = {
  all: ['photos'] as const,
  lists: () => ['photos', 'list'] as const,
  list: (equipmentId: string, kinds: PhotoKind[] = []) => ['photos', 'list', equipmentId, [...kinds].sort()] as const,
  detail: (id: string) => ['photos', 'detail', id] as const,
};

export function usePhotos(equipmentId: string, kinds: PhotoKind[] = []) {
  return useInfiniteQuery({
    queryKey: photoKeys.list(equipmentId, kinds),
    queryFn: ({ pageParam }) => {
      const params = new URLSearchParams();
      for (const k of kinds) params.append('kind', k);
      if (pageParam) params.set('cursor', pageParam);
      return apiFetch<PhotoListDto>(`/api/equipment/${equipmentId}/photos?${params}`);
    },
    initialPageParam: '',
    getNextPageParam: (last) => last.nextCursor ?? undefined,
    // A new kind filter keeps the current page on screen (and the uploader above it mounted).
    placeholderData: keepPreviousData,
  });
}

export function useUpdatePhoto() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ id, input }: { id: string; input: UpdatePhotoInput }) => apiFetch<PhotoDto>(`/api/photos/${id}`, { method: 'PATCH', json: input }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: photoKeys.all }),
  });
}

export function useDeletePhoto() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (id: string) => apiFetch<void>(`/api/photos/${id}`, { method: 'DELETE' }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: photoKeys.all }),
  });
}

export function useRepairPhotoStorage() {
  return useMutation({ mutationFn: () => apiFetch<StorageRepairDto>('/api/photos/consistency/repair', { method: 'POST' }) });
}

export interface UploadFields {
  kind: PhotoKind;
  caption: string;
  /** One per file, kept across retries so a retry after a lost answer finds the stored photo. */
  uploadKey: string;
}

export interface UploadProgress {
  /** Bytes of the request sent so far. */
  sent: number;
  total: number;
}

/**
 * Sends one photo to POST /api/equipment/:id/photos with upload progress (fetch has none), and
 * turns every failure into an ApiError with a message a person can act on.
 */
export function uploadPhotoFile(
  equipmentId: string,
  file: File,
  fields: UploadFields,
  onProgress: (p: UploadProgress) => void,
  signal?: AbortSignal,
): Promise<PhotoDto> {
  return new Promise((resolve, reject) => {
    const body = new FormData();
    body.set('kind', fields.kind);
    if (fields.caption.trim()) body.set('caption', fields.caption.trim());
    body.set('uploadKey', fields.uploadKey);
    body.set('file', file, file.name);
    const xhr = new XMLHttpRequest();
    xhr.open('POST', `/api/equipment/${equipmentId}/photos`);
    xhr.setRequestHeader('Accept', 'application/json');
    xhr.upload.onprogress = (e) => onProgress({ sent: e.loaded, total: e.lengthComputable ? e.total : file.size });
    xhr.onerror = () => reject(new ApiError(0, 'network', 'The connection dropped before the photo arrived. Nothing was saved; press Retry.'));
    xhr.ontimeout = () => reject(new ApiError(0, 'network', 'The upload took too long. Nothing was saved; press Retry on a better signal.'));
    xhr.onabort = () => reject(new ApiError(0, 'network', 'The upload was cancelled.'));
    xhr.onload = () => {
      let data: unknown = null;
      try {
        data = xhr.responseText ? JSON.parse(xhr.responseText) : null;
      } catch {
        data = null;
      }
      if (xhr.status >= 200 && xhr.status < 300) {
        resolve(data as PhotoDto);
        return;
      }
      const error = (data as Partial<ErrorBody> | null)?.error;
      reject(new ApiError(xhr.status, error?.code ?? 'internal', error?.message ?? `The server answered ${xhr.status}. Nothing was saved; press Retry.`, error?.issues ?? []));
    };
    signal?.addEventListener('abort', () => xhr.abort(), { once: true });
    xhr.send(body);
  });
}
