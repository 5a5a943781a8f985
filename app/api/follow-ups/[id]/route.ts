import { idParamsSchema } from '@/lib/api/schemas';
import { withApi } from '@/lib/api/handler';
import { updateFollowUpSchema } from '@/lib/follow-ups/schemas';
import { getFollowUp, updateFollowUp } from '@/lib/follow-ups/service';

// GET /api/follow-ups/:id: one follow-up.
export const GET = withApi({ params: idParamsSchema }, async ({ actor, params }) => getFollowUp(actor, params.id));

// PATCH /api/follow-ups/:id: move it along: scheduled (date), resolved or declined (with what was done or why).
export const PATCH = withApi({ permission: 'followups.write', params: idParamsSchema, body: updateFollowUpSchema }, async ({ actor, params, body }) =>
  updateFollowUp(actor, params.id, body),
);
