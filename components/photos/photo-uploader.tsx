'use client';

import { useQueryClient } from '@tanstack/react-query';
import { Camera, CircleCheck, ImageOff, ImagePlus, LoaderCircle, OctagonAlert, RotateCcw, Upload, X } from 'lucide-react';
import { useEffect, useId, useRef, useState } from 'react';
import { Button } from '@/components/ui/button';
import { Input, Select } from '@/components/ui/field';
import { ApiError } from '@/lib/api/client';
import type { PhotoDto } from '@/lib/photos/dto';
import { photoKeys, uploadPhotoFile } from '@/lib/photos/hooks';
import { formatBytes, MAX_PHOTO_BYTES, photoFileProblem, photoKindLabels, photoKinds, type PhotoKind } from '@/lib/photos/schemas';
import { cn } from '@/lib/utils';

// Several photos at once, from the camera or from files; each with its kind, an optional caption,
// its own progress bar and, when it fails, its own plain error and Retry. Independent of any page:
// the equipment page, a scan result or a visit form mount it with the equipment's id.

type Status = 'ready' | 'uploading' | 'processing' | 'done' | 'failed';

interface Item {
  id: string;
  file: File;
  preview: string;
  kind: PhotoKind;
  caption: string;
  status: Status;
  percent: number;
  error?: string;
  /** False when sending the same file again cannot help (too large, empty). */
  retryable: boolean;
  photo?: PhotoDto;
}

/** Up to two uploads at a time: faster on a good line, still gentle on a weak one. */
const PARALLEL = 2;

function newId(): string {
  return typeof crypto !== 'undefined' && 'randomUUID' in crypto
    ? crypto.randomUUID()
    : '10000000-1000-4000-8000-100000000000'.replace(/[018]/g, (c) => (Number(c) ^ (Math.random() * 16) >> (Number(c) / 4)).toString(16));
}

export interface PhotoUploaderProps {
  equipmentId: string;
  /** Kind preselected for new photos (a scan of a nameplate might start with "nameplate"). */
  defaultKind?: PhotoKind;
  /** Called once per stored photo, e.g. for a visit form to link it to an entry. */
  onUploaded?: (photo: PhotoDto) => void;
}

