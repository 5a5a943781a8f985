'use client';

import { ClipboardList, ClipboardPen, CloudOff, QrCode, ScanLine, Wifi } from 'lucide-react';
import { useEffect, useState } from 'react';
import { ConditionBadge } from '@/components/equipment/condition-badge';
import { DetailList } from '@/components/equipment/detail-list';
import { EquipmentTypeIcon } from '@/components/equipment/equipment-type-icon';
import { EquipmentStatusBadge } from '@/components/equipment/status-badge';
import { buttonVariants } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { EntryKindLabel, SeverityBadge } from '@/components/visits/badges';
import { EntrySummary } from '@/components/visits/entry-summary';
import { groupByVisit, VisitGroupTitle } from '@/components/visits/visit-group-title';
import { currentSettings } from '@/lib/equipment/current-settings';
import type { Nameplate } from '@/lib/equipment/nameplate';
import { equipmentTypeLabels } from '@/lib/equipment/types';
import { formatDay } from '@/lib/format/dates';
import { formatMoment } from '@/lib/format/moments';
import { readKeptUnit } from '@/lib/offline/keep-site';
import type { UnitQuery } from '@/lib/offline/lookup';
import type { StoredPack } from '@/lib/offline/store';
import type { PackUnit } from '@/lib/sites/pack-schema';
import { checkCode, formatCode } from '@/lib/tags/code';
import { offlineUser } from '@/lib/offline/user';
import { phoneVisitsAt } from '@/lib/visits/outbox';
import { phoneVisitHref } from '@/lib/visits/start-on-phone';
import { StartVisitForm } from '@/app/(app)/visits/new/_components/start-visit-form';

type State = { status: 'loading' } | { status: 'missing'; query: UnitQuery | null } | { status: 'found'; kept: StoredPack; unit: PackUnit };

/** ?code= (a tag's code, as typed or scanned) or ?id= (an equipment id) of the page's own address. */
function queryFromLocation(): UnitQuery | null {
  const params = new URLSearchParams(window.location.search);
  const code = params.get('code');
  if (code) return { code };
  const id = params.get('id');
  return id ? { id } : null;
}

/** The unit named by `query`, else by the page's own address (?code= or ?id=). */
export function OfflineUnitView({ query: given }: { query?: UnitQuery } = {}) {
  const [state, setState] = useState<State>({ status: 'loading' });
  const [online, setOnline] = useState(true);
  const givenCode = given && 'code' in given ? given.code : null;
  const givenId = given && 'id' in given ? given.id : null;

  useEffect(() => {
    const query: UnitQuery | null = givenCode ? { code: givenCode } : givenId ? { id: givenId } : queryFromLocation();
    setOnline(navigator.onLine);
    const on = () => setOnline(navigator.onLine);
    window.addEventListener('online', on);
    window.addEventListener('offline', on);
    void (async () => {
      const found = query ? await readKeptUnit(query).catch(() => null) : null;
      setState(found ? { status: 'found', kept: found.kept, unit: found.unit } : { status: 'missing', query });
    })();
    return () => {
      window.removeEventListener('online', on);
      window.removeEventListener('offline', on);
    };
  }, [givenCode, givenId]);

  if (state.status === 'loading') {
    return (
      <p role="status" className="text-slate-600">
        Looking on this phone…
      </p>
    );
  }
  if (state.status === 'missing') return <NotOnPhone query={state.query} online={online} />;
  return <KeptUnit kept={state.kept} unit={state.unit} online={online} />;
}

function NotOnPhone({ query, online }: { query: UnitQuery | null; online: boolean }) {
  const code = query && 'code' in query ? query.code : null;
  const check = code ? checkCode(code) : null;
  return (
    <div className="space-y-4" data-testid="offline-unit-missing">
      <h1 className="text-xl font-bold">This unit is not on this phone</h1>
      <p className="text-slate-700">
        {code ? (
          <>
            Tag <span className="font-mono font-semibold tracking-wider">{check?.status === 'valid' ? formatCode(check.normalized) : code}</span> belongs to no site kept on this phone.
          </>
        ) : (
          'No unit was named.'
        )}{' '}
        Without signal, only units of sites kept on this phone open. Keep a site from its page while there is signal.
      </p>
      <div className="flex flex-wrap gap-2">
        <a href="/scan" className={buttonVariants({ size: 'lg' })}>
          <ScanLine aria-hidden className="size-5" /> Scan another tag
        </a>
        {online && code ? (
          <a href={`/T/${encodeURIComponent(code)}`} className={buttonVariants({ variant: 'secondary', size: 'lg' })}>
            <Wifi aria-hidden className="size-5" /> Look it up online
          </a>
        ) : null}
      </div>
    </div>
  );
}

