import { withApi } from '@/lib/api/handler';
import { pdfResponse } from '@/lib/tags/http';
import { calibrationQuerySchema } from '@/lib/tags/schemas';
import { calibrationPdf } from '@/lib/tags/print-runs';

export const runtime = 'nodejs';

// GET /api/print-runs/calibration?layoutId=: one page to check printer scaling for a layout.
export const GET = withApi({ permission: 'tags.print', query: calibrationQuerySchema }, async ({ actor, query }) =>
  pdfResponse(await calibrationPdf(actor, query.layoutId)),
);
