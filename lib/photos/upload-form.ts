import 'server-only';
import type { NextRequest } from 'next/server';
import { zodIssues } from '@/lib/api/issues';
import { AppError } from '@/lib/errors';
import { assertPhotoSize } from '@/lib/photos/process';
import { cleanFileName, formatBytes, MAX_PHOTO_BYTES, MAX_UPLOAD_OVERHEAD_BYTES, uploadPhotoFieldsSchema, type UploadPhotoFields } from '@/lib/photos/schemas';

// Reads one multipart photo upload with a hard byte limit: a declared Content-Length over the
// limit is refused before any byte is read, and a body that turns out longer (chunked, or a
// wrong header) is cut off as soon as it passes the limit, so nobody can make the server
// buffer more than one photo's worth.

const LIMIT = MAX_PHOTO_BYTES + MAX_UPLOAD_OVERHEAD_BYTES;
const tooLarge = () => new AppError('payload_too_large', `The upload is larger than the ${formatBytes(MAX_PHOTO_BYTES)} limit for one photo.`);

async function readLimited(req: NextRequest): Promise<Buffer> {
  const declared = req.headers.get('content-length');
  if (declared !== null && Number(declared) > LIMIT) throw tooLarge();
  if (!req.body) return Buffer.alloc(0);
  const reader = req.body.getReader();
  const chunks: Uint8Array[] = [];
  let total = 0;
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    total += value.byteLength;
    if (total > LIMIT) {
      await reader.cancel().catch(() => undefined);
      throw tooLarge();
    }
    chunks.push(value);
  }
  return Buffer.concat(chunks, total);
}

export interface PhotoUpload {
  fields: UploadPhotoFields;
  fileName: string | null;
  bytes: Uint8Array;
}

/** Parses `file` plus the `kind`, `caption` and `uploadKey` fields of a multipart/form-data body. */
export async function readPhotoUpload(req: NextRequest): Promise<PhotoUpload> {
  const type = req.headers.get('content-type') ?? '';
  if (!type.toLowerCase().startsWith('multipart/form-data')) {
    throw new AppError('unsupported_media_type', 'Send the photo as multipart/form-data with the image in the "file" field.');
  }
  const raw = await readLimited(req);
  let form: FormData;
  try {
    form = await new Response(new Uint8Array(raw.buffer as ArrayBuffer, raw.byteOffset, raw.byteLength), { headers: { 'content-type': type } }).formData();
  } catch {
    throw new AppError('bad_request', 'The upload could not be read; it may have been cut off. Try again.');
  }
  const text = (name: string) => {
    const v = form.get(name);
    return typeof v === 'string' ? v : undefined;
  };
  const parsed = uploadPhotoFieldsSchema.safeParse({ kind: text('kind'), caption: text('caption'), uploadKey: text('uploadKey') || undefined });
  const file = form.get('file');
  const issues = parsed.success ? [] : zodIssues(parsed.error);
  if (!(file instanceof Blob)) issues.push({ path: 'file', message: 'Choose a photo to upload.' });
  if (!parsed.success || !(file instanceof Blob)) throw new AppError('validation_failed', 'Some fields need attention.', issues);
  assertPhotoSize(file.size);
  return {
    fields: parsed.data,
    fileName: cleanFileName(file instanceof File ? file.name : null),
    bytes: new Uint8Array(await file.arrayBuffer()),
  };
}
