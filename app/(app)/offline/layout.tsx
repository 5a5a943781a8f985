import type { ReactNode } from 'react';
import { QueryProvider } from '@/components/query/query-provider';

// These pages fetch in the browser: the query provider is here, not in the root layout, so the
// Scan page and a unit's page ship without it (DEVELOPERS.md, "Phone pages").
export default function QueryLayout({ children }: { children: ReactNode }) {
  return <QueryProvider>{children}</QueryProvider>;
}
