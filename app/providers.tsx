'use client';

import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { useState, type ReactNode } from 'react';

export function Providers({ children }: { children: ReactNode }) {
  const [queryClient] = useState(
    () =>
      new QueryClient({
        defaultOptions: {
          queries: { staleTime: 30_000, retry: 1, refetchOnWindowFocus: false },
          // Mutations retry on a dropped connection only, never on a refusal from the server.
          mutations: { retry: (count, error) => count < 3 && (error as { code?: string }).code === 'network' },
        },
      }),
  );
  // No next-auth SessionProvider: nothing reads the session in the browser (the server decides
  // every page), and its script would be in every page; sign-in and sign-out import it when used.
  return <QueryClientProvider client={queryClient}>{children}</QueryClientProvider>;
}
