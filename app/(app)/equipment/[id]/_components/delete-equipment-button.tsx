'use client';

import { Trash2 } from 'lucide-react';
import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { Button } from '@/components/ui/button';
import { ApiError } from '@/lib/api/client';
import { equipmentKeys } from '@/lib/equipment/keys';
import { deleteEquipment } from '@/lib/equipment/requests';
import { invalidateQueries } from '@/lib/query/invalidate';
import { systemKeys } from '@/lib/systems/keys';

export function DeleteEquipmentButton({ id, name, siteId }: { id: string; name: string; siteId: string }) {
  const router = useRouter();
  // A plain request, not useMutation: a unit's page ships without the query library (DEVELOPERS.md, "Phone pages").
  const [pending, setPending] = useState(false);
  const [error, setError] = useState<string>();
  return (
    <>
      <Button
        variant="danger"
        disabled={pending}
        onClick={async () => {
          if (!window.confirm(`Delete “${name}”? It leaves every list, but its records stay for audits.`)) return;
          setError(undefined);
          setPending(true);
          try {
            await deleteEquipment(id);
            await invalidateQueries(equipmentKeys.all, systemKeys.all);
            router.push(`/sites/${siteId}`);
            router.refresh();
          } catch (e) {
            setError(e instanceof ApiError ? e.message : 'Nothing was deleted. Try again.');
            setPending(false);
          }
        }}
      >
        <Trash2 aria-hidden className="size-4" />
        {pending ? 'Deleting…' : 'Delete'}
      </Button>
      {error ? (
        <p role="alert" className="basis-full text-sm font-medium text-red-700">
          {error}
        </p>
      ) : null}
    </>
  );
}
