'use client';

import { ArrowLeft, CircleCheck, Lock, RefreshCw, ScanLine, Shuffle } from 'lucide-react';
import { useRouter, useSearchParams } from 'next/navigation';
import { useCallback, useEffect, useMemo, useRef, useState } from 'react';
import { EquipmentTypeIcon } from '@/components/equipment/equipment-type-icon';
import { TagScanner } from '@/components/tags/tag-scanner';
import { Alert } from '@/components/ui/alert';
import { LeaveDialog } from '@/components/ui/leave-dialog';
import { useLeaveGuard } from '@/components/ui/use-leave-guard';
import { unsentMessage } from '@/components/photos/use-photo-uploads';
import { Card } from '@/components/ui/card';
import { EntryKindLabel, entryKindIcons, SaveStateBadge } from '@/components/visits/badges';
import { EntrySummary } from '@/components/visits/entry-summary';
import { refrigerantCautions as cautionsFor } from '@/lib/calc/cautions';
import { useKeepSite } from '@/lib/offline';
import { OFFLINE_VISIT_PATH } from '@/lib/offline/cache-names';
import { findRefrigerant } from '@/lib/calc/refrigerants';
import type { EquipmentDto } from '@/lib/equipment/dto';
import { equipmentTypeLabels } from '@/lib/equipment/types';
import type { ErrorIssue } from '@/lib/errors';
import { formatCode } from '@/lib/tags/code';
import type { UnitPrefs } from '@/lib/units/quantities';
import type { VisitDetailDto } from '@/lib/visits/dto';
import { useVisit, useVisitOutbox, type SaveOutcome } from '@/lib/visits/hooks';
import { kindsFor } from '@/lib/visits/kinds';
import type { EntryContext } from '@/lib/visits/kinds/types';
import { newClientId, outboxTitle, type OutboxItem } from '@/lib/visits/outbox';
import { createEntrySchema, type CreateEntryInput } from '@/lib/visits/schemas';
import { ENTRY_KINDS, entryKindLabels, type EntryKind } from '@/lib/visits/terms';
import { CloseVisitPanel, stillMissing } from '@/app/(app)/visits/[id]/_components/close-visit-panel';
import { entryForms } from '@/app/(app)/visits/[id]/_components/entry-forms';
import { EntryRows, type Row } from '@/app/(app)/visits/[id]/_components/entry-rows';
import type { FieldErrors, SubmitResult } from '@/app/(app)/visits/[id]/_components/form-kit';
import { UnitPicker, type Touched } from '@/app/(app)/visits/[id]/_components/unit-picker';

// A visit on a phone, one unit at a time: pick the unit (search, scan or list), pick what to record
// from the kinds that fit it, save, and move on. A bar at the bottom always shows where the visit
// stands and how to close it. Where we are lives in the URL (?equipment=&kind=&step=), as plain
// history entries, so the phone's back button walks back through it.

const NO_CONTEXT: EntryContext = { refrigerant: null, elevationM: 0, designBoxTempC: null, nameplateVoltage: null, controlVoltageNominal: null, designPressureHighKpaG: null };

type Step = 'scan' | 'close';

/** zod and server issue paths ("data.asLeft.cutInKpaG") → the form's field keys ("asLeft.cutInKpaG"). */
function toFieldErrors(issues: readonly { path: string | PropertyKey[]; message: string }[]): FieldErrors {
  const out: FieldErrors = {};
  for (const i of issues) {
    const path = (Array.isArray(i.path) ? i.path.map(String).join('.') : String(i.path)).replace(/^data\.?/, '');
    if (!(path in out)) out[path] = i.message;
  }
  return out;
}

