'use client';

import { useQuery } from '@tanstack/react-query';
import { apiFetch } from '@/lib/api/client';
import { saveRecord, useChange } from '@/lib/mutations';
import type { Page } from '@/lib/api/cursor';
import type { CreateFollowUpInput, FollowUpStatus, UpdateFollowUpInput } from '@/lib/follow-ups/schemas';
import type { FollowUpDto } from '@/lib/follow-ups/dto';
import type { Severity } from '@/lib/visits/schemas';

export interface FollowUpFilters {
  siteId?: string;
  equipmentId?: string;
  status?: FollowUpStatus[];
  severity?: Severity[];
}

export const followUpKeys = {
  all: ['follow-ups'] as const,
  list: (filters: FollowUpFilters) => ['follow-ups', 'list', filters] as const,
};

export function followUpSearchParams(filters: FollowUpFilters): URLSearchParams {
  const params = new URLSearchParams();
  if (filters.siteId) params.set('siteId', filters.siteId);
  if (filters.equipmentId) params.set('equipmentId', filters.equipmentId);
  for (const s of filters.status ?? []) params.append('status', s);
  for (const s of filters.severity ?? []) params.append('severity', s);
  return params;
}

export function useFollowUps(filters: FollowUpFilters, initial?: Page<FollowUpDto>) {
  return useQuery({
    queryKey: followUpKeys.list(filters),
    queryFn: ({ signal }) => apiFetch<Page<FollowUpDto>>(`/api/follow-ups?${followUpSearchParams(filters)}&limit=200`, { signal }),
    ...(initial ? { initialData: initial } : {}),
  });
}

export function useCreateFollowUp() {
  return useChange((input: CreateFollowUpInput) => saveRecord<FollowUpDto>('/api/follow-ups', undefined, input), followUpKeys.all);
}

export function useUpdateFollowUp(id: string) {
  return useChange((input: UpdateFollowUpInput) => saveRecord<FollowUpDto>('/api/follow-ups', id, input), followUpKeys.all);
}
