import 'server-only';
import busboy from 'busboy';
import type { NextRequest } from 'next/server';
import { INVALID_TEXT_MESSAGE, isValidText, stripBidiControls } from '@/lib/api/text';
import { AppError } from '@/lib/errors';

// Multipart bodies are read with a hard byte limit: a declared Content-Length over the limit is
// refused before any byte is read, and a body that turns out longer (chunked, or a wrong header)
// is cut off as soon as it passes the limit, so nobody can make the server buffer more than the
// route allows. The body is parsed while it arrives (busboy), each file kept once as its chunks:
// the platform's Response.formData() buffered the whole body, then copied every file out of it,
// several times slower for a phone photo.

export function isMultipart(req: NextRequest): boolean {
  return (req.headers.get('content-type') ?? '').toLowerCase().startsWith('multipart/form-data');
}

const unreadable = () => new AppError('bad_request', 'The upload could not be read; it may have been cut off. Try again.');

type Part = { name: string; value: string } | { name: string; file: { chunks: Buffer[]; fileName: string; type: string } };

/** Parses a multipart/form-data body of at most `maxBytes`. */
export async function readMultipart(req: NextRequest, maxBytes: number, tooLarge: () => AppError): Promise<FormData> {
  const parts = await parseParts(req, maxBytes, tooLarge);
  checkText(parts);
  const out = new FormData();
  for (const part of parts) {
    if ('value' in part) out.append(part.name, part.value);
    else out.append(part.name, new File(part.file.chunks.map((c) => new Uint8Array(c.buffer as ArrayBuffer, c.byteOffset, c.byteLength)), cleanName(part.file), { type: part.file.type }));
  }
  return out;
}

export interface MultipartFile {
  fileName: string;
  type: string;
  bytes: Buffer;
}

/**
 * The same parse and checks as readMultipart, with each file as one Buffer (a single copy of its
 * chunks) instead of a File: a File copies its chunks, and reading it back copies them again, two
 * extra copies of a multi-megabyte photo for a caller that needs the bytes. Fields in the order sent.
 */
export async function readMultipartParts(
  req: NextRequest,
  maxBytes: number,
  tooLarge: () => AppError,
): Promise<{ fields: [string, string][]; files: [string, MultipartFile][] }> {
  const parts = await parseParts(req, maxBytes, tooLarge);
  checkText(parts);
  const fields: [string, string][] = [];
  const files: [string, MultipartFile][] = [];
  for (const part of parts) {
    if ('value' in part) fields.push([part.name, part.value]);
    else files.push([part.name, { fileName: cleanName(part.file), type: part.file.type, bytes: Buffer.concat(part.file.chunks) }]);
  }
  return { fields, files };
}

async function parseParts(req: NextRequest, maxBytes: number, tooLarge: () => AppError): Promise<Part[]> {
  const declared = req.headers.get('content-length');
  if (declared !== null && Number(declared) > maxBytes) throw tooLarge();
  let parser: busboy.Busboy;
  try {
    // Names and values as UTF-8, as browsers send them; no part limit below the body's own.
    parser = busboy({ headers: { 'content-type': req.headers.get('content-type') ?? '' }, defParamCharset: 'utf8', limits: { fieldSize: maxBytes } });
  } catch {
    throw unreadable();
  }
  const parts: Part[] = [];
  let ended = false;
  // A part header the parser refuses while the body is still arriving holds bytes no header may
  // (a NUL in a field or file name): the same 422 as invalid text elsewhere. At the end, a header
  // left unfinished means the body was cut off.
  let badHeader = false;
  const parsed = new Promise<void>((resolve, reject) => {
    parser.on('field', (name, value) => parts.push({ name, value }));
    parser.on('file', (name, stream, info) => {
      const file = { chunks: [] as Buffer[], fileName: info.filename ?? '', type: info.mimeType };
      parts.push({ name, file });
      stream.on('data', (chunk: Buffer) => file.chunks.push(chunk));
      // A file cut short fails the whole form through the parser's own error.
      stream.on('error', () => undefined);
    });
    parser.on('close', resolve);
    let failed = false;
    parser.on('error', (error: Error) => {
      // Only the first error says what went wrong.
      if (!failed) badHeader = !ended && error.message === 'Malformed part header';
      failed = true;
      reject(error);
    });
  });
  parsed.catch(() => undefined);

  let total = 0;
  if (req.body) {
    const reader = req.body.getReader();
    for (;;) {
      const { done, value } = await reader.read();
      if (done) break;
      total += value.byteLength;
      if (total > maxBytes) {
        await reader.cancel().catch(() => undefined);
        parser.destroy();
        throw tooLarge();
      }
      parser.write(Buffer.from(value.buffer, value.byteOffset, value.byteLength));
    }
  }
  ended = true;
  parser.end();
  try {
    await parsed;
  } catch {
    if (badHeader) throw new AppError('validation_failed', INVALID_TEXT_MESSAGE, [{ path: '(part header)', message: INVALID_TEXT_MESSAGE }]);
    throw unreadable();
  }
  return parts;
}

/** Refuses NUL and broken Unicode in any field name, value or file name (422). */
function checkText(parts: Part[]): void {
  for (const part of parts) {
    const valid = isValidText(part.name) && isValidText('value' in part ? part.value : part.file.fileName);
    if (!valid) throw new AppError('validation_failed', INVALID_TEXT_MESSAGE, [{ path: isValidText(part.name) ? part.name : '(key)', message: INVALID_TEXT_MESSAGE }]);
  }
}

/** A file name without bidirectional controls, so a name cannot disguise its extension. */
const cleanName = (file: { fileName: string }) => stripBidiControls(file.fileName);

/**
 * A form's text fields as a plain object for the route's zod schema. An empty field counts as
 * absent, as a blank select or input means "not given"; files are left to the handler.
 */
export function formFields(form: Iterable<[string, FormDataEntryValue]>): Record<string, string> {
  const out: Record<string, string> = {};
  for (const [key, value] of form) {
    if (typeof value === 'string' && value !== '') out[key] = value;
  }
  return out;
}
