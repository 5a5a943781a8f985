'use client';

import { useQuery } from '@tanstack/react-query';
import { apiFetch } from '@/lib/api/client';
import { visitKeys } from '@/lib/visits/keys';

// One reading of one unit over time, for the chart on the unit page. Its own module (re-exported
// by lib/visits/hooks.ts): the unit page loads it on first paint, and hooks.ts is large.

export interface ReadingPoint {
  recordedAt: string;
  value: number;
}

export function useReadingSeries(equipmentId: string, key: string) {
  return useQuery({
    queryKey: visitKeys.readings(equipmentId, key),
    queryFn: ({ signal }) => apiFetch<{ key: string; points: ReadingPoint[] }>(`/api/equipment/${equipmentId}/readings?key=${encodeURIComponent(key)}`, { signal }),
  });
}
