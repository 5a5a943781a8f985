import type { QueryClient, QueryKey } from '@tanstack/react-query';

// Only a type import: pages without the query library (the phone pages) can still tell the cache
// that a write made it stale, without loading the library for it.
let client: QueryClient | undefined;

export function registerQueryClient(c: QueryClient): void {
  client = c;
}

/** Marks cached queries under these keys stale; nothing to do when no page has cached any yet. */
export async function invalidateQueries(...keys: QueryKey[]): Promise<void> {
  const c = client;
  if (!c) return;
  await Promise.all(keys.map((queryKey) => c.invalidateQueries({ queryKey })));
}
