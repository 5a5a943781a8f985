'use client';

import dynamic from 'next/dynamic';
import type { ComponentType, ReactNode } from 'react';

/** Resolves to a function component, e.g. `async () => (await import(…)).Name`; P may include undefined (`props?:`). */
type Loader<P> = () => Promise<(props: P) => ReactNode>;

/**
 * A component's script and the query provider, fetched together and only when needed, for the
 * pages that ship without TanStack Query (DEVELOPERS.md, "Phone pages"). Neither is imported
 * statically here, so whoever imports this file keeps the library out of its first load.
 */
export function loadWithQuery<P>(load: Loader<P>): Promise<ComponentType<NonNullable<P>>> {
  return Promise.all([load(), import('@/components/query/query-provider')]).then(([Component, q]) => q.withQueryProvider<NonNullable<P>>(Component));
}

/** The same as a component that loads on its first render (next/dynamic, in the browser only). */
export function lazyWithQuery<P>(load: Loader<P>, options: { loading?: () => ReactNode } = {}): ComponentType<NonNullable<P>> {
  return dynamic(() => loadWithQuery(load), { ssr: false, loading: options.loading });
}
