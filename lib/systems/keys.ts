// TanStack Query keys for systems, apart from the hooks so that the equipment hooks can invalidate
// them without an import cycle (the system hooks invalidate equipment in turn).
export const systemKeys = {
  all: ['systems'] as const,
  list: (q: Record<string, unknown>) => ['systems', 'list', q] as const,
  detail: (id: string) => ['systems', 'detail', id] as const,
};
