import type { Metadata } from 'next';
import { PageHeader } from '@/components/ui/card';
import { requirePageActor } from '@/lib/auth';
import { ClientForm } from '@/app/(app)/clients/_components/client-form';

export const metadata: Metadata = { title: 'New client' };

export default async function NewClientPage() {
  await requirePageActor('/clients/new', 'clients.write');
  return (
    <>
      <PageHeader title="New client" />
      <ClientForm />
    </>
  );
}
