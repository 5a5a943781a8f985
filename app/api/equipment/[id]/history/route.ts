import { idParamsSchema } from '@/lib/api/schemas';
import { withApi } from '@/lib/api/handler';
import { historyQuerySchema } from '@/lib/visits/schemas';
import { equipmentHistory } from '@/lib/visits/history';

// GET /api/equipment/:id/history: the equipment's entries, newest first (filter by kind; keyset pages).
export const GET = withApi({ params: idParamsSchema, query: historyQuerySchema }, async ({ actor, params, query }) => equipmentHistory(actor, params.id, query));
