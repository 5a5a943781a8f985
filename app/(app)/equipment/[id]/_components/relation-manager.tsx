'use client';

import { Unlink } from 'lucide-react';
import Link from 'next/link';
import { useState } from 'react';
import { EquipmentTypeIcon } from '@/components/equipment/equipment-type-icon';
import { lazyWithQuery } from '@/components/query/lazy-with-query';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { EmptyState } from '@/components/ui/card';
import { ApiError } from '@/lib/api/client';
import type { RelationDto } from '@/lib/equipment/dto';
import { equipmentKeys } from '@/lib/equipment/keys';
import { removeRelation } from '@/lib/equipment/requests';
import { invalidateQueries } from '@/lib/query/invalidate';
import type { equipmentTypeLabels, relationPhrases } from '@/lib/equipment/types';

// Loaded when "Change connections" opens (its form library, schemas and the query provider it
// needs are not needed before).
const AddRelationForm = lazyWithQuery(async () => (await import('@/app/(app)/equipment/[id]/_components/add-relation-form')).AddRelationForm, {
  loading: () => (
    <p role="status" className="p-4 text-slate-600">
      Loading the form…
    </p>
  ),
});

/** The words for relations and types come from the page: their module would bring the whole
 * service-life table (lib/calc) into the unit page's first scripts. */
export type RelationWords = { phrases: typeof relationPhrases; typeLabels: typeof equipmentTypeLabels };

export function RelationManager({
  equipmentId,
  siteId,
  relations: initial,
  canWrite,
  words,
}: {
  equipmentId: string;
  siteId: string;
  relations: RelationDto[];
  canWrite: boolean;
  words: RelationWords;
}) {
  const phrase = (r: RelationDto): string => words.phrases[r.kind][r.direction];
  const [relations, setRelations] = useState(initial);
  // A plain request, not useMutation: a unit's page ships without the query library (DEVELOPERS.md, "Phone pages").
  const [removing, setRemoving] = useState(false);
  const [removeError, setRemoveError] = useState<string>();
  // Editing tools show only when asked for: the list reads as plain links until then.
  const [editing, setEditing] = useState(false);

  return (
    <div className="space-y-3">
      {relations.length === 0 ? (
        <EmptyState title="Not connected to other equipment yet.">
          Say what is wired to what and what feeds what, e.g. a thermostat is wired to a liquid-line solenoid; a condensing unit feeds its evaporators.
        </EmptyState>
      ) : (
        <ul className="divide-y divide-slate-200 rounded-lg border border-slate-200 bg-white" aria-label="Connected equipment">
          {relations.map((r) => (
            <li key={r.id} className="flex min-h-14 flex-wrap items-center gap-x-3 gap-y-1 px-4 py-2">
              <EquipmentTypeIcon type={r.other.type} />
              <span className="min-w-0 flex-1">
                <span className="font-semibold text-slate-700">{phrase(r)}:</span>{' '}
                <Link href={`/equipment/${r.other.id}`} className="inline-flex min-h-11 items-center font-semibold text-ice-800 underline">
                  {r.other.name}
                </Link>
                <span className="block text-sm text-slate-600">{words.typeLabels[r.other.type]}</span>
              </span>
              {canWrite && editing ? (
                <Button
                  variant="ghost"
                  size="md"
                  aria-label={`Remove connection: ${phrase(r)} ${r.other.name}`}
                  disabled={removing}
                  onClick={async () => {
                    setRemoveError(undefined);
                    setRemoving(true);
                    try {
                      await removeRelation(equipmentId, r.id);
                      void invalidateQueries(equipmentKeys.all);
                      setRelations((rs) => rs.filter((x) => x.id !== r.id));
                    } catch (e) {
                      setRemoveError(e instanceof ApiError ? e.message : 'The connection was not removed. Try again.');
                    } finally {
                      setRemoving(false);
                    }
                  }}
                >
                  <Unlink aria-hidden className="size-4" /> Remove
                </Button>
              ) : null}
            </li>
          ))}
        </ul>
      )}
      {removeError ? <Alert tone="danger" title={removeError} /> : null}
      {canWrite ? (
        <details className="rounded-lg border border-slate-200 bg-white" onToggle={(e) => setEditing(e.currentTarget.open)}>
          <summary className="flex min-h-11 cursor-pointer items-center px-4 font-semibold text-slate-900 hover:bg-slate-50">Change connections</summary>
          <div className="border-t border-slate-200">
            {editing ? <AddRelationForm equipmentId={equipmentId} siteId={siteId} onAdded={setRelations} /> : null}
          </div>
        </details>
      ) : null}
    </div>
  );
}
