import { idParamsSchema } from '@/lib/api/schemas';
import { withApi } from '@/lib/api/handler';
import { visitReportPdf } from '@/lib/visits/close';

// GET /api/visits/:id/report: the visit's PDF report (access-checked; made on demand if missing).
export const GET = withApi({ params: idParamsSchema }, async ({ actor, params }) => {
  const bytes = await visitReportPdf(actor, params.id);
  return new Response(Buffer.from(bytes), {
    headers: {
      'Content-Type': 'application/pdf',
      'Content-Disposition': `inline; filename="visit-report-${params.id.slice(0, 8)}.pdf"`,
      'Cache-Control': 'private, no-store',
    },
  });
});
