import { MapPin } from 'lucide-react';
import { EmptyState } from '@/components/ui/card';
import { LinkRow } from '@/components/ui/link-row';
import { siteAddress, type SiteDto } from '@/lib/sites/dto';

export function SiteList({ sites, showClient = true, empty }: { sites: SiteDto[]; showClient?: boolean; empty: string }) {
  if (sites.length === 0) return <EmptyState title={empty} />;
  return (
    <ul className="divide-y divide-slate-200 overflow-hidden rounded-lg border border-slate-200 bg-white">
      {sites.map((s) => (
        <LinkRow
          key={s.id}
          href={`/sites/${s.id}`}
          icon={MapPin}
          truncate
          title={
            <>
              {s.name}
              {s.archivedAt ? <span className="ml-2 rounded bg-slate-200 px-1.5 text-xs font-medium text-slate-700">Archived</span> : null}
            </>
          }
          detail={
            <>
              {showClient ? `${s.clientName} · ` : ''}
              {siteAddress(s) || 'No address yet'} · {s.areaCount} {s.areaCount === 1 ? 'area' : 'areas'}
            </>
          }
        />
      ))}
    </ul>
  );
}
