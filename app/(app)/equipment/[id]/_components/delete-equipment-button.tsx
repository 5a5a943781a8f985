'use client';

import { Trash2 } from 'lucide-react';
import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { Button } from '@/components/ui/button';
import { ApiError } from '@/lib/api/client';
import { useDeleteEquipment } from '@/lib/equipment/hooks';

export function DeleteEquipmentButton({ id, name, siteId }: { id: string; name: string; siteId: string }) {
  const router = useRouter();
  const remove = useDeleteEquipment(id);
  const [error, setError] = useState<string>();
  return (
    <>
      <Button
        variant="danger"
        disabled={remove.isPending}
        onClick={async () => {
          if (!window.confirm(`Delete “${name}”? It leaves every list, but its records stay for audits.`)) return;
          setError(undefined);
          try {
            await remove.mutateAsync();
            router.push(`/sites/${siteId}`);
            router.refresh();
          } catch (e) {
            setError(e instanceof ApiError ? e.message : 'Nothing was deleted. Try again.');
          }
        }}
      >
        <Trash2 aria-hidden className="size-4" />
        {remove.isPending ? 'Deleting…' : 'Delete'}
      </Button>
      {error ? (
        <p role="alert" className="basis-full text-sm font-medium text-red-700">
          {error}
        </p>
      ) : null}
    </>
  );
}
