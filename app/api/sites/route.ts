import { withApi } from '@/lib/api/handler';
import { createSiteSchema, listSitesQuerySchema } from '@/lib/sites/schemas';
import { createSite, listSites } from '@/lib/sites/service';

// GET /api/sites: sites visible to the caller (keyset pages; filter by clientId, search q).
export const GET = withApi({ query: listSitesQuerySchema }, async ({ actor, query }) => listSites(actor, query));

// POST /api/sites: create a site for a client.
export const POST = withApi({ permission: 'sites.write', body: createSiteSchema, status: 201 }, async ({ actor, body }) => createSite(actor, body));
