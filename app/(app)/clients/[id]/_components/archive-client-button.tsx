'use client';

import { ArchiveToggle } from '@/components/ui/archive-toggle';
import { useArchiveClient } from '@/lib/clients/hooks';

export function ArchiveClientButton({ clientId, archived }: { clientId: string; archived: boolean }) {
  const mutation = useArchiveClient(clientId);
  return <ArchiveToggle archived={archived} noun="client" confirmText="Archive this client? It is hidden from lists but keeps its sites and history, and can be restored." mutation={mutation} />;
}
