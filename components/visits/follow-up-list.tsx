'use client';

import { CalendarClock, CircleCheck, Ban, Undo2 } from 'lucide-react';
import { TextLink } from '@/components/ui/text-link';
import { useRouter } from 'next/navigation';
import { useId, useState, type FormEvent } from 'react';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { EmptyState } from '@/components/ui/card';
import { describedBy, Field, Input, Textarea } from '@/components/ui/field';
import { FollowUpStatusBadge, SeverityBadge } from '@/components/visits/badges';
import { useUpdateFollowUp } from '@/lib/follow-ups/hooks';
import type { UpdateFollowUpInput } from '@/lib/follow-ups/schemas';
import type { FollowUpDto } from '@/lib/follow-ups/dto';
import { formatDay } from '@/lib/format/dates';


export function ageText(f: Pick<FollowUpDto, 'ageDays' | 'status'>): string {
  const n = f.ageDays;
  const span = n === 0 ? 'less than a day' : n === 1 ? '1 day' : `${n} days`;
  return f.status === 'resolved' || f.status === 'declined' ? `Was open ${span}` : `Open ${span}`;
}

/**
 * Follow-ups with their age, and — for staff — the next step: schedule, resolve or decline.
 * `openVisitBySite` lets a technician tie a resolution to the visit they are on at that site.
 */
export function FollowUpList({
  items,
  showSite = true,
  openVisitBySite = {},
  empty = 'No follow-ups here.',
}: {
  items: FollowUpDto[];
  showSite?: boolean;
  openVisitBySite?: Record<string, string>;
  empty?: string;
}) {
  if (items.length === 0) return <EmptyState title={empty} />;
  return (
    <ul className="divide-y divide-slate-200 overflow-hidden rounded-lg border border-slate-200 bg-white" aria-label="Follow-ups">
      {items.map((f) => (
        <FollowUpRow key={f.id} item={f} showSite={showSite} openVisitId={openVisitBySite[f.siteId]} />
      ))}
    </ul>
  );
}

type Step = 'schedule' | 'resolve' | 'decline' | null;

function FollowUpRow({ item: f, showSite, openVisitId }: { item: FollowUpDto; showSite: boolean; openVisitId?: string }) {
  const [step, setStep] = useState<Step>(null);
  const live = f.status === 'open' || f.status === 'scheduled';
  return (
    <li className="space-y-2 px-4 py-3" data-follow-up={f.id}>
      <div className="flex flex-wrap items-center gap-2">
        <SeverityBadge severity={f.severity} />
        <FollowUpStatusBadge status={f.status} />
        <span className="text-sm font-semibold text-slate-800" data-testid="follow-up-age">
          {ageText(f)}
        </span>
      </div>
      <p className="break-words text-base font-semibold text-slate-900">{f.title}</p>
      <p className="text-sm text-slate-700">
        Raised by {f.createdByName} on {formatDay(f.createdAt)}
      </p>
      {/* Where it is and where it came from, each a whole tap target rather than a word in a line. */}
      <div className="flex flex-wrap gap-x-4 text-sm">
        {showSite ? <TextLink href={`/sites/${f.siteId}`}>{f.siteName}</TextLink> : null}
        {f.equipmentId && f.equipmentName ? <TextLink href={`/equipment/${f.equipmentId}`}>{f.equipmentName}</TextLink> : null}
        {f.raisedVisitId ? <TextLink href={`/visits/${f.raisedVisitId}`}>The visit that raised it</TextLink> : null}
      </div>
      {f.status === 'scheduled' && f.scheduledFor ? (
        <p className="flex items-center gap-1.5 text-sm font-semibold text-ice-900">
          <CalendarClock aria-hidden className="size-4" /> Planned for {formatDay(f.scheduledFor)}
        </p>
      ) : null}
      {!live ? (
        <p className="text-sm text-slate-800">
          {f.status === 'resolved' ? 'Resolved' : 'Declined'} by {f.closedByName ?? 'someone'}
          {f.closedAt ? ` on ${formatDay(f.closedAt)}` : ''}
          {f.closedVisitId ? ' on a visit' : ''}
          {f.resolution ? `: ${f.resolution}` : ''}
        </p>
      ) : null}
      {!live && f.closedVisitId ? (
        <TextLink href={`/visits/${f.closedVisitId}`} className="text-sm">
          The visit that closed it
        </TextLink>
      ) : null}
      {f.canUpdate && live ? (
        step === null ? (
          <div className="flex flex-wrap gap-2 pt-1">
            <Button variant="secondary" onClick={() => setStep('schedule')}>
              <CalendarClock aria-hidden className="size-4" /> {f.status === 'scheduled' ? 'Reschedule' : 'Schedule'}
            </Button>
            <Button variant="secondary" onClick={() => setStep('resolve')}>
              <CircleCheck aria-hidden className="size-4" /> Resolve
            </Button>
            <Button variant="secondary" onClick={() => setStep('decline')}>
              <Ban aria-hidden className="size-4" /> Decline
            </Button>
            {f.status === 'scheduled' ? <Unschedule id={f.id} /> : null}
          </div>
        ) : (
          <StepForm item={f} step={step} openVisitId={openVisitId} onDone={() => setStep(null)} />
        )
      ) : null}
    </li>
  );
}

