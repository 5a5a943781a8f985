'use client';

import { CircleCheck, Lock } from 'lucide-react';
import { useRouter } from 'next/navigation';
import { useMemo, useState } from 'react';
import { useForm } from 'react-hook-form';
import { BoundField } from '@/components/forms/bound-field';
import { schemaResolver } from '@/components/forms/schema-resolver';
import { Alert } from '@/components/ui/alert';
import { Card } from '@/components/ui/card';
import type { VisitDetailDto } from '@/lib/visits/dto';
import { newClientId, waitingWords, type OutboxItem } from '@/lib/visits/outbox';
import { closeVisitSchema, type CloseVisitInput } from '@/lib/visits/schemas';
import { BoundCheckCard } from '@/app/(app)/visits/[id]/_components/form-kit';

/** Bypasses on record: the server's, plus any recorded on the phone and not yet sent. */
export function bypassesOf(visit: VisitDetailDto, items: readonly OutboxItem[]): string[] {
  const local = items.flatMap((i) => (i.type === 'entry' && i.input.kind === 'action' && i.input.data.bypassedControl ? [i.input.data.bypassDescription ?? 'a control'] : []));
  return [...visit.openBypasses.map((b) => b.description), ...local];
}

/** What still stands between the visit and its close, in words (empty when nothing does). */
export function stillMissing(visit: VisitDetailDto, items: readonly OutboxItem[]): string[] {
  const out: string[] = [];
  const start = items.find((i) => i.type === 'start');
  if (start?.state === 'refused') out.push(`The server refused to start this visit: ${start.error ?? 'no reason given'}`);
  else if (start) out.push('The visit itself is not on the server yet: it goes first when there is signal.');
  const work = items.filter((i) => i.type !== 'close' && i.type !== 'start');
  const waiting = waitingWords(work);
  if (waiting) out.push(`${waiting.replace(/ waiting$/, '')} not yet sent: they wait for signal.`);
  const refused = work.filter((i) => i.state === 'refused').length;
  if (refused > 0) out.push(`${refused} ${refused === 1 ? 'entry was' : 'entries were'} refused by the server: record ${refused === 1 ? 'it' : 'them'} again or discard ${refused === 1 ? 'it' : 'them'}.`);
  for (const b of bypassesOf(visit, items)) out.push(`Bypass to confirm removed: ${b}.`);
  return out;
}

interface CloseValues {
  summary: string;
  confirmBypassRemoved: boolean;
}

const BYPASS_UNCONFIRMED = 'A bypassed control is recorded on this visit. Confirm the jumper or bypass was removed before closing.';

/** The close's own schema, plus what only the phone knows: bypasses recorded here and not yet sent. */
function closeResolver(hasBypass: boolean) {
  const schema = closeVisitSchema.refine((d) => !hasBypass || d.confirmBypassRemoved, { path: ['confirmBypassRemoved'], message: BYPASS_UNCONFIRMED });
  return schemaResolver(schema, (v: CloseValues) => v);
}

/**
 * Closing: a summary and — when a control was bypassed — the technician's confirmation that the
 * jumper is gone (the server checks the same and records it). The close goes into the phone's
 * outbox behind the work made before it, so a visit closed without signal closes once all of it
 * has reached the server.
 */
export function CloseVisitPanel({
  visit,
  items,
  queueClose,
}: {
  visit: VisitDetailDto;
  items: readonly OutboxItem[];
  queueClose: (input: { summary: string; confirmBypassRemoved: boolean; clientCloseId: string }) => Promise<OutboxItem | null>;
}) {
  const missing = stillMissing(visit, items);
  const router = useRouter();
  const [problem, setProblem] = useState<string | null>(null);
  const bypasses = bypassesOf(visit, items);
  const queued = items.find((i) => i.type === 'close');
  const hasBypass = bypasses.length > 0;
  const resolver = useMemo(() => closeResolver(hasBypass), [hasBypass]);
  const form = useForm<CloseValues, unknown, CloseVisitInput>({ resolver, defaultValues: { summary: '', confirmBypassRemoved: false } });
  const bypassError = form.formState.errors.confirmBypassRemoved?.message;

  const submit = form.handleSubmit(async (input) => {
    setProblem(null);
    // A new id per press: a refused close is not kept, and a repeat of one that went through returns the closed visit.
    const left = await queueClose({ summary: input.summary, confirmBypassRemoved: input.confirmBypassRemoved, clientCloseId: newClientId() });
    if (!left) router.refresh();
    else if (left.state === 'refused') setProblem(left.error ?? 'The server refused to close the visit.');
  });

  if (queued && queued.state !== 'refused') {
    return (
      <Card>
        <div role="status" className="space-y-2" data-testid="close-queued">
          <h2 className="flex items-center gap-2 text-lg font-semibold">
            <Lock aria-hidden className="size-5 text-ice-700" /> Closing as soon as there is signal
          </h2>
          <p>The close is kept on this phone behind the work made before it, and goes to the server after it. You can leave this page.</p>
        </div>
      </Card>
    );
  }

  return (
    <Card>
      <form onSubmit={submit} noValidate className="space-y-4" aria-labelledby="close-h">
        <h2 id="close-h" className="flex items-center gap-2 text-lg font-semibold">
          <Lock aria-hidden className="size-5 text-ice-700" /> Close the visit
        </h2>
        {missing.length > 0 ? (
          <Alert tone="warning" title="Still to do before closing">
            <ul className="list-disc space-y-1 pl-4" data-testid="close-missing">
              {missing.map((m) => (
                <li key={m}>{m}</li>
              ))}
            </ul>
          </Alert>
        ) : (
          <p className="flex items-center gap-2 font-semibold text-emerald-900">
            <CircleCheck aria-hidden className="size-5" /> Every entry is on the server.
          </p>
        )}
        <BoundField form={form} name="summary" id="close-summary" label="Summary for the client" multiline={4} hint="What was wrong, what was done, what is still open. It goes into the report e-mailed to the client." />
        {hasBypass ? (
          <BoundCheckCard form={form} name="confirmBypassRemoved" id="close-bypass-removed" tone="warning">
            I removed every jumper or bypass and the controls are back in service
          </BoundCheckCard>
        ) : null}
        {problem || bypassError || queued?.state === 'refused' ? (
          <Alert tone="danger" title="The visit is still open">
            {problem ?? bypassError ?? queued?.error}
          </Alert>
        ) : null}
        <button type="submit" disabled={form.formState.isSubmitting} className="min-h-12 w-full rounded-md bg-ice-900 px-5 text-base font-semibold text-white hover:bg-ice-800 disabled:opacity-60 sm:w-auto">
          {form.formState.isSubmitting ? 'Closing…' : 'Close visit'}
        </button>
      </form>
    </Card>
  );
}
