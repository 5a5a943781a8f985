'use client';

import { CircleCheck, Lock } from 'lucide-react';
import { useRouter } from 'next/navigation';
import { useRef, useState, type FormEvent } from 'react';
import { Alert } from '@/components/ui/alert';
import { Card } from '@/components/ui/card';
import { describedBy, Field, Textarea } from '@/components/ui/field';
import type { VisitDetailDto } from '@/lib/visits/dto';
import { useCloseVisit } from '@/lib/visits/hooks';
import type { PendingEntry } from '@/lib/visits/pending';
import { CheckCard } from '@/app/(app)/visits/[id]/_components/form-kit';

/** What still stands between the visit and its close, in words (empty when nothing does). */
export function stillMissing(visit: VisitDetailDto, pending: PendingEntry[]): string[] {
  const out: string[] = [];
  const waiting = pending.filter((p) => p.state !== 'refused');
  const photos = waiting.filter((p) => p.input.kind === 'photo').length;
  const refused = pending.length - waiting.length;
  if (waiting.length > 0) {
    const others = waiting.length - photos;
    const parts = [others > 0 ? `${others} ${others === 1 ? 'entry' : 'entries'}` : null, photos > 0 ? `${photos} ${photos === 1 ? 'photo' : 'photos'}` : null].filter(Boolean);
    out.push(`${parts.join(' and ')} not yet sent: they wait for signal.`);
  }
  if (refused > 0) out.push(`${refused} ${refused === 1 ? 'entry was' : 'entries were'} refused by the server: fix or discard ${refused === 1 ? 'it' : 'them'}.`);
  for (const b of visit.openBypasses) out.push(`Bypass to confirm removed: ${b.description}.`);
  return out;
}

/**
 * Closing: a summary, every entry on the server, and — when a control was bypassed — the
 * technician's confirmation that the jumper is gone. The server checks the same and records it.
 */
export function CloseVisitPanel({ visit, pending }: { visit: VisitDetailDto; pending: PendingEntry[] }) {
  const waitingCount = pending.length;
  const missing = stillMissing(visit, pending);
  const router = useRouter();
  const close = useCloseVisit(visit.id);
  const [summary, setSummary] = useState('');
  const [confirmed, setConfirmed] = useState(false);
  const [problem, setProblem] = useState<string | null>(null);
  const [summaryError, setSummaryError] = useState<string | undefined>();
  const confirmRef = useRef<HTMLDivElement>(null);
  const bypasses = visit.openBypasses;

  function submit(e: FormEvent) {
    e.preventDefault();
    setProblem(null);
    setSummaryError(undefined);
    if (waitingCount > 0) {
      setProblem(`${waitingCount} ${waitingCount === 1 ? 'entry is' : 'entries are'} not on the server yet. They must reach it (or be discarded) before the visit closes.`);
      return;
    }
    if (!summary.trim()) {
      setSummaryError('Summary is required.');
      return;
    }
    if (bypasses.length > 0 && !confirmed) {
      setProblem('A bypassed control is recorded on this visit. Confirm the jumper or bypass was removed before closing.');
      confirmRef.current?.querySelector('input')?.focus();
      return;
    }
    close.mutate(
      { summary, confirmBypassRemoved: confirmed },
      {
        onSuccess: () => router.refresh(),
        onError: (err) => setProblem(err.message),
      },
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
        <Field id="close-summary" label="Summary for the client" error={summaryError} hint="What was wrong, what was done, what is still open. It goes into the report e-mailed to the client.">
          <Textarea id="close-summary" rows={4} value={summary} onChange={(e) => setSummary(e.target.value)} {...describedBy('close-summary', summaryError)} />
        </Field>
        {bypasses.length > 0 ? (
          <div ref={confirmRef} className="space-y-2">
            <Alert tone="danger" title="Bypassed control on record">
              <ul className="list-disc pl-4">
                {bypasses.map((b) => (
                  <li key={b.entryId}>{b.description}</li>
                ))}
              </ul>
            </Alert>
            <CheckCard id="close-bypass-removed" checked={confirmed} onChange={setConfirmed} tone="warning">
              I removed every jumper or bypass and the controls are back in service
            </CheckCard>
          </div>
        ) : null}
        {problem ? (
          <Alert tone="danger" title="The visit is still open">
            {problem}
          </Alert>
        ) : null}
        <button type="submit" disabled={close.isPending} className="min-h-12 w-full rounded-md bg-ice-900 px-5 text-base font-semibold text-white hover:bg-ice-800 disabled:opacity-60 sm:w-auto">
          {close.isPending ? 'Closing…' : 'Close visit'}
        </button>
      </form>
    </Card>
  );
}
