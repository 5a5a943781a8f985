'use client';

import { ArrowLeft, ChevronRight, CircleCheck, RefreshCw } from 'lucide-react';
import { useRouter, useSearchParams } from 'next/navigation';
import { useEffect, useMemo, useRef, useState } from 'react';
import { EquipmentTypeIcon } from '@/components/equipment/equipment-type-icon';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { EntryKindLabel, entryKindIcons, SaveStateBadge, type SaveState } from '@/components/visits/badges';
import { EntrySummary, type SummaryEntry } from '@/components/visits/entry-summary';
import type { ErrorIssue } from '@/lib/errors';
import { refrigerantCautions as cautionsFor } from '@/lib/calc/cautions';
import { findRefrigerant } from '@/lib/calc/refrigerants';
import type { EquipmentDto } from '@/lib/equipment/dto';
import { equipmentTypeLabels } from '@/lib/equipment/types';
import type { UnitPrefs } from '@/lib/units/quantities';
import { cn } from '@/lib/utils';
import type { EntryContext } from '@/lib/visits/kinds/types';
import type { EntryDto, VisitDetailDto } from '@/lib/visits/dto';
import { usePendingEntries, useVisit, useVoidEntry, type SaveOutcome } from '@/lib/visits/hooks';
import { newClientEntryId, type PendingEntry } from '@/lib/visits/pending';
import { createEntrySchema, entryKindLabels, type CreateEntryInput, type EntryKind } from '@/lib/visits/schemas';
import { CloseVisitPanel } from '@/app/(app)/visits/[id]/_components/close-visit-panel';
import type { FieldErrors, SubmitResult } from '@/app/(app)/visits/[id]/_components/form-kit';
import { PhotoForm } from '@/app/(app)/visits/[id]/_components/photo-form';
import { ActionForm, ConditionForm, FindingForm, LeakForm, NoteForm, PartForm, RefrigerantForm } from '@/app/(app)/visits/[id]/_components/other-forms';
import { ReadingForm } from '@/app/(app)/visits/[id]/_components/reading-form';
import { SettingForm } from '@/app/(app)/visits/[id]/_components/setting-form';

const FORM_KINDS: EntryKind[] = ['reading', 'finding', 'action', 'setting_change', 'part', 'refrigerant', 'leak', 'condition', 'note', 'photo'];

const NO_CONTEXT: EntryContext = { refrigerant: null, elevationM: 0, designBoxTempC: null, nameplateVoltage: null, controlVoltageNominal: null, designPressureHighKpaG: null };

/** zod and server issue paths ("data.asLeft.cutInKpaG") → the form's field keys ("asLeft.cutInKpaG"). */
function toFieldErrors(issues: readonly { path: string | PropertyKey[]; message: string }[]): FieldErrors {
  const out: FieldErrors = {};
  for (const i of issues) {
    const path = (Array.isArray(i.path) ? i.path.map(String).join('.') : String(i.path)).replace(/^data\.?/, '');
    if (!(path in out)) out[path] = i.message;
  }
  return out;
}

interface Row {
  key: string;
  kind: EntryKind;
  equipmentId: string;
  equipmentName: string;
  recordedAt: string;
  state: SaveState;
  entry: SummaryEntry;
  saved?: EntryDto;
  pending?: PendingEntry;
}

