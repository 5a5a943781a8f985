import { idParamsSchema } from '@/lib/api/schemas';
import { withApi } from '@/lib/api/handler';
import { reopenVisit } from '@/lib/visits/service';

// POST /api/visits/:id/reopen: the office reopens a closed visit.
export const POST = withApi({ permission: 'visits.review', params: idParamsSchema }, async ({ actor, params }) => reopenVisit(actor, params.id));
