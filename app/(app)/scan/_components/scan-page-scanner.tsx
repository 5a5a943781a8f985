'use client';

import { useRouter } from 'next/navigation';
import { useCallback } from 'react';
import { TagScanner } from '@/components/tags/tag-scanner';
import { openTagCode } from '@/lib/offline/open-unit';

/** The Scan page's scanner: a code read opens what the tag leads to (and is logged there); without signal, the unit from the phone's kept sites. */
export function ScanPageScanner() {
  const router = useRouter();
  const open = useCallback((code: string, via: 'camera' | 'typed') => openTagCode(code, via, router.push), [router]);
  return <TagScanner onCode={open} />;
}
