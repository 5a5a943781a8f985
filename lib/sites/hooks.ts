'use client';

import { useInfiniteQuery } from '@tanstack/react-query';
import { apiFetch } from '@/lib/api/client';
import { archiveRecord, saveRecord, useChange } from '@/lib/mutations';
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
  return useChange((input: CreateSiteInput | UpdateSiteInput) => saveRecord<SiteDto>('/api/sites', id, input), siteKeys.all);
}

export function useArchiveSite(id: string) {
  return useChange((archived: boolean) => archiveRecord<SiteDto>(`/api/sites/${id}`, archived), siteKeys.all);
}

export function useSaveArea(siteId: string, areaId?: string) {
  return useChange((input: CreateAreaInput) => saveRecord<AreaDto>(`/api/sites/${siteId}/areas`, areaId, input), siteKeys.areas(siteId));
}

export function useArchiveArea(siteId: string) {
  return useChange(
    ({ areaId, archived }: { areaId: string; archived: boolean }) => archiveRecord<AreaDto>(`/api/sites/${siteId}/areas/${areaId}`, archived),
    siteKeys.areas(siteId),
  );
}
