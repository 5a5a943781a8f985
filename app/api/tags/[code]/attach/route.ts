import { withApi } from '@/lib/api/handler';
import { attachTagSchema, tagCodeParamsSchema } from '@/lib/tags/schemas';
import { attachTag } from '@/lib/tags/service';

// POST /api/tags/:code/attach: claim a blank tag for existing or new equipment; the equipment's old tag is retired as replaced.
export const POST = withApi({ permission: 'tags.claim', params: tagCodeParamsSchema, body: attachTagSchema }, async ({ actor, params, body }) =>
  attachTag(actor, params.code, body),
);
