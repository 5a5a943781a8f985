import { idParamsSchema } from '@/lib/api/schemas';
import { withApi } from '@/lib/api/handler';
import { closeVisit } from '@/lib/visits/close';
import { closeVisitSchema } from '@/lib/visits/schemas';

// POST /api/visits/:id/close: close with a summary (a bypassed control must be confirmed removed);
// queues the report e-mail and makes the PDF.
export const POST = withApi({ permission: 'visits.start', params: idParamsSchema, body: closeVisitSchema }, async ({ actor, params, body }) => closeVisit(actor, params.id, body));
