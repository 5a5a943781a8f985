import type { Metadata } from 'next';
import { PageHeader } from '@/components/ui/card';
import { orNotFound } from '@/lib/api/page';
import { requirePageActor } from '@/lib/auth';
import { getClient } from '@/lib/clients/service';
import { ClientForm } from '@/app/(app)/clients/_components/client-form';

export const metadata: Metadata = { title: 'Edit client' };

export default async function EditClientPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const actor = await requirePageActor(`/clients/${id}/edit`, 'clients.write');
  const client = await orNotFound(getClient(actor, id));
  return (
    <>
      <PageHeader title={`Edit ${client.name}`} />
      <ClientForm client={client} />
    </>
  );
}
