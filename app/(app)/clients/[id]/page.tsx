import type { Metadata } from 'next';
import { SiteList } from '@/components/sites/site-list';
import { ButtonLink } from '@/components/ui/button';
import { Card, PageHeader } from '@/components/ui/card';
import { orNotFound } from '@/lib/api/page';
import { requirePageActor } from '@/lib/auth';
import { getClient, listContacts } from '@/lib/clients/service';
import { listSites } from '@/lib/sites/service';
import { ArchiveClientButton } from '@/app/(app)/clients/[id]/_components/archive-client-button';
import { ContactManager } from '@/app/(app)/clients/[id]/_components/contact-manager';
import { Section } from '@/components/ui/section';

export const metadata: Metadata = { title: 'Client' };

export default async function ClientPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const actor = await requirePageActor(`/clients/${id}`, 'contacts.read');
  const client = await orNotFound(getClient(actor, id));
  const [sites, contacts] = await Promise.all([listSites(actor, { clientId: id, limit: 200, archived: 'exclude' }), listContacts(actor, id)]);
  return (
    <div className="space-y-6">
      <PageHeader
        title={client.name}
        subtitle={client.archivedAt ? 'Archived client' : `${client.siteCount} ${client.siteCount === 1 ? 'site' : 'sites'}`}
        actions={
          client.canAddSite || client.canEdit || client.canArchive ? (
            <>
              {client.canAddSite ? <ButtonLink href={`/sites/new?clientId=${client.id}`}>Add a site</ButtonLink> : null}
              {client.canEdit ? (
                <ButtonLink href={`/clients/${client.id}/edit`} variant="secondary">
                  Edit
                </ButtonLink>
              ) : null}
              {client.canArchive ? <ArchiveClientButton clientId={client.id} archived={Boolean(client.archivedAt)} /> : null}
            </>
          ) : null
        }
      />
      {client.notes ? <Card className="whitespace-pre-line text-sm">{client.notes}</Card> : null}
      <Section id="sites-h" title="Sites">
        <SiteList sites={sites.items} showClient={false} empty="This client has no sites yet." />
      </Section>
      <Section id="contacts-h" title="Contacts">
        <ContactManager clientId={client.id} contacts={contacts} canWrite={client.canManageContacts} />
      </Section>
    </div>
  );
}