function KeptUnit({ kept, unit, online }: { kept: StoredPack; unit: PackUnit; online: boolean }) {
  const { pack } = kept;
  const prefs = { units: pack.viewer.units, metricPressure: pack.viewer.metricPressure };
  const settings = currentSettings(unit.type, unit.nameplate as Nameplate, prefs);
  const followUps = pack.followUps.filter((f) => f.equipmentId === unit.id);
  // The person's open visit here: the server's (its page, or the phone's copy of it without signal),
  // else one started on this phone and not yet known to the kept copy.
  const [phoneVisitId, setPhoneVisitId] = useState<string | null>(null);
  const [starting, setStarting] = useState(false);
  useEffect(() => {
    let live = true;
    void offlineUser()
      .then((userId) => phoneVisitsAt(userId, pack.site.id))
      .then((visits) => live && setPhoneVisitId(visits[0]?.id ?? null))
      .catch(() => undefined);
    return () => {
      live = false;
    };
  }, [pack.site.id]);
  const openVisitId = pack.openVisit?.id ?? pack.openVisitId;
  const continuing = openVisitId !== null || phoneVisitId !== null;
  const visitHref = openVisitId
    ? `/visits/${openVisitId}?equipment=${unit.id}`
    : phoneVisitId
      ? phoneVisitHref(phoneVisitId, unit.id)
      : `/visits/new?siteId=${pack.site.id}&equipmentId=${unit.id}`;
  const groups = groupByVisit(unit.history, (e) => pack.visits[e.visitId]);
  const details = [
    { label: 'Make', value: unit.make },
    { label: 'Model', value: unit.model },
    { label: 'Serial', value: unit.serial },
    { label: 'System', value: unit.systemName },
    { label: 'Refrigerant', value: unit.refrigerant },
    { label: 'Condition note', value: unit.conditionNote },
  ].filter((d) => d.value);

  return (
    <div className="grid gap-5 lg:grid-cols-[minmax(0,3fr)_minmax(0,2fr)] lg:gap-x-8" data-testid="offline-unit">
      <div className="space-y-2 lg:col-span-2">
        <p role="status" className="flex items-start gap-2 rounded-md border-2 border-ice-700 bg-ice-50 p-3 text-sm text-slate-900" data-testid="offline-unit-source">
          <CloudOff aria-hidden className="mt-0.5 size-5 shrink-0 text-ice-800" />
          <span>
            <strong>From this phone’s copy</strong> of {pack.site.name}, taken {formatMoment(pack.takenAt, pack.site.timeZone)}.{' '}
            {online ? (
              <a href={`/equipment/${unit.id}`} className="font-semibold text-ice-800 underline">
                Open the live page
              </a>
            ) : (
              'Changes made since then are not shown.'
            )}
          </span>
        </p>
        <p className="flex items-center gap-1.5 text-xs font-semibold uppercase tracking-wide text-slate-600">
          <EquipmentTypeIcon type={unit.type} className="size-4" />
          {equipmentTypeLabels[unit.type]}
        </p>
        <h1 className="break-words text-xl font-bold leading-tight tracking-tight text-slate-900 sm:text-2xl">{unit.name}</h1>
        <p className="text-sm text-slate-700">
          {pack.site.name}
          {unit.areaName ? ` · ${unit.areaName}` : ''}
        </p>
        <div className="flex flex-wrap items-center gap-1.5">
          <ConditionBadge condition={unit.condition} />
          <EquipmentStatusBadge status={unit.status} />
          {unit.tagCode ? (
            <span className="inline-flex items-center gap-1 rounded-full border border-slate-300 bg-white px-2 py-0.5 font-mono text-sm font-semibold tracking-wider text-slate-900" data-testid="offline-tag-code">
              <QrCode aria-hidden className="size-4" />
              <span className="sr-only">Tag </span>
              {formatCode(unit.tagCode)}
            </span>
          ) : null}
        </div>
        {settings.length > 0 ? (
          <dl className="rounded-md border border-slate-200 bg-slate-50 px-3 py-1.5 text-sm" aria-label="Current settings" data-testid="offline-current-settings">
            {settings.map((line) => (
              <div key={line.side} className="flex flex-wrap gap-x-1.5">
                <dt className="font-semibold text-slate-800">{line.side}:</dt>
                <dd className="text-slate-900">
                  {line.values.map((v, i) => (
                    <span key={v.label}>
                      {i > 0 ? ' · ' : ''}
                      {v.label} <strong className="whitespace-nowrap">{v.text}</strong>
                    </span>
                  ))}
                </dd>
              </div>
            ))}
          </dl>
        ) : null}
        {unit.status !== 'removed' ? (
          <div className="flex flex-wrap gap-2 pt-1">
            {/* A full page load: the worker answers it from its copy when there is no signal. */}
            <a
              href={visitHref}
              className={buttonVariants({ size: 'lg' })}
              onClick={(e) => {
                // Without signal a visit starts here, on the phone.
                if (!continuing && !navigator.onLine) {
                  e.preventDefault();
                  setStarting(true);
                }
              }}
            >
              {continuing ? (
                <>
                  <ClipboardPen aria-hidden className="size-5" /> Continue visit
                </>
              ) : (
                <>
                  <ClipboardList aria-hidden className="size-5" /> Log a visit<span className="sr-only"> on this unit</span>
                </>
              )}
            </a>
          </div>
        ) : null}
        {starting ? (
          <Card className="mt-2 space-y-3" data-testid="offline-start">
            <h2 className="text-lg font-semibold">Start a visit at {pack.site.name}</h2>
            <p className="text-sm text-slate-700">No signal: the visit starts on this phone and reaches the server, with everything recorded, when there is signal.</p>
            <StartVisitForm siteId={pack.site.id} timeZone={pack.site.timeZone} equipmentId={unit.id} onCancel={() => setStarting(false)} />
          </Card>
        ) : null}
      </div>

      <section aria-labelledby="offline-history-h" className="min-w-0 space-y-2" data-testid="offline-unit-history">
        <h2 id="offline-history-h" className="text-lg font-semibold">
          History <span className="text-sm font-normal text-slate-600">(newest {unit.history.length} kept)</span>
        </h2>
        {groups.length === 0 ? (
          <p className="rounded-lg border border-slate-200 bg-white p-4 text-slate-700">No history yet.</p>
        ) : (
          <ol aria-label="History, newest first" className="space-y-2">
            {groups.map((g, gi) => (
              <li key={`${g.visitId}-${gi}`} className="overflow-hidden rounded-lg border border-slate-200 bg-white">
                <p className="border-b border-slate-200 bg-slate-50 px-3 py-1.5 text-sm">
                  {g.visit ? (
                    <VisitGroupTitle visit={g.visit} />
                  ) : (
                    <span className="font-semibold text-slate-900">Visit</span>
                  )}
                </p>
                <ul className="divide-y divide-slate-100">
                  {g.entries.map((e) => (
                    <li key={e.id} className="px-3 py-2" data-entry-kind={e.kind}>
                      <EntryKindLabel kind={e.kind} />
                      <div className="mt-0.5 text-sm">
                        <EntrySummary entry={e} prefs={prefs} />
                      </div>
                    </li>
                  ))}
                </ul>
              </li>
            ))}
          </ol>
        )}
      </section>

      <aside aria-label="About this unit" className="min-w-0 space-y-5">
        {followUps.length > 0 ? (
          <Card>
            <h2 className="text-lg font-semibold">Open follow-ups</h2>
            <ul className="mt-2 space-y-2">
              {followUps.map((f) => (
                <li key={f.id} className="flex flex-wrap items-center gap-2">
                  <SeverityBadge severity={f.severity} />
                  <span>{f.title}</span>
                  {f.scheduledFor ? <span className="text-sm text-slate-600">planned {formatDay(f.scheduledFor)}</span> : null}
                </li>
              ))}
            </ul>
          </Card>
        ) : null}
        {details.length > 0 ? (
          <Card>
            <h2 className="text-lg font-semibold">Details</h2>
            <DetailList rows={details} />
          </Card>
        ) : null}
      </aside>
    </div>
  );
}
