import { idParamsSchema } from '@/lib/api/schemas';
import { withApi } from '@/lib/api/handler';
import { setSiteArchived } from '@/lib/sites/service';

// POST /api/sites/:id/archive: hide a site from lists (kept, restorable).
export const POST = withApi({ params: idParamsSchema }, async ({ actor, params }) => setSiteArchived(actor, params.id, true));
