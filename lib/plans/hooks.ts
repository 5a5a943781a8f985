'use client';

import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiFetch } from '@/lib/api/client';
import type { PlanDto } from '@/lib/plans/dto';
import type { CancelPlanInput, CreatePlanInput, MovePlanInput } from '@/lib/plans/schemas';

export const planKeys = {
  all: ['plans'] as const,
  list: (filters: Record<string, string | undefined>) => ['plans', 'list', filters] as const,
};

export function useCreatePlan() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: CreatePlanInput) => apiFetch<PlanDto>('/api/plans', { method: 'POST', json: input }),
    onSuccess: () => qc.invalidateQueries({ queryKey: planKeys.all }),
  });
}

export function useMovePlan(id: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: MovePlanInput) => apiFetch<PlanDto>(`/api/plans/${id}`, { method: 'PATCH', json: input }),
    onSuccess: () => qc.invalidateQueries({ queryKey: planKeys.all }),
  });
}

export function useCancelPlan(id: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: CancelPlanInput) => apiFetch<PlanDto>(`/api/plans/${id}/cancel`, { method: 'POST', json: input }),
    onSuccess: () => qc.invalidateQueries({ queryKey: planKeys.all }),
  });
}
