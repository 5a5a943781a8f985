'use client';

import { ImagePlus, X } from 'lucide-react';
import { useEffect, useId, useMemo } from 'react';
import { Button } from '@/components/ui/button';
import { formatBytes, MAX_PHOTO_BYTES } from '@/lib/photos/schemas';

/**
 * One optional photo for a service request. A plain file input, so a phone offers its camera
 * and its library alike; the photo is sent with the request, never on its own.
 */
export function RequestPhotoField({
  file,
  onChange,
  error,
  disabledReason,
}: {
  file: File | null;
  onChange: (file: File | null) => void;
  error?: string;
  /** Why a photo cannot be added yet (no unit chosen), shown instead of the picker. */
  disabledReason?: string;
}) {
  const id = useId();
  const preview = useMemo(() => (file ? URL.createObjectURL(file) : null), [file]);
  useEffect(() => () => (preview ? URL.revokeObjectURL(preview) : undefined), [preview]);
  const hintId = `${id}-hint`;
  const errorId = `${id}-error`;
  return (
    <div className="space-y-2">
      {/* A label only while there is an input to label; otherwise the same words as a heading line. */}
      {!disabledReason && !file ? (
        <label htmlFor={id} className="block text-sm font-semibold text-slate-800">
          Photo (optional)
        </label>
      ) : (
        <p className="text-sm font-semibold text-slate-800">Photo (optional)</p>
      )}
      {disabledReason ? (
        <p id={hintId} className="text-sm text-slate-600">
          {disabledReason}
        </p>
      ) : file && preview ? (
        <div className="flex items-center gap-3 rounded-md border border-slate-300 bg-white p-2">
          {/* eslint-disable-next-line @next/next/no-img-element -- a local object URL, not an optimisable asset */}
          <img src={preview} alt="The photo to send" className="size-20 rounded object-cover" />
          <div className="min-w-0 flex-1 text-sm">
            <p className="truncate font-medium">{file.name}</p>
            <p className="text-slate-600">{formatBytes(file.size)}</p>
          </div>
          <Button variant="secondary" onClick={() => onChange(null)} aria-label={`Remove the photo ${file.name}`}>
            <X aria-hidden className="size-5" /> Remove
          </Button>
        </div>
      ) : (
        <div className="flex min-h-12 items-center gap-3 rounded-md border border-dashed border-slate-400 bg-white px-3 py-2">
          <ImagePlus aria-hidden className="size-6 shrink-0 text-ice-800" />
          <input
            id={id}
            type="file"
            accept="image/jpeg,image/png,image/webp,image/*"
            aria-invalid={Boolean(error)}
            aria-describedby={error ? errorId : hintId}
            className="min-w-0 flex-1 text-base file:mr-3 file:min-h-11 file:rounded-md file:border-0 file:bg-ice-900 file:px-3 file:font-semibold file:text-white"
            onChange={(e) => {
              onChange(e.target.files?.[0] ?? null);
              e.target.value = '';
            }}
          />
        </div>
      )}
      {!disabledReason && !error ? (
        <p id={hintId} className="text-sm text-slate-600">
          What you see: ice on the coil, a leak, a broken part, a display reading. JPEG, PNG or WebP up to {formatBytes(MAX_PHOTO_BYTES)}; it is added to the unit&apos;s photos.
        </p>
      ) : null}
      {error ? (
        <p id={errorId} role="alert" className="text-sm font-medium text-red-700">
          {error}
        </p>
      ) : null}
    </div>
  );
}
