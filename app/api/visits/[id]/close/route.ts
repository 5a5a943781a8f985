import { idParamsSchema } from '@/lib/api/schemas';
import { withApi } from '@/lib/api/handler';
import { logger } from '@/lib/logger';
import { kickMailDelivery } from '@/lib/mail/outbox';
import { closeVisitSchema } from '@/lib/visits/schemas';
import { closeVisit, ensureVisitReport } from '@/lib/visits/service';

// POST /api/visits/:id/close: close with a summary (a bypassed control must be confirmed removed); queues the report.
export const POST = withApi({ permission: 'visits.start', params: idParamsSchema, body: closeVisitSchema }, async ({ actor, params, body }) =>
  closeVisit(actor, params.id, body, undefined, async (visitId) => {
    kickMailDelivery();
    // The PDF is made now when the store answers, else on the first download.
    await ensureVisitReport(actor, visitId).catch((err: unknown) => logger.warn({ err: String(err), visitId }, 'visit report not stored yet'));
  }),
);
