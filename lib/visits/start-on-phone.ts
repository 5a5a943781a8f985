'use client';

import { offlineUser } from '@/lib/offline/user';
import { newClientId, startOnPhone } from '@/lib/visits/outbox';
import type { VisitReason } from '@/lib/visits/terms';

/**
 * Starts a visit with no signal: the phone makes its id, keeps it, and puts its start at the head
 * of the outbox, so everything recorded goes to the server after it. Returns the phone's page for it.
 */
export async function startVisitOnPhone(input: { siteId: string; reason: VisitReason; startedAt?: string; equipmentId?: string }): Promise<string> {
  const userId = await offlineUser();
  const id = newClientId();
  await startOnPhone({ id, userId, siteId: input.siteId, reason: input.reason, startedAt: input.startedAt ?? new Date().toISOString() });
  return phoneVisitHref(id, input.equipmentId);
}

export function phoneVisitHref(visitId: string, equipmentId?: string): string {
  return `/offline/visit?id=${visitId}${equipmentId ? `&equipment=${equipmentId}` : ''}`;
}
