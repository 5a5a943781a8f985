import { withApi } from '@/lib/api/handler';
import { createFollowUpSchema, listFollowUpsQuerySchema } from '@/lib/follow-ups/schemas';
import { createFollowUp, listFollowUps } from '@/lib/follow-ups/service';

// GET /api/follow-ups: follow-ups visible to the caller (open and scheduled by default; filters).
export const GET = withApi({ query: listFollowUpsQuerySchema }, async ({ actor, query }) => listFollowUps(actor, query));

// POST /api/follow-ups: raise a follow-up on a site or a piece of equipment.
export const POST = withApi({ permission: 'followups.write', body: createFollowUpSchema, status: 201 }, async ({ actor, body }) => createFollowUp(actor, body));
