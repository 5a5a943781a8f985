import type { ComponentProps } from 'react';
import { SelectOptions, type SelectOption } from '@/components/forms/select-options';
import { Select } from '@/components/ui/field';
import { cn } from '@/lib/utils';

/**
 * A select that acts at once (a list's filter or sort, a kind to use next), with its label and its
 * options; value and change come from the caller. A label may be hidden where the row around says
 * what the choice is, but it is always there for screen readers.
 */
export function LabelledSelect({
  id,
  label,
  hideLabel,
  options,
  empty,
  className,
  selectClassName,
  ...select
}: {
  id: string;
  label: string;
  hideLabel?: boolean;
  options: readonly SelectOption[];
  /** A first, empty choice ("All sites"). */
  empty?: string;
  /** The block around label and select (its width in a row). */
  className?: string;
  selectClassName?: string;
} & Omit<ComponentProps<typeof Select>, 'id' | 'children' | 'className'>) {
  return (
    <div className={cn(!hideLabel && 'space-y-1', className)}>
      <label htmlFor={id} className={hideLabel ? 'sr-only' : 'block text-sm font-semibold text-slate-800'}>
        {label}
      </label>
      <Select id={id} className={selectClassName} {...select}>
        <SelectOptions options={options} empty={empty} />
      </Select>
    </div>
  );
}
