import type { Metadata } from 'next';
import { requirePageActor } from '@/lib/auth';
import { OfflineUnitView } from '@/app/(app)/offline/unit/_components/offline-unit-view';

export const metadata: Metadata = { title: 'Unit from this phone' };

/**
 * A unit from a site kept on the phone (lib/offline), for work without signal. The page itself is
 * the same for every unit (the worker keeps one copy of it); the unit comes from ?code= or ?id=,
 * read in the browser from the signed-in person's kept packs.
 */
export default async function OfflineUnitPage() {
  await requirePageActor('/offline/unit', 'entries.write');
  return <OfflineUnitView />;
}