export function VisitWorkspace({
  visit: initialVisit,
  equipment,
  contexts,
  prefs,
  actorId,
  canVoidAny,
}: {
  visit: VisitDetailDto;
  equipment: EquipmentDto[];
  contexts: Record<string, EntryContext>;
  prefs: UnitPrefs;
  actorId: string;
  canVoidAny: boolean;
}) {
  const router = useRouter();
  const search = useSearchParams();
  const visitQuery = useVisit(initialVisit.id, initialVisit);
  const visit = visitQuery.data ?? initialVisit;
  const { pending, waitingCount, online, save, retryAll, discard } = usePendingEntries(visit.id);
  const [justSaved, setJustSaved] = useState<{ clientEntryId: string; outcome: SaveOutcome['outcome']; kind: EntryKind } | null>(null);
  const savedNote = useRef<HTMLDivElement>(null);
  const panelHeading = useRef<HTMLHeadingElement>(null);

  const selectedId = search.get('equipment');
  const selected = equipment.find((e) => e.id === selectedId) ?? null;
  const kindParam = search.get('kind') as EntryKind | null;
  const kind = kindParam && FORM_KINDS.includes(kindParam) ? kindParam : null;
  const names = useMemo(() => new Map(equipment.map((e) => [e.id, e.name])), [equipment]);

  // Plain history entries (no server round trip): the browser's back button walks back through them.
  function go(equipmentId: string | null, k: EntryKind | null) {
    const params = new URLSearchParams();
    if (equipmentId) params.set('equipment', equipmentId);
    if (k) params.set('kind', k);
    const qs = params.toString();
    window.history.pushState(null, '', `/visits/${visit.id}${qs ? `?${qs}` : ''}`);
  }

  useEffect(() => {
    if (selected) panelHeading.current?.focus();
  }, [selected, kind]);
  // Focus moves to the saved entry once its form has closed, never while a form is still in use.
  useEffect(() => {
    if (justSaved && !kind) savedNote.current?.focus();
  }, [justSaved, kind]);

  // A pending entry the server already has (its answer was lost on the way back) is done.
  const savedIds = useMemo(() => new Set(visit.entries.map((e) => e.clientEntryId)), [visit.entries]);
  useEffect(() => {
    for (const p of pending) if (savedIds.has(p.input.clientEntryId)) discard(p.input.clientEntryId);
  }, [pending, savedIds, discard]);

  const rows: Row[] = useMemo(() => {
    const fromServer: Row[] = visit.entries.map((e) => ({
      key: e.id,
      kind: e.kind,
      equipmentId: e.equipmentId,
      equipmentName: e.equipmentName,
      recordedAt: e.recordedAt,
      state: 'saved',
      entry: e,
      saved: e,
    }));
    const waiting: Row[] = pending
      .filter((p) => !savedIds.has(p.input.clientEntryId))
      .map((p) => ({
        key: p.input.clientEntryId,
        kind: p.input.kind,
        equipmentId: p.input.equipmentId,
        equipmentName: names.get(p.input.equipmentId) ?? 'Equipment',
        recordedAt: p.savedAt,
        state: p.state,
        entry: { kind: p.input.kind, data: p.input.data as Record<string, unknown> },
        pending: p,
      }));
    return [...fromServer, ...waiting].sort((a, b) => b.recordedAt.localeCompare(a.recordedAt));
  }, [visit.entries, pending, savedIds, names]);

  const counts = useMemo(() => {
    const m = new Map<string, number>();
    for (const r of rows) if (!r.saved?.voidedAt) m.set(r.equipmentId, (m.get(r.equipmentId) ?? 0) + 1);
    return m;
  }, [rows]);

  /** `stay`: keep the form open (the photo form links several uploads one after another). */
  async function submit(k: EntryKind, data: unknown, stay = false): Promise<SubmitResult> {
    if (!selected) return { ok: false, errors: {}, message: 'Choose the equipment first.' };
    const candidate = { equipmentId: selected.id, clientEntryId: newClientEntryId(), recordedAt: new Date().toISOString(), kind: k, data };
    const parsed = createEntrySchema.safeParse(candidate);
    if (!parsed.success) return { ok: false, errors: toFieldErrors(parsed.error.issues), message: 'Check the highlighted fields; nothing was saved.' };
    const input: CreateEntryInput = parsed.data;
    const result = await save(input);
    if (result.outcome === 'refused') return { ok: false, errors: toFieldErrors(result.error.issues as ErrorIssue[]), message: result.error.message };
    setJustSaved({ clientEntryId: input.clientEntryId, outcome: result.outcome, kind: k });
    if (!stay) go(selected.id, null);
    // A replaced component has a new record now: reload the list of equipment.
    if (result.outcome === 'saved' && input.kind === 'part' && input.data.replacesEquipment) router.refresh();
    return { ok: true };
  }

  const justSavedRow = justSaved ? rows.find((r) => r.key === justSaved.clientEntryId || r.saved?.clientEntryId === justSaved.clientEntryId) : undefined;
  const ctx = selected ? (contexts[selected.id] ?? NO_CONTEXT) : NO_CONTEXT;
  const refrigerant = ctx.refrigerant ? findRefrigerant(ctx.refrigerant) : undefined;
  const handling = refrigerant ? cautionsFor(refrigerant) : [];
  const cancel = () => selected && go(selected.id, null);

  return (
    <div className="space-y-5">
      {!online || waitingCount > 0 ? (
        <Alert tone="warning" title={online ? `${waitingCount} ${waitingCount === 1 ? 'entry is' : 'entries are'} waiting to be sent` : 'No signal'}>
          <p>
            {waitingCount > 0
              ? 'They are kept on this phone and sent as soon as there is a connection. Do not clear this browser’s data until they are sent.'
              : 'You can keep working: entries are kept on this phone and sent when the connection returns.'}
          </p>
          {waitingCount > 0 ? (
            <button type="button" onClick={() => void retryAll()} className="mt-2 inline-flex min-h-11 items-center gap-2 rounded-md border border-amber-500 bg-white px-3 font-semibold">
              <RefreshCw aria-hidden className="size-4" /> Try sending now
            </button>
          ) : null}
        </Alert>
      ) : null}

      {visit.openBypasses.length > 0 ? (
        <Alert tone="danger" title="A safety or operating control is bypassed">
          <ul className="list-disc pl-4">
            {visit.openBypasses.map((b) => (
              <li key={b.entryId}>{b.description}</li>
            ))}
          </ul>
          <p className="mt-1">Remove the jumper before leaving; the visit closes only after you confirm it.</p>
        </Alert>
      ) : null}

      {justSaved && justSavedRow ? (
        <div ref={savedNote} tabIndex={-1} role="status" className="rounded-lg border-2 border-emerald-300 bg-white p-3 outline-none focus-visible:outline-3" data-testid="just-saved">
          <div className="mb-1 flex flex-wrap items-center gap-2">
            {justSavedRow.state === 'saved' ? <CircleCheck aria-hidden className="size-5 text-emerald-800" /> : null}
            <span className="font-semibold">
              {entryKindLabels[justSaved.kind]} on {justSavedRow.equipmentName}
            </span>
            <SaveStateBadge state={justSavedRow.state} />
          </div>
          <EntrySummary entry={justSavedRow.entry} prefs={prefs} />
          {justSavedRow.state !== 'saved' && justSaved.kind === 'refrigerant' ? (
            <p className="mt-1 text-sm text-slate-700">The leak rate is worked out when the entry reaches the server.</p>
          ) : null}
        </div>
      ) : null}

      {!selected ? (
        <section aria-labelledby="pick-h" className="space-y-3">
          <h2 id="pick-h" className="text-lg font-semibold">
            Choose the equipment
          </h2>
          <EquipmentPicker equipment={equipment} counts={counts} onPick={(id) => go(id, null)} />
        </section>
      ) : (
        <section aria-labelledby="panel-h" className="space-y-4">
          <button type="button" onClick={() => go(null, null)} className="inline-flex min-h-11 items-center gap-2 rounded-md px-2 font-semibold text-ice-800 hover:bg-ice-50">
            <ArrowLeft aria-hidden className="size-5" /> All equipment
          </button>
          <div className="flex items-start gap-3">
            <EquipmentTypeIcon type={selected.type} className="mt-1 size-6" />
            <div className="min-w-0">
              <h2 id="panel-h" ref={panelHeading} tabIndex={-1} className="break-words text-xl font-bold outline-none">
                {selected.name}
              </h2>
              <p className="text-slate-700">
                {equipmentTypeLabels[selected.type]}
                {selected.areaName ? ` · ${selected.areaName}` : ''}
                {ctx.refrigerant ? ` · ${ctx.refrigerant}` : ''}
              </p>
            </div>
          </div>
          {handling.length ? (
            <Alert tone="warning" title="Flammable or hazardous refrigerant">
              <ul className="list-disc pl-4">
                {handling.map((c) => (
                  <li key={c}>{c}</li>
                ))}
              </ul>
            </Alert>
          ) : null}
          {!kind ? (
            <div role="group" aria-label="Add an entry" className="grid grid-cols-2 gap-2 sm:grid-cols-4">
              {FORM_KINDS.map((k) => {
                const Icon = entryKindIcons[k];
                return (
                  <button
                    key={k}
                    type="button"
                    onClick={() => {
                      setJustSaved(null);
                      go(selected.id, k);
                    }}
                    className="flex min-h-16 flex-col items-center justify-center gap-1 rounded-lg border-2 border-slate-300 bg-white px-2 py-2 text-center font-semibold text-slate-900 hover:border-ice-700 hover:bg-ice-50"
                  >
                    <Icon aria-hidden className="size-6 text-ice-700" />
                    {entryKindLabels[k]}
                  </button>
                );
              })}
            </div>
          ) : (
            <Card className="space-y-3">
              <h3 className="flex items-center gap-2 text-lg font-bold">
                <EntryKindLabel kind={kind} className="text-lg" />
              </h3>
              {kind === 'reading' ? <ReadingForm ctx={ctx} prefs={prefs} refrigerantCautions={handling} onSubmit={(d) => submit('reading', d)} onCancel={cancel} /> : null}
              {kind === 'setting_change' ? <SettingForm unit={selected} ctx={ctx} prefs={prefs} onSubmit={(d) => submit('setting_change', d)} onCancel={cancel} /> : null}
              {kind === 'finding' ? <FindingForm onSubmit={(d) => submit('finding', d)} onCancel={cancel} /> : null}
              {kind === 'action' ? <ActionForm onSubmit={(d) => submit('action', d)} onCancel={cancel} /> : null}
              {kind === 'part' ? <PartForm equipmentName={selected.name} onSubmit={(d) => submit('part', d)} onCancel={cancel} /> : null}
              {kind === 'refrigerant' ? <RefrigerantForm ctx={ctx} prefs={prefs} refrigerantCautions={handling} onSubmit={(d) => submit('refrigerant', d)} onCancel={cancel} /> : null}
              {kind === 'leak' ? <LeakForm refrigerantCautions={handling} onSubmit={(d) => submit('leak', d)} onCancel={cancel} /> : null}
              {kind === 'condition' ? <ConditionForm current={selected.condition} onSubmit={(d) => submit('condition', d)} onCancel={cancel} /> : null}
              {kind === 'note' ? <NoteForm onSubmit={(d) => submit('note', d)} onCancel={cancel} /> : null}
              {kind === 'photo' ? <PhotoForm equipmentId={selected.id} onSubmit={(d) => submit('photo', d, true)} onDone={cancel} /> : null}
            </Card>
          )}
        </section>
      )}

      <section aria-labelledby="entries-h" className="space-y-3">
        <h2 id="entries-h" className="text-lg font-semibold">
          {selected ? `Entries on ${selected.name} in this visit` : 'This visit so far'}
        </h2>
        <EntryRows
          rows={selected ? rows.filter((r) => r.equipmentId === selected.id) : rows}
          showEquipment={!selected}
          prefs={prefs}
          visitId={visit.id}
          timeZone={visit.timeZone}
          canVoid={(r) => canVoidAny || r.saved?.createdBy === actorId}
          onDiscard={discard}
        />
      </section>

      {!selected ? <CloseVisitPanel visit={visit} waitingCount={waitingCount} /> : null}
    </div>
  );
}

