'use client';

import type { ReactNode } from 'react';
import type { FieldValues, Path, UseFormReturn } from 'react-hook-form';
import { BoundField } from '@/components/forms/bound-field';
import { conversionFor, type Quantity, type UnitPrefs } from '@/lib/units/quantities';

/**
 * A number typed in the reader's units (the unit in the label), bound to a react-hook-form field;
 * `schemaResolver` converts it to SI and words its range errors in the same units. A value that
 * may be below zero gets the text keypad: phone number pads often have no minus key.
 */
export function UnitNumberField<T extends FieldValues>({
  form,
  name,
  label,
  quantity,
  prefs,
  hint,
  negative = false,
}: {
  form: Pick<UseFormReturn<T>, 'register' | 'formState'>;
  name: Path<T>;
  label: string;
  quantity: Quantity;
  prefs: UnitPrefs;
  hint?: ReactNode;
  negative?: boolean;
}) {
  return <BoundField form={form} name={name} label={`${label} (${conversionFor(quantity, prefs).label})`} hint={hint} input={{ inputMode: negative ? 'text' : 'decimal', autoComplete: 'off' }} />;
}
