'use client';

import { Wrench } from 'lucide-react';
import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { ApiError } from '@/lib/api/client';
import type { StorageRepairDto } from '@/lib/photos/dto';
import { useRepairPhotoStorage } from '@/lib/photos/hooks';

export function RepairStorageButton({ disabled }: { disabled: boolean }) {
  const router = useRouter();
  const repair = useRepairPhotoStorage();
  const [result, setResult] = useState<StorageRepairDto>();
  const [error, setError] = useState<string>();

  async function run() {
    if (!window.confirm('Repair photo storage? Files with no record are deleted, and records with no image left are removed. This cannot be undone.')) return;
    setError(undefined);
    try {
      setResult(await repair.mutateAsync());
      router.refresh();
    } catch (e) {
      setError(e instanceof ApiError ? e.message : 'Nothing was repaired. Try again.');
    }
  }

  return (
    <div className="space-y-3">
      <Button variant="primary" size="lg" onClick={() => void run()} disabled={disabled || repair.isPending}>
        <Wrench aria-hidden className="size-5" />
        {repair.isPending ? 'Repairing…' : 'Repair'}
      </Button>
      {result ? (
        <Alert tone={result.failures.length ? 'warning' : 'success'} title={result.failures.length ? 'Repaired in part.' : 'Repaired.'}>
          {result.deletedObjects} leftover file(s) deleted, {result.regenerated} photo(s) given new small copies, {result.restored} original(s) rebuilt, {result.removedRecords}{' '}
          record(s) removed.
          {result.failures.length ? (
            <ul className="mt-1 list-disc pl-5">
              {result.failures.map((f) => (
                <li key={f}>{f}</li>
              ))}
            </ul>
          ) : null}
        </Alert>
      ) : null}
      {error ? (
        <Alert tone="danger" title="Repair failed.">
          {error}
        </Alert>
      ) : null}
    </div>
  );
}
