import { idParamsSchema } from '@/lib/api/schemas';
import { withApi } from '@/lib/api/handler';
import { historyQuerySchema } from '@/lib/visits/schemas';
import { systemHistory } from '@/lib/visits/history';

// GET /api/systems/:id/history: the merged history of the system's equipment, newest first.
export const GET = withApi({ params: idParamsSchema, query: historyQuerySchema }, async ({ actor, params, query }) => systemHistory(actor, params.id, query));
