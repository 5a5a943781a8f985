'use client';

import { QueryClientProvider } from '@tanstack/react-query';
import { useState, type ComponentType, type ReactNode } from 'react';
import { getQueryClient } from '@/lib/query/client';

/**
 * TanStack Query for the pages and islands that fetch in the browser. It is not in the root
 * layout: the Scan page and a unit's page ship without the library (DEVELOPERS.md, "Phone pages").
 */
export function QueryProvider({ children }: { children: ReactNode }) {
  const [client] = useState(getQueryClient);
  return <QueryClientProvider client={client}>{children}</QueryClientProvider>;
}

/** For a component loaded on demand on a page without the provider (next/dynamic or import()). */
export function withQueryProvider<P extends object>(Component: ComponentType<P>): ComponentType<P> {
  function WithQuery(props: P) {
    return (
      <QueryProvider>
        <Component {...props} />
      </QueryProvider>
    );
  }
  WithQuery.displayName = `WithQuery(${Component.displayName ?? Component.name})`;
  return WithQuery;
}
