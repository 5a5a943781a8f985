// Small API answers go out as they are, with their length, instead of through a compressor.
// Next (16.4, server/send-response.js) drops a route handler's Content-Length, so the compression
// middleware in server.ts cannot see that an answer is small: it compressed every one, /api/me's
// 200 bytes and every 401 included, at about half a millisecond each, and sent them chunked.
// So jsonResponse (lib/api/handler.ts) states the body's size in a header of our own, and the
// middleware's filter turns it back into Content-Length and removes it before anything is sent.
import type { ServerResponse } from 'node:http';

export const BODY_BYTES_HEADER = 'x-rimeline-body-bytes';
/** Where compression starts: server.ts gives the middleware this threshold too. */
export const COMPRESS_FROM_BYTES = 1024;

/**
 * Reads and removes the body-size header; for an answer under the threshold sets Content-Length
 * and says true (leave it uncompressed).
 */
export function sendsSmallAnswer(res: ServerResponse): boolean {
  const declared = res.getHeader(BODY_BYTES_HEADER);
  if (declared === undefined) return false;
  res.removeHeader(BODY_BYTES_HEADER);
  if (!/^\d{1,9}$/.test(String(declared))) return false;
  const bytes = Number(declared);
  if (bytes >= COMPRESS_FROM_BYTES) return false;
  res.setHeader('Content-Length', bytes);
  return true;
}
