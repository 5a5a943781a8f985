'use client';

import { useState } from 'react';
import { Button } from '@/components/ui/button';
import { EntryKindLabel, SaveStateBadge, type SaveState } from '@/components/visits/badges';
import { EntrySummary, type SummaryEntry } from '@/components/visits/entry-summary';
import { formatClock } from '@/lib/format/dates';
import type { UnitPrefs } from '@/lib/units/quantities';
import { cn } from '@/lib/utils';
import type { EntryDto } from '@/lib/visits/dto';
import { useVoidEntry } from '@/lib/visits/hooks';
import type { OutboxItem } from '@/lib/visits/outbox';
import type { EntryKind } from '@/lib/visits/terms';

// The entries of a visit as the technician sees them: saved, on their way, or refused and waiting
// for a fix. Saved entries can be struck out with a reason (kept on record), never deleted.

export interface Row {
  key: string;
  kind: EntryKind;
  equipmentId: string;
  equipmentName: string;
  recordedAt: string;
  state: SaveState;
  entry: SummaryEntry;
  saved?: EntryDto;
  pending?: OutboxItem;
}

export function EntryRows({
  rows,
  showEquipment,
  prefs,
  visitId,
  timeZone,
  canVoid,
  onDiscard,
  onRedo,
}: {
  rows: Row[];
  showEquipment: boolean;
  prefs: UnitPrefs;
  visitId: string;
  timeZone: string;
  canVoid: (r: Row) => boolean;
  onDiscard: (clientEntryId: string) => void;
  /** Opens the entry's form on its unit, to record a refused entry again with the fix. */
  onRedo: (r: Row) => void;
}) {
  if (rows.length === 0) return <p className="rounded-lg border border-dashed border-slate-300 bg-white p-4 text-slate-700">Nothing recorded yet.</p>;
  return (
    <ol className="divide-y divide-slate-200 overflow-hidden rounded-lg border border-slate-200 bg-white" aria-label="Entries, newest first">
      {rows.map((r) => (
        <li key={r.key} className={cn('space-y-1 px-4 py-3', r.saved?.voidedAt && 'bg-slate-50')} data-entry-state={r.state} data-entry-kind={r.kind}>
          <div className="flex flex-wrap items-center gap-x-3 gap-y-1">
            <EntryKindLabel kind={r.kind} />
            <time dateTime={r.recordedAt} className="text-sm text-slate-600">
              {formatClock(r.recordedAt, timeZone)}
            </time>
            {showEquipment ? <span className="text-sm font-medium text-slate-800">{r.equipmentName}</span> : null}
            <SaveStateBadge state={r.state} className="ml-auto" />
          </div>
          <div className={cn(r.saved?.voidedAt && 'text-slate-600 line-through')}>
            <EntrySummary entry={r.entry} prefs={prefs} />
          </div>
          {r.saved?.voidedAt ? <p className="text-sm font-semibold">Struck out: {r.saved.voidReason}</p> : null}
          {r.pending?.state === 'refused' ? (
            <div className="space-y-2">
              <p role="alert" className="text-sm font-semibold text-red-800">
                The server refused it: {r.pending.error}
              </p>
              {r.pending.issues?.length ? (
                <ul className="list-disc pl-5 text-sm text-red-800">
                  {r.pending.issues.map((i) => (
                    <li key={`${i.path}-${i.message}`}>{i.message}</li>
                  ))}
                </ul>
              ) : null}
              <p className="text-sm text-slate-700">It stays here until you record it again with the fix, or discard it.</p>
              <div className="flex flex-wrap gap-2">
                <Button size="sm" onClick={() => onRedo(r)}>
                  Record it again
                </Button>
                <Button variant="secondary" size="sm" onClick={() => onDiscard(r.key)}>
                  Discard this entry
                </Button>
              </div>
            </div>
          ) : null}
          {r.pending?.state === 'waiting' && r.pending.error ? <p className="text-sm font-semibold text-amber-900">{r.pending.error}</p> : null}
          {r.saved && !r.saved.voidedAt && canVoid(r) ? <VoidEntry visitId={visitId} entryId={r.saved.id} /> : null}
        </li>
      ))}
    </ol>
  );
}

/** Entries are records that must last: a mistake is voided with a reason, never deleted. */
function VoidEntry({ visitId, entryId }: { visitId: string; entryId: string }) {
  const [open, setOpen] = useState(false);
  const [reason, setReason] = useState('');
  const voidEntry = useVoidEntry(visitId);
  if (!open) {
    return (
      <button type="button" onClick={() => setOpen(true)} className="min-h-11 text-sm font-semibold text-slate-700 underline">
        Strike out (kept on record)…
      </button>
    );
  }
  const id = `void-${entryId}`;
  return (
    <form
      className="flex flex-col gap-2 sm:flex-row sm:items-end"
      onSubmit={(e) => {
        e.preventDefault();
        voidEntry.mutate({ entryId, reason }, { onSuccess: () => setOpen(false) });
      }}
    >
      <label htmlFor={id} className="flex-1 text-sm font-semibold">
        Why is it wrong?
        <input id={id} value={reason} onChange={(e) => setReason(e.target.value)} className="mt-1 block min-h-11 w-full rounded-md border border-slate-300 px-3 text-base font-normal" />
      </label>
      <Button type="submit" variant="danger" disabled={voidEntry.isPending || reason.trim() === ''}>
        Strike out
      </Button>
      <Button variant="secondary" onClick={() => setOpen(false)}>
        Keep it
      </Button>
      {voidEntry.error ? (
        <p role="alert" className="text-sm font-semibold text-red-800">
          {voidEntry.error.message}
        </p>
      ) : null}
    </form>
  );
}
