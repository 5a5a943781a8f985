'use client';

import type { LucideIcon } from 'lucide-react';
import { Minus, OctagonAlert, Plus, TriangleAlert } from 'lucide-react';
import { useState, type FormEvent, type ReactNode } from 'react';
import { Alert } from '@/components/ui/alert';
import { describedBy, Field, Input, Textarea } from '@/components/ui/field';
import { cn } from '@/lib/utils';

// Building blocks of the visit's entry forms: big targets for gloved fingers, numbers typed with a
// decimal keypad (and a ± button, because that keypad often has no minus key), choices as cards.

export type FieldErrors = Record<string, string>;

/** What a form hands to the workspace; the workspace validates with the shared schema and saves. */
export type SubmitResult = { ok: true } | { ok: false; errors: FieldErrors; message?: string };

export function NumberInput({
  id,
  label,
  unit,
  value,
  onChange,
  error,
  hint,
  allowNegative = false,
  className,
}: {
  id: string;
  label: string;
  unit?: string;
  value: string;
  onChange: (v: string) => void;
  error?: string;
  hint?: ReactNode;
  allowNegative?: boolean;
  className?: string;
}) {
  const flip = () => {
    const t = value.trim();
    onChange(t.startsWith('-') ? t.slice(1) : `-${t}`);
  };
  return (
    <Field id={id} label={unit ? `${label} (${unit})` : label} error={error} hint={hint} className={className}>
      <div className="flex gap-1">
        <Input
          id={id}
          inputMode="decimal"
          autoComplete="off"
          enterKeyHint="next"
          value={value}
          onChange={(e) => onChange(e.target.value)}
          className="min-h-12 text-lg tabular-nums"
          {...describedBy(id, error)}
        />
        {allowNegative ? (
          <button
            type="button"
            onClick={flip}
            className="min-h-12 min-w-12 shrink-0 rounded-md border border-slate-300 bg-white text-lg font-bold text-slate-900 hover:bg-slate-100"
            aria-label={`Change the sign of ${label}`}
          >
            ±
          </button>
        ) : null}
      </div>
    </Field>
  );
}

export function Stepper({ id, label, value, onChange, min = 1, max = 1000 }: { id: string; label: string; value: number; onChange: (v: number) => void; min?: number; max?: number }) {
  return (
    <div className="space-y-1">
      <span id={`${id}-label`} className="block text-sm font-semibold text-slate-800">
        {label}
      </span>
      <div className="flex items-center gap-2" role="group" aria-labelledby={`${id}-label`}>
        <button
          type="button"
          className="flex size-12 items-center justify-center rounded-md border border-slate-300 bg-white hover:bg-slate-100 disabled:opacity-50"
          onClick={() => onChange(Math.max(min, value - 1))}
          disabled={value <= min}
          aria-label={`One fewer (${label})`}
        >
          <Minus aria-hidden className="size-5" />
        </button>
        <output id={id} aria-live="polite" className="min-w-12 text-center text-2xl font-bold tabular-nums">
          {value}
        </output>
        <button
          type="button"
          className="flex size-12 items-center justify-center rounded-md border border-slate-300 bg-white hover:bg-slate-100 disabled:opacity-50"
          onClick={() => onChange(Math.min(max, value + 1))}
          disabled={value >= max}
          aria-label={`One more (${label})`}
        >
          <Plus aria-hidden className="size-5" />
        </button>
      </div>
    </div>
  );
}

export const choiceCard =
  'flex min-h-14 cursor-pointer items-center gap-3 rounded-lg border-2 border-slate-300 bg-white px-3 py-2 font-semibold text-slate-900 has-[:checked]:border-ice-800 has-[:checked]:bg-ice-50 has-[:checked]:ring-2 has-[:checked]:ring-ice-800 has-[:focus-visible]:outline has-[:focus-visible]:outline-3 has-[:focus-visible]:outline-offset-2 has-[:focus-visible]:outline-ice-500';

