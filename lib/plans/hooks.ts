'use client';

import { apiFetch } from '@/lib/api/client';
import { saveRecord, useChange } from '@/lib/mutations';
import type { PlanDto } from '@/lib/plans/dto';
import type { CancelPlanInput, CreatePlanInput, MovePlanInput } from '@/lib/plans/schemas';

export const planKeys = {
  all: ['plans'] as const,
  list: (filters: Record<string, string | undefined>) => ['plans', 'list', filters] as const,
};

export function useCreatePlan() {
  return useChange((input: CreatePlanInput) => saveRecord<PlanDto>('/api/plans', undefined, input), planKeys.all);
}

export function useMovePlan(id: string) {
  return useChange((input: MovePlanInput) => saveRecord<PlanDto>('/api/plans', id, input), planKeys.all);
}

export function useCancelPlan(id: string) {
  return useChange((input: CancelPlanInput) => apiFetch<PlanDto>(`/api/plans/${id}/cancel`, { method: 'POST', json: input }), planKeys.all);
}
