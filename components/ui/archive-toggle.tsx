'use client';

import { useRouter } from 'next/navigation';
import { Button } from '@/components/ui/button';

/**
 * Archive or restore a record: asks before archiving (never before restoring), then refreshes the
 * page's server data. The caller passes its own mutation, which takes the new archived state.
 */
export function ArchiveToggle({
  archived,
  noun,
  confirmText,
  mutation,
}: {
  archived: boolean;
  noun: string;
  confirmText: string;
  mutation: { isPending: boolean; mutateAsync: (archive: boolean) => Promise<unknown> };
}) {
  const router = useRouter();
  return (
    <Button
      variant="secondary"
      disabled={mutation.isPending}
      onClick={async () => {
        if (!archived && !window.confirm(confirmText)) return;
        await mutation.mutateAsync(!archived);
        router.refresh();
      }}
    >
      {archived ? `Restore ${noun}` : `Archive ${noun}`}
    </Button>
  );
}
