'use client';

import { useInfiniteQuery, useMutation, useQueryClient } from '@tanstack/react-query';
import { apiFetch } from '@/lib/api/client';
import type { Page } from '@/lib/api/cursor';
import type { AreaDto, SiteDto } from '@/lib/sites/dto';
import type { CreateAreaInput, CreateSiteInput, UpdateSiteInput } from '@/lib/sites/schemas';

export const siteKeys = {
  all: ['sites'] as const,
  list: (q: Record<string, unknown>) => ['sites', 'list', q] as const,
  detail: (id: string) => ['sites', 'detail', id] as const,
  areas: (id: string) => ['sites', 'detail', id, 'areas'] as const,
};

export function useSites(query: { q?: string; clientId?: string; archived?: string }, initial?: Page<SiteDto>) {
  return useInfiniteQuery({
    queryKey: siteKeys.list(query),
    queryFn: ({ pageParam }) => {
      const params = new URLSearchParams();
      if (query.q) params.set('q', query.q);
      if (query.clientId) params.set('clientId', query.clientId);
      if (query.archived) params.set('archived', query.archived);
      if (pageParam) params.set('cursor', pageParam);
      params.set('limit', '50');
      return apiFetch<Page<SiteDto>>(`/api/sites?${params}`);
    },
    initialPageParam: '' as string,
    getNextPageParam: (last) => last.nextCursor ?? undefined,
    ...(initial && !query.q && !query.archived ? { initialData: { pages: [initial], pageParams: [''] } } : {}),
  });
}

export function useSaveSite(id?: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: CreateSiteInput | UpdateSiteInput) =>
      id ? apiFetch<SiteDto>(`/api/sites/${id}`, { method: 'PATCH', json: input }) : apiFetch<SiteDto>('/api/sites', { method: 'POST', json: input }),
    onSuccess: () => qc.invalidateQueries({ queryKey: siteKeys.all }),
  });
}

export function useArchiveSite(id: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (archived: boolean) => apiFetch<SiteDto>(`/api/sites/${id}/${archived ? 'archive' : 'restore'}`, { method: 'POST' }),
    onSuccess: () => qc.invalidateQueries({ queryKey: siteKeys.all }),
  });
}

export function useSaveArea(siteId: string, areaId?: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: CreateAreaInput) =>
      areaId
        ? apiFetch<AreaDto>(`/api/sites/${siteId}/areas/${areaId}`, { method: 'PATCH', json: input })
        : apiFetch<AreaDto>(`/api/sites/${siteId}/areas`, { method: 'POST', json: input }),
    onSuccess: () => qc.invalidateQueries({ queryKey: siteKeys.areas(siteId) }),
  });
}

export function useArchiveArea(siteId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ areaId, archived }: { areaId: string; archived: boolean }) =>
      apiFetch<AreaDto>(`/api/sites/${siteId}/areas/${areaId}/${archived ? 'archive' : 'restore'}`, { method: 'POST' }),
    onSuccess: () => qc.invalidateQueries({ queryKey: siteKeys.areas(siteId) }),
  });
}