export function PhotoUploader({ equipmentId, defaultKind = 'general', onUploaded }: PhotoUploaderProps) {
  const queryClient = useQueryClient();
  const baseId = useId();
  const cameraInput = useRef<HTMLInputElement>(null);
  const filesInput = useRef<HTMLInputElement>(null);
  const [kind, setKind] = useState<PhotoKind>(defaultKind);
  const [items, setItems] = useState<Item[]>([]);
  const itemsRef = useRef(items);
  itemsRef.current = items;
  const uploadKeys = useRef(new Map<string, string>());

  // Object URLs hold the picked file in memory; let them go with the item.
  useEffect(() => () => itemsRef.current.forEach((i) => URL.revokeObjectURL(i.preview)), []);

  const patch = (id: string, change: Partial<Item>) => setItems((all) => all.map((i) => (i.id === id ? { ...i, ...change } : i)));

  function add(list: FileList | null) {
    if (!list || list.length === 0) return;
    const added: Item[] = [...list].map((file) => {
      const problem = photoFileProblem(file);
      return {
        id: newId(),
        file,
        preview: URL.createObjectURL(file),
        kind,
        caption: '',
        status: problem ? 'failed' : 'ready',
        percent: 0,
        error: problem,
        retryable: !problem,
      };
    });
    setItems((all) => [...all, ...added]);
  }

  async function send(item: Item): Promise<void> {
    let key = uploadKeys.current.get(item.id);
    if (!key) {
      key = newId();
      uploadKeys.current.set(item.id, key);
    }
    patch(item.id, { status: 'uploading', percent: 0, error: undefined });
    try {
      const photo = await uploadPhotoFile(equipmentId, item.file, { kind: item.kind, caption: item.caption, uploadKey: key }, ({ sent, total }) => {
        const percent = total > 0 ? Math.min(100, Math.round((sent / total) * 100)) : 0;
        patch(item.id, percent >= 100 ? { percent: 100, status: 'processing' } : { percent });
      });
      patch(item.id, { status: 'done', percent: 100, photo });
      onUploaded?.(photo);
      await queryClient.invalidateQueries({ queryKey: photoKeys.lists() });
    } catch (error) {
      const message = error instanceof ApiError ? error.message : 'The upload failed. Nothing was saved; press Retry.';
      const retryable = !(error instanceof ApiError) || ![413, 415, 422].includes(error.status);
      patch(item.id, { status: 'failed', error: message, retryable });
    }
  }

  async function uploadAll() {
    const queue = itemsRef.current.filter((i) => i.status === 'ready');
    const workers = Array.from({ length: Math.min(PARALLEL, queue.length) }, async () => {
      for (let next = queue.shift(); next; next = queue.shift()) {
        // Read the latest kind and caption: they may have changed since the queue was made.
        const current = itemsRef.current.find((i) => i.id === next!.id);
        if (current && current.status === 'ready') await send(current);
      }
    });
    await Promise.all(workers);
  }

  function remove(id: string) {
    const item = itemsRef.current.find((i) => i.id === id);
    if (item) URL.revokeObjectURL(item.preview);
    uploadKeys.current.delete(id);
    setItems((all) => all.filter((i) => i.id !== id));
  }

  function clearFinished() {
    itemsRef.current.filter((i) => i.status === 'done').forEach((i) => remove(i.id));
  }

  const ready = items.filter((i) => i.status === 'ready').length;
  const busy = items.some((i) => i.status === 'uploading' || i.status === 'processing');
  const done = items.filter((i) => i.status === 'done').length;

  return (
    <div className="space-y-4 rounded-lg border border-slate-200 bg-white p-4 shadow-sm">
      <div className="flex flex-col gap-3 sm:flex-row sm:items-end">
        <div className="space-y-1 sm:w-56">
          <label htmlFor={`${baseId}-kind`} className="block text-sm font-semibold text-slate-800">
            Kind for new photos
          </label>
          <Select id={`${baseId}-kind`} value={kind} onChange={(e) => setKind(e.target.value as PhotoKind)}>
            {photoKinds.map((k) => (
              <option key={k} value={k}>
                {photoKindLabels[k]}
              </option>
            ))}
          </Select>
        </div>
        <div className="flex flex-wrap gap-2">
          <Button size="lg" onClick={() => cameraInput.current?.click()}>
            <Camera aria-hidden className="size-5" />
            Take photo
          </Button>
          <Button size="lg" variant="secondary" onClick={() => filesInput.current?.click()}>
            <ImagePlus aria-hidden className="size-5" />
            Choose files
          </Button>
        </div>
        {/* image/* lets a phone offer its camera roll and convert its own formats to JPEG. */}
        <input
          ref={cameraInput}
          type="file"
          accept="image/*"
          capture="environment"
          multiple
          className="hidden"
          aria-label="Take a photo with the camera"
          data-testid="photo-camera-input"
          onChange={(e) => {
            add(e.target.files);
            e.target.value = '';
          }}
        />
        <input
          ref={filesInput}
          type="file"
          accept="image/jpeg,image/png,image/webp,image/*"
          multiple
          className="hidden"
          aria-label="Choose photo files"
          data-testid="photo-file-input"
          onChange={(e) => {
            add(e.target.files);
            e.target.value = '';
          }}
        />
      </div>
      <p className="text-sm text-slate-600">JPEG, PNG or WebP, up to {formatBytes(MAX_PHOTO_BYTES)} each. Location data is removed unless your company keeps it.</p>

      {items.length > 0 ? (
        <ul className="space-y-3" aria-label="Photos to upload">
          {items.map((item, index) => (
            <UploadRow
              key={item.id}
              item={item}
              label={`${baseId}-${index}`}
              onChange={(change) => patch(item.id, change)}
              onRetry={() => void send(item)}
              onRemove={() => remove(item.id)}
            />
          ))}
        </ul>
      ) : null}

      {items.length > 0 ? (
        <div className="flex flex-wrap items-center gap-2">
          {ready > 0 || busy ? (
            <Button size="lg" onClick={() => void uploadAll()} disabled={ready === 0 || busy}>
              <Upload aria-hidden className="size-5" />
              {busy ? 'Uploading…' : `Upload ${ready} photo${ready === 1 ? '' : 's'}`}
            </Button>
          ) : null}
          {done > 0 ? (
            <Button variant="ghost" onClick={clearFinished} disabled={busy}>
              Clear uploaded
            </Button>
          ) : null}
          <p className="text-sm text-slate-700" role="status" aria-live="polite">
            {busy ? 'Uploading…' : done > 0 ? `${done} uploaded.` : ''}
          </p>
        </div>
      ) : null}
    </div>
  );
}

