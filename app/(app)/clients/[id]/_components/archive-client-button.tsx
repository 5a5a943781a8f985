'use client';

import { useRouter } from 'next/navigation';
import { Button } from '@/components/ui/button';
import { useArchiveClient } from '@/lib/clients/hooks';

export function ArchiveClientButton({ clientId, archived }: { clientId: string; archived: boolean }) {
  const router = useRouter();
  const mutation = useArchiveClient(clientId);
  return (
    <Button
      variant="secondary"
      disabled={mutation.isPending}
      onClick={async () => {
        if (!archived && !window.confirm('Archive this client? It is hidden from lists but keeps its sites and history, and can be restored.')) return;
        await mutation.mutateAsync(!archived);
        router.refresh();
      }}
    >
      {archived ? 'Restore client' : 'Archive client'}
    </Button>
  );
}
