// TanStack Query keys for equipment, apart from the hooks so that pages without the query library
// (a scanned unit's page) can mark them stale through lib/query/invalidate.
export const equipmentKeys = {
  all: ['equipment'] as const,
  lists: () => ['equipment', 'list'] as const,
  list: (filters: object) => ['equipment', 'list', filters] as const,
  detail: (id: string) => ['equipment', 'detail', id] as const,
};
