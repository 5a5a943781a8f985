import { idParamsSchema } from '@/lib/api/schemas';
import { withApi } from '@/lib/api/handler';
import { getVisit } from '@/lib/visits/service';

// GET /api/visits/:id: a visit with its entries and any bypass not yet confirmed removed.
export const GET = withApi({ params: idParamsSchema }, async ({ actor, params }) => getVisit(actor, params.id));
