'use client';

import { useRouter } from 'next/navigation';
import { useCallback, useEffect, useState } from 'react';
import { lazyWithQuery } from '@/components/query/lazy-with-query';
import { TagScanner } from '@/components/tags/tag-scanner';
import { PageHeader } from '@/components/ui/card';
import { OFFLINE_UNIT_PATH } from '@/lib/offline/cache-names';
import { openTagCode } from '@/lib/offline/open-unit';

// Only shown without signal, so its script waits until then (the service worker keeps a copy).
// It brings the query provider with it: its start-visit form saves through the query library,
// which the Scan page itself ships without (DEVELOPERS.md, "Phone pages").
const OfflineUnitView = lazyWithQuery(async () => (await import('@/app/(app)/offline/unit/_components/offline-unit-view')).OfflineUnitView);

/**
 * The Scan page's scanner: a code read opens what the tag leads to (and is logged there); without
 * signal, the unit from the phone's kept sites, shown here at once rather than by a page load
 * (Back returns to the scanner).
 */
export function ScanPageScanner() {
  const router = useRouter();
  const [kept, setKept] = useState<string | null>(null);
  const open = useCallback((code: string, via: 'camera' | 'typed') => openTagCode(code, via, router.push, setKept), [router]);
  useEffect(() => {
    const back = () => {
      if (window.location.pathname !== OFFLINE_UNIT_PATH) setKept(null);
    };
    window.addEventListener('popstate', back);
    return () => window.removeEventListener('popstate', back);
  }, []);
  if (kept) return <OfflineUnitView query={{ code: kept }} />;
  return (
    <>
      <PageHeader title="Scan" subtitle="Scan an equipment tag to open the unit and its history." />
      <TagScanner onCode={open} />
    </>
  );
}
