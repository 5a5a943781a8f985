'use client';

import { CircleCheck, CloudOff, LoaderCircle, Smartphone, TriangleAlert } from 'lucide-react';
import { Button } from '@/components/ui/button';
import { formatMoment } from '@/lib/format/moments';
import { useKeepSite } from '@/lib/offline/keep-site';
import { formatBytes } from '@/lib/photos/schemas';

/**
 * "Keep this site on the phone": the site's units, their recent history and open follow-ups kept
 * for work without signal, refreshed whenever there is signal. Status in words and icon, never
 * colour alone.
 */
export function KeepSitePanel({ siteId, timeZone }: { siteId: string; timeZone: string }) {
  const { status, kept, error, keep, forget } = useKeepSite(siteId, { onlyIfKept: true });
  const saving = status === 'saving';
  return (
    <section aria-labelledby="keep-site-h" className="rounded-lg border border-slate-200 bg-white p-4" data-testid="keep-site">
      <h2 id="keep-site-h" className="flex items-center gap-2 text-base font-semibold">
        <Smartphone aria-hidden className="size-5 text-ice-800" />
        On this phone
      </h2>
      <div className="mt-2 space-y-2 text-sm" aria-live="polite">
        {status === 'loading' ? <p className="text-slate-600">Checking this phone…</p> : null}
        {status === 'not_kept' ? <p className="text-slate-700">Keep this site to open its units and their history where there is no signal.</p> : null}
        {kept && status !== 'loading' ? (
          <p className="flex flex-wrap items-center gap-x-2 gap-y-1" data-testid="keep-site-status">
            {status === 'ready' ? (
              <span className="inline-flex items-center gap-1 font-semibold text-emerald-800">
                <CircleCheck aria-hidden className="size-4" /> Ready without signal
              </span>
            ) : null}
            {status === 'saving' ? (
              <span className="inline-flex items-center gap-1 font-semibold text-slate-800">
                <LoaderCircle aria-hidden className="size-4 animate-spin" /> Refreshing…
              </span>
            ) : null}
            {status === 'failed' ? (
              <span className="inline-flex items-center gap-1 font-semibold text-amber-900">
                <CloudOff aria-hidden className="size-4" /> Not refreshed: older copy kept
              </span>
            ) : null}
            <span className="text-slate-700">
              {kept.unitCount} {kept.unitCount === 1 ? 'unit' : 'units'} · {formatBytes(kept.sizeBytes)} · taken {formatMoment(kept.takenAt, timeZone)}
            </span>
          </p>
        ) : null}
        {status === 'saving' && !kept ? (
          <p className="inline-flex items-center gap-1 font-semibold text-slate-800">
            <LoaderCircle aria-hidden className="size-4 animate-spin" /> Saving to this phone…
          </p>
        ) : null}
        {status === 'failed' && error ? (
          <p className="flex items-start gap-1 text-amber-900" role="alert">
            <TriangleAlert aria-hidden className="mt-0.5 size-4 shrink-0" /> {error}
          </p>
        ) : null}
      </div>
      <div className="mt-3 flex flex-wrap gap-2">
        {kept ? (
          <>
            <Button variant="secondary" onClick={() => void keep()} disabled={saving}>
              Refresh now
            </Button>
            <Button variant="ghost" onClick={() => void forget()} disabled={saving}>
              Remove from this phone
            </Button>
          </>
        ) : (
          <Button size="lg" onClick={() => void keep()} disabled={saving || status === 'loading'}>
            <Smartphone aria-hidden className="size-5" /> Keep this site on the phone
          </Button>
        )}
      </div>
    </section>
  );
}
