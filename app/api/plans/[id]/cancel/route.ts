import { idParamsSchema } from '@/lib/api/schemas';
import { withApi } from '@/lib/api/handler';
import { cancelPlanSchema } from '@/lib/plans/schemas';
import { cancelPlan } from '@/lib/plans/service';

// POST /api/plans/:id/cancel: cancel a plan not yet started, with an optional reason (office).
export const POST = withApi({ permission: 'plans.write', params: idParamsSchema, body: cancelPlanSchema }, async ({ actor, params, body }) => cancelPlan(actor, params.id, body));
