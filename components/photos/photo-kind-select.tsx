import type { ComponentProps } from 'react';
import { LabelledSelect } from '@/components/forms/labelled-select';
import { optionsOf } from '@/components/forms/select-options';
import { photoKindLabels, photoKinds } from '@/lib/photos/terms';

const kindOptions = optionsOf(photoKinds, photoKindLabels);

/** A photo's kind: the uploader's kind for new photos, a failed photo's before it is sent again, a sent photo's details. */
export function PhotoKindSelect(props: Omit<ComponentProps<typeof LabelledSelect>, 'options' | 'empty'>) {
  return <LabelledSelect options={kindOptions} {...props} />;
}