function StatusLine({ item }: { item: Item }) {
  if (item.status === 'done') {
    return (
      <p className="flex items-center gap-1.5 text-sm font-semibold text-emerald-800">
        <CircleCheck aria-hidden className="size-4" /> Uploaded
      </p>
    );
  }
  if (item.status === 'failed') {
    return (
      <p role="alert" className="flex items-start gap-1.5 text-sm font-medium text-red-800">
        <OctagonAlert aria-hidden className="mt-0.5 size-4 shrink-0" />
        <span>
          <span className="font-semibold">Not uploaded: </span>
          {item.error}
        </span>
      </p>
    );
  }
  if (item.status === 'uploading' || item.status === 'processing') {
    return (
      <div className="space-y-1">
        <div
          role="progressbar"
          aria-label={`Upload of ${item.file.name}`}
          aria-valuemin={0}
          aria-valuemax={100}
          aria-valuenow={item.percent}
          className="h-3 overflow-hidden rounded-full bg-slate-200"
        >
          <div className="h-full rounded-full bg-ice-700 transition-[width] duration-150" style={{ width: `${item.percent}%` }} />
        </div>
        <p className="flex items-center gap-1.5 text-sm text-slate-700">
          <LoaderCircle aria-hidden className="size-4 animate-spin" />
          {item.status === 'processing' ? 'Sent; checking and storing…' : `Uploading ${item.percent}%`}
        </p>
      </div>
    );
  }
  return <p className="text-sm text-slate-600">Ready to upload</p>;
}

function UploadRow({
  item,
  label,
  onChange,
  onRetry,
  onRemove,
}: {
  item: Item;
  label: string;
  onChange: (change: Partial<Item>) => void;
  onRetry: () => void;
  onRemove: () => void;
}) {
  // The browser cannot draw every file it is handed (not an image, or a format it lacks).
  const [previewBroken, setPreviewBroken] = useState(false);
  const editable = item.status === 'ready' || (item.status === 'failed' && item.retryable);
  const working = item.status === 'uploading' || item.status === 'processing';
  return (
    <li
      className={cn('flex gap-3 rounded-md border p-3', item.status === 'failed' ? 'border-red-300 bg-red-50' : 'border-slate-200')}
      data-testid="upload-row"
      data-status={item.status}
    >
      {previewBroken ? (
        <span className="flex size-16 shrink-0 items-center justify-center rounded bg-slate-100 text-slate-600 sm:size-20">
          <ImageOff aria-hidden className="size-6" />
        </span>
      ) : (
        <img src={item.preview} alt="" className="size-16 shrink-0 rounded object-cover sm:size-20" onError={() => setPreviewBroken(true)} />
      )}
      <div className="min-w-0 flex-1 space-y-2">
        <p className="truncate text-sm font-semibold text-slate-900" title={item.file.name}>
          {item.file.name} <span className="font-normal text-slate-600">· {formatBytes(item.file.size)}</span>
        </p>
        {editable ? (
          <div className="grid gap-2 sm:grid-cols-[10rem_1fr]">
            <div>
              <label htmlFor={`${label}-kind`} className="sr-only">
                Kind of {item.file.name}
              </label>
              <Select id={`${label}-kind`} value={item.kind} onChange={(e) => onChange({ kind: e.target.value as PhotoKind })}>
                {photoKinds.map((k) => (
                  <option key={k} value={k}>
                    {photoKindLabels[k]}
                  </option>
                ))}
              </Select>
            </div>
            <div>
              <label htmlFor={`${label}-caption`} className="sr-only">
                Caption for {item.file.name}
              </label>
              <Input id={`${label}-caption`} value={item.caption} maxLength={500} placeholder="Caption (optional)" onChange={(e) => onChange({ caption: e.target.value })} />
            </div>
          </div>
        ) : (
          <p className="text-sm text-slate-700">
            {photoKindLabels[item.kind]}
            {item.caption ? ` · ${item.caption}` : ''}
          </p>
        )}
        <StatusLine item={item} />
        {!working && item.status !== 'done' ? (
          <div className="flex flex-wrap gap-2">
            {item.status === 'failed' && item.retryable ? (
              <Button onClick={onRetry}>
                <RotateCcw aria-hidden className="size-4" /> Retry
              </Button>
            ) : null}
            <Button variant="secondary" onClick={onRemove} aria-label={`Remove ${item.file.name}`}>
              <X aria-hidden className="size-4" /> Remove
            </Button>
          </div>
        ) : null}
      </div>
    </li>
  );
}
