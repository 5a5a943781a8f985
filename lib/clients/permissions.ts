import { can } from '@/lib/auth/access';
import type { Actor } from '@/lib/auth/actor';

// What the viewer may do on a client, decided once and sent with it (page and
// GET /api/clients/:id alike). An archived client keeps its sites but gets no new one.

export interface ClientFlags {
  canEdit: boolean;
  /** Archive, or restore an archived one. */
  canArchive: boolean;
  canAddSite: boolean;
  canManageContacts: boolean;
}

export function clientFlags(actor: Actor, client: { archivedAt: string | null }): ClientFlags {
  return {
    canEdit: can(actor, 'clients.write'),
    canArchive: can(actor, 'clients.write'),
    canAddSite: !client.archivedAt && can(actor, 'sites.write'),
    canManageContacts: can(actor, 'contacts.write'),
  };
}
