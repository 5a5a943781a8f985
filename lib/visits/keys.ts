import type { EntryKind } from '@/lib/visits/terms';

// TanStack Query keys for visits, apart from lib/visits/hooks.ts so that a page's small client
// parts (the reading chart) can share the keys without loading the outbox and the entry kinds.

export type HistoryScope = 'equipment' | 'system';

export const visitKeys = {
  all: ['visits'] as const,
  detail: (id: string) => ['visits', 'detail', id] as const,
  histories: () => ['visits', 'history'] as const,
  history: (scope: HistoryScope, id: string, kinds: readonly EntryKind[]) => ['visits', 'history', scope, id, kinds] as const,
  readings: (equipmentId: string, key: string) => ['visits', 'readings', equipmentId, key] as const,
};