export interface Choice<T extends string> {
  value: T;
  label: string;
  hint?: string;
  Icon?: LucideIcon;
  iconClass?: string;
}

export function ChoiceCards<T extends string>({
  name,
  legend,
  choices,
  value,
  onChange,
  error,
  columns = 'grid-cols-1 min-[400px]:grid-cols-2',
}: {
  name: string;
  legend: string;
  choices: Choice<T>[];
  value: T | '';
  onChange: (v: T) => void;
  error?: string;
  columns?: string;
}) {
  return (
    <fieldset aria-describedby={error ? `${name}-error` : undefined}>
      <legend className="mb-2 text-sm font-semibold text-slate-800">{legend}</legend>
      <div className={cn('grid gap-2', columns)}>
        {choices.map((c) => (
          <label key={c.value} className={choiceCard}>
            <input type="radio" name={name} value={c.value} checked={value === c.value} onChange={() => onChange(c.value)} className="size-5 shrink-0 accent-ice-800" />
            {c.Icon ? <c.Icon aria-hidden className={cn('size-5 shrink-0', c.iconClass ?? 'text-ice-700')} /> : null}
            <span className="min-w-0">
              <span className="block">{c.label}</span>
              {c.hint ? <span className="block text-sm font-normal text-slate-700">{c.hint}</span> : null}
            </span>
          </label>
        ))}
      </div>
      {error ? (
        <p id={`${name}-error`} role="alert" className="mt-2 text-sm font-medium text-red-700">
          {error}
        </p>
      ) : null}
    </fieldset>
  );
}

export function CheckCard({ id, checked, onChange, children, tone = 'plain' }: { id: string; checked: boolean; onChange: (v: boolean) => void; children: ReactNode; tone?: 'plain' | 'warning' }) {
  return (
    <label
      htmlFor={id}
      className={cn(
        'flex min-h-14 cursor-pointer items-start gap-3 rounded-lg border-2 bg-white px-3 py-3 font-semibold text-slate-900 has-[:focus-visible]:outline has-[:focus-visible]:outline-3 has-[:focus-visible]:outline-offset-2 has-[:focus-visible]:outline-ice-500',
        tone === 'warning' ? 'border-amber-500 has-[:checked]:bg-amber-50' : 'border-slate-300 has-[:checked]:border-ice-800 has-[:checked]:bg-ice-50',
      )}
    >
      <input id={id} type="checkbox" checked={checked} onChange={(e) => onChange(e.target.checked)} className="mt-0.5 size-6 shrink-0 accent-ice-800" />
      <span>{children}</span>
    </label>
  );
}

export interface ComputedRow {
  key: string;
  label: string;
  value: string;
  note?: string;
  tone?: 'plain' | 'warning' | 'danger';
}

/** Live computed values beside the inputs, with what they rest on. */
export function ComputedPanel({ title, rows, bases, problems, empty }: { title: string; rows: ComputedRow[]; bases: string[]; problems: string[]; empty: string }) {
  return (
    <section aria-label={title} className="rounded-lg border-2 border-ice-200 bg-ice-50 p-3">
      <h4 className="text-sm font-bold uppercase tracking-wide text-ice-900">{title}</h4>
      {rows.length === 0 ? (
        <p className="mt-1 text-sm text-slate-700">{empty}</p>
      ) : (
        <dl className="mt-2 grid gap-x-4 gap-y-2 sm:grid-cols-2">
          {rows.map((r) => (
            <div key={r.key} data-computed={r.key} className={cn(r.tone === 'danger' && 'text-red-900', r.tone === 'warning' && 'text-amber-950')}>
              <dt className="text-sm font-medium text-slate-700">{r.label}</dt>
              <dd className="flex items-center gap-1.5 text-xl font-bold tabular-nums">
                {r.tone === 'danger' ? <OctagonAlert aria-hidden className="size-5 shrink-0" /> : r.tone === 'warning' ? <TriangleAlert aria-hidden className="size-5 shrink-0" /> : null}
                <span data-testid={`computed-${r.key}`}>{r.value}</span>
              </dd>
              {r.note ? <dd className="text-sm">{r.note}</dd> : null}
            </div>
          ))}
        </dl>
      )}
      {problems.map((p) => (
        <Alert key={p} tone="warning" title="Cannot compute everything" className="mt-2">
          {p}
        </Alert>
      ))}
      {bases.length ? (
        <details className="mt-2 text-sm text-slate-800">
          <summary className="min-h-11 cursor-pointer py-2 font-semibold">How this is worked out</summary>
          <ul className="list-disc space-y-1 pl-5">
            {bases.map((b) => (
              <li key={b}>{b}</li>
            ))}
          </ul>
        </details>
      ) : null}
    </section>
  );
}

