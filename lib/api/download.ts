// One way to hand a file to the browser (PDF reports, CSV exports, photo bytes): the type, a safe
// file name in both header forms, and no caching unless the caller says otherwise.

export interface DownloadFile {
  filename: string;
  contentType: string;
  body: string | Uint8Array | ReadableStream<Uint8Array>;
}

/**
 * A Content-Disposition value: an ASCII `filename` for old clients (quotes, backslashes and
 * anything outside printable ASCII become "_") and the exact name as RFC 6266 / RFC 5987 `filename*`.
 */
export function contentDisposition(kind: 'inline' | 'attachment', filename: string): string {
  const ascii = filename.replace(/[^\x20-\x7e]|["\\]/g, '_');
  return `${kind}; filename="${ascii}"; filename*=UTF-8''${encodeURIComponent(filename)}`;
}

export function downloadResponse(
  file: DownloadFile,
  { disposition = 'attachment', cacheControl = 'private, no-store', headers = {} }: { disposition?: 'inline' | 'attachment'; cacheControl?: string; headers?: Record<string, string> } = {},
): Response {
  const body = file.body instanceof Uint8Array ? Buffer.from(file.body) : file.body;
  return new Response(body, {
    headers: {
      'Content-Type': file.contentType,
      'Content-Disposition': contentDisposition(disposition, file.filename),
      'Cache-Control': cacheControl,
      'X-Content-Type-Options': 'nosniff',
      ...headers,
    },
  });
}
