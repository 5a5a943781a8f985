import { Building2, ChevronRight } from 'lucide-react';
import type { Metadata } from 'next';
import Link from 'next/link';
import { ButtonLink } from '@/components/ui/button';
import { EmptyState, PageHeader } from '@/components/ui/card';
import { requirePageActor } from '@/lib/auth';
import { listClients } from '@/lib/clients/service';
import { listClientsQuerySchema } from '@/lib/clients/schemas';

export const metadata: Metadata = { title: 'Clients' };

export default async function ClientsPage({ searchParams }: { searchParams: Promise<Record<string, string | undefined>> }) {
  const actor = await requirePageActor('/clients', 'clients.write');
  const query = listClientsQuerySchema.parse({ ...(await searchParams), limit: 50 });
  const page = await listClients(actor, query);
  const showArchived = query.archived === 'only';
  return (
    <>
      <PageHeader title="Clients" subtitle="Equipment owners your company serves." actions={<ButtonLink href="/clients/new">New client</ButtonLink>} />
      <form className="mb-4 flex flex-col gap-2 sm:flex-row" role="search">
        <label htmlFor="client-q" className="sr-only">
          Search clients
        </label>
        <input id="client-q" name="q" type="search" defaultValue={query.q ?? ''} placeholder="Search clients" className="min-h-11 rounded-md border border-slate-300 px-3 sm:max-w-sm" />
        {showArchived ? <input type="hidden" name="archived" value="only" /> : null}
        <button className="min-h-11 rounded-md border border-slate-300 bg-white px-4 font-semibold">Search</button>
        <Link className="flex min-h-11 items-center px-2 text-sm font-semibold text-ice-800 underline" href={showArchived ? '/clients' : '/clients?archived=only'}>
          {showArchived ? 'Show active clients' : 'Show archived clients'}
        </Link>
      </form>
      {page.items.length === 0 ? (
        <EmptyState title={query.q ? `No clients match “${query.q}”.` : showArchived ? 'No archived clients.' : 'No clients yet.'} />
      ) : (
        <ul className="divide-y divide-slate-200 rounded-lg border border-slate-200 bg-white">
          {page.items.map((c) => (
            <li key={c.id}>
              <Link href={`/clients/${c.id}`} className="flex min-h-14 items-center gap-3 px-4 py-3 hover:bg-ice-50">
                <Building2 aria-hidden className="size-5 text-ice-700" />
                <span className="flex-1">
                  <span className="block font-semibold">{c.name}</span>
                  <span className="text-sm text-slate-600">
                    {c.siteCount} {c.siteCount === 1 ? 'site' : 'sites'}
                  </span>
                </span>
                <ChevronRight aria-hidden className="size-5 text-slate-400" />
              </Link>
            </li>
          ))}
        </ul>
      )}
      {page.nextCursor ? (
        <p className="mt-3">
          <Link className="font-semibold text-ice-800 underline" href={`/clients?${new URLSearchParams({ ...(query.q ? { q: query.q } : {}), archived: query.archived, cursor: page.nextCursor })}`}>
            Next page
          </Link>
        </p>
      ) : null}
    </>
  );
}
