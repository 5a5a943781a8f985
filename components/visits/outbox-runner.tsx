'use client';

import { useQueryClient } from '@tanstack/react-query';
import { useEffect } from 'react';
import { visitKeys } from '@/lib/visits/hooks';
import { drainOutbox } from '@/lib/visits/outbox-sender';

const EVERY_MS = 30_000;

/**
 * Sends whatever visit work the phone still holds, from any page of the app: when it opens, when
 * the connection comes back, and every half minute (each item after its back-off).
 */
export function OutboxRunner() {
  const qc = useQueryClient();
  useEffect(() => {
    if (typeof indexedDB === 'undefined') return;
    const run = (force: boolean) =>
      void drainOutbox({ force, onSent: (item) => void qc.invalidateQueries({ queryKey: visitKeys.detail(item.visitId) }) }).catch(() => undefined);
    run(true);
    const online = () => run(true);
    window.addEventListener('online', online);
    const timer = window.setInterval(() => run(false), EVERY_MS);
    return () => {
      window.removeEventListener('online', online);
      window.clearInterval(timer);
    };
  }, [qc]);
  return null;
}
