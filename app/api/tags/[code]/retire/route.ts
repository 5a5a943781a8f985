import { withApi } from '@/lib/api/handler';
import { retireTagSchema, tagCodeParamsSchema } from '@/lib/tags/schemas';
import { retireTag } from '@/lib/tags/service';

// POST /api/tags/:code/retire: retire a damaged or lost tag (or void an unused blank one).
export const POST = withApi({ permission: 'tags.claim', params: tagCodeParamsSchema, body: retireTagSchema }, async ({ actor, params, body }) =>
  retireTag(actor, params.code, body),
);
