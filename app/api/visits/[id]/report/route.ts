import { idParamsSchema } from '@/lib/api/schemas';
import { withApi } from '@/lib/api/handler';
import { ensureVisitReport } from '@/lib/visits/service';
import { getObjectBytes } from '@/storage/objects';

// GET /api/visits/:id/report: the visit's PDF report (access-checked; made on demand if missing).
export const GET = withApi({ params: idParamsSchema }, async ({ actor, params }) => {
  const key = await ensureVisitReport(actor, params.id);
  const bytes = await getObjectBytes(key);
  return new Response(Buffer.from(bytes), {
    headers: {
      'Content-Type': 'application/pdf',
      'Content-Disposition': `inline; filename="visit-report-${params.id.slice(0, 8)}.pdf"`,
      'Cache-Control': 'private, no-store',
    },
  });
});
