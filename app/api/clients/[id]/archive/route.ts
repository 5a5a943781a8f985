import { idParamsSchema } from '@/lib/api/schemas';
import { withApi } from '@/lib/api/handler';
import { setClientArchived } from '@/lib/clients/service';

// POST /api/clients/:id/archive: hide a client from lists (kept, restorable).
export const POST = withApi({ params: idParamsSchema }, async ({ actor, params }) => setClientArchived(actor, params.id, true));
