import { QueryClient } from '@tanstack/react-query';
import { registerQueryClient } from '@/lib/query/invalidate';

let browserClient: QueryClient | undefined;

function makeClient(): QueryClient {
  return new QueryClient({
    defaultOptions: {
      queries: { staleTime: 30_000, retry: 1, refetchOnWindowFocus: false },
      // Mutations retry on a dropped connection only, never on a refusal from the server.
      mutations: { retry: (count, error) => count < 3 && (error as { code?: string }).code === 'network' },
    },
  });
}

/**
 * One client per browser tab, shared by every page that mounts a QueryProvider (so the cache
 * outlives a visit to a page without one); a new one per server render, never shared between people.
 */
export function getQueryClient(): QueryClient {
  if (typeof window === 'undefined') return makeClient();
  if (!browserClient) {
    browserClient = makeClient();
    registerQueryClient(browserClient);
  }
  return browserClient;
}
