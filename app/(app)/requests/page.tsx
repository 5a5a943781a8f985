import { BellRing } from 'lucide-react';
import type { Metadata } from 'next';
import Link from 'next/link';
import { ButtonLink } from '@/components/ui/button';
import { EmptyState, PageHeader } from '@/components/ui/card';
import { requirePageActor } from '@/lib/auth';
import { can } from '@/lib/auth/access';
import { listRequests } from '@/lib/requests/service';
import { requestStatusLabels, REQUEST_STATUSES, urgencyLabels, type RequestStatus } from '@/lib/requests/schemas';
import { RequestStatusBadge, UrgencyBadge } from '@/app/(app)/requests/_components/badges';

export const metadata: Metadata = { title: 'Service requests' };

export default async function RequestsPage({ searchParams }: { searchParams: Promise<{ status?: string }> }) {
  const actor = await requirePageActor('/requests', 'requests.read');
  const { status } = await searchParams;
  const chosen = (REQUEST_STATUSES as readonly string[]).includes(status ?? '') ? [status as RequestStatus] : status === 'all' ? undefined : (['new', 'acknowledged', 'scheduled'] as RequestStatus[]);
  const requests = await listRequests(actor, { status: chosen, limit: 200 });
  return (
    <div className="space-y-4">
      <PageHeader
        title="Service requests"
        subtitle={actor.role === 'client' ? 'What you asked for, and where it stands' : 'Owners’ requests, most urgent first'}
        actions={can(actor, 'requests.create') ? <ButtonLink href="/requests/new">Ask for service</ButtonLink> : null}
      />
      <nav aria-label="Filter by status" className="flex flex-wrap gap-2 text-sm">
        {[['', 'Open'], ...REQUEST_STATUSES.map((s) => [s, requestStatusLabels[s]]), ['all', 'All']].map(([value, label]) => (
          <Link key={value} href={value ? `/requests?status=${value}` : '/requests'} aria-current={(status ?? '') === value ? 'page' : undefined} className="flex min-h-11 items-center rounded-md border border-slate-300 bg-white px-3 font-semibold aria-[current=page]:bg-ice-100">
            {label}
          </Link>
        ))}
      </nav>
      {requests.length === 0 ? (
        <EmptyState title="No requests here." />
      ) : (
        <ul className="divide-y divide-slate-200 rounded-lg border border-slate-200 bg-white">
          {requests.map((r) => (
            <li key={r.id}>
              <Link href={`/requests/${r.id}`} className="flex flex-col gap-1 px-4 py-3 hover:bg-ice-50 sm:flex-row sm:items-center">
                <BellRing aria-hidden className="hidden size-5 text-ice-700 sm:block" />
                <span className="min-w-0 flex-1">
                  <span className="block font-semibold">{r.equipmentName ? `${r.equipmentName} · ${r.siteName}` : r.siteName}</span>
                  <span className="block truncate text-sm text-slate-700">{r.description}</span>
                  <span className="block text-xs text-slate-600">
                    {r.requestedByName} · {r.clientName} · {r.createdAt.slice(0, 16).replace('T', ' ')} UTC{r.photoId ? ' · with a photo' : ''}
                  </span>
                </span>
                <span className="flex flex-wrap gap-1.5">
                  <UrgencyBadge urgency={r.urgency} title={urgencyLabels[r.urgency]} />
                  <RequestStatusBadge status={r.status} />
                </span>
              </Link>
            </li>
          ))}
        </ul>
      )}
    </div>
  );
}