function EquipmentPicker({ equipment, counts, onPick }: { equipment: EquipmentDto[]; counts: Map<string, number>; onPick: (id: string) => void }) {
  const groups = useMemo(() => {
    const m = new Map<string, EquipmentDto[]>();
    for (const e of equipment) m.set(e.areaName ?? '', [...(m.get(e.areaName ?? '') ?? []), e]);
    return [...m.entries()].sort(([a], [b]) => (a === '' ? 1 : b === '' ? -1 : a.localeCompare(b)));
  }, [equipment]);
  if (equipment.length === 0) {
    return <p className="rounded-lg border border-dashed border-slate-300 bg-white p-4">No equipment is registered at this site yet. Register it from the site page, then come back.</p>;
  }
  return (
    <div className="space-y-4">
      {groups.map(([area, items]) => (
        <div key={area || 'none'} className="space-y-2">
          <h3 className="text-sm font-bold uppercase tracking-wide text-slate-700">{area || 'No area'}</h3>
          <ul className="grid grid-cols-1 gap-2 sm:grid-cols-2 lg:grid-cols-3">
            {items.map((e) => {
              const n = counts.get(e.id) ?? 0;
              return (
                <li key={e.id}>
                  <button
                    type="button"
                    onClick={() => onPick(e.id)}
                    className="flex min-h-16 w-full items-center gap-3 rounded-lg border-2 border-slate-300 bg-white px-3 py-2 text-left hover:border-ice-700 hover:bg-ice-50"
                  >
                    <EquipmentTypeIcon type={e.type} className="size-6" />
                    <span className="min-w-0 flex-1">
                      <span className="block break-words font-semibold text-slate-900">{e.name}</span>
                      <span className="block text-sm text-slate-700">{equipmentTypeLabels[e.type]}</span>
                      {n > 0 ? (
                        <span className="mt-0.5 inline-flex items-center gap-1 text-sm font-semibold text-emerald-900">
                          <CircleCheck aria-hidden className="size-4" /> {n} {n === 1 ? 'entry' : 'entries'} this visit
                        </span>
                      ) : null}
                    </span>
                    <ChevronRight aria-hidden className="size-5 shrink-0 text-slate-500" />
                  </button>
                </li>
              );
            })}
          </ul>
        </div>
      ))}
    </div>
  );
}

