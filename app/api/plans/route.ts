import { withApi } from '@/lib/api/handler';
import { createPlanSchema, listPlansQuerySchema } from '@/lib/plans/schemas';
import { createPlan, listPlans } from '@/lib/plans/service';

// GET /api/plans: planned visits the caller may see (by day range, site, technician, status).
export const GET = withApi({ permission: 'plans.read', query: listPlansQuerySchema }, async ({ actor, query }) => listPlans(actor, query));

// POST /api/plans: plan a visit (office).
export const POST = withApi({ permission: 'plans.write', body: createPlanSchema, status: 201 }, async ({ actor, body }) => createPlan(actor, body));
