import { idParamsSchema } from '@/lib/api/schemas';
import { withApi } from '@/lib/api/handler';
import { updateSystemSchema } from '@/lib/systems/schemas';
import { getSystem, updateSystem } from '@/lib/systems/service';

// GET /api/systems/:id: one system.
export const GET = withApi({ params: idParamsSchema }, async ({ actor, params }) => getSystem(actor, params.id));

// PATCH /api/systems/:id: edit a system.
export const PATCH = withApi({ permission: 'systems.write', params: idParamsSchema, body: updateSystemSchema }, async ({ actor, params, body }) =>
  updateSystem(actor, params.id, body),
);
