import type { Metadata } from 'next';
import { requirePageActor } from '@/lib/auth';
import { OfflineVisitView } from '@/app/(app)/offline/visit/_components/offline-visit-view';

export const metadata: Metadata = { title: 'Visit on this phone' };

/**
 * A visit from the phone's kept copy, for work without signal: one started on the phone, or an
 * open one whose page was never loaded here. One page for every visit (the worker keeps one copy);
 * the visit comes from ?id=, read in the browser from the signed-in person's outbox and kept sites.
 */
export default async function OfflineVisitPage() {
  await requirePageActor('/offline/visit', 'entries.write');
  return <OfflineVisitView />;
}
