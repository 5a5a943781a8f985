'use client';

import { useRouter } from 'next/navigation';
import { Button } from '@/components/ui/button';
import { useArchiveSite } from '@/lib/sites/hooks';

export function ArchiveSiteButton({ siteId, archived }: { siteId: string; archived: boolean }) {
  const router = useRouter();
  const mutation = useArchiveSite(siteId);
  return (
    <Button
      variant="secondary"
      disabled={mutation.isPending}
      onClick={async () => {
        if (!archived && !window.confirm('Archive this site? It is hidden from lists but keeps its history, and can be restored.')) return;
        await mutation.mutateAsync(!archived);
        router.refresh();
      }}
    >
      {archived ? 'Restore site' : 'Archive site'}
    </Button>
  );
}
