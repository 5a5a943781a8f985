'use client';

import { CloudOff, ScanLine } from 'lucide-react';
import { Suspense, useEffect, useState } from 'react';
import { buttonVariants } from '@/components/ui/button';
import { formatMoment } from '@/lib/format/moments';
import { readAllPacks, type StoredPack } from '@/lib/offline/store';
import { offlineUser } from '@/lib/offline/user';
import { visitFromPack, type VisitCopy, type VisitHead } from '@/lib/offline/visit-copy';
import { outboxItems, phoneVisit, subscribeOutbox } from '@/lib/visits/outbox';
import { visitReasonLabels } from '@/lib/visits/terms';
import { VisitWorkspace } from '@/app/(app)/visits/[id]/_components/visit-workspace';

type State = { status: 'loading' } | { status: 'missing' } | { status: 'found'; copy: VisitCopy; kept: StoredPack; onPhoneOnly: boolean };

function visitIdFromLocation(): string | null {
  const id = new URLSearchParams(window.location.search).get('id');
  return id && /^[0-9a-f-]{36}$/i.test(id) ? id.toLowerCase() : null;
}

/** The visit's own page once the server has it and answers: the phone's copy is only for no signal. */
async function liveVisitHref(visitId: string): Promise<string | null> {
  if (!navigator.onLine) return null;
  if ((await outboxItems(visitId)).some((i) => i.type === 'start')) return null;
  const res = await fetch(`/api/visits/${visitId}`, { credentials: 'same-origin', cache: 'no-store' }).catch(() => null);
  if (!res?.ok) return null;
  const params = new URLSearchParams(window.location.search);
  params.delete('id');
  const rest = params.toString();
  return `/visits/${visitId}${rest ? `?${rest}` : ''}`;
}

async function findVisit(visitId: string): Promise<State> {
  const userId = await offlineUser();
  const packs = await readAllPacks(userId);
  const started = await phoneVisit(userId, visitId);
  let head: VisitHead | null = null;
  let kept: StoredPack | undefined;
  if (started) {
    kept = packs.find((p) => p.pack.site.id === started.siteId);
    head = { id: started.id, reason: started.reason, startedAt: started.startedAt };
  } else {
    kept = packs.find((p) => p.pack.openVisit?.id === visitId);
    if (kept?.pack.openVisit) head = kept.pack.openVisit;
  }
  if (!kept || !head) return { status: 'missing' };
  return { status: 'found', copy: visitFromPack(kept.pack, head), kept, onPhoneOnly: Boolean(started) };
}

/** A visit from the phone's copy (?id=); moves to the visit's own page once the server has it. */
export function OfflineVisitView() {
  const [state, setState] = useState<State>({ status: 'loading' });

  useEffect(() => {
    const visitId = visitIdFromLocation();
    if (!visitId) {
      setState({ status: 'missing' });
      return;
    }
    let live = true;
    let checking = false;
    const goLiveIfYouCan = async () => {
      if (checking) return;
      checking = true;
      const href = await liveVisitHref(visitId).catch(() => null);
      checking = false;
      if (href && live) window.location.replace(href);
    };
    void findVisit(visitId).then((s) => live && setState(s));
    void goLiveIfYouCan();
    // The start reached the server (its item left the outbox) or the signal came back.
    const unsubscribe = subscribeOutbox(() => void goLiveIfYouCan());
    window.addEventListener('online', goLiveIfYouCan);
    return () => {
      live = false;
      unsubscribe();
      window.removeEventListener('online', goLiveIfYouCan);
    };
  }, []);

  if (state.status === 'loading') {
    return (
      <p role="status" className="text-slate-600">
        Looking on this phone…
      </p>
    );
  }
  if (state.status === 'missing') {
    return (
      <div className="space-y-4" data-testid="offline-visit-missing">
        <h1 className="text-xl font-bold">This visit is not on this phone</h1>
        <p className="text-slate-700">Without signal, a visit opens only when its site is kept on this phone. Scan a unit’s tag to start one there.</p>
        <a href="/scan" className={buttonVariants({ size: 'lg' })}>
          <ScanLine aria-hidden className="size-5" /> Scan a tag
        </a>
      </div>
    );
  }

  const { copy, kept, onPhoneOnly } = state;
  return (
    <div className="space-y-4" data-testid="offline-visit">
      <header>
        <h1 className="break-words text-xl font-bold tracking-tight text-slate-900">{copy.visit.siteName}</h1>
        <p className="text-sm text-slate-700">
          {visitReasonLabels[copy.visit.reason]} · {copy.visit.technicianName} · started {formatMoment(copy.visit.startedAt, copy.visit.timeZone)}
        </p>
        <p className="mt-2 flex items-start gap-2 rounded-md border-2 border-ice-700 bg-ice-50 p-3 text-sm text-slate-900" data-testid="offline-visit-source">
          <CloudOff aria-hidden className="mt-0.5 size-5 shrink-0 text-ice-800" />
          <span>
            <strong>{onPhoneOnly ? 'Started on this phone without signal.' : 'From this phone’s copy.'}</strong> Units and their history as kept on {formatMoment(kept.pack.takenAt, kept.pack.site.timeZone)}. Everything you record is kept here and sent, in order, when there is signal.
          </span>
        </p>
      </header>
      <Suspense fallback={<p role="status">Loading the visit…</p>}>
        <VisitWorkspace
          visit={copy.visit}
          equipment={copy.equipment}
          contexts={copy.contexts}
          tagCodes={copy.tagCodes}
          prefs={copy.prefs}
          phoneCopy
        />
      </Suspense>
    </div>
  );
}
