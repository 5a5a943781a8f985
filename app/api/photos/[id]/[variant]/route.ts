import { contentDisposition } from '@/lib/api/download';
import { withApi } from '@/lib/api/handler';
import { photoVariantParamsSchema, photoVariantQuerySchema } from '@/lib/photos/schemas';
import { openPhotoFile } from '@/lib/photos/files';

export const runtime = 'nodejs';

// GET /api/photos/:id/thumb|display|original: the image bytes, after the photo's access check.
export const GET = withApi({ permission: 'photos.read', params: photoVariantParamsSchema, query: photoVariantQuerySchema }, async ({ actor, params, query }) => {
  const file = await openPhotoFile(actor, params.id, params.variant);
  const headers = new Headers({
    'Content-Type': file.contentType,
    // Stored files never change under their address, but only this signed-in browser may keep them.
    'Cache-Control': 'private, max-age=86400, immutable',
    'X-Content-Type-Options': 'nosniff',
    'Content-Security-Policy': "default-src 'none'; sandbox",
    'Content-Disposition': contentDisposition(query.download ? 'attachment' : 'inline', file.fileName),
  });
  if (file.contentLength !== null) headers.set('Content-Length', String(file.contentLength));
  return new Response(file.body, { status: 200, headers });
});
