import { idParamsSchema } from '@/lib/api/schemas';
import { withApi } from '@/lib/api/handler';
import { pdfResponse } from '@/lib/tags/http';
import { getPrintRunPdf } from '@/lib/tags/print-runs';

export const runtime = 'nodejs';

// GET /api/print-runs/:id/pdf: the run's label sheet again, as stored.
export const GET = withApi({ permission: 'tags.print', params: idParamsSchema }, async ({ actor, params }) => pdfResponse(await getPrintRunPdf(actor, params.id)));
