'use client';

import { ArchiveToggle } from '@/components/ui/archive-toggle';
import { useArchiveSite } from '@/lib/sites/hooks';

export function ArchiveSiteButton({ siteId, archived }: { siteId: string; archived: boolean }) {
  const mutation = useArchiveSite(siteId);
  return <ArchiveToggle archived={archived} noun="site" confirmText="Archive this site? It is hidden from lists but keeps its history, and can be restored." mutation={mutation} />;
}
