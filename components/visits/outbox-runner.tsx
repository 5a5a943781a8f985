'use client';

import { useEffect } from 'react';

const EVERY_MS = 30_000;

/**
 * Sends whatever visit work the phone still holds, from any page of the app: when it opens, when
 * the connection comes back, and every half minute (each item after its back-off). It is in every
 * page, so it only looks into the outbox; the sender and the visit code it needs are fetched when
 * there is something to send. It tells the query cache through lib/query/invalidate, as pages
 * without the query provider (the Scan page, a unit's page) run it too.
 */
export function OutboxRunner() {
  useEffect(() => {
    if (typeof indexedDB === 'undefined') return;
    const run = async (force: boolean) => {
      // Even the look into the outbox (idb) loads after the page, not with it.
      const { outboxItems } = await import('@/lib/visits/outbox');
      if ((await outboxItems()).length === 0) return;
      const [{ drainOutbox }, { visitKeys }, { offlineUser }, { invalidateQueries }] = await Promise.all([
        import('@/lib/visits/outbox-sender'),
        import('@/lib/visits/keys'),
        import('@/lib/offline/user'),
        import('@/lib/query/invalidate'),
      ]);
      // Only the signed-in person's own work is sent under their session.
      const userId = await offlineUser();
      await drainOutbox({ userId, force, onSent: (item) => void invalidateQueries(visitKeys.detail(item.visitId)) });
    };
    const go = (force: boolean) => void run(force).catch(() => undefined);
    go(true);
    const online = () => go(true);
    window.addEventListener('online', online);
    const timer = window.setInterval(() => go(false), EVERY_MS);
    return () => {
      window.removeEventListener('online', online);
      window.clearInterval(timer);
    };
  }, []);
  return null;
}
