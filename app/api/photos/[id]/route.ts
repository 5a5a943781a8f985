import { withApi } from '@/lib/api/handler';
import { photoParamsSchema, updatePhotoSchema } from '@/lib/photos/schemas';
import { deletePhoto, updatePhoto } from '@/lib/photos/changes';
import { getPhoto } from '@/lib/photos/service';

// GET /api/photos/:id: one photo's details and the addresses of its image files.
export const GET = withApi({ permission: 'photos.read', params: photoParamsSchema }, async ({ actor, params }) => getPhoto(actor, params.id));

// PATCH /api/photos/:id: change the kind or caption (uploader, office, admin).
export const PATCH = withApi({ permission: 'photos.read', params: photoParamsSchema, body: updatePhotoSchema }, async ({ actor, params, body }) =>
  updatePhoto(actor, params.id, body),
);

// DELETE /api/photos/:id: remove the photo and its stored files (uploader, office, admin; audited).
export const DELETE = withApi({ permission: 'photos.read', params: photoParamsSchema }, async ({ actor, params }) => deletePhoto(actor, params.id));
