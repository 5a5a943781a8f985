import { idParamsSchema } from '@/lib/api/schemas';
import { withApi } from '@/lib/api/handler';
import { markReviewed } from '@/lib/visits/service';

// POST /api/visits/:id/review: the office marks a closed visit reviewed.
export const POST = withApi({ permission: 'visits.review', params: idParamsSchema }, async ({ actor, params }) => markReviewed(actor, params.id));
