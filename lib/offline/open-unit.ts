'use client';

import { OFFLINE_UNIT_PATH } from '@/lib/offline/cache-names';

/**
 * Opens what a scanned or typed tag code leads to. Without signal the phone goes straight to the
 * unit from its kept sites (a full page load the worker answers from its copy); with signal, the
 * tag's own route (which logs the scan). A connection that only looks alive still ends on the
 * kept unit: the failed page load is answered by the worker (app/sw.ts).
 */
export function openTagCode(code: string, via: 'camera' | 'typed', push: (href: string) => void): void {
  if (typeof navigator !== 'undefined' && navigator.onLine === false) {
    window.location.assign(`${OFFLINE_UNIT_PATH}?code=${encodeURIComponent(code)}`);
    return;
  }
  push(`/T/${code}?via=${via}`);
}
