import { withApi } from '@/lib/api/handler';
import { siteAreaParamsSchema } from '@/lib/sites/schemas';
import { setAreaArchived } from '@/lib/sites/service';

// POST /api/sites/:id/areas/:areaId/restore: bring an archived area back.
export const POST = withApi({ params: siteAreaParamsSchema }, async ({ actor, params }) => setAreaArchived(actor, params.id, params.areaId, false));
