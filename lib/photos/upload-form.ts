import 'server-only';
import type { NextRequest } from 'next/server';
import { zodIssues } from '@/lib/api/issues';
import { formFields, isMultipart, readMultipartParts } from '@/lib/api/multipart';
import { AppError } from '@/lib/errors';
import { assertPhotoSize } from '@/lib/photos/process';
import { cleanFileName, formatBytes, MAX_PHOTO_BYTES, MAX_UPLOAD_OVERHEAD_BYTES, uploadPhotoFieldsSchema, type UploadPhotoFields } from '@/lib/photos/schemas';

// One photo with a few text fields; the byte limit is one photo's worth plus the form framing.

export const PHOTO_UPLOAD_LIMIT = MAX_PHOTO_BYTES + MAX_UPLOAD_OVERHEAD_BYTES;
export const photoTooLarge = () => new AppError('payload_too_large', `The upload is larger than the ${formatBytes(MAX_PHOTO_BYTES)} limit for one photo.`);

export interface PhotoUpload {
  fields: UploadPhotoFields;
  fileName: string | null;
  bytes: Uint8Array;
}

/** The image in a form's `file` field (size-checked), or null when none was sent. */
export async function formPhotoFile(form: FormData): Promise<{ fileName: string | null; bytes: Uint8Array } | null> {
  const file = form.get('file');
  if (!(file instanceof Blob)) return null;
  assertPhotoSize(file.size);
  return { fileName: cleanFileName(file instanceof File ? file.name : null), bytes: new Uint8Array(await file.arrayBuffer()) };
}

/** Parses `file` plus the `kind`, `caption` and `uploadKey` fields of a multipart/form-data body. */
export async function readPhotoUpload(req: NextRequest): Promise<PhotoUpload> {
  if (!isMultipart(req)) throw new AppError('unsupported_media_type', 'Send the photo as multipart/form-data with the image in the "file" field.');
  // The photo as one Buffer straight from the parser (no File to copy it into and out of).
  const { fields, files } = await readMultipartParts(req, PHOTO_UPLOAD_LIMIT, photoTooLarge);
  const parsed = uploadPhotoFieldsSchema.safeParse(formFields(fields));
  const sent = files.find(([name]) => name === 'file')?.[1];
  if (sent) assertPhotoSize(sent.bytes.byteLength);
  const file = sent ? { fileName: cleanFileName(sent.fileName), bytes: sent.bytes } : null;
  const issues = parsed.success ? [] : zodIssues(parsed.error);
  if (!file) issues.push({ path: 'file', message: 'Choose a photo to upload.' });
  if (!parsed.success || !file) throw new AppError('validation_failed', 'Some fields need attention.', issues);
  return { fields: parsed.data, ...file };
}
