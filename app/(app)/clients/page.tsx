import { Building2 } from 'lucide-react';
import type { Metadata } from 'next';
import Link from 'next/link';
import { ButtonLink } from '@/components/ui/button';
import { EmptyState, PageHeader } from '@/components/ui/card';
import { LinkRow } from '@/components/ui/link-row';
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
            <LinkRow key={c.id} href={`/clients/${c.id}`} icon={Building2} title={c.name} detail={`${c.siteCount} ${c.siteCount === 1 ? 'site' : 'sites'}`} />
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
