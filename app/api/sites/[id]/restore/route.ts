import { idParamsSchema } from '@/lib/api/schemas';
import { withApi } from '@/lib/api/handler';
import { setSiteArchived } from '@/lib/sites/service';

// POST /api/sites/:id/restore: bring an archived site back.
export const POST = withApi({ params: idParamsSchema }, async ({ actor, params }) => setSiteArchived(actor, params.id, false));
