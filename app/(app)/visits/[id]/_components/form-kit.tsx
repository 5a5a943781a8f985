'use client';

import type { LucideIcon } from 'lucide-react';
import { Minus, OctagonAlert, Plus, TriangleAlert } from 'lucide-react';
import { useState, type ReactNode, type Ref } from 'react';
import { useController, type Control, type FieldValues, type Path, type UseFormReturn } from 'react-hook-form';
import { Alert } from '@/components/ui/alert';
import type { UnitPrefs } from '@/lib/units/quantities';
import { cn } from '@/lib/utils';
import type { EntryContext } from '@/lib/visits/kinds/types';

// Building blocks of the visit's entry forms on react-hook-form: big targets for gloved fingers,
// choices as cards. Numbers and text use the shared fields of components/forms.

export type FieldErrors = Record<string, string>;

/** What a form hands to the workspace; the workspace validates with the shared schema and saves. */
export type SubmitResult = { ok: true } | { ok: false; errors: FieldErrors; message?: string };

/** What the workspace gives every entry form: the save of the kind's data and the close. */
export interface EntryFormProps<D> {
  onSubmit: (data: D) => Promise<SubmitResult>;
  onCancel: () => void;
}

/** A form that works out values from the unit and its system as they are typed, in the reader's units. */
export interface ComputingFormProps<D> extends EntryFormProps<D> {
  ctx: EntryContext;
  prefs: UnitPrefs;
}

function Stepper({ id, label, value, onChange, min = 1, max = 1000, buttonRef }: { id: string; label: string; value: number; onChange: (v: number) => void; min?: number; max?: number; buttonRef?: Ref<HTMLButtonElement> }) {
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
          ref={buttonRef}
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
  inputRef,
}: {
  name: string;
  legend: string;
  choices: Choice<T>[];
  value: T | '';
  onChange: (v: T) => void;
  error?: string;
  columns?: string;
  /** Given the first card's radio, so a form can focus the group on an error. */
  inputRef?: Ref<HTMLInputElement>;
}) {
  return (
    <fieldset aria-describedby={error ? `${name}-error` : undefined}>
      <legend className="mb-2 text-sm font-semibold text-slate-800">{legend}</legend>
      <div className={cn('grid gap-2', columns)}>
        {choices.map((c, i) => (
          <label key={c.value} className={choiceCard}>
            <input ref={i === 0 ? inputRef : undefined} type="radio" name={name} value={c.value} checked={value === c.value} onChange={() => onChange(c.value)} className="size-5 shrink-0 accent-ice-800" />
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

function CheckCard({ id, checked, onChange, children, tone = 'plain', inputRef }: { id: string; checked: boolean; onChange: (v: boolean) => void; children: ReactNode; tone?: 'plain' | 'warning'; inputRef?: Ref<HTMLInputElement> }) {
  return (
    <label
      htmlFor={id}
      className={cn(
        'flex min-h-14 cursor-pointer items-start gap-3 rounded-lg border-2 bg-white px-3 py-3 font-semibold text-slate-900 has-[:focus-visible]:outline has-[:focus-visible]:outline-3 has-[:focus-visible]:outline-offset-2 has-[:focus-visible]:outline-ice-500',
        tone === 'warning' ? 'border-amber-500 has-[:checked]:bg-amber-50' : 'border-slate-300 has-[:checked]:border-ice-800 has-[:checked]:bg-ice-50',
      )}
    >
      <input ref={inputRef} id={id} type="checkbox" checked={checked} onChange={(e) => onChange(e.target.checked)} className="mt-0.5 size-6 shrink-0 accent-ice-800" />
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


type Bound<T extends FieldValues, O> = { form: { control: Control<T, unknown, O> }; name: Path<T> };

/** Choice cards bound to a react-hook-form field holding the chosen value ('' for none). */
export function BoundChoiceCards<T extends FieldValues, O, V extends string>({ form, name, id = name, ...props }: Bound<T, O> & { id?: string; legend: string; choices: Choice<V>[]; columns?: string; onPick?: (v: V) => void }) {
  const { field, fieldState } = useController<T, Path<T>, O>({ control: form.control, name });
  const { onPick, ...rest } = props;
  return (
    <ChoiceCards<V>
      {...rest}
      name={id}
      value={props.choices.find((c) => c.value === field.value)?.value ?? ''}
      onChange={(v) => {
        field.onChange(v);
        onPick?.(v);
      }}
      error={fieldState.error?.message}
      inputRef={field.ref}
    />
  );
}

/** A yes/no card bound to a react-hook-form boolean field. */
export function BoundCheckCard<T extends FieldValues, O>({ form, name, id, tone, children }: Bound<T, O> & { id: string; tone?: 'plain' | 'warning'; children: ReactNode }) {
  const { field } = useController<T, Path<T>, O>({ control: form.control, name });
  return (
    <CheckCard id={id} checked={field.value === true} onChange={field.onChange} tone={tone} inputRef={field.ref}>
      {children}
    </CheckCard>
  );
}

/** A whole-number stepper bound to a react-hook-form number field. */
export function BoundStepper<T extends FieldValues, O>({ form, name, id, label, min = 1, max = 1000 }: Bound<T, O> & { id: string; label: string; min?: number; max?: number }) {
  const { field, fieldState } = useController<T, Path<T>, O>({ control: form.control, name });
  const value = typeof field.value === 'number' ? field.value : min;
  return (
    <div className="space-y-1">
      <Stepper id={id} label={label} value={value} onChange={field.onChange} min={min} max={max} buttonRef={field.ref} />
      {fieldState.error ? (
        <p role="alert" className="text-sm font-medium text-red-700">
          {fieldState.error.message}
        </p>
      ) : null}
    </div>
  );
}

/**
 * An entry form's save: the form's resolver has checked the values with the kind's schema; the
 * workspace adds the entry's client id and saves it (or keeps it in the outbox). Its refusals land
 * on the fields (the first one focused) and in the "Not saved" banner; a save clears the form.
 */
export function useEntrySubmit<V extends FieldValues, D>(form: UseFormReturn<V, unknown, D>, onSubmit: (data: D) => Promise<SubmitResult>, onSaved: () => void = () => form.reset()) {
  const [message, setMessage] = useState<string | null>(null);
  const submit = form.handleSubmit(
    async (data) => {
      setMessage(null);
      const result = await onSubmit(data);
      if (result.ok) {
        onSaved();
        return;
      }
      setMessage(result.message ?? null);
      Object.entries(result.errors).forEach(([path, text], i) => {
        // The workspace's paths are the kind schema's, which are this form's field names.
        form.setError((path || 'root') as Path<V>, { type: 'server', message: text }, { shouldFocus: i === 0 });
      });
    },
    (errors) => setMessage(errors.root?.message ?? 'Check the highlighted fields; nothing was saved.'),
  );
  return { submit, message, busy: form.formState.isSubmitting };
}

export function NotSaved({ message }: { message: string | null }) {
  return message ? (
    <Alert tone="danger" title="Not saved">
      {message}
    </Alert>
  ) : null;
}
