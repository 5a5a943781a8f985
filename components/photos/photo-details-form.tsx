'use client';

import { CircleCheck, OctagonAlert } from 'lucide-react';
import { useState } from 'react';
import { useForm, useWatch } from 'react-hook-form';
import { schemaResolver } from '@/components/forms/schema-resolver';
import { PhotoKindSelect } from '@/components/photos/photo-kind-select';
import { Button } from '@/components/ui/button';
import { describedBy, Input } from '@/components/ui/field';
import type { PhotoDto } from '@/lib/photos/dto';
import { useUpdatePhoto } from '@/lib/photos/hooks';
import { photoKindLabels, updatePhotoSchema, type PhotoKind, type UpdatePhotoInput } from '@/lib/photos/schemas';

interface DetailsValues {
  kind: PhotoKind;
  caption: string;
}

const resolver = schemaResolver(updatePhotoSchema, (v: DetailsValues) => v);

/** Kind and caption of a stored photo, changed in place (PATCH) when its uploader may edit it. */
export function PhotoDetailsForm({ photo, label, fileName, onSaved }: { photo: PhotoDto; label: string; fileName: string; onSaved: (photo: PhotoDto) => void }) {
  const update = useUpdatePhoto();
  const [saved, setSaved] = useState(false);
  const form = useForm<DetailsValues, unknown, UpdatePhotoInput>({ resolver, defaultValues: { kind: photo.kind, caption: photo.caption ?? '' } });
  const [kind, caption] = useWatch({ control: form.control, name: ['kind', 'caption'] });
  const captionError = form.formState.errors.caption?.message;
  if (!photo.canEdit) {
    return (
      <p className="text-sm text-slate-700">
        {photoKindLabels[photo.kind]}
        {photo.caption ? ` · ${photo.caption}` : ''}
      </p>
    );
  }
  const changed = kind !== photo.kind || caption.trim() !== (photo.caption ?? '');
  const submit = form.handleSubmit(async (input) => {
    if (!changed) return;
    setSaved(false);
    const next = await update.mutateAsync({ id: photo.id, input }).catch(() => null);
    if (!next) return;
    form.reset({ kind: next.kind, caption: next.caption ?? '' });
    setSaved(true);
    onSaved(next);
  });
  const problem = captionError ?? (update.isError ? update.error.message : null);
  return (
    <form className="space-y-2" noValidate onSubmit={submit}>
      <div className="grid gap-2 sm:grid-cols-[10rem_1fr]">
        <PhotoKindSelect id={`${label}-kind`} label={`Kind of ${fileName}`} hideLabel {...form.register('kind')} />
        <div>
          <label htmlFor={`${label}-caption`} className="sr-only">
            Caption for {fileName}
          </label>
          <Input id={`${label}-caption`} maxLength={500} placeholder="Add a caption (optional)" {...describedBy(`${label}-caption`, captionError)} {...form.register('caption')} />
        </div>
      </div>
      {changed ? (
        <Button type="submit" variant="secondary" disabled={form.formState.isSubmitting}>
          {form.formState.isSubmitting ? 'Saving…' : 'Save kind and caption'}
        </Button>
      ) : null}
      {problem ? (
        <p id={`${label}-caption-error`} role="alert" className="flex items-start gap-1.5 text-sm font-medium text-red-800">
          <OctagonAlert aria-hidden className="mt-0.5 size-4 shrink-0" />
          {problem}
        </p>
      ) : saved && !changed ? (
        <p role="status" className="flex items-center gap-1.5 text-sm text-emerald-800">
          <CircleCheck aria-hidden className="size-4" /> Saved
        </p>
      ) : null}
    </form>
  );
}
