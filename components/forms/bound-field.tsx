'use client';

import type { InputHTMLAttributes, ReactNode } from 'react';
import { get, type FieldValues, type Path, type UseFormReturn } from 'react-hook-form';
import { Field, Input, Textarea, describedBy } from '@/components/ui/field';

interface BoundFieldProps<T extends FieldValues> {
  form: Pick<UseFormReturn<T>, 'register' | 'formState'>;
  name: Path<T>;
  /** The control's id when the name alone could clash with another form on the page. */
  id?: string;
  label: string;
  hint?: ReactNode;
  /** A text area instead of a one-line input, with this many rows. */
  multiline?: boolean | number;
  className?: string;
  input?: Omit<InputHTMLAttributes<HTMLInputElement>, 'id' | 'name'>;
}

/** A text field bound to a react-hook-form field: label, control, hint and the field's error, wired for screen readers. */
export function BoundField<T extends FieldValues>({ form, name, id = name, label, hint, multiline, className, input }: BoundFieldProps<T>) {
  const error = (get(form.formState.errors, name) as { message?: string } | undefined)?.message;
  const wiring = { id, ...describedBy(id, error), ...form.register(name) };
  return (
    <Field id={id} label={label} error={error} hint={hint} className={className}>
      {multiline ? <Textarea rows={typeof multiline === 'number' ? multiline : undefined} {...wiring} /> : <Input {...input} {...wiring} />}
    </Field>
  );
}
