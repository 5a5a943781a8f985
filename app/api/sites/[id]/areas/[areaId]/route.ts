import { withApi } from '@/lib/api/handler';
import { siteAreaParamsSchema, updateAreaSchema } from '@/lib/sites/schemas';
import { updateArea } from '@/lib/sites/service';

// PATCH /api/sites/:id/areas/:areaId: edit an area.
export const PATCH = withApi({ permission: 'areas.write', params: siteAreaParamsSchema, body: updateAreaSchema }, async ({ actor, params, body }) =>
  updateArea(actor, params.id, params.areaId, body),
);
