'use client';

import type { FieldValues } from 'react-hook-form';
import { NumberField, type NumberFieldProps } from '@/components/forms/number-field';
import { conversionFor, type Quantity, type UnitPrefs } from '@/lib/units/quantities';

/**
 * A number typed in the reader's units (the unit in the label), bound to a react-hook-form field;
 * `schemaResolver` converts it to SI and words its range errors in the same units.
 */
export function UnitNumberField<T extends FieldValues, O = T>({ quantity, prefs, ...props }: Omit<NumberFieldProps<T, O>, 'unit'> & { quantity: Quantity; prefs: UnitPrefs }) {
  return <NumberField {...props} unit={conversionFor(quantity, prefs).label} />;
}
