'use client';

import { Hammer, ClipboardCheck, Droplets, Repeat, Search, ThermometerSun } from 'lucide-react';
import { useRouter } from 'next/navigation';
import { useMemo, useState } from 'react';
import { useForm, useWatch } from 'react-hook-form';
import { BoundField } from '@/components/forms/bound-field';
import { FormFooter } from '@/components/forms/form-footer';
import { Alert } from '@/components/ui/alert';
import { ApiError } from '@/lib/api/client';
import { readPack } from '@/lib/offline/store';
import { offlineUser } from '@/lib/offline/user';
import { useStartVisit } from '@/lib/visits/hooks';
import { startVisitOnPhone } from '@/lib/visits/start-on-phone';
import { VISIT_REASONS, visitReasonLabels, type StartVisitInput } from '@/lib/visits/schemas';
import { startResolver, type StartValues } from '@/app/(app)/visits/new/_components/start-visit-values';
import { BoundChoiceCards } from '@/app/(app)/visits/[id]/_components/form-kit';

const reasonIcons = {
  no_cooling: ThermometerSun,
  maintenance: ClipboardCheck,
  install: Hammer,
  inspection: Search,
  leak_check: Droplets,
  follow_up: Repeat,
} as const;

const reasonChoices = VISIT_REASONS.map((r) => ({ value: r, label: visitReasonLabels[r], Icon: reasonIcons[r] }));
const whenChoices = [
  { value: 'now' as const, label: 'Just now' },
  { value: 'earlier' as const, label: 'Earlier today' },
];

export function StartVisitForm({ siteId, timeZone, equipmentId, onCancel }: { siteId: string; timeZone: string; equipmentId?: string; onCancel?: () => void }) {
  const router = useRouter();
  const start = useStartVisit();
  const resolver = useMemo(() => startResolver(siteId, timeZone), [siteId, timeZone]);
  const form = useForm<StartValues, unknown, StartVisitInput>({ resolver, defaultValues: { reason: '', when: 'now', time: '' } });
  const when = useWatch({ control: form.control, name: 'when' });
  const [phoneProblem, setPhoneProblem] = useState<string | null>(null);

  const submit = form.handleSubmit((input) => {
    if (!navigator.onLine) return startHere(input);
    start.mutate(input, {
      onSuccess: (visit) => router.push(`/visits/${visit.id}${equipmentId ? `?equipment=${equipmentId}` : ''}`),
      // The signal went while sending: start it on the phone instead.
      onError: (error) => {
        if (error instanceof ApiError && error.code === 'network') void startHere(input);
      },
    });
  });

  /** No signal: the visit starts on the phone, if its site is kept here, and reaches the server later. */
  async function startHere({ reason, startedAt }: StartVisitInput) {
    setPhoneProblem(null);
    const kept = await readPack(await offlineUser(), siteId).catch(() => null);
    if (!kept) {
      setPhoneProblem('There is no signal, and this site is not kept on this phone. Keep a site on the phone while there is signal to start visits there without it.');
      return;
    }
    window.location.assign(await startVisitOnPhone({ siteId, reason, startedAt, equipmentId }));
  }

  return (
    <form onSubmit={submit} noValidate className="space-y-5">
      <BoundChoiceCards form={form} name="reason" legend="Why are you here?" columns="grid-cols-1 min-[400px]:grid-cols-2 md:grid-cols-3" choices={reasonChoices} />
      <BoundChoiceCards form={form} name="when" legend="Arrived" choices={whenChoices} />
      {when === 'earlier' ? <BoundField form={form} name="time" id="arrived-at" label="Arrived at (site time)" className="max-w-xs" input={{ type: 'time', className: 'min-h-12 text-lg' }} /> : null}
      {phoneProblem ? (
        <Alert tone="danger" title="The visit was not started">
          {phoneProblem}
        </Alert>
      ) : start.error && !(start.error instanceof ApiError && start.error.code === 'network') ? (
        <Alert tone="danger" title="The visit was not started">
          {start.error.message}
        </Alert>
      ) : null}
      <FormFooter submitting={start.isPending || form.formState.isSubmitting} submitLabel="Start visit" busyLabel="Starting…" onCancel={onCancel} />
    </form>
  );
}
