import 'server-only';

/** A PDF download: private, never cached by a proxy. */
export function pdfResponse({ bytes, filename }: { bytes: Uint8Array; filename: string }): Response {
  return new Response(Buffer.from(bytes), {
    status: 200,
    headers: {
      'content-type': 'application/pdf',
      'content-length': String(bytes.byteLength),
      'content-disposition': `attachment; filename="${filename.replace(/[^A-Za-z0-9._-]/g, '_')}"`,
      'cache-control': 'private, no-store',
    },
  });
}
