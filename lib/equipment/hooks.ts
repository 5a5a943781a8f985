'use client';

import { keepPreviousData, useInfiniteQuery, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { apiFetch } from '@/lib/api/client';
import { saveRecord, useChange } from '@/lib/mutations';
import type { Page } from '@/lib/api/cursor';
import type { RefrigerantId } from '@/lib/calc/refrigerants';
import type { EquipmentDetailDto, EquipmentDto } from '@/lib/equipment/dto';
import type { ImportPreview } from '@/lib/equipment/import';
import type { CreateEquipmentInput, CreateRelationInput, EquipmentSort, UpdateEquipmentInput } from '@/lib/equipment/schemas';
import type { EquipmentStatus, EquipmentType } from '@/lib/equipment/types';
import type { AreaDto } from '@/lib/sites/dto';
import { siteKeys } from '@/lib/sites/hooks';
import { systemKeys } from '@/lib/systems/keys';
import { equipmentKeys } from '@/lib/equipment/keys';
import { addRelation } from '@/lib/equipment/requests';

/** What the equipment table asks the API for; also what its URL carries. */
export interface EquipmentListFilters {
  siteId?: string;
  areaId?: string;
  systemId?: string;
  type: EquipmentType[];
  condition: number[];
  refrigerant: RefrigerantId[];
  status: EquipmentStatus[];
  /** 'only': the removed units, shown apart from the current ones. */
  removed?: 'only';
  q?: string;
  sort: EquipmentSort;
  dir: 'asc' | 'desc';
}


/** Query string for GET /api/equipment and its CSV export (repeated keys for several values). */
export function equipmentSearchParams(filters: Partial<EquipmentListFilters>): URLSearchParams {
  const params = new URLSearchParams();
  if (filters.siteId) params.set('siteId', filters.siteId);
  if (filters.areaId) params.set('areaId', filters.areaId);
  if (filters.systemId) params.set('systemId', filters.systemId);
  for (const t of filters.type ?? []) params.append('type', t);
  for (const c of filters.condition ?? []) params.append('condition', String(c));
  for (const r of filters.refrigerant ?? []) params.append('refrigerant', r);
  for (const s of filters.status ?? []) params.append('status', s);
  if (filters.removed) params.set('removed', filters.removed);
  if (filters.q) params.set('q', filters.q);
  if (filters.sort && filters.sort !== 'name') params.set('sort', filters.sort);
  if (filters.dir && filters.dir !== 'asc') params.set('dir', filters.dir);
  return params;
}

const PAGE_SIZE = 50;

export function useEquipmentList(filters: EquipmentListFilters, initial?: { filters: EquipmentListFilters; page: Page<EquipmentDto> }) {
  const matchesInitial = initial !== undefined && JSON.stringify(initial.filters) === JSON.stringify(filters);
  return useInfiniteQuery({
    queryKey: equipmentKeys.list(filters),
    queryFn: ({ pageParam, signal }) => {
      const params = equipmentSearchParams(filters);
      if (pageParam) params.set('cursor', pageParam);
      params.set('limit', String(PAGE_SIZE));
      return apiFetch<Page<EquipmentDto>>(`/api/equipment?${params}`, { signal });
    },
    initialPageParam: '' as string,
    getNextPageParam: (last) => last.nextCursor ?? undefined,
    // Typing in the search box keeps the current rows on screen until the new ones arrive.
    placeholderData: keepPreviousData,
    ...(matchesInitial ? { initialData: { pages: [initial.page], pageParams: [''] } } : {}),
  });
}

/** Equipment on one site, for pickers (relations). Sites rarely hold more than a few hundred units. */
export function useSiteEquipment(siteId: string) {
  return useQuery({
    queryKey: equipmentKeys.list({ siteId, picker: true }),
    queryFn: ({ signal }) => apiFetch<Page<EquipmentDto>>(`/api/equipment?siteId=${siteId}&limit=200`, { signal }),
  });
}

export function useSiteAreas(siteId: string | undefined) {
  return useQuery({
    queryKey: siteKeys.areas(siteId ?? ''),
    queryFn: ({ signal }) => apiFetch<Page<AreaDto>>(`/api/sites/${siteId}/areas`, { signal }),
    enabled: Boolean(siteId),
  });
}

export function useSaveEquipment(id?: string) {
  return useChange((input: CreateEquipmentInput | UpdateEquipmentInput) => saveRecord<EquipmentDetailDto>('/api/equipment', id, input), equipmentKeys.all, systemKeys.all);
}

export function useAddRelation(id: string) {
  return useChange((input: CreateRelationInput) => addRelation(id, input), equipmentKeys.all);
}

/** CSV import: a preview first ({ commit: false }), then the same file with { commit: true }. */
export function useEquipmentImport(siteId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: { csv: string; commit: boolean }) => apiFetch<ImportPreview>(`/api/sites/${siteId}/equipment-import`, { method: 'POST', json: input }),
    onSuccess: (result) => {
      if (result.imported > 0) return Promise.all([qc.invalidateQueries({ queryKey: equipmentKeys.all }), qc.invalidateQueries({ queryKey: siteKeys.all })]);
    },
  });
}
