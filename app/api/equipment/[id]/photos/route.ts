import { withApi } from '@/lib/api/handler';
import { equipmentPhotosParamsSchema, listPhotosQuerySchema } from '@/lib/photos/schemas';
import { listPhotos, uploadPhoto } from '@/lib/photos/service';
import { readPhotoUpload } from '@/lib/photos/upload-form';

// sharp and the S3 client need Node, not the edge runtime.
export const runtime = 'nodejs';

// GET /api/equipment/:id/photos: the equipment's photos, newest first, with counts per kind.
export const GET = withApi({ permission: 'photos.read', params: equipmentPhotosParamsSchema, query: listPhotosQuerySchema }, async ({ actor, params, query }) =>
  listPhotos(actor, params.id, query),
);

// POST /api/equipment/:id/photos: upload one photo (multipart: file, kind, caption?, uploadKey?).
export const POST = withApi({ permission: 'photos.upload', params: equipmentPhotosParamsSchema, status: 201 }, async ({ actor, params, req }) => {
  const upload = await readPhotoUpload(req);
  // The parser's buffer belongs to this request alone, so location comes out of it in place.
  return uploadPhoto(actor, { equipmentId: params.id, ...upload.fields, fileName: upload.fileName, bytes: upload.bytes, handedOver: true });
});
