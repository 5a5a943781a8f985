import { withApi } from '@/lib/api/handler';
import { formPhotoFile, PHOTO_UPLOAD_LIMIT, photoTooLarge } from '@/lib/photos/upload-form';
import { createRequestSchema, listRequestsQuerySchema } from '@/lib/requests/schemas';
import { createRequest, listRequests } from '@/lib/requests/service';

// sharp and the S3 client (a photo may come with the request) need Node, not the edge runtime.
export const runtime = 'nodejs';

// GET /api/requests: service requests visible to the caller, most urgent first.
export const GET = withApi({ query: listRequestsQuerySchema }, async ({ actor, query }) => ({ items: await listRequests(actor, query), nextCursor: null }));

// POST /api/requests: an owner (or the office) asks for service on a site or a unit; the office is
// e-mailed. JSON, or multipart/form-data with the same fields plus an optional photo in `file`.
export const POST = withApi(
  { permission: 'requests.create', body: createRequestSchema, multipart: { maxBytes: PHOTO_UPLOAD_LIMIT, tooLarge: photoTooLarge }, status: 201 },
  async ({ actor, body, form }) => createRequest(actor, body, undefined, (form && (await formPhotoFile(form))) || undefined),
);
