import { idParamsSchema } from '@/lib/api/schemas';
import { withApi } from '@/lib/api/handler';
import { updateSiteSchema } from '@/lib/sites/schemas';
import { getSite, updateSite } from '@/lib/sites/service';

// GET /api/sites/:id: one site.
export const GET = withApi({ params: idParamsSchema }, async ({ actor, params }) => getSite(actor, params.id));

// PATCH /api/sites/:id: edit a site.
export const PATCH = withApi({ permission: 'sites.write', params: idParamsSchema, body: updateSiteSchema }, async ({ actor, params, body }) =>
  updateSite(actor, params.id, body),
);
