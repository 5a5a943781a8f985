import { idParamsSchema } from '@/lib/api/schemas';
import { withApi } from '@/lib/api/handler';
import { updateRequestSchema } from '@/lib/requests/schemas';
import { getRequest, updateRequest } from '@/lib/requests/service';

// GET /api/requests/:id: one service request.
export const GET = withApi({ params: idParamsSchema }, async ({ actor, params }) => getRequest(actor, params.id));

// PATCH /api/requests/:id: the office moves it along (seen, visit planned, done, declined) with a note.
export const PATCH = withApi({ permission: 'requests.manage', params: idParamsSchema, body: updateRequestSchema }, async ({ actor, params, body }) =>
  updateRequest(actor, params.id, body),
);
