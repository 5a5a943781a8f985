'use client';

import { TZDate } from '@date-fns/tz';
import { Hammer, ClipboardCheck, Droplets, Repeat, Search, ThermometerSun } from 'lucide-react';
import { useRouter } from 'next/navigation';
import { useState, type FormEvent } from 'react';
import { Alert } from '@/components/ui/alert';
import { describedBy, Field, Input } from '@/components/ui/field';
import { ApiError } from '@/lib/api/client';
import { readPack } from '@/lib/offline/store';
import { offlineUser } from '@/lib/offline/user';
import { useStartVisit } from '@/lib/visits/hooks';
import { startVisitOnPhone } from '@/lib/visits/start-on-phone';
import { VISIT_REASONS, visitReasonLabels, type VisitReason } from '@/lib/visits/schemas';
import { ChoiceCards } from '@/app/(app)/visits/[id]/_components/form-kit';

const reasonIcons = {
  no_cooling: ThermometerSun,
  maintenance: ClipboardCheck,
  install: Hammer,
  inspection: Search,
  leak_check: Droplets,
  follow_up: Repeat,
} as const;

/** "07:30" today in the site's time zone → an instant. */
function todayAt(hhmm: string, timeZone: string): string | null {
  const m = /^(\d{1,2}):(\d{2})$/.exec(hhmm);
  if (!m) return null;
  const now = new TZDate(Date.now(), timeZone);
  const at = new TZDate(now.getFullYear(), now.getMonth(), now.getDate(), Number(m[1]), Number(m[2]), 0, timeZone);
  if (at.getTime() > Date.now()) return null;
  return new Date(at.getTime()).toISOString();
}

export function StartVisitForm({ siteId, timeZone, equipmentId }: { siteId: string; timeZone: string; equipmentId?: string }) {
  const router = useRouter();
  const start = useStartVisit();
  const [reason, setReason] = useState<VisitReason | ''>('');
  const [when, setWhen] = useState<'now' | 'earlier'>('now');
  const [time, setTime] = useState('');
  const [errors, setErrors] = useState<{ reason?: string; time?: string }>({});
  const [phoneProblem, setPhoneProblem] = useState<string | null>(null);

  function submit(e: FormEvent) {
    e.preventDefault();
    const next: typeof errors = {};
    if (!reason) next.reason = 'Choose the reason for the visit.';
    const startedAt = when === 'earlier' ? todayAt(time, timeZone) : undefined;
    if (when === 'earlier' && !startedAt) next.time = 'Give a time earlier today, like 07:30.';
    setErrors(next);
    if (Object.keys(next).length || !reason) return;
    if (!navigator.onLine) {
      void startHere(reason, startedAt);
      return;
    }
    start.mutate(
      { siteId, reason, ...(startedAt ? { startedAt } : {}) },
      {
        onSuccess: (visit) => router.push(`/visits/${visit.id}${equipmentId ? `?equipment=${equipmentId}` : ''}`),
        // The signal went while sending: start it on the phone instead.
        onError: (error) => {
          if (error instanceof ApiError && error.code === 'network') void startHere(reason, startedAt);
        },
      },
    );
  }

  /** No signal: the visit starts on the phone, if its site is kept here, and reaches the server later. */
  async function startHere(r: VisitReason, startedAt: string | null | undefined) {
    setPhoneProblem(null);
    const kept = await readPack(await offlineUser(), siteId).catch(() => null);
    if (!kept) {
      setPhoneProblem('There is no signal, and this site is not kept on this phone. Keep a site on the phone while there is signal to start visits there without it.');
      return;
    }
    window.location.assign(await startVisitOnPhone({ siteId, reason: r, startedAt: startedAt ?? undefined, equipmentId }));
  }

  return (
    <form onSubmit={submit} noValidate className="space-y-5">
      <ChoiceCards<VisitReason>
        name="reason"
        legend="Why are you here?"
        value={reason}
        onChange={setReason}
        error={errors.reason}
        columns="grid-cols-1 min-[400px]:grid-cols-2 md:grid-cols-3"
        choices={VISIT_REASONS.map((r) => ({ value: r, label: visitReasonLabels[r], Icon: reasonIcons[r] }))}
      />
      <ChoiceCards<'now' | 'earlier'>
        name="when"
        legend="Arrived"
        value={when}
        onChange={setWhen}
        choices={[
          { value: 'now', label: 'Just now' },
          { value: 'earlier', label: 'Earlier today' },
        ]}
      />
      {when === 'earlier' ? (
        <Field id="arrived-at" label="Arrived at (site time)" error={errors.time} className="max-w-xs">
          <Input id="arrived-at" type="time" value={time} onChange={(e) => setTime(e.target.value)} className="min-h-12 text-lg" {...describedBy('arrived-at', errors.time)} />
        </Field>
      ) : null}
      {phoneProblem ? (
        <Alert tone="danger" title="The visit was not started">
          {phoneProblem}
        </Alert>
      ) : start.error && !(start.error instanceof ApiError && start.error.code === 'network') ? (
        <Alert tone="danger" title="The visit was not started">
          {start.error.message}
        </Alert>
      ) : null}
      <button type="submit" disabled={start.isPending} className="min-h-14 w-full rounded-md bg-ice-900 px-6 text-lg font-semibold text-white hover:bg-ice-800 disabled:opacity-60 sm:w-auto">
        {start.isPending ? 'Starting…' : 'Start visit'}
      </button>
    </form>
  );
}
