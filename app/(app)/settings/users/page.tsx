import type { Metadata } from 'next';
import { PageHeader } from '@/components/ui/card';
import { requirePageActor } from '@/lib/auth';
import { listClients } from '@/lib/clients/service';
import { listInvitations, listUsers } from '@/lib/users/service';
import { InviteForm } from '@/app/(app)/settings/users/_components/invite-form';
import { UserTable } from '@/app/(app)/settings/users/_components/user-table';
import { Section } from '@/components/ui/section';

export const metadata: Metadata = { title: 'Users' };

export default async function UsersPage() {
  const actor = await requirePageActor('/settings/users', 'users.manage');
  const [users, invitations, clients] = await Promise.all([listUsers(actor), listInvitations(actor), listClients(actor, { limit: 200, archived: 'exclude' })]);
  const clientChoices = clients.items.map((c) => ({ id: c.id, name: c.name }));
  return (
    <div className="space-y-8">
      <PageHeader title="Users" subtitle="Invite people, change roles, deactivate accounts." />
      <Section id="invite-h" title="Invite someone">
        <InviteForm clients={clientChoices} invitations={invitations} />
      </Section>
      <Section id="users-h" title="People">
        <UserTable users={users} clients={clientChoices} selfId={actor.id} />
      </Section>
    </div>
  );
}
