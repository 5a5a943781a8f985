'use client';

import { useEffect } from 'react';

/**
 * In the signed-in layout: names the person the phone's offline copy belongs to (wiping another
 * person's copy first) and registers the service worker (app/sw.ts) in built apps.
 */
export function OfflineSetup({ userId }: { userId: string }) {
  useEffect(() => {
    // Loaded here rather than imported: the offline store (and idb) stays out of every page's first scripts.
    void import('@/lib/offline/user').then(({ setOfflineUser }) => setOfflineUser(userId));
  }, [userId]);
  useEffect(() => {
    if (process.env.NODE_ENV !== 'production' || !('serviceWorker' in navigator)) return;
    navigator.serviceWorker.register('/serwist/sw.js', { scope: '/', updateViaCache: 'none' }).catch(() => {
      // No worker (private mode, an old browser): the app works as before, only not offline.
    });
  }, []);
  return null;
}
