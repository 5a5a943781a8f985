import { SelectOptions, type SelectOption } from '@/components/forms/select-options';
import { Select } from '@/components/ui/field';
import { cn } from '@/lib/utils';

// No 'use client': list pages filter through a plain GET form that works before any script runs.

/** One choice of a list page's GET filter form, named as its query parameter. */
export function FilterSelect({ name, label, options, value, empty, className }: { name: string; label: string; options: readonly SelectOption[]; value: string; empty?: string; className?: string }) {
  return (
    <label className={cn('block text-sm font-semibold text-slate-800', className)}>
      {label}
      <Select name={name} defaultValue={value} className="mt-1">
        <SelectOptions options={options} empty={empty} />
      </Select>
    </label>
  );
}
