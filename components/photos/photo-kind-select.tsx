import type { ComponentProps } from 'react';
import { optionsOf, SelectOptions } from '@/components/forms/select-options';
import { Select } from '@/components/ui/field';
import { cn } from '@/lib/utils';
import { photoKindLabels, photoKinds } from '@/lib/photos/terms';

const kindOptions = optionsOf(photoKinds, photoKindLabels);

/**
 * A photo's kind, labelled: the uploader's kind for new photos, a failed photo's before it is
 * sent again, a sent photo's details. Value and change come from the caller (state or a form's register).
 */
export function PhotoKindSelect({ id, label, hideLabel, className, ...select }: { id: string; label: string; hideLabel?: boolean; className?: string } & Omit<ComponentProps<typeof Select>, 'id' | 'children' | 'className'>) {
  return (
    <div className={cn(!hideLabel && 'space-y-1', className)}>
      <label htmlFor={id} className={hideLabel ? 'sr-only' : 'block text-sm font-semibold text-slate-800'}>
        {label}
      </label>
      <Select id={id} {...select}>
        <SelectOptions options={kindOptions} />
      </Select>
    </div>
  );
}
