'use client';

import type { InputHTMLAttributes, ReactNode } from 'react';
import { get, type FieldValues, type Path, type UseFormReturn } from 'react-hook-form';
import { Field, Input, Textarea, describedBy } from '@/components/ui/field';

interface BoundFieldProps<T extends FieldValues> {
  form: Pick<UseFormReturn<T>, 'register' | 'formState'>;
  name: Path<T>;
  label: string;
  hint?: ReactNode;
  /** A text area instead of a one-line input. */
  multiline?: boolean;
  className?: string;
  input?: Omit<InputHTMLAttributes<HTMLInputElement>, 'id' | 'name'>;
}

/** A text field bound to a react-hook-form field: label, control, hint and the field's error, wired for screen readers. */
export function BoundField<T extends FieldValues>({ form, name, label, hint, multiline, className, input }: BoundFieldProps<T>) {
  const error = (get(form.formState.errors, name) as { message?: string } | undefined)?.message;
  const wiring = { id: name, ...describedBy(name, error), ...form.register(name) };
  return (
    <Field id={name} label={label} error={error} hint={hint} className={className}>
      {multiline ? <Textarea {...wiring} /> : <Input {...input} {...wiring} />}
    </Field>
  );
}
