'use client';

import { useMutation, useQuery } from '@tanstack/react-query';
import { apiFetch } from '@/lib/api/client';
import type { Page } from '@/lib/api/cursor';
import type { EquipmentDto } from '@/lib/equipment/dto';
import type { CreateRequestInput, ServiceRequestDto, UpdateRequestInput } from '@/lib/requests/schemas';

export const requestKeys = { all: ['requests'] as const, siteEquipment: (siteId: string) => ['requests', 'site-equipment', siteId] as const };

export function useSiteEquipmentChoices(siteId: string) {
  return useQuery({
    queryKey: requestKeys.siteEquipment(siteId),
    queryFn: () => apiFetch<Page<EquipmentDto>>(`/api/equipment?siteId=${siteId}&limit=200&sort=name`),
    enabled: Boolean(siteId),
  });
}

export function useCreateRequest() {
  return useMutation({ mutationFn: (input: CreateRequestInput) => apiFetch<ServiceRequestDto>('/api/requests', { method: 'POST', json: input }) });
}

export function useUpdateRequest(id: string) {
  return useMutation({ mutationFn: (input: UpdateRequestInput) => apiFetch<ServiceRequestDto>(`/api/requests/${id}`, { method: 'PATCH', json: input }) });
}
