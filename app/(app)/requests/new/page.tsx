import type { Metadata } from 'next';
import { PageHeader } from '@/components/ui/card';
import { requirePageActor } from '@/lib/auth';
import { listSites } from '@/lib/sites/service';
import { RequestForm } from '@/app/(app)/requests/_components/request-form';

export const metadata: Metadata = { title: 'Ask for service' };

export default async function NewRequestPage({ searchParams }: { searchParams: Promise<{ siteId?: string; equipmentId?: string }> }) {
  const actor = await requirePageActor('/requests/new', 'requests.create');
  const { siteId, equipmentId } = await searchParams;
  const sites = await listSites(actor, { limit: 200, archived: 'exclude' });
  return (
    <>
      <PageHeader title="Ask for service" subtitle="The office is told at once by e-mail and answers here." />
      <RequestForm sites={sites.items.map((s) => ({ id: s.id, name: s.name }))} siteId={siteId} equipmentId={equipmentId} />
    </>
  );
}
