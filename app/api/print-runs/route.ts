import { withApi } from '@/lib/api/handler';
import { createPrintRunSchema, listPrintRunsQuerySchema } from '@/lib/tags/schemas';
import { createPrintRun, listPrintRuns } from '@/lib/tags/print-runs';

// GET /api/print-runs: print runs, newest first, with claimed counts.
export const GET = withApi({ permission: 'tags.print', query: listPrintRunsQuerySchema }, async ({ actor, query }) => listPrintRuns(actor, query));

// POST /api/print-runs: new tags for chosen equipment or N blank tags for a site; the label PDF is generated and stored.
export const POST = withApi({ permission: 'tags.print', body: createPrintRunSchema, status: 201 }, async ({ actor, body }) => createPrintRun(actor, body));
