import { withApi } from '@/lib/api/handler';
import { createSystemSchema, listSystemsQuerySchema } from '@/lib/systems/schemas';
import { createSystem, listSystems } from '@/lib/systems/service';

// GET /api/systems: refrigeration systems visible to the caller (filter by siteId).
export const GET = withApi({ query: listSystemsQuerySchema }, async ({ actor, query }) => ({ items: await listSystems(actor, query), nextCursor: null }));

// POST /api/systems: create a system on a site.
export const POST = withApi({ permission: 'systems.write', body: createSystemSchema, status: 201 }, async ({ actor, body }) => createSystem(actor, body));
