import { downloadResponse } from '@/lib/api/download';
import { idParamsSchema } from '@/lib/api/schemas';
import { withApi } from '@/lib/api/handler';
import { visitReportPdf } from '@/lib/visits/close';

// GET /api/visits/:id/report: the visit's PDF report (access-checked; made on demand if missing).
export const GET = withApi({ params: idParamsSchema }, async ({ actor, params }) => {
  const body = await visitReportPdf(actor, params.id);
  return downloadResponse({ filename: `visit-report-${params.id.slice(0, 8)}.pdf`, contentType: 'application/pdf', body }, { disposition: 'inline' });
});
