'use client';

import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiFetch } from '@/lib/api/client';
import { equipmentKeys } from '@/lib/equipment/hooks';
import type { SystemDto } from '@/lib/systems/dto';
import { systemKeys } from '@/lib/systems/keys';
import type { CreateSystemInput, UpdateSystemInput } from '@/lib/systems/schemas';

export { systemKeys };

export function useSaveSystem(id?: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: CreateSystemInput | UpdateSystemInput) =>
      id ? apiFetch<SystemDto>(`/api/systems/${id}`, { method: 'PATCH', json: input }) : apiFetch<SystemDto>('/api/systems', { method: 'POST', json: input }),
    onSuccess: () => Promise.all([qc.invalidateQueries({ queryKey: systemKeys.all }), qc.invalidateQueries({ queryKey: equipmentKeys.all })]),
  });
}

export function useArchiveSystem(id: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (archived: boolean) => apiFetch<SystemDto>(`/api/systems/${id}/${archived ? 'archive' : 'restore'}`, { method: 'POST' }),
    onSuccess: () => qc.invalidateQueries({ queryKey: systemKeys.all }),
  });
}
