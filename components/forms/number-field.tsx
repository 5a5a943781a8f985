'use client';

import type { ReactNode } from 'react';
import { useController, type Control, type FieldValues, type Path } from 'react-hook-form';
import { Field, Input, describedBy } from '@/components/ui/field';
import { cn } from '@/lib/utils';

/** "-12" ↔ "12": the sign flipped on typed text, for keypads without a minus key. */
export function flipSign(text: string): string {
  const t = text.trim();
  return t.startsWith('-') ? t.slice(1) : `-${t}`;
}

export interface NumberFieldProps<T extends FieldValues, O = T> {
  /** The form (or anything holding its control); `O` is what its resolver submits. */
  form: { control: Control<T, unknown, O> };
  name: Path<T>;
  /** The control's id when the name alone could clash with another form on the page. */
  id?: string;
  label: string;
  /** Shown in brackets after the label, e.g. "psig" or "V". */
  unit?: string;
  hint?: ReactNode;
  /**
   * The value may be below zero. Phone decimal pads often have no minus key: with `signButton` a ±
   * button beside the field flips the sign and the decimal pad stays; without, the text keypad.
   */
  negative?: boolean;
  signButton?: boolean;
  /** Bigger text and target, for the visit's forms used with gloves on. */
  large?: boolean;
  className?: string;
}

/** A number typed as text, bound to a react-hook-form field; the form's resolver reads and checks it. */
export function NumberField<T extends FieldValues, O = T>({ form, name, id = name, label, unit, hint, negative = false, signButton = false, large = false, className }: NumberFieldProps<T, O>) {
  const {
    field: { ref, value, onChange, onBlur },
    fieldState,
  } = useController<T, Path<T>, O>({ control: form.control, name });
  const error = fieldState.error?.message;
  const text = typeof value === 'string' ? value : value == null ? '' : String(value);
  const withSign = negative && signButton;
  return (
    <Field id={id} label={unit ? `${label} (${unit})` : label} error={error} hint={hint} className={className}>
      <div className="flex gap-1">
        <Input
          id={id}
          ref={ref}
          name={name}
          value={text}
          onChange={(e) => onChange(e.target.value)}
          onBlur={onBlur}
          inputMode={negative && !withSign ? 'text' : 'decimal'}
          autoComplete="off"
          enterKeyHint={large ? 'next' : undefined}
          className={cn(large && 'min-h-12 text-lg tabular-nums')}
          {...describedBy(id, error)}
        />
        {withSign ? (
          <button
            type="button"
            onClick={() => onChange(flipSign(text))}
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
