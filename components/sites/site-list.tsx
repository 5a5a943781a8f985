import { ChevronRight, MapPin } from 'lucide-react';
import Link from 'next/link';
import { EmptyState } from '@/components/ui/card';
import { siteAddress, type SiteDto } from '@/lib/sites/dto';

export function SiteList({ sites, showClient = true, empty }: { sites: SiteDto[]; showClient?: boolean; empty: string }) {
  if (sites.length === 0) return <EmptyState title={empty} />;
  return (
    <ul className="divide-y divide-slate-200 overflow-hidden rounded-lg border border-slate-200 bg-white">
      {sites.map((s) => (
        <li key={s.id}>
          <Link href={`/sites/${s.id}`} className="flex min-h-14 items-center gap-3 px-4 py-3 hover:bg-ice-50">
            <MapPin aria-hidden className="size-5 shrink-0 text-ice-700" />
            <span className="min-w-0 flex-1">
              <span className="block font-semibold text-slate-900">
                {s.name}
                {s.archivedAt ? <span className="ml-2 rounded bg-slate-200 px-1.5 text-xs font-medium text-slate-700">Archived</span> : null}
              </span>
              <span className="block truncate text-sm text-slate-600">
                {showClient ? `${s.clientName} · ` : ''}
                {siteAddress(s) || 'No address yet'} · {s.areaCount} {s.areaCount === 1 ? 'area' : 'areas'}
              </span>
            </span>
            <ChevronRight aria-hidden className="size-5 text-slate-400" />
          </Link>
        </li>
      ))}
    </ul>
  );
}