export function VisitWorkspace({
  visit: initialVisit,
  equipment,
  contexts,
  tagCodes,
  prefs,
  phoneCopy = false,
}: {
  visit: VisitDetailDto;
  equipment: EquipmentDto[];
  contexts: Record<string, EntryContext>;
  /** Attached tag code by equipment id. */
  tagCodes: Record<string, string>;
  prefs: UnitPrefs;
  /** Shown from the phone's kept copy without signal (/offline/visit): its address keeps ?id=, nothing is fetched. */
  phoneCopy?: boolean;
}) {
  const router = useRouter();
  const search = useSearchParams();
  const visitQuery = useVisit(initialVisit.id, initialVisit, { fromServer: !phoneCopy });
  const visit = visitQuery.data ?? initialVisit;
  const { items, waitingCount, online, save, savePhoto, queueClose, retryAll, discard } = useVisitOutbox(visit.id);
  // A visit keeps its site on the phone, so its units open from a scan without signal.
  const kept = useKeepSite(visit.siteId);
  // Photos chosen in the photo form and not sent yet: changing unit, scanning or closing asks first.
  const [unsentPhotos, setUnsentPhotos] = useState(0);
  const photoGuard = useLeaveGuard(unsentPhotos > 0, unsentMessage(unsentPhotos), { pageLeave: false });
  const [justSaved, setJustSaved] = useState<{ clientEntryId: string; outcome: SaveOutcome['outcome']; kind: EntryKind } | null>(null);
  const savedNote = useRef<HTMLDivElement>(null);
  const panelHeading = useRef<HTMLHeadingElement>(null);

  const selected = equipment.find((e) => e.id === search.get('equipment')) ?? null;
  const kindParam = search.get('kind') as EntryKind | null;
  const kind = kindParam && (ENTRY_KINDS as readonly string[]).includes(kindParam) ? kindParam : null;
  const stepParam = search.get('step');
  const step: Step | null = stepParam === 'scan' || stepParam === 'close' ? stepParam : null;
  const names = useMemo(() => new Map(equipment.map((e) => [e.id, e.name])), [equipment]);
  const byCode = useMemo(() => new Map(Object.entries(tagCodes).map(([id, code]) => [code.toUpperCase(), id])), [tagCodes]);

  const go = useCallback(
    (to: { equipment?: string | null; kind?: EntryKind | null; step?: Step | null }) => {
      const params = new URLSearchParams();
      if (phoneCopy) params.set('id', visit.id);
      if (to.equipment) params.set('equipment', to.equipment);
      if (to.kind) params.set('kind', to.kind);
      if (to.step) params.set('step', to.step);
      const qs = params.toString();
      window.history.pushState(null, '', `${phoneCopy ? OFFLINE_VISIT_PATH : `/visits/${visit.id}`}${qs ? `?${qs}` : ''}`);
    },
    [visit.id, phoneCopy],
  );

  // The photo form is gone (left on purpose): nothing of it is left to guard.
  useEffect(() => {
    if (kind !== 'photo') setUnsentPhotos(0);
  }, [kind]);
  useEffect(() => {
    if (selected && !step) panelHeading.current?.focus();
  }, [selected, kind, step]);
  // Focus moves to the saved entry once its form has closed, never while a form is still in use.
  useEffect(() => {
    if (justSaved && !kind) savedNote.current?.focus();
  }, [justSaved, kind]);

  // A pending entry the server already has (its answer was lost on the way back) is done.
  const savedIds = useMemo(() => new Set(visit.entries.map((e) => e.clientEntryId)), [visit.entries]);
  useEffect(() => {
    for (const i of items) if (i.type !== 'close' && savedIds.has(i.id)) discard(i.id);
  }, [items, savedIds, discard]);
  const unsent = useMemo(() => items.filter((i) => !savedIds.has(i.id)), [items, savedIds]);

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
    const waiting: Row[] = unsent.flatMap((p) => (p.type === 'close' || p.type === 'start' ? [] : [outboxRow(p, names)]));
    return [...fromServer, ...waiting].sort((a, b) => b.recordedAt.localeCompare(a.recordedAt));
  }, [visit.entries, unsent, names]);

  const touched = useMemo(() => {
    const m = new Map<string, Touched>();
    for (const r of rows) {
      if (r.saved?.voidedAt) continue;
      const t = m.get(r.equipmentId) ?? { count: 0, kinds: new Map<EntryKind, number>() };
      t.count += 1;
      t.kinds.set(r.kind, (t.kinds.get(r.kind) ?? 0) + 1);
      m.set(r.equipmentId, t);
    }
    return m;
  }, [rows]);

  async function submit(k: EntryKind, data: unknown, opts?: { stay: boolean }): Promise<SubmitResult> {
    if (!selected) return { ok: false, errors: {}, message: 'Choose the unit first.' };
    const candidate = { equipmentId: selected.id, clientEntryId: newClientId(), recordedAt: new Date().toISOString(), kind: k, data };
    const parsed = createEntrySchema.safeParse(candidate);
    if (!parsed.success) return { ok: false, errors: toFieldErrors(parsed.error.issues), message: 'Check the highlighted fields; nothing was saved.' };
    const input: CreateEntryInput = parsed.data;
    const result = await save(input);
    if (result.outcome === 'refused') return { ok: false, errors: toFieldErrors(result.error.issues as ErrorIssue[]), message: result.error.message };
    setJustSaved({ clientEntryId: input.clientEntryId, outcome: result.outcome, kind: k });
    if (!opts?.stay) go({ equipment: selected.id });
    // The unit's record changed on the server (a replaced component, new current settings): reload it.
    if (result.outcome === 'saved' && ((input.kind === 'part' && input.data.replacesEquipment) || input.kind === 'setting_change')) router.refresh();
    return { ok: true };
  }

  async function keepPhotos(equipmentId: string, files: File[]): Promise<void> {
    for (const file of files) {
      await savePhoto({ equipmentId, file, fileName: file.name || 'photo.jpg', kind: 'general', caption: null, uploadKey: newClientId(), clientEntryId: newClientId() });
    }
  }

  const [scanProblem, setScanProblem] = useState<{ code: string; attempt: number } | null>(null);
  const onCode = useCallback(
    (code: string) => {
      const id = byCode.get(code.toUpperCase());
      if (id) {
        setScanProblem(null);
        setJustSaved(null);
        go({ equipment: id });
      } else setScanProblem((p) => ({ code, attempt: (p?.attempt ?? 0) + 1 }));
    },
    [byCode, go],
  );

  const justSavedRow = justSaved ? rows.find((r) => r.key === justSaved.clientEntryId || r.saved?.clientEntryId === justSaved.clientEntryId) : undefined;
  const ctx = selected ? (contexts[selected.id] ?? NO_CONTEXT) : NO_CONTEXT;
  const refrigerant = ctx.refrigerant ? findRefrigerant(ctx.refrigerant) : undefined;
  const handling = refrigerant ? cautionsFor(refrigerant) : [];
  const cancel = () => selected && go({ equipment: selected.id });
  const fitting = selected ? kindsFor(selected) : [];
  const missing = stillMissing(visit, unsent);

  let main;
  if (step === 'close') {
    main = (
      <div className="space-y-3">
        <button type="button" onClick={() => go({ equipment: selected?.id })} className="inline-flex min-h-11 items-center gap-2 rounded-md px-2 font-semibold text-ice-800 hover:bg-ice-50">
          <ArrowLeft aria-hidden className="size-5" /> Back to the units
        </button>
        <CloseVisitPanel visit={visit} items={unsent} queueClose={queueClose} />
      </div>
    );
  } else if (step === 'scan') {
    main = (
      <section aria-labelledby="scan-h" className="space-y-3">
        <button type="button" onClick={() => go({ equipment: selected?.id })} className="inline-flex min-h-11 items-center gap-2 rounded-md px-2 font-semibold text-ice-800 hover:bg-ice-50">
          <ArrowLeft aria-hidden className="size-5" /> Back
        </button>
        <h2 id="scan-h" className="text-lg font-semibold">
          Scan the unit’s tag
        </h2>
        {scanProblem ? (
          <Alert tone="warning" title={`Tag ${formatCode(scanProblem.code)} is not on a unit at this site.`}>
            Scan another tag, or find the unit by name. Tags of other sites open from the Scan page.
          </Alert>
        ) : null}
        {/* A fresh scanner after a miss, so the next tag is read. */}
        <TagScanner key={scanProblem?.attempt ?? 0} onCode={onCode} compact />
      </section>
    );
  } else if (!selected) {
    main = (
      <>
        <UnitPicker equipment={equipment} tagCodes={tagCodes} touched={touched} onPick={(id) => go({ equipment: id })} onScan={() => go({ step: 'scan' })} />
        <p className="text-sm text-slate-700" data-testid="site-kept" role="status">
          {kept.status === 'ready' ? 'This site is kept on the phone: ready without signal.' : kept.status === 'saving' ? 'Keeping this site on the phone…' : kept.status === 'failed' && kept.kept ? 'This site is on the phone (an older copy).' : null}
        </p>
      </>
    );
  } else {
    const code = tagCodes[selected.id];
    main = (
      <section aria-labelledby="panel-h" className="space-y-4">
        <div className="flex items-start gap-3">
          <EquipmentTypeIcon type={selected.type} className="mt-1 size-6" />
          <div className="min-w-0 flex-1">
            <h2 id="panel-h" ref={panelHeading} tabIndex={-1} className="break-words text-xl font-bold outline-none">
              {selected.name}
            </h2>
            <p className="text-slate-700">
              {equipmentTypeLabels[selected.type]}
              {selected.areaName ? ` · ${selected.areaName}` : ''}
              {ctx.refrigerant ? ` · ${ctx.refrigerant}` : ''}
              {code ? (
                <>
                  {' · '}
                  <span className="whitespace-nowrap font-mono">{formatCode(code)}</span>
                </>
              ) : null}
            </p>
          </div>
        </div>
        <div className="grid grid-cols-2 gap-2">
          <button type="button" onClick={() => photoGuard.confirm(() => go({}))} className="inline-flex min-h-12 items-center justify-center gap-2 rounded-md border border-slate-300 bg-white px-3 font-semibold text-slate-900 hover:bg-slate-100">
            <Shuffle aria-hidden className="size-5" /> Change unit
          </button>
          <button type="button" onClick={() => photoGuard.confirm(() => go({ step: 'scan' }))} className="inline-flex min-h-12 items-center justify-center gap-2 rounded-md border border-slate-300 bg-white px-3 font-semibold text-slate-900 hover:bg-slate-100">
            <ScanLine aria-hidden className="size-5" /> Scan another tag
          </button>
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
            {fitting.map((k) => {
              const Icon = entryKindIcons[k];
              return (
                <button
                  key={k}
                  type="button"
                  onClick={() => {
                    setJustSaved(null);
                    go({ equipment: selected.id, kind: k });
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
            {entryForms[kind]({ unit: selected, ctx, prefs, refrigerantCautions: handling, onSubmit: (d, opts) => submit(kind, d, opts), onCancel: cancel, onUnsentChange: setUnsentPhotos, keepPhotosOffline: (files) => keepPhotos(selected.id, files) })}
          </Card>
        )}
        <section aria-labelledby="entries-h" className="space-y-3">
          <h3 id="entries-h" className="text-lg font-semibold">
            On this unit in this visit
          </h3>
          <EntryRows
            rows={rows.filter((r) => r.equipmentId === selected.id)}
            showEquipment={false}
            prefs={prefs}
            visitId={visit.id}
            timeZone={visit.timeZone}
            canVoid={(r) => r.saved?.canVoid === true}
            onDiscard={discard}
            onRedo={(r) => go({ equipment: r.equipmentId, kind: r.kind })}
          />
        </section>
      </section>
    );
  }

  const refusedStart = items.find((i) => i.type === 'start' && i.state === 'refused');

  return (
    <div className="space-y-4 pb-28">
      {refusedStart ? (
        <Alert tone="danger" title="The server refused to start this visit">
          <p>{refusedStart.error}</p>
          <p className="mt-1">Everything recorded is kept on this phone and waits behind the start. Sort out the reason (for example, close your other open visit at this site), then try again.</p>
          <button type="button" onClick={() => void retryAll()} className="mt-2 inline-flex min-h-11 items-center gap-2 rounded-md border border-red-600 bg-white px-3 font-semibold">
            <RefreshCw aria-hidden className="size-4" /> Try starting it again
          </button>
        </Alert>
      ) : null}
      {!online || waitingCount > 0 ? (
        <Alert tone="warning" title={outboxTitle(online, unsent)}>
          <p>
            {waitingCount > 0
              ? 'What waits is kept on this phone and sent as soon as there is a connection. Do not clear this browser’s data until it is sent.'
              : 'You can keep working: entries are kept on this phone and sent when the connection returns.'}
          </p>
          {waitingCount > 0 ? (
            <button type="button" onClick={() => void retryAll()} className="mt-2 inline-flex min-h-11 items-center gap-2 rounded-md border border-amber-500 bg-white px-3 font-semibold">
              <RefreshCw aria-hidden className="size-4" /> Try sending now
            </button>
          ) : null}
        </Alert>
      ) : null}

      {visit.openBypasses.length > 0 && step !== 'close' ? (
        <Alert tone="danger" title="A safety or operating control is bypassed">
          <ul className="list-disc pl-4">
            {visit.openBypasses.map((b) => (
              <li key={b.entryId}>{b.description}</li>
            ))}
          </ul>
          <p className="mt-1">Remove the jumper before leaving; the visit closes only after you confirm it.</p>
        </Alert>
      ) : null}

      {justSaved && justSavedRow && !kind && !step ? (
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

      {main}

      <VisitBar
        entryCount={rows.filter((r) => !r.saved?.voidedAt).length}
        unitCount={touched.size}
        missing={missing.length}
        closeQueued={unsent.some((i) => i.type === 'close' && i.state !== 'refused')}
        closing={step === 'close'}
        canClose={visit.canClose}
        onClose={() => photoGuard.confirm(() => go({ equipment: selected?.id, step: 'close' }))}
      />
      <LeaveDialog {...photoGuard.dialog} />
    </div>
  );
}

/** An item still on the phone, as a row of the visit's entries. */
function outboxRow(p: Exclude<OutboxItem, { type: 'close' | 'start' }>, names: Map<string, string>): Row {
  const equipmentId = p.type === 'entry' ? p.input.equipmentId : p.equipmentId;
  return {
    key: p.id,
    kind: p.type === 'entry' ? p.input.kind : 'photo',
    equipmentId,
    equipmentName: names.get(equipmentId) ?? 'Equipment',
    recordedAt: p.savedAt,
    state: p.state,
    entry: p.type === 'entry' ? { kind: p.input.kind, data: p.input.data as Record<string, unknown> } : { kind: 'photo', data: { caption: p.caption ?? p.fileName } },
    pending: p,
  };
}

/** Always in reach at the bottom of the screen: where the visit stands, and the way to close it. */
function VisitBar({
  entryCount,
  unitCount,
  missing,
  closeQueued,
  closing,
  canClose,
  onClose,
}: {
  entryCount: number;
  unitCount: number;
  missing: number;
  closeQueued: boolean;
  closing: boolean;
  canClose: boolean;
  onClose: () => void;
}) {
  return (
    <div className="fixed inset-x-0 bottom-0 z-30 border-t border-slate-300 bg-white/95 shadow-[0_-2px_8px_rgba(15,23,42,0.12)] backdrop-blur print:hidden" data-testid="visit-bar">
      <div className="mx-auto flex max-w-5xl items-center gap-3 px-4 py-2">
        <p className="min-w-0 flex-1 text-sm leading-tight" role="status">
          <span className="block font-semibold text-slate-900">{closeQueued ? 'Closing when there is signal' : 'Visit open'}</span>
          <span className="block text-slate-700">
            {entryCount} {entryCount === 1 ? 'entry' : 'entries'} on {unitCount} {unitCount === 1 ? 'unit' : 'units'}
            {missing > 0 ? ` · ${missing} to settle` : ''}
          </span>
        </p>
        {canClose && !closing ? (
          <button type="button" onClick={onClose} className="inline-flex min-h-12 shrink-0 items-center gap-2 rounded-md bg-ice-900 px-4 font-semibold text-white hover:bg-ice-800">
            <Lock aria-hidden className="size-5" /> Close visit
          </button>
        ) : null}
      </div>
    </div>
  );
}
