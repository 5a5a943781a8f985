'use client';

import { useMutation, useQuery } from '@tanstack/react-query';
import { apiFetch } from '@/lib/api/client';
import type { Page } from '@/lib/api/cursor';
import type { EquipmentDto } from '@/lib/equipment/dto';
import type { ServiceRequestDto } from '@/lib/requests/dto';
import type { CreateRequestInput, UpdateRequestInput } from '@/lib/requests/schemas';

export const requestKeys = { all: ['requests'] as const, siteEquipment: (siteId: string) => ['requests', 'site-equipment', siteId] as const };

export function useSiteEquipmentChoices(siteId: string) {
  return useQuery({
    queryKey: requestKeys.siteEquipment(siteId),
    queryFn: () => apiFetch<Page<EquipmentDto>>(`/api/equipment?siteId=${siteId}&limit=200&sort=name`),
    enabled: Boolean(siteId),
  });
}

/** Sends the request as JSON, or as multipart/form-data when a photo goes with it. */
export function useCreateRequest() {
  return useMutation({
    mutationFn: ({ photo, ...input }: CreateRequestInput & { photo?: File | null }) => {
      if (!photo) return apiFetch<ServiceRequestDto>('/api/requests', { method: 'POST', json: input });
      const form = new FormData();
      for (const [key, value] of Object.entries(input)) if (value !== null && value !== undefined) form.set(key, String(value));
      form.set('file', photo, photo.name);
      return apiFetch<ServiceRequestDto>('/api/requests', { method: 'POST', body: form });
    },
  });
}

export function useUpdateRequest(id: string) {
  return useMutation({ mutationFn: (input: UpdateRequestInput) => apiFetch<ServiceRequestDto>(`/api/requests/${id}`, { method: 'PATCH', json: input }) });
}