function Unschedule({ id }: { id: string }) {
  const router = useRouter();
  const update = useUpdateFollowUp(id);
  return (
    <Button variant="ghost" disabled={update.isPending} onClick={() => update.mutate({ status: 'open' }, { onSuccess: () => router.refresh() })}>
      <Undo2 aria-hidden className="size-4" /> Back to open
    </Button>
  );
}

function StepForm({ item, step, openVisitId, onDone }: { item: FollowUpDto; step: Exclude<Step, null>; openVisitId?: string; onDone: () => void }) {
  const router = useRouter();
  const update = useUpdateFollowUp(item.id);
  const id = useId();
  const [date, setDate] = useState(item.scheduledFor ?? '');
  const [text, setText] = useState('');
  const [onVisit, setOnVisit] = useState(Boolean(openVisitId));
  const [error, setError] = useState<string | undefined>();

  function submit(e: FormEvent) {
    e.preventDefault();
    setError(undefined);
    let input: UpdateFollowUpInput;
    if (step === 'schedule') {
      if (!date) return setError('Choose the date it is planned for.');
      input = { status: 'scheduled', scheduledFor: date };
    } else {
      if (!text.trim()) return setError(step === 'resolve' ? 'Say what was done.' : 'Say why it was declined.');
      input = { status: step === 'resolve' ? 'resolved' : 'declined', resolution: text, visitId: onVisit && openVisitId ? openVisitId : null };
    }
    update.mutate(input, {
      onSuccess: () => {
        onDone();
        router.refresh();
      },
    });
  }

  const fieldId = `${id}-${step}`;
  return (
    <form onSubmit={submit} noValidate className="space-y-3 rounded-md border border-slate-300 bg-slate-50 p-3">
      {step === 'schedule' ? (
        <Field id={fieldId} label="Planned for" error={error} className="max-w-xs">
          <Input id={fieldId} type="date" value={date} onChange={(e) => setDate(e.target.value)} className="min-h-12" {...describedBy(fieldId, error)} />
        </Field>
      ) : (
        <Field id={fieldId} label={step === 'resolve' ? 'What was done' : 'Why it was declined'} error={error}>
          <Textarea id={fieldId} rows={3} value={text} onChange={(e) => setText(e.target.value)} {...describedBy(fieldId, error)} />
        </Field>
      )}
      {step !== 'schedule' && openVisitId ? (
        <label className="flex min-h-11 items-center gap-2 font-medium">
          <input type="checkbox" checked={onVisit} onChange={(e) => setOnVisit(e.target.checked)} className="size-5 accent-ice-800" />
          On my open visit at this site
        </label>
      ) : null}
      {update.error ? (
        <Alert tone="danger" title="Not saved">
          {update.error.message}
        </Alert>
      ) : null}
      <div className="flex flex-wrap gap-2">
        <Button type="submit" disabled={update.isPending}>
          {step === 'schedule' ? 'Schedule' : step === 'resolve' ? 'Mark resolved' : 'Mark declined'}
        </Button>
        <Button variant="secondary" onClick={onDone}>
          Cancel
        </Button>
      </div>
    </form>
  );
}
