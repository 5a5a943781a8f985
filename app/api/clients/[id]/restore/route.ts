import { idParamsSchema } from '@/lib/api/schemas';
import { withApi } from '@/lib/api/handler';
import { setClientArchived } from '@/lib/clients/service';

// POST /api/clients/:id/restore: bring an archived client back.
export const POST = withApi({ params: idParamsSchema }, async ({ actor, params }) => setClientArchived(actor, params.id, false));