/** Safety cautions: shown where the work is hazardous, always deferring to local codes and licensed practice. */
export function Cautions({ items, title = 'Safety' }: { items: string[]; title?: string }) {
  if (items.length === 0) return null;
  return (
    <Alert tone="warning" title={title}>
      <ul className="list-disc space-y-1 pl-4">
        {items.map((c) => (
          <li key={c}>{c}</li>
        ))}
      </ul>
    </Alert>
  );
}

export function FormActions({ busy, onCancel, label = 'Save entry' }: { busy: boolean; onCancel: () => void; label?: string }) {
  return (
    <div className="flex flex-col-reverse gap-2 pt-2 sm:flex-row">
      <button type="button" onClick={onCancel} className="min-h-12 rounded-md border border-slate-300 bg-white px-5 font-semibold text-slate-900 hover:bg-slate-100">
        Cancel
      </button>
      <button type="submit" disabled={busy} className="min-h-12 flex-1 rounded-md bg-ice-900 px-5 text-base font-semibold text-white hover:bg-ice-800 disabled:opacity-60 sm:flex-none">
        {busy ? 'Saving…' : label}
      </button>
    </div>
  );
}

/** Parses a typed number; empty → null, junk → NaN (the schema refuses it with a message). */
export function parseTyped(text: string): number | null {
  const t = text.trim().replace(',', '.');
  if (t === '') return null;
  const n = Number(t);
  return Number.isFinite(n) ? n : Number.NaN;
}

export type Submit = (data: Record<string, unknown>) => Promise<SubmitResult>;

/** Shared plumbing: busy flag, the server's field errors and message, reset after a save. */
export function useEntryForm(onSubmit: Submit, reset: () => void) {
  const [errors, setErrors] = useState<FieldErrors>({});
  const [message, setMessage] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  async function run(e: FormEvent, data: Record<string, unknown>) {
    e.preventDefault();
    setBusy(true);
    setMessage(null);
    const result = await onSubmit(data);
    setBusy(false);
    if (result.ok) {
      setErrors({});
      reset();
    } else {
      setErrors(result.errors);
      setMessage(result.message ?? null);
    }
  }
  return { errors, message, busy, run };
}

export function NotSaved({ message }: { message: string | null }) {
  return message ? (
    <Alert tone="danger" title="Not saved">
      {message}
    </Alert>
  ) : null;
}

export function TextArea({ id, label, value, onChange, error, hint, rows = 3 }: { id: string; label: string; value: string; onChange: (v: string) => void; error?: string; hint?: ReactNode; rows?: number }) {
  return (
    <Field id={id} label={label} error={error} hint={hint}>
      <Textarea id={id} rows={rows} value={value} onChange={(e) => onChange(e.target.value)} className="text-base" {...describedBy(id, error)} />
    </Field>
  );
}

export function TextInput({ id, label, value, onChange, error, hint, placeholder }: { id: string; label: string; value: string; onChange: (v: string) => void; error?: string; hint?: ReactNode; placeholder?: string }) {
  return (
    <Field id={id} label={label} error={error} hint={hint}>
      <Input id={id} value={value} placeholder={placeholder} autoComplete="off" onChange={(e) => onChange(e.target.value)} className="min-h-12" {...describedBy(id, error)} />
    </Field>
  );
}
