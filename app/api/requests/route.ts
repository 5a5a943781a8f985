import { withApi } from '@/lib/api/handler';
import { createRequestSchema, listRequestsQuerySchema } from '@/lib/requests/schemas';
import { createRequest, listRequests } from '@/lib/requests/service';

// GET /api/requests: service requests visible to the caller, most urgent first.
export const GET = withApi({ query: listRequestsQuerySchema }, async ({ actor, query }) => ({ items: await listRequests(actor, query), nextCursor: null }));

// POST /api/requests: an owner (or the office) asks for service on a site or a unit; the office is e-mailed.
export const POST = withApi({ permission: 'requests.create', body: createRequestSchema, status: 201 }, async ({ actor, body }) => createRequest(actor, body));
