import 'server-only';
import type { NextRequest } from 'next/server';
import { INVALID_TEXT_MESSAGE, isValidText, stripBidiControls } from '@/lib/api/text';
import { AppError } from '@/lib/errors';

// Multipart bodies are read with a hard byte limit: a declared Content-Length over the limit is
// refused before any byte is read, and a body that turns out longer (chunked, or a wrong header)
// is cut off as soon as it passes the limit, so nobody can make the server buffer more than the
// route allows.

export function isMultipart(req: NextRequest): boolean {
  return (req.headers.get('content-type') ?? '').toLowerCase().startsWith('multipart/form-data');
}

async function readLimited(req: NextRequest, maxBytes: number, tooLarge: () => AppError): Promise<Buffer> {
  const declared = req.headers.get('content-length');
  if (declared !== null && Number(declared) > maxBytes) throw tooLarge();
  if (!req.body) return Buffer.alloc(0);
  const reader = req.body.getReader();
  const chunks: Uint8Array[] = [];
  let total = 0;
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    total += value.byteLength;
    if (total > maxBytes) {
      await reader.cancel().catch(() => undefined);
      throw tooLarge();
    }
    chunks.push(value);
  }
  return Buffer.concat(chunks, total);
}

/** Parses a multipart/form-data body of at most `maxBytes`. */
export async function readMultipart(req: NextRequest, maxBytes: number, tooLarge: () => AppError): Promise<FormData> {
  const raw = await readLimited(req, maxBytes, tooLarge);
  let form: FormData;
  try {
    form = await new Response(new Uint8Array(raw.buffer as ArrayBuffer, raw.byteOffset, raw.byteLength), { headers: { 'content-type': req.headers.get('content-type') ?? '' } }).formData();
  } catch {
    throw new AppError('bad_request', 'The upload could not be read; it may have been cut off. Try again.');
  }
  return cleanForm(form);
}

/**
 * Refuses NUL and broken Unicode in any field name, value or file name (422), and removes
 * bidirectional controls from file names so a name cannot disguise its extension.
 */
function cleanForm(form: FormData): FormData {
  const out = new FormData();
  for (const [key, value] of form.entries()) {
    const valid = isValidText(key) && isValidText(typeof value === 'string' ? value : value.name);
    if (!valid) throw new AppError('validation_failed', INVALID_TEXT_MESSAGE, [{ path: isValidText(key) ? key : '(key)', message: INVALID_TEXT_MESSAGE }]);
    if (typeof value === 'string') out.append(key, value);
    else out.append(key, new File([value], stripBidiControls(value.name), { type: value.type, lastModified: value.lastModified }));
  }
  return out;
}

/**
 * A form's text fields as a plain object for the route's zod schema. An empty field counts as
 * absent, as a blank select or input means "not given"; files are left to the handler.
 */
export function formFields(form: FormData): Record<string, string> {
  const out: Record<string, string> = {};
  for (const [key, value] of form.entries()) {
    if (typeof value === 'string' && value !== '') out[key] = value;
  }
  return out;
}
