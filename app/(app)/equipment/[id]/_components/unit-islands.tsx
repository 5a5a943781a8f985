'use client';

import { lazyWithQuery } from '@/components/query/lazy-with-query';
import { Section } from '@/components/ui/section';
import { useNearScreen } from '@/components/ui/use-near-screen';
import type { UnitPrefs } from '@/lib/units/quantities';

// The photos and the readings chart sit below a phone's first screen and fetch in the browser:
// their scripts, the query library and its provider load when they come near the screen, so a
// scanned unit's first load carries none of them (DEVELOPERS.md, "Phone pages").
const EquipmentPhotos = lazyWithQuery(async () => (await import('@/components/photos/equipment-photos')).EquipmentPhotos, {
  loading: () => <Waiting what="photos" />,
});
const ReadingChart = lazyWithQuery(async () => (await import('@/components/visits/reading-chart')).ReadingChart, {
  loading: () => <Waiting what="readings" />,
});

function Waiting({ what }: { what: string }) {
  return (
    <p role="status" className="min-h-24 text-slate-600">
      Loading the {what}…
    </p>
  );
}

export function UnitPhotos({ equipmentId }: { equipmentId: string }) {
  const [ref, near] = useNearScreen();
  // The wrapper stays while its content swaps, so a spec (or a link) can scroll to it either way.
  return (
    <div ref={ref} data-testid="unit-photos">
      {near ? (
        <EquipmentPhotos equipmentId={equipmentId} />
      ) : (
        <Section id="photos-h" title="Photos">
          <div className="min-h-24" />
        </Section>
      )}
    </div>
  );
}

export function UnitReadingChart(props: { equipmentId: string; prefs: UnitPrefs; timeZone: string }) {
  const [ref, near] = useNearScreen();
  return (
    <div ref={ref} className="min-h-24" data-testid="unit-readings">
      {near ? <ReadingChart {...props} /> : null}
    </div>
  );
}
