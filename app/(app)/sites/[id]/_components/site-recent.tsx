import Link from 'next/link';
import { EmptyState } from '@/components/ui/card';
import { photoKindLabels } from '@/lib/photos/schemas';
import type { PhotoDto } from '@/lib/photos/dto';
import type { VisitDto } from '@/lib/visits/dto';
import { visitReasonLabels } from '@/lib/visits/schemas';
import { formatDay } from '@/lib/format/dates';
import { Section } from '@/components/ui/section';


/** The site's last closed visits, newest first, each opening its record. */
export function SiteRecentVisits({ visits, siteId }: { visits: VisitDto[]; siteId: string }) {
  return (
    <Section
      id="recent-visits-h"
      title="Recent visits"
      link={{ href: `/visits?siteId=${siteId}`, label: 'All visits at this site' }}
    >
      {visits.length === 0 ? (
        <EmptyState title="No finished visits at this site yet." />
      ) : (
        <ul className="divide-y divide-slate-200 rounded-lg border border-slate-200 bg-white">
          {visits.map((v) => (
            <li key={v.id}>
              <Link href={`/visits/${v.id}`} className="block px-4 py-3 hover:bg-ice-50">
                <span className="block font-semibold">
                  {visitReasonLabels[v.reason]} · {formatDay(v.startedAt, v.timeZone)}
                </span>
                <span className="block text-sm text-slate-600">{v.technicianName}</span>
                {v.summary ? <span className="mt-0.5 line-clamp-2 block text-sm text-slate-800">{v.summary}</span> : null}
              </Link>
            </li>
          ))}
        </ul>
      )}
    </Section>
  );
}

/** The newest photos of the site's equipment; each opens its unit's page, where the gallery is. */
export function SiteRecentPhotos({ photos, timeZone }: { photos: (PhotoDto & { equipmentName: string })[]; timeZone: string }) {
  return (
    <Section id="recent-photos-h" title="Recent photos">
      {photos.length === 0 ? (
        <EmptyState title="No photos of this site's equipment yet." />
      ) : (
        <ul className="grid grid-cols-2 gap-3 sm:grid-cols-4">
          {photos.map((p) => (
            <li key={p.id}>
              <Link href={`/equipment/${p.equipmentId}#photos-h`} className="block rounded-lg border border-slate-200 bg-white p-1.5 hover:bg-ice-50">
                {/* eslint-disable-next-line @next/next/no-img-element -- served by the access-checked photo route */}
                <img src={p.urls.thumb} alt={p.caption ?? `${photoKindLabels[p.kind]} photo of ${p.equipmentName}`} width={200} height={200} loading="lazy" className="aspect-square w-full rounded object-cover" />
                <span className="mt-1 block truncate text-sm font-semibold">{p.equipmentName}</span>
                <span className="block text-xs text-slate-600">
                  {photoKindLabels[p.kind]} · {formatDay(p.sortAt, timeZone)}
                </span>
              </Link>
            </li>
          ))}
        </ul>
      )}
    </Section>
  );
}
