'use client';

import type { ReactNode } from 'react';
import { get, type FieldValues, type Path, type RegisterOptions, type UseFormReturn } from 'react-hook-form';
import { SelectOptions, type SelectOption } from '@/components/forms/select-options';
import { Field, Select, describedBy } from '@/components/ui/field';

/** A choice from a list, bound to a react-hook-form field: label, select, hint and the field's error. */
export function BoundSelect<T extends FieldValues>({
  form,
  name,
  id = name,
  label,
  hint,
  options,
  placeholder,
  className,
  rules,
  disabled,
}: {
  form: Pick<UseFormReturn<T>, 'register' | 'formState'>;
  name: Path<T>;
  /** The control's id when the name alone could clash with another form on the page. */
  id?: string;
  label: string;
  hint?: ReactNode;
  options: readonly SelectOption[];
  /** A first, empty option ("Choose…") for a field with no value yet. */
  placeholder?: string;
  className?: string;
  /** react-hook-form's own register options: an onChange that clears a dependent field, a setValueAs ('' → null). */
  rules?: Pick<RegisterOptions<T, Path<T>>, 'onChange' | 'setValueAs'>;
  disabled?: boolean;
}) {
  const error = (get(form.formState.errors, name) as { message?: string } | undefined)?.message;
  return (
    <Field id={id} label={label} error={error} hint={hint} className={className}>
      <Select id={id} disabled={disabled} {...describedBy(id, error)} {...form.register(name, rules)}>
        <SelectOptions options={options} empty={placeholder} />
      </Select>
    </Field>
  );
}
