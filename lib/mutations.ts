'use client';

import { useMutation, useQueryClient, type QueryKey } from '@tanstack/react-query';
import { apiFetch } from '@/lib/api/client';

// The shape every domain's change hook shares: call the API, then fetch again what it changed.

/** A change through the API; once it succeeds, the queries under each key in `refresh` are fetched again. */
export function useChange<I, T>(mutationFn: (input: I) => Promise<T>, ...refresh: QueryKey[]) {
  const qc = useQueryClient();
  return useMutation({ mutationFn, onSuccess: () => Promise.all(refresh.map((queryKey) => qc.invalidateQueries({ queryKey }))) });
}

/** Creates a record (POST to `path`) or, given its id, changes it (PATCH `path/id`). */
export function saveRecord<T>(path: string, id: string | undefined, input: unknown): Promise<T> {
  return id ? apiFetch<T>(`${path}/${id}`, { method: 'PATCH', json: input }) : apiFetch<T>(path, { method: 'POST', json: input });
}

/** Archives or restores the record at `path`. */
export function archiveRecord<T>(path: string, archived: boolean): Promise<T> {
  return apiFetch<T>(`${path}/${archived ? 'archive' : 'restore'}`, { method: 'POST' });
}
