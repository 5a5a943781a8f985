import { ChevronRight, MapPin } from 'lucide-react';
import Link from 'next/link';
import { EmptyState, PageHeader } from '@/components/ui/card';
import { siteAddress, type SiteDto } from '@/lib/sites/dto';

/** The first step of a flow that starts at a site: large targets, each linking to `path?siteId=…`. */
export function SitePicker({ title, subtitle, sites, path }: { title: string; subtitle: string; sites: SiteDto[]; path: string }) {
  return (
    <div className="space-y-5">
      <PageHeader title={title} subtitle={subtitle} />
      {sites.length === 0 ? (
        <EmptyState title="No sites yet." />
      ) : (
        <ul className="grid grid-cols-1 gap-2 sm:grid-cols-2">
          {sites.map((s) => (
            <li key={s.id}>
              <Link href={`${path}?siteId=${s.id}`} className="flex min-h-16 items-center gap-3 rounded-lg border-2 border-slate-300 bg-white px-4 py-2 hover:border-ice-700 hover:bg-ice-50">
                <MapPin aria-hidden className="size-6 shrink-0 text-ice-700" />
                <span className="min-w-0 flex-1">
                  <span className="block font-semibold">{s.name}</span>
                  <span className="block text-sm text-slate-700">
                    {s.clientName}
                    {siteAddress(s) ? ` · ${siteAddress(s)}` : ''}
                  </span>
                </span>
                <ChevronRight aria-hidden className="size-5 text-slate-500" />
              </Link>
            </li>
          ))}
        </ul>
      )}
    </div>
  );
}
