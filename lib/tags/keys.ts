// TanStack Query keys for tags, apart from the hooks so that pages without the query library
// (a scanned unit's page) can mark them stale through lib/query/invalidate.
export const tagKeys = {
  all: ['tags'] as const,
  runs: () => ['tags', 'print-runs'] as const,
  run: (id: string) => ['tags', 'print-runs', id] as const,
};
