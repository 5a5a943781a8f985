'use client';

import { OFFLINE_UNIT_PATH } from '@/lib/offline/cache-names';

/**
 * Opens what a scanned or typed tag code leads to. With signal: the tag's own route (which logs
 * the scan). Without (the browser says so): `showKept` shows the unit from the phone's kept sites
 * in place, with the pack page's address in the bar, so nothing reloads. A connection that only
 * looks alive still ends on the kept unit: the failed page load is answered by the worker
 * (app/sw.ts).
 */
export function openTagCode(code: string, via: 'camera' | 'typed', push: (href: string) => void, showKept?: (code: string) => void): void {
  if (typeof navigator !== 'undefined' && navigator.onLine === false) {
    const href = `${OFFLINE_UNIT_PATH}?code=${encodeURIComponent(code)}`;
    if (showKept) {
      window.history.pushState(null, '', href);
      showKept(code);
    } else {
      window.location.assign(href);
    }
    return;
  }
  push(`/T/${code}?via=${via}`);
}
