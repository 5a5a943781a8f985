'use client';

import { ArchiveToggle } from '@/components/ui/archive-toggle';
import { useArchiveSystem } from '@/lib/systems/hooks';

export function ArchiveSystemButton({ systemId, archived }: { systemId: string; archived: boolean }) {
  const mutation = useArchiveSystem(systemId);
  return <ArchiveToggle archived={archived} noun="system" confirmText="Archive this system? It is hidden from new equipment forms but keeps its equipment and history, and can be restored." mutation={mutation} />;
}
