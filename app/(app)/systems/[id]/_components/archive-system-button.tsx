'use client';

import { useRouter } from 'next/navigation';
import { Button } from '@/components/ui/button';
import { useArchiveSystem } from '@/lib/systems/hooks';

export function ArchiveSystemButton({ systemId, archived }: { systemId: string; archived: boolean }) {
  const router = useRouter();
  const mutation = useArchiveSystem(systemId);
  return (
    <Button
      variant="secondary"
      disabled={mutation.isPending}
      onClick={async () => {
        if (!archived && !window.confirm('Archive this system? It is hidden from new equipment forms but keeps its equipment and history, and can be restored.')) return;
        await mutation.mutateAsync(!archived);
        router.refresh();
      }}
    >
      {archived ? 'Restore system' : 'Archive system'}
    </Button>
  );
}
