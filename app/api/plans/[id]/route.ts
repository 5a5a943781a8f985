import { idParamsSchema } from '@/lib/api/schemas';
import { withApi } from '@/lib/api/handler';
import { movePlanSchema } from '@/lib/plans/schemas';
import { getPlan, movePlan } from '@/lib/plans/service';

// GET /api/plans/:id: one planned visit.
export const GET = withApi({ permission: 'plans.read', params: idParamsSchema }, async ({ actor, params }) => getPlan(actor, params.id));

// PATCH /api/plans/:id: move it to another day, window or technician (office).
export const PATCH = withApi({ permission: 'plans.write', params: idParamsSchema, body: movePlanSchema }, async ({ actor, params, body }) => movePlan(actor, params.id, body));
