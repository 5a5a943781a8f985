import { z } from 'zod';
import { withApi } from '@/lib/api/handler';
import { AppError } from '@/lib/errors';
import { getEquipmentTagInfo, siteTagCodes } from '@/lib/tags/service';

const querySchema = z.object({ equipmentId: z.uuid().optional(), siteId: z.uuid().optional() });

// GET /api/tags?equipmentId=: a piece of equipment's current tag, earlier tags and last scan.
// GET /api/tags?siteId=: the current tag code of each tagged piece of equipment on a site.
export const GET = withApi({ query: querySchema }, async ({ actor, query }) => {
  if (query.equipmentId) return getEquipmentTagInfo(actor, query.equipmentId);
  if (query.siteId) return { codes: await siteTagCodes(actor, query.siteId) };
  throw new AppError('bad_request', 'Ask for equipmentId or siteId.');
});
