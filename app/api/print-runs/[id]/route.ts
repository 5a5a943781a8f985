import { idParamsSchema } from '@/lib/api/schemas';
import { withApi } from '@/lib/api/handler';
import { getPrintRun } from '@/lib/tags/print-runs';

// GET /api/print-runs/:id: one print run with its tags.
export const GET = withApi({ permission: 'tags.print', params: idParamsSchema }, async ({ actor, params }) => getPrintRun(actor, params.id));