function EntryRows({
  rows,
  showEquipment,
  prefs,
  visitId,
  timeZone,
  canVoid,
  onDiscard,
}: {
  rows: Row[];
  showEquipment: boolean;
  prefs: UnitPrefs;
  visitId: string;
  timeZone: string;
  canVoid: (r: Row) => boolean;
  onDiscard: (clientEntryId: string) => void;
}) {
  if (rows.length === 0) return <p className="rounded-lg border border-dashed border-slate-300 bg-white p-4 text-slate-700">Nothing recorded yet.</p>;
  return (
    <ol className="divide-y divide-slate-200 overflow-hidden rounded-lg border border-slate-200 bg-white" aria-label="Entries, newest first">
      {rows.map((r) => (
        <li key={r.key} className={cn('space-y-1 px-4 py-3', r.saved?.voidedAt && 'bg-slate-50')} data-entry-state={r.state} data-entry-kind={r.kind}>
          <div className="flex flex-wrap items-center gap-x-3 gap-y-1">
            <EntryKindLabel kind={r.kind} />
            <time dateTime={r.recordedAt} className="text-sm text-slate-600">
              {new Intl.DateTimeFormat('en-US', { timeZone, hour: 'numeric', minute: '2-digit' }).format(new Date(r.recordedAt))}
            </time>
            {showEquipment ? <span className="text-sm font-medium text-slate-800">{r.equipmentName}</span> : null}
            <SaveStateBadge state={r.state} className="ml-auto" />
          </div>
          <div className={cn(r.saved?.voidedAt && 'text-slate-600 line-through')}>
            <EntrySummary entry={r.entry} prefs={prefs} />
          </div>
          {r.saved?.voidedAt ? <p className="text-sm font-semibold">Voided: {r.saved.voidReason}</p> : null}
          {r.pending?.state === 'refused' ? (
            <div className="space-y-2">
              <p role="alert" className="text-sm font-semibold text-red-800">
                The server refused it: {r.pending.error}
              </p>
              <Button variant="secondary" size="sm" onClick={() => onDiscard(r.key)}>
                Discard this entry
              </Button>
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
        Void this entry…
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
        Void entry
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
